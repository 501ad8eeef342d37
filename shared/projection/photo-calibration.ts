/**
 * Solving a reference photo's calibration from what the user gave: the clicked landmark top,
 * the lens as focal length + sensor width, a 35 mm-equivalent focal length or an angle, and
 * optionally two horizon points for the roll.
 */
import type { PhotoCalibrationInput, PhotoFovInput } from '../schemas/photo';
import { calibrateFromLandmark, MIN_HORIZON_SPAN_PX, type Calibration } from './calibrate';
import {
  assertSkyDirection,
  fovFrom35mmEquivalent,
  horizontalFovDeg,
  MAX_HORIZONTAL_FOV_DEG,
  MIN_HORIZONTAL_FOV_DEG,
  type SkyDirection,
} from './camera';

/** A calibration input that cannot be solved, with the dotted path of the offending field. */
export class CalibrationInputError extends RangeError {
  override name = 'CalibrationInputError';
  constructor(readonly field: string, message: string) {
    super(message);
  }
}

/**
 * The horizontal field of view the input describes.
 * @param fov - focal length + sensor width (FOV = 2 atan(w / 2f)), 35 mm-equivalent focal length
 *   (a 36 mm wide frame), or the angle itself
 * @returns degrees
 * @throws CalibrationInputError (a RangeError) when the angle falls outside 1..179 degrees
 */
export function horizontalFovFromInput(fov: PhotoFovInput): number {
  let deg: number;
  let field: string;
  if (fov.kind === 'focal') {
    deg = horizontalFovDeg(fov.focalLengthMm, fov.sensorWidthMm);
    field = 'fov.focalLengthMm';
  } else if (fov.kind === 'equivalent35') {
    deg = fovFrom35mmEquivalent(fov.focal35Mm);
    field = 'fov.focal35Mm';
  } else {
    deg = fov.horizontalFovDeg;
    field = 'fov.horizontalFovDeg';
  }
  if (!(deg >= MIN_HORIZONTAL_FOV_DEG && deg <= MAX_HORIZONTAL_FOV_DEG)) {
    throw new CalibrationInputError(
      field,
      `That lens gives a ${deg.toFixed(1)} deg field of view; the overlay needs ${MIN_HORIZONTAL_FOV_DEG}-${MAX_HORIZONTAL_FOV_DEG} deg (a rectilinear lens)`,
    );
  }
  return deg;
}

/**
 * Solves the camera pose of a photo from the user's calibration input.
 * @param input - clicks in the upright original's pixels and the lens (schema-checked shape)
 * @param landmark - the landmark top's true azimuth 0..360 and elevation angle -90..90, degrees
 * @param size - the upright original's width and height, px (above 0)
 * @returns the pose and the click's residual, px
 * @throws CalibrationInputError (a RangeError) naming the field when a click lies outside the image,
 *   the horizon points are closer than 1 px, or the field of view is out of range; RangeError on an
 *   invalid landmark or size
 */
export function solvePhotoCalibration(
  input: PhotoCalibrationInput,
  landmark: SkyDirection,
  size: { widthPx: number; heightPx: number },
): Calibration {
  const direction = assertSkyDirection(landmark, 'landmark');
  const { widthPx, heightPx } = size;
  if (!(widthPx > 0 && heightPx > 0 && Number.isFinite(widthPx) && Number.isFinite(heightPx))) {
    throw new RangeError(`image size must be positive (got ${widthPx} x ${heightPx})`);
  }
  const inside = (p: { x: number; y: number }, field: string, what: string) => {
    if (!(p.x >= 0 && p.x <= widthPx && p.y >= 0 && p.y <= heightPx)) {
      throw new CalibrationInputError(field, `The ${what} must lie inside the ${widthPx} x ${heightPx} px photo`);
    }
  };
  inside(input.landmarkTopPx, 'landmarkTopPx', 'landmark top');
  if (input.horizonPx) {
    const [a, b] = input.horizonPx;
    inside(a, 'horizonPx.0', 'first horizon point');
    inside(b, 'horizonPx.1', 'second horizon point');
    if (Math.hypot(b.x - a.x, b.y - a.y) < MIN_HORIZON_SPAN_PX) {
      throw new CalibrationInputError('horizonPx', 'Mark two different points on the horizon');
    }
  }
  return calibrateFromLandmark({
    clickPx: input.landmarkTopPx,
    landmark: direction,
    horizontalFovDeg: horizontalFovFromInput(input.fov),
    widthPx,
    heightPx,
    horizonPx: input.horizonPx,
  });
}
