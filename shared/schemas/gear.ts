/**
 * Gear: the camera bodies and lenses a user owns, and whether a star tracker is at hand. Users
 * type their own gear; no list of makes or models is shipped. Derived figures (crop factor, pixel
 * pitch) are in shared/shotplan/gear.ts.
 */
import { z } from 'zod';
import { hasNoNul, NUL_MESSAGE } from './text';

/** Smallest and largest sensor side accepted, mm (phone sensors to large medium format). */
export const MIN_SENSOR_SIDE_MM = 1;
export const MAX_SENSOR_SIDE_MM = 100;
/** Pixel pitch bounds, micrometres. */
export const MIN_PIXEL_PITCH_UM = 0.5;
export const MAX_PIXEL_PITCH_UM = 50;
/** Pixel count bounds, megapixels. */
export const MIN_MEGAPIXELS = 0.1;
export const MAX_MEGAPIXELS = 1000;
/** Image width bounds, pixels. */
export const MIN_WIDTH_PX = 100;
export const MAX_WIDTH_PX = 100_000;
/** Focal length bounds, mm (rectilinear lenses; fisheye projections are not modelled). */
export const MIN_FOCAL_LENGTH_MM = 1;
export const MAX_FOCAL_LENGTH_MM = 5000;
/** Widest-aperture bounds, f-number. */
export const MIN_F_NUMBER = 0.7;
export const MAX_F_NUMBER = 32;
/** How far a given pixel pitch may differ from the one the pixel count gives, as a fraction. */
export const PIXEL_FIGURES_TOLERANCE = 0.1;
/** Longest gear name, characters. */
export const MAX_GEAR_NAME_CHARS = 80;
/** Most bodies and lenses in one gear list. */
export const MAX_GEAR_BODIES = 50;
export const MAX_GEAR_LENSES = 100;

/**
 * Pixel pitch of square pixels from the sensor size and a pixel count: `1000 w / widthPx`, or
 * `1000 sqrt(w h / (MP x 1e6))` from megapixels. Not range-checked (the schemas below check the
 * figures first); shared/shotplan re-exports it.
 * @param sensorWidthMm - sensor width, mm
 * @param sensorHeightMm - sensor height, mm
 * @param count - `{ widthPx }` (pixels across the width) or `{ megapixels }` (millions of pixels)
 * @returns the pitch, micrometres
 */
export function pixelPitchFromCountUm(
  sensorWidthMm: number,
  sensorHeightMm: number,
  count: { widthPx: number } | { megapixels: number },
): number {
  if ('widthPx' in count) return (1000 * sensorWidthMm) / count.widthPx;
  return 1000 * Math.sqrt((sensorWidthMm * sensorHeightMm) / (count.megapixels * 1e6));
}

const gearNameSchema = (what: string) =>
  z.string({ error: `Name the ${what}` }).trim().min(1, `Name the ${what}`).max(MAX_GEAR_NAME_CHARS, `A name is at most ${MAX_GEAR_NAME_CHARS} characters`).refine(hasNoNul, NUL_MESSAGE);

const boundedNumber = (label: string, unit: string, min: number, max: number) =>
  z.number({ error: `${label} must be a number` })
    .finite(`${label} must be a finite number`)
    .min(min, `${label} must be between ${min} and ${max} ${unit}`)
    .max(max, `${label} must be between ${min} and ${max} ${unit}`);

function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / b;
}

/**
 * A camera body: sensor width and height (mm, the width being the long side) and one or more of
 * pixel pitch (um), width in pixels, megapixels. When several are given they must agree within
 * 10 %; the pitch is then taken from the pitch, else from the width in pixels, else from the
 * megapixels.
 */
export const cameraBodySchema = z.object({
  name: gearNameSchema('camera body'),
  sensorWidthMm: boundedNumber('Sensor width', 'mm', MIN_SENSOR_SIDE_MM, MAX_SENSOR_SIDE_MM),
  sensorHeightMm: boundedNumber('Sensor height', 'mm', MIN_SENSOR_SIDE_MM, MAX_SENSOR_SIDE_MM),
  pixelPitchUm: boundedNumber('Pixel pitch', 'um', MIN_PIXEL_PITCH_UM, MAX_PIXEL_PITCH_UM).optional(),
  widthPx: boundedNumber('Image width', 'px', MIN_WIDTH_PX, MAX_WIDTH_PX).int('Image width must be a whole number of pixels').optional(),
  megapixels: boundedNumber('Pixel count', 'megapixels', MIN_MEGAPIXELS, MAX_MEGAPIXELS).optional(),
}).superRefine((b, ctx) => {
  if (b.sensorHeightMm > b.sensorWidthMm) {
    ctx.addIssue({ code: 'custom', path: ['sensorHeightMm'], message: 'Give the long side of the sensor as its width' });
  }
  if (b.pixelPitchUm === undefined && b.widthPx === undefined && b.megapixels === undefined) {
    ctx.addIssue({ code: 'custom', path: ['pixelPitchUm'], message: 'Give the pixel pitch, the image width in pixels or the megapixels' });
    return;
  }
  const fromWidth = b.widthPx === undefined ? undefined : pixelPitchFromCountUm(b.sensorWidthMm, b.sensorHeightMm, { widthPx: b.widthPx });
  const fromCount = b.megapixels === undefined ? undefined : pixelPitchFromCountUm(b.sensorWidthMm, b.sensorHeightMm, { megapixels: b.megapixels });
  const pitchFromPixels = fromWidth ?? fromCount;
  if (b.pixelPitchUm !== undefined && pitchFromPixels !== undefined && relativeDifference(b.pixelPitchUm, pitchFromPixels) > PIXEL_FIGURES_TOLERANCE) {
    ctx.addIssue({
      code: 'custom',
      path: ['pixelPitchUm'],
      message: `Pixel pitch does not match the pixel count (which gives about ${pitchFromPixels.toFixed(2)} um)`,
    });
  }
  if (fromWidth !== undefined && fromCount !== undefined && relativeDifference(fromWidth, fromCount) > PIXEL_FIGURES_TOLERANCE) {
    ctx.addIssue({ code: 'custom', path: ['widthPx'], message: 'Image width in pixels does not match the megapixels' });
  }
});
export type CameraBody = z.infer<typeof cameraBodySchema>;

/**
 * A rectilinear lens: a prime's `focalLengthMm`, or a zoom's `zoomMinMm` and `zoomMaxMm` (not
 * both), and its widest aperture as an f-number (the smallest N, e.g. 1.4 for f/1.4; for a zoom
 * whose widest aperture changes with the focal length, the one at the short end).
 */
export const lensSchema = z.object({
  name: gearNameSchema('lens'),
  focalLengthMm: boundedNumber('Focal length', 'mm', MIN_FOCAL_LENGTH_MM, MAX_FOCAL_LENGTH_MM).optional(),
  zoomMinMm: boundedNumber('Shortest focal length', 'mm', MIN_FOCAL_LENGTH_MM, MAX_FOCAL_LENGTH_MM).optional(),
  zoomMaxMm: boundedNumber('Longest focal length', 'mm', MIN_FOCAL_LENGTH_MM, MAX_FOCAL_LENGTH_MM).optional(),
  widestApertureF: boundedNumber('Widest aperture', '(f-number)', MIN_F_NUMBER, MAX_F_NUMBER),
}).superRefine((l, ctx) => {
  const zoomGiven = l.zoomMinMm !== undefined || l.zoomMaxMm !== undefined;
  if (l.focalLengthMm !== undefined && zoomGiven) {
    ctx.addIssue({ code: 'custom', path: ['focalLengthMm'], message: 'Give a focal length for a prime or a zoom range, not both' });
    return;
  }
  if (l.focalLengthMm !== undefined) return;
  if (!zoomGiven) {
    ctx.addIssue({ code: 'custom', path: ['focalLengthMm'], message: 'Give the focal length, or both ends of the zoom range' });
    return;
  }
  if (l.zoomMinMm === undefined) ctx.addIssue({ code: 'custom', path: ['zoomMinMm'], message: 'Give the shortest focal length of the zoom' });
  if (l.zoomMaxMm === undefined) ctx.addIssue({ code: 'custom', path: ['zoomMaxMm'], message: 'Give the longest focal length of the zoom' });
  if (l.zoomMinMm !== undefined && l.zoomMaxMm !== undefined && !(l.zoomMaxMm > l.zoomMinMm)) {
    ctx.addIssue({ code: 'custom', path: ['zoomMaxMm'], message: 'The longest focal length must be above the shortest' });
  }
});
export type Lens = z.infer<typeof lensSchema>;

/** A user's gear: bodies, lenses, and whether a star tracker is available. */
export const gearProfileSchema = z.object({
  bodies: z.array(cameraBodySchema).max(MAX_GEAR_BODIES, `At most ${MAX_GEAR_BODIES} camera bodies`).default([]),
  lenses: z.array(lensSchema).max(MAX_GEAR_LENSES, `At most ${MAX_GEAR_LENSES} lenses`).default([]),
  starTrackerAvailable: z.boolean({ error: 'Say whether a star tracker is available (true or false)' }).default(false),
});
export type GearProfile = z.infer<typeof gearProfileSchema>;
export type GearProfileBody = z.input<typeof gearProfileSchema>;

/**
 * The gear chosen for one shot plan: a body, a lens, the focal length and f-number to use (both
 * optional: the lens's shortest focal length and widest aperture), and whether the sky is tracked.
 */
export const shotGearSchema = z.object({
  body: cameraBodySchema,
  lens: lensSchema,
  focalLengthMm: boundedNumber('Focal length', 'mm', MIN_FOCAL_LENGTH_MM, MAX_FOCAL_LENGTH_MM).optional(),
  fNumber: boundedNumber('Aperture', '(f-number)', MIN_F_NUMBER, MAX_F_NUMBER).optional(),
  tracked: z.boolean({ error: 'Say whether the sky is tracked (true or false)' }).default(false),
}).superRefine((g, ctx) => {
  const min = g.lens.focalLengthMm ?? g.lens.zoomMinMm;
  const max = g.lens.focalLengthMm ?? g.lens.zoomMaxMm;
  if (g.focalLengthMm !== undefined && min !== undefined && max !== undefined && (g.focalLengthMm < min || g.focalLengthMm > max)) {
    ctx.addIssue({ code: 'custom', path: ['focalLengthMm'], message: min === max ? `This lens has a focal length of ${min} mm` : `This lens zooms from ${min} to ${max} mm` });
  }
  if (g.fNumber !== undefined && g.fNumber < g.lens.widestApertureF) {
    ctx.addIssue({ code: 'custom', path: ['fNumber'], message: `This lens opens to f/${g.lens.widestApertureF} at most` });
  }
});
export type ShotGear = z.infer<typeof shotGearSchema>;
export type ShotGearBody = z.input<typeof shotGearSchema>;
