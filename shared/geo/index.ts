/**
 * Gnomon's geometry: sightline distance and bearings on WGS84, elevation angles with curvature
 * and refraction, magnetic declination (WMM2025), frames, where to stand, and coordinate text.
 */
export {
  destinationPoint,
  distanceM,
  geodesicInverse,
  initialBearingDeg,
  MAX_GEODESIC_DISTANCE_M,
  sphericalDestinationPoint,
  sphericalDistanceM,
  sphericalInitialBearingDeg,
  WGS84_FLATTENING,
  WGS84_SEMI_MAJOR_AXIS_M,
} from './geodesy';
export type { Destination, GeodesicLine, GeoPoint } from './geodesy';

export {
  angularWidthDeg,
  curvatureRefractionDropM,
  DEFAULT_REFRACTION_COEFFICIENT,
  EARTH_RADIUS_M,
  elevationAngleDeg,
  eyeElevationM,
  landmarkElevationAnglesDeg,
  MAX_REFRACTION_COEFFICIENT,
  MAX_SIGHTLINE_DISTANCE_M,
  MIN_REFRACTION_COEFFICIENT,
  MIN_SIGHTLINE_DISTANCE_M,
} from './elevation';
export type { LandmarkElevationAngles } from './elevation';

export {
  COMPASS_BLACKOUT_HORIZONTAL_NT,
  COMPASS_CAUTION_HORIZONTAL_NT,
  magneticBearingDeg,
  magneticDeclination,
  MAGNETIC_MODEL_NAME,
  MAGNETIC_MODEL_VALID_FROM_YEAR,
  MAGNETIC_MODEL_VALID_UNTIL_YEAR,
  trueBearingFromMagneticDeg,
} from './magnetic';
export type { MagneticDeclination, MagneticPosition } from './magnetic';

export { DEFAULT_BAND_HEIGHT_DEG, frameFromSightline, MIN_FRAME_HALF_WIDTH_DEG, sightlineGeometry } from './frame';
export type { FrameOptions, SightlineGeometry } from './frame';

export {
  DEFAULT_MAX_STANDING_DISTANCE_M,
  distanceForElevationAngleM,
  MAX_CANDIDATE_SPOTS,
  whereToStand,
  whereToStandLine,
} from './where-to-stand';
export type { ElevationAngleRange, EyeHeight, StandingSpot, WhereToStandOptions } from './where-to-stand';

export { formatDecimalDegrees, formatDms, parseCoordinates } from './coordinates';
export type { CoordinateParseResult } from './coordinates';

export { angleDifferenceDeg, normalizeDegrees360 } from '../units';
