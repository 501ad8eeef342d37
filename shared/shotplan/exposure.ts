/**
 * Exposure limits for a shot plan.
 *
 * Untracked sky: the longest exposure before stars visibly trail, by two rules shown side by side:
 * - the "500 rule", t = 500 / (f x crop factor) s: common practice, origin unknown;
 * - the NPF rule (F. Michaud, Societe Astronomique du Havre, 2016): simple form
 *   t = (35 N + 30 p) / f, with N the f-number, p the pixel pitch (um), f the focal length (mm);
 *   and its full form with the target's declination d,
 *   t = k (16.856 N + 0.0997 f + 13.713 p) / (f cos d), k = 1 (constants from memory: treat the
 *   full form's figures as indicative; the simple form is the published one used for checks).
 *
 * Tracked sky: a sub-exposure range by focal length (common practice for portable star trackers,
 * see {@link suggestedSubExposureRange}), the frames needed for a total integration time, and
 * the time left before the lineup ends or the Moon rises.
 */
import { assertFiniteInRange, assertValidDate } from '../guards';
import { MAX_F_NUMBER, MAX_FOCAL_LENGTH_MM, MAX_PIXEL_PITCH_UM, MIN_F_NUMBER, MIN_FOCAL_LENGTH_MM, MIN_PIXEL_PITCH_UM } from '../schemas/gear';
import { MS_PER_SECOND, RAD_PER_DEG } from '../units';

/** Numerator of the 500 rule, seconds x mm. */
export const RULE_500_NUMERATOR = 500;
/** Largest |declination| the NPF full form accepts, degrees (its 1/cos(d) has no bound at the pole). */
export const MAX_NPF_DECLINATION_DEG = 89;
/** Smallest and largest crop factor accepted. */
export const MIN_CROP_FACTOR = 0.1;
export const MAX_CROP_FACTOR = 20;
/** Longest total integration or sub-exposure accepted, seconds (one day). */
export const MAX_INTEGRATION_S = 86_400;

function focal(value: unknown, name = 'focalLengthMm'): number {
  return assertFiniteInRange(value, name, MIN_FOCAL_LENGTH_MM, MAX_FOCAL_LENGTH_MM);
}

/**
 * The 500 rule (common practice): t = 500 / (f x crop factor).
 * @param focalLengthMm - focal length, mm 1..5000
 * @param cropFactor - crop factor (43.27 mm / sensor diagonal), 0.1..20 (1 for 36 x 24 mm)
 * @returns the longest untracked exposure, seconds
 * @throws RangeError on invalid input
 */
export function rule500Seconds(focalLengthMm: number, cropFactor: number): number {
  const f = focal(focalLengthMm);
  const c = assertFiniteInRange(cropFactor, 'cropFactor', MIN_CROP_FACTOR, MAX_CROP_FACTOR);
  return RULE_500_NUMERATOR / (f * c);
}

/**
 * The NPF rule, simple form (F. Michaud, 2016): t = (35 N + 30 p) / f.
 * @param fNumber - aperture, f-number 0.7..32
 * @param pixelPitchUm - pixel pitch, micrometres 0.5..50
 * @param focalLengthMm - focal length (the real one, not 35 mm-equivalent), mm 1..5000
 * @returns the longest untracked exposure, seconds
 * @throws RangeError on invalid input
 */
export function npfSimpleSeconds(fNumber: number, pixelPitchUm: number, focalLengthMm: number): number {
  const n = assertFiniteInRange(fNumber, 'fNumber', MIN_F_NUMBER, MAX_F_NUMBER);
  const p = assertFiniteInRange(pixelPitchUm, 'pixelPitchUm', MIN_PIXEL_PITCH_UM, MAX_PIXEL_PITCH_UM);
  const f = focal(focalLengthMm);
  return (35 * n + 30 * p) / f;
}

/** Constants of the NPF full form (from memory, see the module header). */
export const NPF_FULL_CONSTANTS = { aperture: 16.856, focal: 0.0997, pitch: 13.713 } as const;

/**
 * The NPF rule, full form with the target's declination: t = k (16.856 N + 0.0997 f + 13.713 p)
 * / (f cos d) (constants from memory). Stars near the celestial equator move fastest across the
 * sensor; the allowed time grows as 1 / cos(declination) toward the poles.
 * @param fNumber - aperture, f-number 0.7..32
 * @param pixelPitchUm - pixel pitch, micrometres 0.5..50
 * @param focalLengthMm - focal length, mm 1..5000
 * @param declinationDeg - the target's declination, degrees -89..89
 * @param k - tolerance factor, 0.1..10 (default 1; larger allows more trailing)
 * @returns the longest untracked exposure, seconds
 * @throws RangeError on invalid input
 */
export function npfFullSeconds(fNumber: number, pixelPitchUm: number, focalLengthMm: number, declinationDeg: number, k = 1): number {
  const n = assertFiniteInRange(fNumber, 'fNumber', MIN_F_NUMBER, MAX_F_NUMBER);
  const p = assertFiniteInRange(pixelPitchUm, 'pixelPitchUm', MIN_PIXEL_PITCH_UM, MAX_PIXEL_PITCH_UM);
  const f = focal(focalLengthMm);
  const d = assertFiniteInRange(declinationDeg, 'declinationDeg', -MAX_NPF_DECLINATION_DEG, MAX_NPF_DECLINATION_DEG);
  const kk = assertFiniteInRange(k, 'k', 0.1, 10);
  const c = NPF_FULL_CONSTANTS;
  return (kk * (c.aperture * n + c.focal * f + c.pitch * p)) / (f * Math.cos(d * RAD_PER_DEG));
}

/** Inputs of {@link untrackedLimits}. */
export interface UntrackedInputs {
  focalLengthMm: number;
  fNumber: number;
  cropFactor: number;
  pixelPitchUm: number;
  /** The target's declination, degrees -89..89; without it the full NPF form is left out. */
  declinationDeg?: number;
}

/** The untracked limits side by side, seconds; see {@link untrackedLimits}. */
export interface UntrackedLimits {
  rule500S: number;
  npfSimpleS: number;
  /** Null without a declination. */
  npfFullS: number | null;
}

/**
 * The 500 rule and the NPF rule (simple and, with a declination, full form) side by side.
 * @param inputs - focal length (mm 1..5000), f-number (0.7..32), crop factor (0.1..20), pixel
 *   pitch (um 0.5..50), optional declination (deg -89..89)
 * @returns the three limits, seconds
 * @throws RangeError on invalid input
 */
export function untrackedLimits(inputs: UntrackedInputs): UntrackedLimits {
  const i = inputs ?? ({} as UntrackedInputs);
  return {
    rule500S: rule500Seconds(i.focalLengthMm, i.cropFactor),
    npfSimpleS: npfSimpleSeconds(i.fNumber, i.pixelPitchUm, i.focalLengthMm),
    npfFullS: i.declinationDeg === undefined ? null : npfFullSeconds(i.fNumber, i.pixelPitchUm, i.focalLengthMm, i.declinationDeg),
  };
}

/** A suggested sub-exposure range, seconds. */
export interface SubExposureRange {
  minS: number;
  maxS: number;
  /** Where the figures come from. */
  basis: 'common practice';
}

/**
 * Sub-exposure range commonly used on a portable star tracker, by focal length (common practice:
 * tracking and polar-alignment errors grow with focal length, so longer lenses take shorter
 * subs): up to 35 mm 60..240 s, up to 85 mm 60..180 s, up to 200 mm 30..120 s, beyond 30..60 s.
 * A bright sky (light pollution, twilight) calls for the shorter end.
 * @param focalLengthMm - focal length, mm 1..5000
 * @returns the range, seconds
 * @throws RangeError on invalid input
 */
export function suggestedSubExposureRange(focalLengthMm: number): SubExposureRange {
  const f = focal(focalLengthMm);
  if (f <= 35) return { minS: 60, maxS: 240, basis: 'common practice' };
  if (f <= 85) return { minS: 60, maxS: 180, basis: 'common practice' };
  if (f <= 200) return { minS: 30, maxS: 120, basis: 'common practice' };
  return { minS: 30, maxS: 60, basis: 'common practice' };
}

/**
 * Frames needed to reach a total integration time: ceil(total / sub).
 * @param totalIntegrationS - wanted total exposure, seconds, above 0 and at most 86 400
 * @param subExposureS - one frame's exposure, seconds, above 0 and at most 86 400
 * @returns the number of frames (at least 1)
 * @throws RangeError on invalid input
 */
export function framesForIntegration(totalIntegrationS: number, subExposureS: number): number {
  const total = assertFiniteInRange(totalIntegrationS, 'totalIntegrationS', 0, MAX_INTEGRATION_S);
  const sub = assertFiniteInRange(subExposureS, 'subExposureS', 0, MAX_INTEGRATION_S);
  if (!(total > 0)) throw new RangeError(`totalIntegrationS must be above 0 (got ${total})`);
  if (!(sub > 0)) throw new RangeError(`subExposureS must be above 0 (got ${sub})`);
  // Round off float noise (600 / 0.1) before taking the ceiling.
  return Math.max(1, Math.ceil(Number((total / sub).toFixed(9))));
}

/** What ends the dark time for the sky: see {@link timeAvailable}. */
export type SkyDeadline = 'lineup-end' | 'moonrise';

/** Time left for the sky; see {@link timeAvailable}. */
export interface TimeAvailable {
  /** Seconds from the start to the first deadline, 0 when it has passed. */
  seconds: number;
  /** The deadline that comes first (lineup end on a tie). */
  limitedBy: SkyDeadline;
  /** When that is. */
  until: Date;
}

/**
 * Time left from a start to the lineup's end or moonrise, whichever comes first.
 * @param start - when shooting starts
 * @param lineupEnd - end of the lineup
 * @param moonrise - the moonrise that ends the dark time, or null/undefined when the Moon stays down
 * @returns seconds left (0 when the deadline has passed), which deadline, and when
 * @throws RangeError on an invalid Date
 */
export function timeAvailable(start: Date, lineupEnd: Date, moonrise?: Date | null): TimeAvailable {
  const s = assertValidDate(start, 'start').getTime();
  const end = assertValidDate(lineupEnd, 'lineupEnd').getTime();
  let limitedBy: SkyDeadline = 'lineup-end';
  let until = end;
  if (moonrise !== undefined && moonrise !== null) {
    const m = assertValidDate(moonrise, 'moonrise').getTime();
    if (m < end) { limitedBy = 'moonrise'; until = m; }
  }
  return { seconds: Math.max(0, (until - s) / MS_PER_SECOND), limitedBy, until: new Date(until) };
}

/** Inputs of {@link trackedStackPlan}. */
export interface TrackedStackInputs {
  /** One frame's exposure, seconds, above 0. */
  subExposureS: number;
  /** Wanted total exposure, seconds, above 0. */
  totalIntegrationS: number;
  /** Time between frames (read-out, dithering), seconds 0..3600 (default 0). */
  frameGapS?: number;
  start: Date;
  lineupEnd: Date;
  moonrise?: Date | null;
}

/** A tracked sky stack; see {@link trackedStackPlan}. */
export interface TrackedStackPlan {
  /** Frames needed for the total integration. */
  frames: number;
  /** Time the stack takes: frames x sub + (frames - 1) x gap, seconds. */
  durationS: number;
  /** Time left before the lineup ends or the Moon rises. */
  available: TimeAvailable;
  /** Whether the whole stack ends in time. */
  fits: boolean;
  /** Frames that end in time (at most `frames`). */
  framesInTime: number;
  /** Exposure those frames add up to, seconds. */
  integrationInTimeS: number;
}

/**
 * Frames and time for a tracked sky stack, and how much of it fits before the lineup ends or
 * the Moon rises.
 * @param inputs - sub-exposure and total (seconds, above 0 and at most 86 400), gap between
 *   frames (seconds 0..3600), start, lineup end and optional moonrise
 * @returns the stack's frames and duration and what fits in the time left
 * @throws RangeError on invalid input
 */
export function trackedStackPlan(inputs: TrackedStackInputs): TrackedStackPlan {
  const i = inputs ?? ({} as TrackedStackInputs);
  const frames = framesForIntegration(i.totalIntegrationS, i.subExposureS);
  const gap = assertFiniteInRange(i.frameGapS ?? 0, 'frameGapS', 0, 3600);
  const available = timeAvailable(i.start, i.lineupEnd, i.moonrise);
  const durationS = frames * i.subExposureS + (frames - 1) * gap;
  // Frames n end at n x sub + (n - 1) x gap <= available.
  const framesInTime = Math.max(0, Math.min(frames, Math.floor((available.seconds + gap) / (i.subExposureS + gap) + 1e-9)));
  return {
    frames,
    durationS,
    available,
    fits: durationS <= available.seconds + 1e-9,
    framesInTime,
    integrationInTimeS: framesInTime * i.subExposureS,
  };
}
