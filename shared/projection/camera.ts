/**
 * Rectilinear (gnomonic, pinhole) camera model for the sky overlay: where a sky direction
 * (true azimuth, altitude) lands in a photo, and which direction a pixel looks at.
 *
 * Pinhole camera formulas as in Hartley & Zisserman, "Multiple View Geometry in Computer Vision"
 * (2nd ed., ch. 6, the basic pinhole model x = f X / Z): a direction with camera coordinates
 * (X right, Y up, Z along the optical axis) lands at `x = cx + f_px X / Z`, `y = cy - f_px Y / Z`
 * (pixel y runs down), and the horizontal field of view is `2 atan(w / 2f)`.
 *
 * Written here rather than taken from a package: the maths is a few lines of vector algebra on
 * top of our own azimuth/altitude conventions, and no maintained package does exactly this.
 *
 * Conventions: world axes East, North, Up; azimuth true, from north, clockwise, degrees;
 * altitude above the horizon, degrees. Sky points and the pose must use the same kind of
 * altitude (apparent, i.e. with refraction, as the sightline and the sky engine give by default).
 */
import { z } from 'zod';
import { assertFiniteInRange, assertPositiveUpTo } from '../guards';
import { DEG_PER_RAD, normalizeDegrees360, RAD_PER_DEG } from '../units';

/** Smallest horizontal field of view accepted, degrees. */
export const MIN_HORIZONTAL_FOV_DEG = 1;
/** Largest horizontal field of view accepted, degrees (a rectilinear lens cannot reach 180). */
export const MAX_HORIZONTAL_FOV_DEG = 179;
/** Largest image side accepted, pixels. */
export const MAX_IMAGE_SIDE_PX = 1_000_000;
/** Width of the 35 mm film frame (full frame), millimetres. */
export const FULL_FRAME_WIDTH_MM = 36;

/**
 * A camera pose and its image: where the optical axis points, the roll about it, the horizontal
 * field of view and the image size (square pixels). Saved with a calibrated photo.
 */
export const cameraPoseSchema = z.object({
  /** True azimuth of the optical axis, degrees 0..360. */
  azimuthDeg: z.number().finite().min(0).max(360),
  /** Altitude of the optical axis, degrees -90..90. */
  altitudeDeg: z.number().finite().min(-90).max(90),
  /**
   * Roll about the optical axis, degrees -180..180. Positive: the camera is turned clockwise as
   * the photographer sees it from behind, so a level horizon rises to the right in the image.
   */
  rollDeg: z.number().finite().min(-180).max(180).default(0),
  /** Horizontal field of view, degrees 1..179. */
  horizontalFovDeg: z.number().finite().min(MIN_HORIZONTAL_FOV_DEG).max(MAX_HORIZONTAL_FOV_DEG),
  /** Image width in pixels, above 0. */
  widthPx: z.number().finite().gt(0).max(MAX_IMAGE_SIDE_PX),
  /** Image height in pixels, above 0. */
  heightPx: z.number().finite().gt(0).max(MAX_IMAGE_SIDE_PX),
});
/** A camera pose and its image size; see {@link cameraPoseSchema}. */
export type CameraPose = z.infer<typeof cameraPoseSchema>;

/** A direction in the sky: true azimuth (degrees 0..360) and altitude (degrees -90..90). */
export interface SkyDirection {
  azimuthDeg: number;
  altitudeDeg: number;
}

/** A point in the image, pixels: x to the right, y down, origin at the top-left corner. */
export interface PixelPoint {
  x: number;
  y: number;
}

/** Where a sky direction lands in the image. */
export interface ProjectedPoint extends PixelPoint {
  /** True when the direction is in front of the camera (positive along the optical axis). */
  inFront: boolean;
}

type Vec3 = readonly [number, number, number];

/** Orthonormal camera axes in world East-North-Up coordinates, with the pixel scale. */
export interface CameraBasis {
  /** Unit vector to the image's right. */
  right: Vec3;
  /** Unit vector to the image's top. */
  up: Vec3;
  /** Unit vector along the optical axis. */
  forward: Vec3;
  /** Focal length in pixels: (width / 2) / tan(horizontal FOV / 2). */
  focalPx: number;
  /** Image centre x, pixels (width / 2). */
  centreX: number;
  /** Image centre y, pixels (height / 2). */
  centreY: number;
}

/**
 * Checks a camera pose field by field.
 * @param pose - the pose (see {@link cameraPoseSchema} for ranges); `rollDeg` may be omitted (0)
 * @returns the pose with `rollDeg` filled in
 * @throws RangeError naming the first bad field
 */
export function assertCameraPose(pose: unknown): CameraPose {
  if (typeof pose !== 'object' || pose === null) throw new RangeError('pose must be an object');
  const p = pose as Partial<CameraPose>;
  return {
    azimuthDeg: assertFiniteInRange(p.azimuthDeg, 'pose.azimuthDeg', 0, 360),
    altitudeDeg: assertFiniteInRange(p.altitudeDeg, 'pose.altitudeDeg', -90, 90),
    rollDeg: assertFiniteInRange(p.rollDeg ?? 0, 'pose.rollDeg', -180, 180),
    horizontalFovDeg: assertFiniteInRange(p.horizontalFovDeg, 'pose.horizontalFovDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG),
    widthPx: assertPositiveUpTo(p.widthPx, 'pose.widthPx', MAX_IMAGE_SIDE_PX),
    heightPx: assertPositiveUpTo(p.heightPx, 'pose.heightPx', MAX_IMAGE_SIDE_PX),
  };
}

/**
 * Checks a sky direction.
 * @param direction - azimuth 0..360 deg, altitude -90..90 deg
 * @param name - the argument's name for the message
 * @returns the direction
 * @throws RangeError when a field is not finite or out of range
 */
export function assertSkyDirection(direction: unknown, name = 'direction'): SkyDirection {
  const d = (direction ?? {}) as Partial<SkyDirection>;
  return {
    azimuthDeg: assertFiniteInRange(d.azimuthDeg, `${name}.azimuthDeg`, 0, 360),
    altitudeDeg: assertFiniteInRange(d.altitudeDeg, `${name}.altitudeDeg`, -90, 90),
  };
}

/**
 * Checks a pixel point (any finite coordinates; points outside the image are allowed).
 * @param point - x and y in pixels
 * @param name - the argument's name for the message
 * @returns the point
 * @throws RangeError when a coordinate is not finite
 */
export function assertPixelPoint(point: unknown, name = 'point'): PixelPoint {
  const p = (point ?? {}) as Partial<PixelPoint>;
  return { x: assertFiniteInRange(p.x, `${name}.x`), y: assertFiniteInRange(p.y, `${name}.y`) };
}

/**
 * Horizontal field of view of a pinhole camera, `2 atan(w / 2f)` (Hartley & Zisserman,
 * Multiple View Geometry, the pinhole model).
 * @param focalLengthMm - focal length, mm, above 0 and at most 10 000
 * @param sensorWidthMm - sensor (or film) width, mm, above 0 and at most 1 000
 * @returns the horizontal field of view, degrees (0..180)
 * @throws RangeError on invalid input
 */
export function horizontalFovDeg(focalLengthMm: number, sensorWidthMm: number): number {
  assertPositiveUpTo(focalLengthMm, 'focalLengthMm', 10_000);
  assertPositiveUpTo(sensorWidthMm, 'sensorWidthMm', 1000);
  return 2 * Math.atan(sensorWidthMm / (2 * focalLengthMm)) * DEG_PER_RAD;
}

/**
 * Horizontal field of view from a 35 mm-equivalent focal length (a 36 mm-wide frame).
 * @param focal35Mm - 35 mm-equivalent focal length, mm, above 0 and at most 10 000
 * @returns the horizontal field of view, degrees (0..180)
 * @throws RangeError on invalid input
 */
export function fovFrom35mmEquivalent(focal35Mm: number): number {
  assertPositiveUpTo(focal35Mm, 'focal35Mm', 10_000);
  return horizontalFovDeg(focal35Mm, FULL_FRAME_WIDTH_MM);
}

/**
 * Focal length in pixels for a horizontal field of view and image width: `(w/2) / tan(fov/2)`.
 * @param horizontalFovDegrees - horizontal field of view, degrees 1..179
 * @param widthPx - image width, pixels, above 0
 * @returns focal length, pixels
 * @throws RangeError on invalid input
 */
export function focalLengthPx(horizontalFovDegrees: number, widthPx: number): number {
  assertFiniteInRange(horizontalFovDegrees, 'horizontalFovDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG);
  assertPositiveUpTo(widthPx, 'widthPx', MAX_IMAGE_SIDE_PX);
  return widthPx / 2 / Math.tan((horizontalFovDegrees / 2) * RAD_PER_DEG);
}

/** Unit vector (East, North, Up) of a direction given in radians. */
function unitVector(azimuthRad: number, altitudeRad: number): Vec3 {
  const c = Math.cos(altitudeRad);
  return [c * Math.sin(azimuthRad), c * Math.cos(azimuthRad), Math.sin(altitudeRad)];
}

const dot = (a: Vec3, b: Vec3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];

/**
 * The camera's axes and pixel scale for a pose (computed once, reused for many points).
 * @param pose - a camera pose (see {@link cameraPoseSchema})
 * @returns the camera basis
 * @throws RangeError on an invalid pose
 */
export function cameraBasis(pose: CameraPose): CameraBasis {
  const p = assertCameraPose(pose);
  const az = p.azimuthDeg * RAD_PER_DEG;
  const alt = p.altitudeDeg * RAD_PER_DEG;
  const roll = p.rollDeg * RAD_PER_DEG;
  const forward = unitVector(az, alt);
  // Unrolled axes: right is level (the azimuth fixes it even at the zenith), up = right x forward.
  const right0: Vec3 = [Math.cos(az), -Math.sin(az), 0];
  const up0: Vec3 = [-Math.sin(alt) * Math.sin(az), -Math.sin(alt) * Math.cos(az), Math.cos(alt)];
  const cr = Math.cos(roll);
  const sr = Math.sin(roll);
  // Positive roll tips the camera's top toward its right.
  const right: Vec3 = [right0[0] * cr - up0[0] * sr, right0[1] * cr - up0[1] * sr, right0[2] * cr - up0[2] * sr];
  const up: Vec3 = [up0[0] * cr + right0[0] * sr, up0[1] * cr + right0[1] * sr, up0[2] * cr + right0[2] * sr];
  return { right, up, forward, focalPx: focalLengthPx(p.horizontalFovDeg, p.widthPx), centreX: p.widthPx / 2, centreY: p.heightPx / 2 };
}

/**
 * Projects a direction with a precomputed basis (no input checks: for loops over checked data).
 * @param basis - from {@link cameraBasis}
 * @param azimuthDeg - true azimuth, degrees
 * @param altitudeDeg - altitude, degrees
 * @returns the pixel; x and y are NaN when the direction is not in front of the camera
 */
export function projectWithBasis(basis: CameraBasis, azimuthDeg: number, altitudeDeg: number): ProjectedPoint {
  const d = unitVector(azimuthDeg * RAD_PER_DEG, altitudeDeg * RAD_PER_DEG);
  const z = dot(d, basis.forward);
  if (!(z > 0)) return { x: Number.NaN, y: Number.NaN, inFront: false };
  return {
    x: basis.centreX + (basis.focalPx * dot(d, basis.right)) / z,
    y: basis.centreY - (basis.focalPx * dot(d, basis.up)) / z,
    inFront: true,
  };
}

/**
 * Where a sky direction lands in the image (rectilinear projection).
 * @param pose - camera pose and image size (see {@link cameraPoseSchema})
 * @param direction - true azimuth 0..360 deg, altitude -90..90 deg
 * @returns pixel x (right) and y (down) from the top-left corner, image centre at (w/2, h/2);
 *   the point may lie outside the image. When the direction is behind the camera (90 deg or
 *   more from the optical axis) `inFront` is false and x, y are NaN.
 * @throws RangeError on invalid input
 */
export function skyToPixel(pose: CameraPose, direction: SkyDirection): ProjectedPoint {
  const d = assertSkyDirection(direction);
  return projectWithBasis(cameraBasis(pose), d.azimuthDeg, d.altitudeDeg);
}

/**
 * The sky direction seen at a pixel (inverse of {@link skyToPixel} for points in front).
 * @param pose - camera pose and image size (see {@link cameraPoseSchema})
 * @param point - pixel x (right) and y (down), any finite values (outside the image allowed)
 * @returns true azimuth in [0, 360) deg and altitude in [-90, 90] deg
 * @throws RangeError on invalid input
 */
export function pixelToSky(pose: CameraPose, point: PixelPoint): SkyDirection {
  const b = cameraBasis(pose);
  const p = assertPixelPoint(point);
  const u = (p.x - b.centreX) / b.focalPx;
  const v = -(p.y - b.centreY) / b.focalPx;
  const e = u * b.right[0] + v * b.up[0] + b.forward[0];
  const n = u * b.right[1] + v * b.up[1] + b.forward[1];
  const up = u * b.right[2] + v * b.up[2] + b.forward[2];
  const horizontal = Math.hypot(e, n);
  return {
    azimuthDeg: normalizeDegrees360(Math.atan2(e, n) * DEG_PER_RAD),
    altitudeDeg: Math.atan2(up, horizontal) * DEG_PER_RAD,
  };
}

/**
 * Angular separation between two sky directions (haversine-free vector form, exact at all angles).
 * @param a - first direction (azimuth 0..360 deg, altitude -90..90 deg)
 * @param b - second direction
 * @returns the separation, degrees 0..180
 * @throws RangeError on invalid input
 */
export function angularSeparationDeg(a: SkyDirection, b: SkyDirection): number {
  const p = assertSkyDirection(a, 'a');
  const q = assertSkyDirection(b, 'b');
  const u = unitVector(p.azimuthDeg * RAD_PER_DEG, p.altitudeDeg * RAD_PER_DEG);
  const w = unitVector(q.azimuthDeg * RAD_PER_DEG, q.altitudeDeg * RAD_PER_DEG);
  const cross = Math.hypot(u[1] * w[2] - u[2] * w[1], u[2] * w[0] - u[0] * w[2], u[0] * w[1] - u[1] * w[0]);
  return Math.atan2(cross, dot(u, w)) * DEG_PER_RAD;
}
