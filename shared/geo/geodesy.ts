/**
 * Distance, bearing and destination point on the Earth.
 *
 * Two families, for two jobs:
 *
 * - **WGS84 (ellipsoidal)**: {@link geodesicInverse}, {@link distanceM}, {@link initialBearingDeg},
 *   {@link destinationPoint}. These feed the sightline readout, the frame and the where-to-stand
 *   search. They call geographiclib-geodesic (C. F. F. Karney's reference implementation, accurate
 *   to about 15 nm on WGS84), because turf's spherical formulas are off by up to 0.56 % in
 *   distance and 0.19 deg in bearing even on short lines (measured against geographiclib on random
 *   lines up to 50 km; the worst case is an oblique line near the equator, where the ratio of the
 *   ellipsoid's two radii of curvature N/M is largest). 0.19 deg is ten times the sky engine's
 *   arcminute accuracy and a sizeable part of a narrow frame, so it is not good enough for the
 *   numbers we show or search with.
 * - **Spherical (turf)**: {@link sphericalDistanceM}, {@link sphericalInitialBearingDeg},
 *   {@link sphericalDestinationPoint}: @turf/turf's haversine and great-circle formulas on a sphere
 *   of radius 6 371 008.8 m. Good for drawing on the map (lines, sectors), where 0.6 % and 0.2 deg
 *   are far below a pixel's worth at the zoom levels that show them; not for the readout.
 *
 * Note for packaging: geographiclib-geodesic is pure JavaScript with no I/O (it runs in the
 * browser); it has to be a runtime dependency of the project for this module.
 */
import geographiclib from 'geographiclib-geodesic';
import { bearing as turfBearing, destination as turfDestination, distance as turfDistance } from '@turf/turf';
import type { Vantage } from '../schemas/geometry';
import { assertFiniteInRange } from '../guards';
import { normalizeDegrees180, normalizeDegrees360 } from '../units';

/** A point on the Earth: geodetic latitude and longitude in degrees (WGS84). */
export type GeoPoint = Pick<Vantage, 'lat' | 'lon'>;

/** WGS84 semi-major axis, metres. */
export const WGS84_SEMI_MAJOR_AXIS_M = 6_378_137;
/** WGS84 flattening (dimensionless). */
export const WGS84_FLATTENING = 1 / 298.257223563;
/**
 * Largest distance the direct problem accepts, metres: half the equator's length, the longest
 * geodesic that is still a shortest path. Sightlines are far shorter; this only catches nonsense.
 */
export const MAX_GEODESIC_DISTANCE_M = 20_003_931;

const WGS84 = geographiclib.Geodesic.WGS84;
const INVERSE_MASK = geographiclib.Geodesic.DISTANCE | geographiclib.Geodesic.AZIMUTH;
const DIRECT_MASK = geographiclib.Geodesic.LATITUDE | geographiclib.Geodesic.LONGITUDE | geographiclib.Geodesic.AZIMUTH;

function checkPoint(name: string, point: GeoPoint): void {
  if (point === null || typeof point !== 'object') {
    throw new RangeError(`${name} must be an object with lat and lon in degrees`);
  }
  assertFiniteInRange(point.lat, `${name}.lat (deg)`, -90, 90);
  assertFiniteInRange(point.lon, `${name}.lon (deg)`, -180, 180);
}

/** Result of the inverse geodesic problem between two points. */
export interface GeodesicLine {
  /** Length of the shortest geodesic on WGS84, metres (>= 0). */
  distanceM: number;
  /** True bearing of the line as it leaves `from`, degrees clockwise from north, `[0, 360)`. */
  initialBearingDeg: number;
  /**
   * True bearing of the line as it arrives at `to` (direction of travel), degrees `[0, 360)`.
   * The bearing from `to` back to `from` is this plus 180.
   */
  finalBearingDeg: number;
}

/**
 * Inverse geodesic problem on the WGS84 ellipsoid: distance and bearings from `from` to `to`.
 * Accurate to about 15 nanometres (geographiclib-geodesic). Coincident points give distance 0
 * and bearing 0 (north by convention).
 *
 * @param from - start point, lat -90..90 deg, lon -180..180 deg
 * @param to - end point, lat -90..90 deg, lon -180..180 deg
 * @returns distance in metres and initial/final true bearings in degrees `[0, 360)`
 * @throws RangeError on NaN or out-of-range coordinates
 */
export function geodesicInverse(from: GeoPoint, to: GeoPoint): GeodesicLine {
  checkPoint('from', from);
  checkPoint('to', to);
  const r = WGS84.Inverse(from.lat, from.lon, to.lat, to.lon, INVERSE_MASK);
  const distance = r.s12 ?? 0;
  return {
    distanceM: distance,
    initialBearingDeg: distance === 0 ? 0 : normalizeDegrees360(r.azi1 ?? 0),
    finalBearingDeg: distance === 0 ? 0 : normalizeDegrees360(r.azi2 ?? 0),
  };
}

/**
 * Geodesic distance on WGS84 from `from` to `to`, metres.
 *
 * @param from - start point (lat -90..90, lon -180..180 deg)
 * @param to - end point (lat -90..90, lon -180..180 deg)
 * @returns distance in metres, >= 0
 * @throws RangeError on NaN or out-of-range coordinates
 */
export function distanceM(from: GeoPoint, to: GeoPoint): number {
  return geodesicInverse(from, to).distanceM;
}

/**
 * Initial true bearing of the WGS84 geodesic from `from` to `to` (e.g. vantage to landmark),
 * degrees clockwise from true north in `[0, 360)`. 0 when the points coincide.
 *
 * @param from - start point (lat -90..90, lon -180..180 deg)
 * @param to - end point (lat -90..90, lon -180..180 deg)
 * @returns bearing in degrees, `[0, 360)`
 * @throws RangeError on NaN or out-of-range coordinates
 */
export function initialBearingDeg(from: GeoPoint, to: GeoPoint): number {
  return geodesicInverse(from, to).initialBearingDeg;
}

/** A point reached by the direct problem, with the bearing of travel on arrival. */
export interface Destination extends GeoPoint {
  /** True bearing of travel at the destination, degrees `[0, 360)`. */
  finalBearingDeg: number;
}

/**
 * Direct geodesic problem on WGS84: the point reached from `start` by travelling `distanceM`
 * along the geodesic that leaves at `bearingDeg` (true).
 *
 * @param start - start point (lat -90..90, lon -180..180 deg)
 * @param bearingDeg - initial true bearing, degrees, any finite value (taken modulo 360)
 * @param distance - distance in metres, 0..{@link MAX_GEODESIC_DISTANCE_M}
 * @returns the destination (lon folded to -180..180) and the final bearing
 * @throws RangeError on NaN or out-of-range input
 */
export function destinationPoint(start: GeoPoint, bearingDeg: number, distance: number): Destination {
  checkPoint('start', start);
  assertFiniteInRange(bearingDeg, 'bearingDeg');
  assertFiniteInRange(distance, 'distanceM', 0, MAX_GEODESIC_DISTANCE_M);
  const r = WGS84.Direct(start.lat, start.lon, normalizeDegrees360(bearingDeg), distance, DIRECT_MASK);
  return {
    lat: r.lat2 ?? start.lat,
    lon: normalizeDegrees180(r.lon2 ?? start.lon),
    finalBearingDeg: normalizeDegrees360(r.azi2 ?? bearingDeg),
  };
}

/**
 * Great-circle (haversine) distance on a sphere of radius 6 371 008.8 m, through @turf/turf.
 * For map drawing only: off the WGS84 geodesic by up to about 0.56 % (meridian lines near the
 * equator); use {@link distanceM} for numbers shown or searched with.
 *
 * @param from - start point (lat -90..90, lon -180..180 deg)
 * @param to - end point (lat -90..90, lon -180..180 deg)
 * @returns distance in metres, >= 0
 * @throws RangeError on NaN or out-of-range coordinates
 */
export function sphericalDistanceM(from: GeoPoint, to: GeoPoint): number {
  checkPoint('from', from);
  checkPoint('to', to);
  return turfDistance([from.lon, from.lat], [to.lon, to.lat], { units: 'meters' });
}

/**
 * Initial great-circle bearing on a sphere, through @turf/turf. For map drawing only: off the
 * WGS84 geodesic's bearing by up to about 0.19 deg on short oblique lines near the equator
 * (0.07 deg at 52 deg latitude); use {@link initialBearingDeg} for numbers shown or searched with.
 *
 * @param from - start point (lat -90..90, lon -180..180 deg)
 * @param to - end point (lat -90..90, lon -180..180 deg)
 * @returns bearing in degrees, `[0, 360)`
 * @throws RangeError on NaN or out-of-range coordinates
 */
export function sphericalInitialBearingDeg(from: GeoPoint, to: GeoPoint): number {
  checkPoint('from', from);
  checkPoint('to', to);
  return normalizeDegrees360(turfBearing([from.lon, from.lat], [to.lon, to.lat]));
}

/**
 * Destination along a great circle on a sphere of radius 6 371 008.8 m, through @turf/turf.
 * For map drawing only (same accuracy as {@link sphericalDistanceM} and
 * {@link sphericalInitialBearingDeg}); use {@link destinationPoint} for spots to stand at.
 *
 * @param start - start point (lat -90..90, lon -180..180 deg)
 * @param bearingDeg - initial bearing, degrees, any finite value (taken modulo 360)
 * @param distance - distance in metres, 0..{@link MAX_GEODESIC_DISTANCE_M}
 * @returns the destination point (lon folded to -180..180)
 * @throws RangeError on NaN or out-of-range input
 */
export function sphericalDestinationPoint(start: GeoPoint, bearingDeg: number, distance: number): GeoPoint {
  checkPoint('start', start);
  assertFiniteInRange(bearingDeg, 'bearingDeg');
  assertFiniteInRange(distance, 'distanceM', 0, MAX_GEODESIC_DISTANCE_M);
  const coordinates = turfDestination([start.lon, start.lat], distance, normalizeDegrees360(bearingDeg), { units: 'meters' }).geometry.coordinates;
  // A GeoJSON position is [lon, lat]; turf always fills both.
  return { lat: coordinates[1] as number, lon: normalizeDegrees180(coordinates[0] as number) };
}
