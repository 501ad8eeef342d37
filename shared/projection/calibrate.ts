/**
 * Calibration of a reference photo for the sky overlay: from the pixel where the user clicked
 * the landmark top (whose true azimuth and elevation angle the sightline gives), the horizontal
 * field of view and the image size, solve where the camera pointed. The roll comes from the
 * caller (default 0) or from two clicked points on the horizon.
 *
 * Closed-form solution in the rectilinear model of ./camera: the clicked pixel fixes the
 * landmark's direction in camera coordinates; the altitude of the optical axis follows from the
 * landmark's elevation angle (one sine equation), then the azimuth from the landmark's azimuth.
 */
import { assertFiniteInRange, assertPositiveUpTo } from '../guards';
import { DEG_PER_RAD, normalizeDegrees360, RAD_PER_DEG } from '../units';
import {
  assertPixelPoint,
  assertSkyDirection,
  type CameraPose,
  focalLengthPx,
  MAX_HORIZONTAL_FOV_DEG,
  MAX_IMAGE_SIDE_PX,
  MIN_HORIZONTAL_FOV_DEG,
  type PixelPoint,
  type SkyDirection,
  skyToPixel,
} from './camera';

/** Smallest distance between the two horizon points, pixels, for a usable roll. */
export const MIN_HORIZON_SPAN_PX = 1;

/** What the calibration needs. */
export interface CalibrationInput {
  /** Pixel where the landmark top was clicked (x right, y down, origin top-left). */
  clickPx: PixelPoint;
  /** The landmark top's true azimuth (0..360 deg) and elevation angle (-90..90 deg). */
  landmark: SkyDirection;
  /** Horizontal field of view, degrees 1..179. */
  horizontalFovDeg: number;
  /** Image width, pixels, above 0. */
  widthPx: number;
  /** Image height, pixels, above 0. */
  heightPx: number;
  /** Roll, degrees -180..180 (default 0); ignored when `horizonPx` is given. */
  rollDeg?: number;
  /** Two points clicked on a level horizon; when given, the roll is taken from them. */
  horizonPx?: readonly [PixelPoint, PixelPoint];
}

/** A solved calibration. */
export interface Calibration {
  /** The camera pose that puts the landmark top at the clicked pixel. */
  pose: CameraPose;
  /**
   * Distance between the clicked pixel and where the landmark top projects with `pose`, pixels.
   * About 0 when an exact solution exists; larger when none does (e.g. a click far to the side
   * with the landmark near the zenith) and the closest pose was returned.
   */
  residualPx: number;
}

/**
 * Roll of the camera from two points on a level horizon in the image. A level great circle (the
 * true horizon, altitude 0) is a straight line in a rectilinear image whose tilt equals the roll
 * whatever the pointing; a sea horizon a little below 0 is close to it near the image centre.
 * @param a - one horizon point, pixels (finite)
 * @param b - the other horizon point, pixels (finite), at least 1 px from `a`
 * @returns roll in degrees, (-90, 90]: positive when the horizon rises to the right
 * @throws RangeError on invalid input or points closer than 1 px
 */
export function rollFromHorizonDeg(a: PixelPoint, b: PixelPoint): number {
  const p = assertPixelPoint(a, 'a');
  const q = assertPixelPoint(b, 'b');
  const [left, right] = p.x <= q.x ? [p, q] : [q, p];
  const dx = right.x - left.x;
  const dy = right.y - left.y;
  if (Math.hypot(dx, dy) < MIN_HORIZON_SPAN_PX) {
    throw new RangeError(`horizon points must be at least ${MIN_HORIZON_SPAN_PX} px apart (got ${Math.hypot(dx, dy)})`);
  }
  // Pixel y runs down: a horizon rising to the right has dy < 0.
  const rollDeg = Math.atan2(-dy, dx) * DEG_PER_RAD;
  return rollDeg <= -90 ? rollDeg + 180 : rollDeg;
}

/**
 * Solves the camera pose so that the landmark top projects to the clicked pixel.
 * @param input - see {@link CalibrationInput} for fields and ranges
 * When the landmark lies past the zenith in the camera's vertical plane (a steep upward shot
 * with a very wide lens) a second pose fits the click as well; the solver returns the usual one,
 * with the landmark on the near side of the zenith.
 * @returns the pose (azimuth in [0, 360), altitude -90..90, the roll used, the FOV and image
 *   size given) and the residual of the clicked point in pixels
 * @throws RangeError on invalid input
 */
export function calibrateFromLandmark(input: CalibrationInput): Calibration {
  if (typeof input !== 'object' || input === null) throw new RangeError('calibration input must be an object');
  const click = assertPixelPoint(input.clickPx, 'clickPx');
  const landmark = assertSkyDirection(input.landmark, 'landmark');
  const fovDeg = assertFiniteInRange(input.horizontalFovDeg, 'horizontalFovDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG);
  const widthPx = assertPositiveUpTo(input.widthPx, 'widthPx', MAX_IMAGE_SIDE_PX);
  const heightPx = assertPositiveUpTo(input.heightPx, 'heightPx', MAX_IMAGE_SIDE_PX);
  const rollDeg =
    input.horizonPx !== undefined
      ? rollFromHorizonDeg(input.horizonPx[0], input.horizonPx[1])
      : assertFiniteInRange(input.rollDeg ?? 0, 'rollDeg', -180, 180);

  const f = focalLengthPx(fovDeg, widthPx);
  // The clicked pixel in rolled camera coordinates (right, up, forward = 1) ...
  const u = (click.x - widthPx / 2) / f;
  const v = -(click.y - heightPx / 2) / f;
  // ... and in unrolled ones (right level, up in the vertical plane of the optical axis).
  const roll = rollDeg * RAD_PER_DEG;
  const a0 = u * Math.cos(roll) + v * Math.sin(roll);
  const b0 = v * Math.cos(roll) - u * Math.sin(roll);
  const norm = Math.hypot(a0, b0, 1);
  const a = a0 / norm;
  const b = b0 / norm;
  const c = 1 / norm;

  // Up component of the landmark's direction for axis altitude t: b cos t + c sin t = sin H,
  // i.e. R sin(t + phi) = sin H with R = hypot(b, c), phi = atan2(b, c).
  const sinH = Math.sin(landmark.altitudeDeg * RAD_PER_DEG);
  const r = Math.hypot(b, c);
  const phi = Math.atan2(b, c);
  const s = Math.asin(Math.max(-1, Math.min(1, sinH / r)));
  const halfPi = Math.PI / 2;
  const inRange = (t: number): boolean => t >= -halfPi - 1e-12 && t <= halfPi + 1e-12;
  const candidates = [s - phi, Math.PI - s - phi, -Math.PI - s - phi].filter(inRange);
  // The first root is the natural one (t = H - phi when the click is on the vertical centre line).
  const tilt = Math.max(-halfPi, Math.min(halfPi, candidates[0] ?? s - phi));

  // Azimuth of the landmark relative to the optical axis, in the camera's level frame.
  const east = a;
  const north = c * Math.cos(tilt) - b * Math.sin(tilt);
  const relativeAzDeg = Math.atan2(east, north) * DEG_PER_RAD;

  const pose: CameraPose = {
    azimuthDeg: normalizeDegrees360(landmark.azimuthDeg - relativeAzDeg),
    altitudeDeg: tilt * DEG_PER_RAD,
    rollDeg,
    horizontalFovDeg: fovDeg,
    widthPx,
    heightPx,
  };
  const back = skyToPixel(pose, landmark);
  const residualPx = back.inFront ? Math.hypot(back.x - click.x, back.y - click.y) : Number.POSITIVE_INFINITY;
  return { pose, residualPx };
}
