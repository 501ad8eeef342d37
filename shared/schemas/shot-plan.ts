/**
 * The gear API (a user's camera bodies, lenses and gear settings as stored) and the shot plan API
 * (a lineup planned with a chosen body and lens: framing, panorama grid, exposure limits, the
 * night's timeline and the shot card). The body and lens figures themselves are checked by the
 * schemas of ./gear.ts.
 */
import { z } from 'zod';
import {
  cameraBodySchema,
  lensSchema,
  MAX_F_NUMBER,
  MAX_FOCAL_LENGTH_MM,
  MIN_F_NUMBER,
  MIN_FOCAL_LENGTH_MM,
} from './gear';
import { targetRefSchema } from './lineup';

// ---------------------------------------------------------------------------------------------
// Gear API
// ---------------------------------------------------------------------------------------------

/** Derived figures of a stored camera body (shared/shotplan deriveBody). */
export const derivedBodySchema = z.object({
  diagonalMm: z.number(),
  cropFactor: z.number(),
  pixelPitchUm: z.number(),
  pixelPitchSource: z.enum(['pixel-pitch', 'width-px', 'megapixels']),
  widthPx: z.number(),
  heightPx: z.number(),
  megapixels: z.number(),
  aspectRatio: z.number(),
});

/** A camera body as the API returns it: what the user typed, with the derived figures. */
export const cameraBodyRecordSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  sensorWidthMm: z.number(),
  sensorHeightMm: z.number(),
  pixelPitchUm: z.number().nullable(),
  widthPx: z.number().int().nullable(),
  megapixels: z.number().nullable(),
  derived: derivedBodySchema,
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
});
export type CameraBodyRecord = z.infer<typeof cameraBodyRecordSchema>;

/** A lens as the API returns it, with its focal range. */
export const lensRecordSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  focalLengthMm: z.number().nullable(),
  zoomMinMm: z.number().nullable(),
  zoomMaxMm: z.number().nullable(),
  widestApertureF: z.number(),
  range: z.object({ minMm: z.number(), maxMm: z.number(), isZoom: z.boolean() }),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
});
export type LensRecord = z.infer<typeof lensRecordSchema>;

/** PUT /api/gear/settings */
export const gearSettingsSchema = z.strictObject({
  starTrackerAvailable: z.boolean({ error: 'Say whether a star tracker is available (true or false)' }),
});
export type GearSettings = z.infer<typeof gearSettingsSchema>;

/** GET /api/gear */
export const gearResponseSchema = z.object({
  bodies: z.array(cameraBodyRecordSchema),
  lenses: z.array(lensRecordSchema),
  settings: gearSettingsSchema,
});
export type GearResponse = z.infer<typeof gearResponseSchema>;
export const cameraBodyResponseSchema = z.object({ body: cameraBodyRecordSchema });
export const lensResponseSchema = z.object({ lens: lensRecordSchema });
export const gearSettingsResponseSchema = z.object({ settings: gearSettingsSchema });

/** POST /api/gear/bodies: a camera body (see cameraBodySchema). */
export const cameraBodyInputSchema = cameraBodySchema;
export type CameraBodyInput = z.infer<typeof cameraBodyInputSchema>;
export type CameraBodyInputBody = z.input<typeof cameraBodyInputSchema>;
/** POST /api/gear/lenses: a lens (see lensSchema). */
export const lensInputSchema = lensSchema;
export type LensInput = z.infer<typeof lensInputSchema>;
export type LensInputBody = z.input<typeof lensInputSchema>;

const somethingToChange = (v: Record<string, unknown>) => Object.values(v).some((x) => x !== undefined);

/**
 * PATCH /api/gear/bodies/:id: any of the fields; `null` clears an optional pixel figure. The
 * merged body is checked again as a whole (cameraBodySchema), so the figures must still agree.
 */
export const cameraBodyPatchSchema = z.strictObject({
  name: cameraBodySchema.shape.name.optional(),
  sensorWidthMm: cameraBodySchema.shape.sensorWidthMm.optional(),
  sensorHeightMm: cameraBodySchema.shape.sensorHeightMm.optional(),
  pixelPitchUm: cameraBodySchema.shape.pixelPitchUm.unwrap().nullable().optional(),
  widthPx: cameraBodySchema.shape.widthPx.unwrap().nullable().optional(),
  megapixels: cameraBodySchema.shape.megapixels.unwrap().nullable().optional(),
}).refine(somethingToChange, { message: 'Nothing to change', path: ['_'] });
export type CameraBodyPatch = z.infer<typeof cameraBodyPatchSchema>;

/**
 * PATCH /api/gear/lenses/:id: any of the fields; `null` clears the prime's focal length or the
 * zoom's ends (to turn one into the other). The merged lens is checked again as a whole.
 */
export const lensPatchSchema = z.strictObject({
  name: lensSchema.shape.name.optional(),
  focalLengthMm: lensSchema.shape.focalLengthMm.unwrap().nullable().optional(),
  zoomMinMm: lensSchema.shape.zoomMinMm.unwrap().nullable().optional(),
  zoomMaxMm: lensSchema.shape.zoomMaxMm.unwrap().nullable().optional(),
  widestApertureF: lensSchema.shape.widestApertureF.optional(),
}).refine(somethingToChange, { message: 'Nothing to change', path: ['_'] });
export type LensPatch = z.infer<typeof lensPatchSchema>;

// ---------------------------------------------------------------------------------------------
// Shot plan request
// ---------------------------------------------------------------------------------------------

/** Longest lineup a shot plan takes, hours. */
export const MAX_SHOT_PLAN_LINEUP_HOURS = 24;
/** Longest sub-exposure or foreground exposure accepted, seconds. */
export const MAX_SHOT_EXPOSURE_S = 3600;
/** Longest total integration accepted, seconds (12 h, the longest block on a timeline). */
export const MAX_SHOT_INTEGRATION_S = 43_200;
/** Total sky integration used when none is given, seconds: tracked and untracked. */
export const DEFAULT_TRACKED_INTEGRATION_S = 1800;
export const DEFAULT_UNTRACKED_INTEGRATION_S = 300;

const instantSchema = (what: string) =>
  z.iso.datetime({ offset: true, error: `Give ${what} as an ISO date-time such as 2027-05-20T23:10:00Z` })
    .refine((s) => { const y = new Date(s).getUTCFullYear(); return y >= 1900 && y < 2200; }, { message: `Give ${what} between 1900 and 2199` })
    .transform((s) => new Date(s));

/** The lineup being planned, as the lineup search returned it (ISO instants). */
export const shotPlanLineupSchema = z.object({
  start: instantSchema('the lineup start'),
  peak: instantSchema('the lineup peak'),
  end: instantSchema('the lineup end'),
}, { error: 'Give the lineup: start, peak and end' }).superRefine((l, ctx) => {
  // Instants that failed their own check are reported there.
  if (!(l.start instanceof Date) || !(l.peak instanceof Date) || !(l.end instanceof Date)) return;
  const s = l.start.getTime();
  const p = l.peak.getTime();
  const e = l.end.getTime();
  if (!(e > s)) ctx.addIssue({ code: 'custom', path: ['end'], message: 'The lineup must end after it starts' });
  else if (e - s > MAX_SHOT_PLAN_LINEUP_HOURS * 3_600_000) {
    ctx.addIssue({ code: 'custom', path: ['end'], message: `A lineup is at most ${MAX_SHOT_PLAN_LINEUP_HOURS} hours long` });
  }
  if (p < s || p > e) ctx.addIssue({ code: 'custom', path: ['peak'], message: 'The peak must lie between the start and the end' });
});

const seconds = (label: string, max: number) =>
  z.number({ error: `${label} must be a number of seconds` }).finite()
    .gt(0, `${label} must be above 0 s`)
    .max(max, `${label} must be at most ${max} s`);

/** What the sky panorama covers besides the landmark. */
export const PANORAMA_COVERS = ['target-path', 'galactic-plane'] as const;
export type PanoramaCover = (typeof PANORAMA_COVERS)[number];
/** When a panorama grid is laid out: only when one frame is not enough, always, or never. */
export const PANORAMA_MODES = ['auto', 'always', 'off'] as const;

/** Panorama settings. */
export const panoramaSettingsSchema = z.strictObject({
  mode: z.enum(PANORAMA_MODES, { error: 'Panorama is auto, always or off' }).default('auto'),
  /** Overlap between neighbouring frames, fraction 0..0.9 (default 0.3). */
  overlap: z.number({ error: 'Overlap must be a number' }).finite().min(0, 'Overlap is from 0 to 0.9').max(0.9, 'Overlap is from 0 to 0.9').default(0.3),
  orientation: z.enum(['landscape', 'portrait'], { error: 'Orientation is landscape or portrait' }).default('portrait'),
  /** The target's path during the lineup, or the galactic plane (at the peak) from the horizon up. */
  cover: z.enum(PANORAMA_COVERS, { error: 'Cover the target path or the galactic plane' }).default('target-path'),
  /** With `galactic-plane`: the highest altitude of the plane to cover, degrees 1..90 (default 60). */
  skyTopAltDeg: z.number({ error: 'Give the altitude in degrees' }).finite().min(1, 'Between 1 and 90 deg').max(90, 'Between 1 and 90 deg').default(60),
  /** One frame's exposure, seconds (default: the untracked limit, rounded down). */
  frameExposureS: seconds('Frame exposure', MAX_SHOT_EXPOSURE_S).optional(),
  /** Time to turn the head between frames, seconds 0..600 (default 5). */
  frameGapS: z.number({ error: 'Give the time between frames in seconds' }).finite().min(0, 'At least 0 s').max(600, 'At most 600 s').default(5),
});
export type PanoramaSettings = z.infer<typeof panoramaSettingsSchema>;

/** The sky stack. */
export const skyExposureSettingsSchema = z.strictObject({
  /** One frame's exposure, seconds (default: tracked, the short end of the usual range; untracked, the NPF limit rounded down). */
  subExposureS: seconds('Sub-exposure', MAX_SHOT_EXPOSURE_S).optional(),
  /** Wanted total exposure, seconds (default 1800 tracked, 300 untracked). */
  totalIntegrationS: seconds('Total integration', MAX_SHOT_INTEGRATION_S).optional(),
  /** Time between frames (read-out, dithering), seconds 0..600 (default 2). */
  frameGapS: z.number({ error: 'Give the time between frames in seconds' }).finite().min(0, 'At least 0 s').max(600, 'At most 600 s').default(2),
});

/** The foreground frames. */
export const foregroundSettingsSchema = z.strictObject({
  /** Number of frames, 0 (none) .. 200 (default 3). */
  frames: z.number({ error: 'Give the number of foreground frames' }).int('A whole number of frames').min(0, 'At least 0 frames').max(200, 'At most 200 frames').default(3),
  /** One frame's exposure, seconds (default 120). */
  exposureS: seconds('Foreground exposure', MAX_SHOT_EXPOSURE_S).default(120),
  /** Shoot the foreground before the sky (default: after). */
  first: z.boolean({ error: 'Say true or false' }).default(false),
});

/** POST /api/sightlines/:id/shot-plan and /shot-card */
export const shotPlanRequestSchema = z.strictObject({
  lineup: shotPlanLineupSchema,
  /** The lineup's target (default: the sightline's usual target). */
  target: targetRefSchema.optional(),
  bodyId: z.uuid({ error: 'Choose a camera body from your gear' }),
  lensId: z.uuid({ error: 'Choose a lens from your gear' }),
  /** Focal length to use, mm (default: the lens's shortest). */
  focalLengthMm: z.number({ error: 'Focal length must be a number' }).finite()
    .min(MIN_FOCAL_LENGTH_MM, `Focal length must be between ${MIN_FOCAL_LENGTH_MM} and ${MAX_FOCAL_LENGTH_MM} mm`)
    .max(MAX_FOCAL_LENGTH_MM, `Focal length must be between ${MIN_FOCAL_LENGTH_MM} and ${MAX_FOCAL_LENGTH_MM} mm`).optional(),
  /** Aperture, f-number (default: the lens's widest). */
  fNumber: z.number({ error: 'Aperture must be a number' }).finite()
    .min(MIN_F_NUMBER, `Aperture must be between f/${MIN_F_NUMBER} and f/${MAX_F_NUMBER}`)
    .max(MAX_F_NUMBER, `Aperture must be between f/${MIN_F_NUMBER} and f/${MAX_F_NUMBER}`).optional(),
  tracked: z.boolean({ error: 'Say whether the sky is tracked (true or false)' }).default(false),
  sky: skyExposureSettingsSchema.prefault({}),
  foreground: foregroundSettingsSchema.prefault({}),
  panorama: panoramaSettingsSchema.prefault({}),
  /** When shooting starts (default: the lineup start). */
  startAt: instantSchema('the start of shooting').optional(),
  /** Gap between blocks, seconds 0..3600 (default 60). */
  blockGapS: z.number({ error: 'Give the gap between blocks in seconds' }).finite().min(0, 'At least 0 s').max(3600, 'At most 3600 s').default(60),
});
export type ShotPlanRequest = z.infer<typeof shotPlanRequestSchema>;
export type ShotPlanRequestBody = z.input<typeof shotPlanRequestSchema>;

/** Formats of POST /api/sightlines/:id/shot-card. */
export const SHOT_CARD_FORMATS = ['html', 'pdf'] as const;
export type ShotCardFormat = (typeof SHOT_CARD_FORMATS)[number];
export const shotCardQuerySchema = z.object({
  format: z.enum(SHOT_CARD_FORMATS, { error: 'Ask for format html or pdf' }).default('html'),
});

// ---------------------------------------------------------------------------------------------
// Shot plan response
// ---------------------------------------------------------------------------------------------

const direction = z.object({ azimuthDeg: z.number(), altitudeDeg: z.number() });
const orientation = z.enum(['landscape', 'portrait']);

const orientationFitSchema = z.object({
  orientation,
  centre: direction.nullable(),
  requiredHorizontalFovDeg: z.number().nullable(),
  requiredVerticalFovDeg: z.number().nullable(),
  longestFocalLengthMm: z.number().nullable(),
  fits: z.boolean(),
});

const fovSchema = z.object({ horizontalDeg: z.number(), verticalDeg: z.number(), diagonalDeg: z.number() });

const panoramaSchema = z.object({
  /** Why the grid is there: one frame is not enough, or it was asked for. */
  reason: z.enum(['does-not-fit', 'asked']),
  orientation,
  cover: z.enum(PANORAMA_COVERS),
  /** The frame's angles as held, degrees. */
  frameFov: z.object({ horizontalDeg: z.number(), verticalDeg: z.number() }),
  span: z.object({ fromAzDeg: z.number(), toAzDeg: z.number(), azimuthWidthDeg: z.number(), bottomAltDeg: z.number(), topAltDeg: z.number() }),
  rowCount: z.number().int(),
  maxColumns: z.number().int(),
  frameCount: z.number().int(),
  overlap: z.number(),
  rows: z.array(z.object({
    index: z.number().int(),
    altitudeDeg: z.number(),
    bandBottomDeg: z.number(),
    bandTopDeg: z.number(),
    columns: z.number().int(),
    azimuthStepDeg: z.number(),
    frameAzimuthWidthDeg: z.number(),
  })),
  frames: z.array(direction.extend({ row: z.number().int(), column: z.number().int() })),
  field: z.object({ azimuthDeg: z.number(), fullCircle: z.boolean(), bottomAltDeg: z.number(), topAltDeg: z.number() }),
  frameExposureS: z.number(),
  frameGapS: z.number(),
  /** A note when the cover asked for could not be used (e.g. the galactic plane is below the horizon). */
  note: z.string().nullable(),
});
export type ShotPlanPanorama = z.infer<typeof panoramaSchema>;

const timelineEventSchema = z.object({ kind: z.string(), label: z.string(), at: z.iso.datetime() });
const placedBlockSchema = z.object({
  index: z.number().int(),
  kind: z.enum(['sky-stack', 'panorama-row', 'foreground']),
  label: z.string(),
  durationS: z.number(),
  start: z.iso.datetime(),
  end: z.iso.datetime(),
});
const warningSchema = z.object({
  blockIndex: z.number().int(),
  blockLabel: z.string(),
  deadline: z.enum(['lineup-end', 'moonrise', 'tide-cut-off', 'astronomical-dawn']),
  deadlineLabel: z.string(),
  deadlineAt: z.iso.datetime(),
  overrunS: z.number(),
  startsAfter: z.boolean(),
  message: z.string(),
});

/** The shot plan of a lineup: everything the shot card shows. Instants are ISO (UTC); `timezone` is the site's. */
export const shotPlanSchema = z.object({
  sightline: z.object({ id: z.string(), name: z.string() }),
  timezone: z.string(),
  /** The local date of the night's evening, 'YYYY-MM-DD'. */
  night: z.string(),
  site: z.object({ lat: z.number(), lon: z.number(), elevationM: z.number() }),
  landmark: z.object({ lat: z.number(), lon: z.number() }),
  bearing: z.object({
    distanceM: z.number(),
    trueDeg: z.number(),
    magneticDeg: z.number(),
    declinationDeg: z.number(),
    compassReliable: z.boolean(),
    warnings: z.array(z.string()),
  }),
  /** The landmark as seen from the vantage: its top and base, and the edges when it is wide. */
  landmarkView: z.object({
    azimuthDeg: z.number(),
    topAltDeg: z.number(),
    baseAltDeg: z.number(),
    angularWidthDeg: z.number(),
    points: z.array(direction),
  }),
  target: z.object({ id: z.string().optional(), name: z.string(), raHours: z.number(), decDeg: z.number() }),
  lineup: z.object({ start: z.iso.datetime(), peak: z.iso.datetime(), end: z.iso.datetime(), durationMin: z.number() }),
  /** The target's path during the lineup. */
  track: z.array(direction.extend({ at: z.iso.datetime() })),
  /** The galactic plane at the lineup's peak (points above -5 deg), for the sketch. */
  galacticPlane: z.array(direction),
  gear: z.object({
    body: z.object({ id: z.string(), name: z.string(), sensorWidthMm: z.number(), sensorHeightMm: z.number(), cropFactor: z.number(), pixelPitchUm: z.number() }),
    lens: z.object({ id: z.string(), name: z.string(), minMm: z.number(), maxMm: z.number(), isZoom: z.boolean(), widestApertureF: z.number() }),
    focalLengthMm: z.number(),
    fNumber: z.number(),
    tracked: z.boolean(),
    starTrackerAvailable: z.boolean(),
  }),
  framing: z.object({
    fov: fovSchema,
    landscape: orientationFitSchema,
    portrait: orientationFitSchema,
    fitsIn: z.array(orientation),
    /** The longest focal length of the lens that still holds everything (null: a panorama is needed). */
    longestFitting: z.object({ focalLengthMm: z.number().nullable(), orientation: orientation.nullable(), centre: direction.nullable() }),
  }),
  panorama: panoramaSchema.nullable(),
  exposure: z.object({
    untracked: z.object({ rule500S: z.number(), npfSimpleS: z.number(), npfFullS: z.number().nullable() }),
    /** The common sub-exposure range on a tracker at this focal length. */
    trackedSubRange: z.object({ minS: z.number(), maxS: z.number(), basis: z.literal('common practice') }),
    sky: z.object({
      tracked: z.boolean(),
      subExposureS: z.number(),
      totalIntegrationS: z.number(),
      frameGapS: z.number(),
      frames: z.number().int(),
      durationS: z.number(),
      available: z.object({ seconds: z.number(), limitedBy: z.enum(['lineup-end', 'moonrise']), until: z.iso.datetime() }),
      fits: z.boolean(),
      framesInTime: z.number().int(),
      integrationInTimeS: z.number(),
    }),
    foreground: z.object({ frames: z.number().int(), exposureS: z.number() }),
  }),
  moon: z.object({ illuminatedFraction: z.number(), phaseName: z.string() }),
  tide: z.object({ status: z.enum(['reachable', 'cut-off', 'unknown']), cutOffAt: z.iso.datetime().nullable() }).nullable(),
  timeline: z.object({
    start: z.iso.datetime(),
    events: z.array(timelineEventSchema),
    blocks: z.array(placedBlockSchema),
    warnings: z.array(warningSchema),
    endsAt: z.iso.datetime(),
  }),
  /** Notes from the sightline's field notes that bear on safety (hazard, tide, access). */
  fieldNotes: z.array(z.object({ kind: z.string(), body: z.string() })),
  /** Cautions for this plan, most specific first; the last is always that a plan is not a promise. */
  cautions: z.array(z.string()),
  generatedAt: z.iso.datetime(),
});
export type ShotPlan = z.infer<typeof shotPlanSchema>;
export const shotPlanResponseSchema = z.object({ plan: shotPlanSchema });
