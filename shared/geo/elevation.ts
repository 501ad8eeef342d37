/**
 * How high the landmark stands in the view: elevation angles of its top and base from the camera
 * eye, with Earth curvature and terrestrial refraction, and its angular width.
 *
 * The model is the surveyor's: over a horizontal distance d, a point of height h above sea level
 * appears at height h - d^2 / (2R) (1 - k) relative to the eye's horizontal plane, where R is the
 * Earth's mean radius and k the coefficient of terrestrial refraction (the light ray's curvature as
 * a fraction of the Earth's). The elevation angle is atan((h - drop - eye) / d), d measured at sea
 * level. Against the exact geometry of a sphere of effective radius R / (1 - k) (measured, and
 * checked in tests/unit/geo/elevation.test.ts) this differs, up to 50 km, by less than 0.001 deg
 * where the angle is under 5 deg and the eye below 1000 m (the usual case), by less than 0.005 deg
 * with eye and landmark below 1000 m at any angle, and by up to 0.04 deg for mountain heights at steep angles (the
 * horizontal run at height h is d (1 + h / R), which the formula ignores). All of it is well below
 * the uncertainty of k itself: 0.13 is a daytime average; it ranges from about 0 to 0.25, and
 * more over cold water at night.
 */
import type { Landmark, Vantage } from '../schemas/geometry';
import { landmarkSchema, vantageSchema } from '../schemas/geometry';
import { distanceM as geodesicDistanceM } from './geodesy';
import { assertFiniteInRange, parseOrThrow } from '../guards';
import { DEG_PER_RAD } from '../units';

/** Mean Earth radius used by the curvature-and-refraction drop, metres. */
export const EARTH_RADIUS_M = 6_371_000;
/** Coefficient of terrestrial refraction, dimensionless: the common survey value. */
export const DEFAULT_REFRACTION_COEFFICIENT = 0.13;
/** Smallest horizontal distance the elevation functions accept, metres: pins closer than this coincide. */
export const MIN_SIGHTLINE_DISTANCE_M = 0.01;
/**
 * Largest horizontal distance the elevation functions accept, metres. The drop formula is a
 * small-angle approximation; 1000 km is far beyond any visible landmark (a 2000 m peak seen from
 * sea level sinks below the horizon at about 170 km) and still within about 1 % of exact.
 */
export const MAX_SIGHTLINE_DISTANCE_M = 1_000_000;
/** Range of refraction coefficients accepted: from sub-refraction to k = 1 (ray as curved as the Earth). */
export const MIN_REFRACTION_COEFFICIENT = -1;
/** Upper bound of the refraction coefficient; at 1 refraction cancels curvature. */
export const MAX_REFRACTION_COEFFICIENT = 1;
/** Heights above sea level accepted for eye and points, metres (Dead Sea shore to above Everest). */
const MIN_HEIGHT_M = -1_000;
const MAX_HEIGHT_M = 12_000;

function checkDistance(distance: number): void {
  assertFiniteInRange(distance, 'distanceM', MIN_SIGHTLINE_DISTANCE_M, MAX_SIGHTLINE_DISTANCE_M);
}

function checkK(k: number): void {
  assertFiniteInRange(k, 'k (refraction coefficient)', MIN_REFRACTION_COEFFICIENT, MAX_REFRACTION_COEFFICIENT);
}

/**
 * Apparent drop of a distant point below the eye's horizontal plane from Earth curvature, less
 * the lift from terrestrial refraction: `d^2 / (2 R) (1 - k)`, R = {@link EARTH_RADIUS_M}.
 *
 * @param distance - horizontal distance in metres, 0..{@link MAX_SIGHTLINE_DISTANCE_M}
 * @param k - refraction coefficient, -1..1 (default {@link DEFAULT_REFRACTION_COEFFICIENT}; 0 for
 *   curvature alone)
 * @returns the drop in metres, >= 0 (0 at k = 1)
 * @throws RangeError on NaN or out-of-range input
 */
export function curvatureRefractionDropM(distance: number, k: number = DEFAULT_REFRACTION_COEFFICIENT): number {
  assertFiniteInRange(distance, 'distanceM', 0, MAX_SIGHTLINE_DISTANCE_M);
  checkK(k);
  return (distance * distance) / (2 * EARTH_RADIUS_M) * (1 - k);
}

/**
 * Apparent elevation angle of a point seen from an eye, with curvature and refraction
 * (see the module comment for the model).
 *
 * @param eyeElevation - eye height above sea level, metres, -1000..12000
 * @param pointElevation - the point's height above sea level, metres, -1000..12000
 * @param distance - horizontal (geodesic) distance eye to point, metres,
 *   {@link MIN_SIGHTLINE_DISTANCE_M}..{@link MAX_SIGHTLINE_DISTANCE_M}
 * @param k - refraction coefficient, -1..1, default 0.13
 * @returns elevation angle in degrees, -90..90 (negative below the eye's horizontal plane)
 * @throws RangeError on NaN or out-of-range input
 */
export function elevationAngleDeg(
  eyeElevation: number,
  pointElevation: number,
  distance: number,
  k: number = DEFAULT_REFRACTION_COEFFICIENT,
): number {
  assertFiniteInRange(eyeElevation, 'eyeElevationM', MIN_HEIGHT_M, MAX_HEIGHT_M);
  assertFiniteInRange(pointElevation, 'pointElevationM', MIN_HEIGHT_M, MAX_HEIGHT_M);
  checkDistance(distance);
  checkK(k);
  const drop = (distance * distance) / (2 * EARTH_RADIUS_M) * (1 - k);
  return Math.atan2(pointElevation - drop - eyeElevation, distance) * DEG_PER_RAD;
}

/**
 * Height of the camera eye above sea level: ground elevation plus camera height.
 *
 * @param vantage - the vantage (elevationM -500..9000 m, cameraHeightM 0..100 m)
 * @returns eye elevation in metres above sea level
 * @throws RangeError when the vantage does not fit its schema
 */
export function eyeElevationM(vantage: Vantage): number {
  const v = parseOrThrow('vantage', vantageSchema, vantage);
  return v.elevationM + v.cameraHeightM;
}

/** Elevation angles of a landmark's top and base as seen from the vantage eye. */
export interface LandmarkElevationAngles {
  /** Apparent elevation angle of the landmark top (base elevation + height), degrees. */
  topDeg: number;
  /** Apparent elevation angle of the landmark base, degrees. */
  baseDeg: number;
  /** Horizontal (WGS84 geodesic) distance vantage to landmark, metres. */
  distanceM: number;
}

/**
 * Elevation angles of the landmark top and base from the vantage eye (ground elevation + camera
 * height), with curvature and refraction.
 *
 * @param vantage - where the camera stands
 * @param landmark - the foreground subject
 * @param options - `k`: refraction coefficient -1..1 (default 0.13); `distanceM`: the horizontal
 *   distance if the caller already has it (metres), else it is computed on WGS84
 * @returns top and base elevation angles in degrees and the distance used
 * @throws RangeError on invalid vantage or landmark, or when they are less than 1 cm apart
 */
export function landmarkElevationAnglesDeg(
  vantage: Vantage,
  landmark: Landmark,
  options: { k?: number; distanceM?: number } = {},
): LandmarkElevationAngles {
  const v = parseOrThrow('vantage', vantageSchema, vantage);
  const l = parseOrThrow('landmark', landmarkSchema, landmark);
  const eye = v.elevationM + v.cameraHeightM;
  const k = options.k ?? DEFAULT_REFRACTION_COEFFICIENT;
  const distance = options.distanceM ?? geodesicDistanceM(v, l);
  if (distance < MIN_SIGHTLINE_DISTANCE_M) {
    throw new RangeError(`The vantage and the landmark coincide (distance ${distance} m): move one of them`);
  }
  return {
    topDeg: elevationAngleDeg(eye, l.baseElevationM + l.heightM, distance, k),
    baseDeg: elevationAngleDeg(eye, l.baseElevationM, distance, k),
    distanceM: distance,
  };
}

/**
 * Angular width of a landmark: the azimuth span `2 atan(w / (2 d))` of a width w seen square-on
 * at horizontal distance d. This is the span in azimuth, which is what a frame needs; near the
 * horizon it equals the apparent angular size.
 *
 * @param widthM - landmark width in metres, 0..10000
 * @param distance - horizontal distance in metres,
 *   {@link MIN_SIGHTLINE_DISTANCE_M}..{@link MAX_SIGHTLINE_DISTANCE_M}
 * @returns angular width in degrees, 0..180
 * @throws RangeError on NaN or out-of-range input
 */
export function angularWidthDeg(widthM: number, distance: number): number {
  assertFiniteInRange(widthM, 'widthM', 0, 10_000);
  checkDistance(distance);
  return 2 * Math.atan(widthM / (2 * distance)) * DEG_PER_RAD;
}
