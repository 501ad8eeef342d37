/**
 * The inverse question: where to stand so that the landmark lines up with a target.
 *
 * Given the target's true azimuth at the chosen time (from the sky engine), the camera's eye
 * height above sea level and the elevation angle at which the landmark top should stand, the spot
 * is on the geodesic through the landmark, on the side away from the target, at the distance
 * where the landmark top appears at that angle.
 *
 * Distance: with the curvature-and-refraction model of ./elevation (tan e = (H - c d^2) / d,
 * H = top - eye, c = (1 - k) / (2R)), the distance solves c d^2 + d tan e - H = 0, a quadratic:
 * solved in closed form (numerically stable), so no iteration is needed.
 *
 * Direction: the spot is *not* simply at "azimuth + 180" from the landmark: meridians converge,
 * so the bearing from the spot back to the landmark differs from the back-bearing by about
 * delta-longitude x sin(latitude) (0.23 deg for a 20 km east-west line at 52 deg N). The start
 * bearing at the landmark is corrected by fixed-point iteration until the bearing from the spot to
 * the landmark equals the target azimuth (to 1e-10 deg, in 2-4 steps).
 */
import type { Landmark } from '../schemas/geometry';
import { landmarkSchema } from '../schemas/geometry';
import { DEFAULT_REFRACTION_COEFFICIENT, EARTH_RADIUS_M, MAX_SIGHTLINE_DISTANCE_M, MIN_REFRACTION_COEFFICIENT, MAX_REFRACTION_COEFFICIENT, MIN_SIGHTLINE_DISTANCE_M } from './elevation';
import { destinationPoint } from './geodesy';
import type { GeoPoint } from './geodesy';
import { assertFiniteInRange, assertPositiveUpTo, parseOrThrow } from '../guards';
import { angleDifferenceDeg, normalizeDegrees360, RAD_PER_DEG } from '../units';

/** Default farthest spot offered, metres: beyond ~50 km a landmark is a speck and the model's checks end. */
export const DEFAULT_MAX_STANDING_DISTANCE_M = 50_000;
/** Largest number of candidate spots one line may ask for. */
export const MAX_CANDIDATE_SPOTS = 1801;
/** Steepest wanted elevation angle accepted, degrees (exclusive of 90, where the spot is under the top). */
const MAX_ABS_ELEVATION_DEG = 89.99;
const BEARING_ITERATION_TOLERANCE_DEG = 1e-10;
const BEARING_ITERATION_MAX_STEPS = 20;

/**
 * The camera eye's height: either directly above sea level, or as the spot's ground elevation
 * plus the camera height (default 1.5 m). The map has no terrain model, so the ground elevation
 * at the spot is the user's to give.
 */
export type EyeHeight =
  | { eyeElevationM: number }
  | { groundElevationM: number; cameraHeightM?: number };

/** A place to stand. */
export interface StandingSpot extends GeoPoint {
  /** Elevation angle of the landmark top seen from this spot, degrees (the wanted one). */
  elevationAngleDeg: number;
  /** Horizontal (WGS84 geodesic) distance from the spot to the landmark, metres. */
  distanceM: number;
  /** True bearing from the spot to the landmark, degrees `[0, 360)`: the target azimuth. */
  bearingToLandmarkDeg: number;
  /** Eye elevation above sea level assumed at the spot, metres. */
  eyeElevationM: number;
}

/** Options for the where-to-stand functions. */
export interface WhereToStandOptions {
  /** Refraction coefficient, -1..1; default 0.13. */
  k?: number;
  /** Farthest spot to offer, metres, 1..1 000 000; default {@link DEFAULT_MAX_STANDING_DISTANCE_M}. */
  maxDistanceM?: number;
}

function eyeElevationOf(eye: EyeHeight): number {
  if (eye === null || typeof eye !== 'object') {
    throw new RangeError('eye must give eyeElevationM, or groundElevationM and cameraHeightM');
  }
  if ('eyeElevationM' in eye) {
    return assertFiniteInRange(eye.eyeElevationM, 'eyeElevationM', -500, 9100);
  }
  const ground = assertFiniteInRange(eye.groundElevationM, 'groundElevationM', -500, 9000);
  const camera = assertFiniteInRange(eye.cameraHeightM ?? 1.5, 'cameraHeightM', 0, 100);
  return ground + camera;
}

/**
 * Horizontal distance at which a point of height `topElevationM` appears at `elevationAngle`
 * from an eye at `eyeElevation`, with curvature and refraction. When the eye is above the top
 * and the angle is negative there are two such distances; the nearer one (the direct view) is
 * returned.
 *
 * @param topElevation - height of the point (landmark top) above sea level, metres, -1000..12000
 * @param eyeElevation - eye height above sea level, metres, -1000..12000
 * @param elevationAngle - wanted elevation angle, degrees, -89.99..89.99
 * @param k - refraction coefficient, -1..1, default 0.13
 * @returns the distance in metres, or null where the angle cannot be reached (e.g. a positive
 *   angle with the eye at or above the top)
 * @throws RangeError on NaN or out-of-range input
 */
export function distanceForElevationAngleM(
  topElevation: number,
  eyeElevation: number,
  elevationAngle: number,
  k: number = DEFAULT_REFRACTION_COEFFICIENT,
): number | null {
  assertFiniteInRange(topElevation, 'topElevationM', -1000, 12_000);
  assertFiniteInRange(eyeElevation, 'eyeElevationM', -1000, 12_000);
  assertFiniteInRange(elevationAngle, 'elevationAngleDeg', -MAX_ABS_ELEVATION_DEG, MAX_ABS_ELEVATION_DEG);
  assertFiniteInRange(k, 'k (refraction coefficient)', MIN_REFRACTION_COEFFICIENT, MAX_REFRACTION_COEFFICIENT);
  const rise = topElevation - eyeElevation;
  const t = Math.tan(elevationAngle * RAD_PER_DEG);
  const c = (1 - k) / (2 * EARTH_RADIUS_M);
  let d: number;
  if (c === 0) {
    // k = 1: no drop, tan e = H / d.
    if (t === 0 || rise / t <= 0) return null;
    d = rise / t;
  } else if (rise > 0) {
    // One positive root; this form avoids cancellation when c d is tiny.
    d = (2 * rise) / (t + Math.sqrt(t * t + 4 * c * rise));
  } else if (rise === 0) {
    if (t >= 0) return null;
    d = -t / c;
  } else {
    // Eye above the top: only angles below the steepest reachable one, -2 sqrt(c |H|) in tan.
    const discriminant = t * t + 4 * c * rise;
    if (t >= 0 || discriminant < 0) return null;
    d = (2 * rise) / (t - Math.sqrt(discriminant));
  }
  return Number.isFinite(d) && d > 0 ? d : null;
}

/**
 * Where to stand so that the landmark lies at `targetAzimuthDeg` (the target's true azimuth at
 * the chosen time) with its top at `elevationAngleDeg`.
 *
 * @param landmark - the foreground subject (schema ranges)
 * @param targetAzimuthDeg - true azimuth of the target seen from the spot, degrees, any finite value
 * @param eye - eye height: `{ eyeElevationM }` (-500..9100 m) or `{ groundElevationM, cameraHeightM }`
 * @param elevationAngleDeg - wanted elevation angle of the landmark top, degrees, -89.99..89.99
 * @param options - refraction coefficient k and the farthest distance to offer
 * @returns the spot, or null where the angle cannot be reached within the distance limit
 * @throws RangeError on NaN or out-of-range input
 */
export function whereToStand(
  landmark: Landmark,
  targetAzimuthDeg: number,
  eye: EyeHeight,
  elevationAngleDeg: number,
  options: WhereToStandOptions = {},
): StandingSpot | null {
  const l = parseOrThrow('landmark', landmarkSchema, landmark);
  assertFiniteInRange(targetAzimuthDeg, 'targetAzimuthDeg');
  const eyeElevation = eyeElevationOf(eye);
  const maxDistance = assertPositiveUpTo(options.maxDistanceM ?? DEFAULT_MAX_STANDING_DISTANCE_M, 'maxDistanceM', MAX_SIGHTLINE_DISTANCE_M);
  const d = distanceForElevationAngleM(l.baseElevationM + l.heightM, eyeElevation, elevationAngleDeg, options.k ?? DEFAULT_REFRACTION_COEFFICIENT);
  if (d === null || d > maxDistance || d < MIN_SIGHTLINE_DISTANCE_M) return null;

  const azimuth = normalizeDegrees360(targetAzimuthDeg);
  let startBearing = azimuth + 180;
  let spot = destinationPoint(l, startBearing, d);
  for (let step = 0; step < BEARING_ITERATION_MAX_STEPS; step += 1) {
    // Travelling landmark -> spot arrives heading finalBearing; the way back is that plus 180.
    const error = angleDifferenceDeg(azimuth, spot.finalBearingDeg + 180);
    if (Math.abs(error) < BEARING_ITERATION_TOLERANCE_DEG) break;
    startBearing += error;
    spot = destinationPoint(l, startBearing, d);
  }
  return {
    lat: spot.lat,
    lon: spot.lon,
    elevationAngleDeg,
    distanceM: d,
    bearingToLandmarkDeg: normalizeDegrees360(spot.finalBearingDeg + 180),
    eyeElevationM: eyeElevation,
  };
}

/** The range of wanted elevation angles for {@link whereToStandLine}. */
export interface ElevationAngleRange extends WhereToStandOptions {
  /** First wanted elevation angle of the landmark top, degrees, -89.99..89.99. */
  fromDeg: number;
  /** Last wanted angle, degrees, -89.99..89.99 (included when a whole number of steps away). */
  toDeg: number;
  /** Step between angles, degrees, > 0; default 1. */
  stepDeg?: number;
}

/**
 * A line of candidate spots: one for each wanted elevation angle from `fromDeg` to `toDeg` in
 * steps of `stepDeg` (either direction), all on the landmark's far side from the target. Angles
 * that cannot be reached (eye above the top, or beyond the distance limit) are left out.
 *
 * @param landmark - the foreground subject (schema ranges)
 * @param targetAzimuthDeg - true azimuth of the target at the chosen time, degrees
 * @param eye - eye height (see {@link EyeHeight})
 * @param range - angles from/to/step in degrees, plus k and the distance limit
 * @returns the reachable spots in the order of the angles (at most {@link MAX_CANDIDATE_SPOTS})
 * @throws RangeError on NaN or out-of-range input, or more than 1801 angles
 */
export function whereToStandLine(
  landmark: Landmark,
  targetAzimuthDeg: number,
  eye: EyeHeight,
  range: ElevationAngleRange,
): StandingSpot[] {
  const from = assertFiniteInRange(range.fromDeg, 'fromDeg', -MAX_ABS_ELEVATION_DEG, MAX_ABS_ELEVATION_DEG);
  const to = assertFiniteInRange(range.toDeg, 'toDeg', -MAX_ABS_ELEVATION_DEG, MAX_ABS_ELEVATION_DEG);
  const step = assertPositiveUpTo(range.stepDeg ?? 1, 'stepDeg', 180);
  // A hair of slack so that 1..10 by 0.1 includes 10 despite rounding.
  const count = Math.floor(Math.abs(to - from) / step + 1e-9) + 1;
  if (count > MAX_CANDIDATE_SPOTS) {
    throw new RangeError(`Too many candidate spots (${count}): use a larger stepDeg or a narrower range (at most ${MAX_CANDIDATE_SPOTS})`);
  }
  const direction = to >= from ? 1 : -1;
  const spots: StandingSpot[] = [];
  for (let i = 0; i < count; i += 1) {
    const spot = whereToStand(landmark, targetAzimuthDeg, eye, from + direction * i * step, range);
    if (spot !== null) spots.push(spot);
  }
  return spots;
}
