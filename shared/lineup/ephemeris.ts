/**
 * Sun and Moon ephemeris tables: Chebyshev fits to astronomy-engine's geocentric apparent
 * positions in the true equator and equinox of date (EQD), plus Greenwich apparent sidereal time.
 *
 * Own code because no maintained npm package fits tables over astronomy-engine: calling the library
 * for every altitude costs 4-9 us (VSOP87 / the lunar series plus precession and nutation), while a
 * table costs about 0.05 us, which is what lets a ten-year search run in milliseconds.
 *
 * - Sun: 32-day segments, 14 terms per component, components x, y, z (AU) of the geocentric
 *   apparent vector (light time and aberration, `GeoVector(Sun, t, true)` rotated by
 *   `Rotation_EQJ_EQD`), GAST minus the Earth rotation angle (deg), and x, y, z of the geometric
 *   vector (`GeoVector(Sun, t, false)`, the minus Earth vector astronomy-engine's `Illumination`
 *   uses: the 20 arcsec of aberration would move a Moon-phase threshold by up to a minute).
 * - Moon: 12-day segments, 16 terms per component, x, y, z (AU) of `GeoMoon` rotated to EQD.
 *
 * Fit error against astronomy-engine (measured by tests/unit/lineup/ephemeris.test.ts over
 * 2000-2040): well under 0.01 arcsec in direction and 1e-8 relative in distance; GAST within
 * 0.001 arcsec. Segments are fitted lazily and kept in a module-level cache (site-independent),
 * so a server process fits each segment once.
 */
import { Body, GeoMoon, GeoVector, MakeTime, RotateVector, Rotation_EQJ_EQD, SiderealTime } from 'astronomy-engine';
import { evalChebyshev, evalChebyshev3, fitChebyshev } from './chebyshev';
import { normalizeDegrees180, RAD_PER_DEG } from '../units';

/** Length of one Sun table segment, days. */
export const SUN_SEGMENT_DAYS = 32;
/** Chebyshev terms per Sun component. */
export const SUN_COEFFICIENTS = 14;
/** Length of one Moon table segment, days. */
export const MOON_SEGMENT_DAYS = 12;
/** Chebyshev terms per Moon component. */
export const MOON_COEFFICIENTS = 16;

const TWO_PI = 2 * Math.PI;

/**
 * Earth rotation angle (IERS 2003) as astronomy-engine computes it, in turns 0..1.
 * @param utDays - UT days since J2000, finite.
 */
export function earthRotationTurns(utDays: number): number {
  // Math.floor instead of % (which is several times slower in V8); same value to 1e-15 turn.
  const turns = 0.779057273264 + 0.00273781191135448 * utDays + (utDays - Math.floor(utDays));
  return turns - Math.floor(turns);
}

/**
 * Earth rotation angle without reduction, in radians: continuous in time, for unwrapped hour
 * angles. Its difference from {@link earthRotationTurns} is a whole number of turns (to 1e-11 rad).
 * @param utDays - UT days since J2000, |utDays| < 1e5.
 */
export function earthRotationUnwrappedRad(utDays: number): number {
  return TWO_PI * (0.779057273264 + 0.00273781191135448 * utDays + utDays);
}

function sampleSun(ut: number, out: Float64Array): void {
  const time = MakeTime(ut);
  const v = RotateVector(Rotation_EQJ_EQD(time), GeoVector(Body.Sun, time, true));
  out[0] = v.x;
  out[1] = v.y;
  out[2] = v.z;
  out[3] = normalizeDegrees180(15 * SiderealTime(time) - 360 * earthRotationTurns(ut));
  const g = RotateVector(Rotation_EQJ_EQD(time), GeoVector(Body.Sun, time, false));
  out[4] = g.x;
  out[5] = g.y;
  out[6] = g.z;
}

function sampleMoon(ut: number, out: Float64Array): void {
  const time = MakeTime(ut);
  const v = RotateVector(Rotation_EQJ_EQD(time), GeoMoon(time));
  out[0] = v.x;
  out[1] = v.y;
  out[2] = v.z;
}

/**
 * One body's table: segments fitted on first use and kept, plus the last segment used (most
 * look-ups hit the same segment as the one before, so they skip the Map).
 */
class SegmentTable {
  private readonly segments = new Map<number, Float64Array>();
  private lastIndex = Number.NaN;
  private last: Float64Array = new Float64Array(0);

  constructor(
    private readonly sample: (ut: number, out: Float64Array) => void,
    private readonly segmentDays: number,
    private readonly coefficientCount: number,
    private readonly componentCount: number,
  ) {}

  /** The coefficients of segment `index` (covering index * segmentDays onwards). */
  segment(index: number): Float64Array {
    if (index === this.lastIndex) return this.last;
    let seg = this.segments.get(index);
    if (!seg) {
      seg = fitChebyshev(this.sample, index * this.segmentDays, (index + 1) * this.segmentDays, this.coefficientCount, this.componentCount);
      this.segments.set(index, seg);
    }
    this.lastIndex = index;
    this.last = seg;
    return seg;
  }

  /** Number of fitted segments held. */
  get size(): number {
    return this.segments.size;
  }

  /** Forgets every fitted segment. */
  clear(): void {
    this.segments.clear();
    this.lastIndex = Number.NaN;
  }
}

const sunTable = new SegmentTable(sampleSun, SUN_SEGMENT_DAYS, SUN_COEFFICIENTS, 7);
const moonTable = new SegmentTable(sampleMoon, MOON_SEGMENT_DAYS, MOON_COEFFICIENTS, 3);

/**
 * Geocentric apparent Sun vector in EQD, from the table.
 * @param utDays - UT days since J2000 (1900..2200 is the engine's span).
 * @param out - Receives x, y, z in AU (length >= 3).
 */
export function sunGeocentricOfDate(utDays: number, out: Float64Array): void {
  const index = Math.floor(utDays / SUN_SEGMENT_DAYS);
  const seg = sunTable.segment(index);
  const x = (2 * (utDays - index * SUN_SEGMENT_DAYS)) / SUN_SEGMENT_DAYS - 1;
  evalChebyshev3(seg, 0, SUN_COEFFICIENTS, x, out);
}

/**
 * Geocentric geometric Sun vector in EQD (no light time, no aberration), from the table.
 * @param utDays - UT days since J2000.
 * @param out - Receives x, y, z in AU (length >= 3).
 */
export function sunGeometricOfDate(utDays: number, out: Float64Array): void {
  const index = Math.floor(utDays / SUN_SEGMENT_DAYS);
  const seg = sunTable.segment(index);
  const x = (2 * (utDays - index * SUN_SEGMENT_DAYS)) / SUN_SEGMENT_DAYS - 1;
  evalChebyshev3(seg, 4 * SUN_COEFFICIENTS, SUN_COEFFICIENTS, x, out);
}

/**
 * Geocentric Moon vector in EQD, from the table.
 * @param utDays - UT days since J2000.
 * @param out - Receives x, y, z in AU (length >= 3).
 */
export function moonGeocentricOfDate(utDays: number, out: Float64Array): void {
  const index = Math.floor(utDays / MOON_SEGMENT_DAYS);
  const seg = moonTable.segment(index);
  const x = (2 * (utDays - index * MOON_SEGMENT_DAYS)) / MOON_SEGMENT_DAYS - 1;
  evalChebyshev3(seg, 0, MOON_COEFFICIENTS, x, out);
}

/**
 * Greenwich apparent sidereal time minus the Earth rotation angle (precession in right ascension
 * plus the equation of the equinoxes), from the table.
 * @param utDays - UT days since J2000.
 * @returns Degrees, small (about +0.3 deg in 2026).
 */
export function siderealOffsetDeg(utDays: number): number {
  const index = Math.floor(utDays / SUN_SEGMENT_DAYS);
  const seg = sunTable.segment(index);
  const x = (2 * (utDays - index * SUN_SEGMENT_DAYS)) / SUN_SEGMENT_DAYS - 1;
  return evalChebyshev(seg, 3 * SUN_COEFFICIENTS, SUN_COEFFICIENTS, x);
}

/**
 * Greenwich apparent sidereal angle, unwrapped (continuous in time), in radians.
 * @param utDays - UT days since J2000.
 */
export function apparentSiderealUnwrappedRad(utDays: number): number {
  return earthRotationUnwrappedRad(utDays) + siderealOffsetDeg(utDays) * RAD_PER_DEG;
}

/**
 * Greenwich apparent sidereal angle in radians, 0..2 pi (astronomy-engine's `SiderealTime` x 15 deg).
 * @param utDays - UT days since J2000.
 */
export function apparentSiderealRad(utDays: number): number {
  const rad = TWO_PI * earthRotationTurns(utDays) + siderealOffsetDeg(utDays) * RAD_PER_DEG;
  return rad < 0 ? rad + TWO_PI : rad >= TWO_PI ? rad - TWO_PI : rad;
}

/**
 * Sun vector and sidereal angle in one table look-up (the hot path of the dark-window search).
 * @param utDays - UT days since J2000.
 * @param out - Receives x, y, z (AU, geocentric apparent, EQD) at 0..2.
 * @returns Greenwich apparent sidereal angle, rad, in about -0.01..2 pi + 0.01 (not reduced
 *   after adding the small sidereal offset).
 */
export function sunGeocentricAndSidereal(utDays: number, out: Float64Array): number {
  const index = Math.floor(utDays / SUN_SEGMENT_DAYS);
  const seg = sunTable.segment(index);
  const x = (2 * (utDays - index * SUN_SEGMENT_DAYS)) / SUN_SEGMENT_DAYS - 1;
  evalChebyshev3(seg, 0, SUN_COEFFICIENTS, x, out);
  return TWO_PI * earthRotationTurns(utDays) + evalChebyshev(seg, 3 * SUN_COEFFICIENTS, SUN_COEFFICIENTS, x) * RAD_PER_DEG;
}

/** Empties the segment cache (benchmarks use it to time a cold start). */
export function clearEphemerisCache(): void {
  sunTable.clear();
  moonTable.clear();
}
