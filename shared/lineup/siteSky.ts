/**
 * Fast topocentric Sun and Moon quantities for one site, from the ephemeris tables.
 *
 * Definitions (the brute-force oracle in tests/unit/lineup uses the same ones through
 * astronomy-engine's `Equator(body, t, observer, true, true)` and `Horizon(..., no refraction)`):
 * - altitudes are geometric (airless), topocentric, of the body's centre, measured from the plane
 *   perpendicular to the geodetic vertical; the observer's geocentric position is astronomy-engine's
 *   (its flattening and equatorial radius), so the Moon's parallax (about 1 deg) is exact;
 * - the Moon is down when its upper limb, lifted by the standard horizontal refraction of 34 arcmin,
 *   is below the astronomical horizon: centre altitude + asin(R_moon / topocentric distance)
 *   + 34/60 deg < 0, with R_moon = MOON_RISE_SET_RADIUS_KM = 1738.1 km and HORIZON_REFRACTION_DEG
 *   from sky/constants.ts (astronomy-engine's constants; at sea level this is exactly its
 *   moonrise/moonset definition, and the night report's);
 * - the Moon's illuminated fraction is (1 + cos i) / 2 with i the Sun-Moon-Earth phase angle from
 *   geometric positions, as in astronomy-engine's `Illumination(Body.Moon, t).phase_fraction`.
 */
import type { ObserverSite } from '../schemas/geometry';
import { KM_PER_AU } from 'astronomy-engine';
import { assertFiniteInRange } from '../guards';
import { HORIZON_REFRACTION_DEG, MOON_RISE_SET_RADIUS_KM } from '../sky/constants';
import { assertSite, MAX_ELEVATION_M, MIN_ELEVATION_M } from '../sky/guards';
import { RAD_PER_DEG } from '../units';
import { apparentSiderealRad, moonGeocentricOfDate, sunGeocentricAndSidereal, sunGeocentricOfDate, sunGeometricOfDate } from './ephemeris';

/** astronomy-engine's Earth equatorial radius, km. */
export const EARTH_EQUATORIAL_RADIUS_KM = 6378.1366;
/** astronomy-engine's Earth polar-to-equatorial axis ratio (1 - flattening). */
export const EARTH_AXIS_RATIO = 0.996647180302104;

const MOON_RADIUS_AU = MOON_RISE_SET_RADIUS_KM / KM_PER_AU;
const SIN_HORIZON_REFRACTION = Math.sin(HORIZON_REFRACTION_DEG * RAD_PER_DEG);
const COS_HORIZON_REFRACTION = Math.cos(HORIZON_REFRACTION_DEG * RAD_PER_DEG);

/**
 * Checks an observer site: finite latitude -90..90, longitude -180..180, elevation -500..9000 m.
 * Unlike the sky modules' {@link assertSite}, which reads a missing elevation as sea level, the
 * engine requires `elevationM` (callers pass sites parsed by the geometry schema, which fills it).
 * @throws RangeError otherwise.
 */
export function checkSite(site: ObserverSite): void {
  assertSite(site);
  assertFiniteInRange(site.elevationM, 'site.elevationM', MIN_ELEVATION_M, MAX_ELEVATION_M);
}

/** Sun and Moon seen from one site; all times are UT days since J2000. */
export class SiteSky {
  /** Geodetic latitude, deg. */
  readonly latDeg: number;
  /** Geodetic latitude, rad. */
  readonly latRad: number;
  /** East longitude, rad. */
  readonly lonRad: number;
  readonly sinLat: number;
  readonly cosLat: number;
  /** Observer's distance from the Earth's axis, AU. */
  private readonly obsAxialAu: number;
  /** Observer's height above the equatorial plane, AU. */
  private readonly obsPolarAu: number;
  private readonly vec = new Float64Array(3);
  private readonly sunVec = new Float64Array(3);

  /** @param site - Latitude/longitude in degrees, elevation in metres above sea level. */
  constructor(site: ObserverSite) {
    checkSite(site);
    this.latDeg = site.lat;
    this.latRad = site.lat * RAD_PER_DEG;
    this.lonRad = site.lon * RAD_PER_DEG;
    this.sinLat = Math.sin(this.latRad);
    this.cosLat = Math.cos(this.latRad);
    const c = 1 / Math.hypot(this.cosLat, EARTH_AXIS_RATIO * this.sinLat);
    const s = EARTH_AXIS_RATIO * EARTH_AXIS_RATIO * c;
    const htKm = site.elevationM / 1000;
    this.obsAxialAu = ((EARTH_EQUATORIAL_RADIUS_KM * c + htKm) * this.cosLat) / KM_PER_AU;
    this.obsPolarAu = ((EARTH_EQUATORIAL_RADIUS_KM * s + htKm) * this.sinLat) / KM_PER_AU;
  }

  /** Local apparent sidereal angle, rad (any branch). @param ut - UT days since J2000. */
  localSiderealRad(ut: number): number {
    return apparentSiderealRad(ut) + this.lonRad;
  }

  /**
   * Sine of the topocentric altitude of the geocentric vector in `this.vec`; leaves the topocentric
   * distance (AU) in `lastDistanceAu`.
   */
  private sinAltitudeOfVec(theta: number): number {
    const v = this.vec;
    const c = Math.cos(theta);
    const s = Math.sin(theta);
    const meridian = v[0]! * c + v[1]! * s - this.obsAxialAu;
    const perpendicular = -v[0]! * s + v[1]! * c;
    const polar = v[2]! - this.obsPolarAu;
    const dist = Math.sqrt(meridian * meridian + perpendicular * perpendicular + polar * polar);
    this.lastDistanceAu = dist;
    return (meridian * this.cosLat + polar * this.sinLat) / dist;
  }

  /** Topocentric distance of the last body evaluated, AU. */
  lastDistanceAu = 0;

  /** Sine of the Sun's geometric topocentric centre altitude, -1..1. @param ut - UT days since J2000. */
  sunSinAltitude(ut: number): number {
    const gast = sunGeocentricAndSidereal(ut, this.vec);
    return this.sinAltitudeOfVec(gast + this.lonRad);
  }

  /** Sun's geometric topocentric centre altitude, deg. @param ut - UT days since J2000. */
  sunAltitudeDeg(ut: number): number {
    return Math.asin(this.sunSinAltitude(ut)) / RAD_PER_DEG;
  }

  /** Sine of the Moon's geometric topocentric centre altitude. @param ut - UT days since J2000. */
  moonSinAltitude(ut: number): number {
    moonGeocentricOfDate(ut, this.vec);
    return this.sinAltitudeOfVec(this.localSiderealRad(ut));
  }

  /** Moon's geometric topocentric centre altitude, deg. @param ut - UT days since J2000. */
  moonAltitudeDeg(ut: number): number {
    return Math.asin(this.moonSinAltitude(ut)) / RAD_PER_DEG;
  }

  /**
   * The Moon-down test in the sine domain: sin(centre altitude) + sin(semidiameter + 34 arcmin),
   * negative exactly when the refracted upper limb is below the horizon (the sine is monotonic on
   * -90..90 deg). The semidiameter is asin(R_moon / topocentric distance), so
   * sin(SD + r) = (R/d) cos r + sqrt(1 - (R/d)^2) sin r, with no trigonometric call.
   * @param ut - UT days since J2000.
   */
  moonLimbSin(ut: number): number {
    return this.limbSinOfLast(this.moonSinAltitude(ut));
  }

  /** {@link SiteSky.moonLimbSin} from the sine of the centre altitude of the Moon just evaluated. */
  private limbSinOfLast(sinAlt: number): number {
    const q = MOON_RADIUS_AU / this.lastDistanceAu;
    return sinAlt + q * COS_HORIZON_REFRACTION + Math.sqrt(1 - q * q) * SIN_HORIZON_REFRACTION;
  }

  /** Refracted upper-limb altitude of the Moon, deg (negative: down). @param ut - UT days since J2000. */
  moonUpperLimbDeg(ut: number): number {
    const alt = this.moonAltitudeDeg(ut);
    return alt + Math.asin(MOON_RADIUS_AU / this.lastDistanceAu) / RAD_PER_DEG + HORIZON_REFRACTION_DEG;
  }

  /**
   * The Moon at one instant from a single table look-up: centre altitude (deg), whether it is down
   * (as {@link SiteSky.moonLimbSin}) and its illuminated fraction.
   * @param ut - UT days since J2000.
   */
  moonAt(ut: number): { altitudeDeg: number; down: boolean; illumination: number } {
    const sinAlt = this.moonSinAltitude(ut);
    const down = this.limbSinOfLast(sinAlt) < 0;
    return { altitudeDeg: Math.asin(sinAlt) / RAD_PER_DEG, down, illumination: this.illuminationOfVec(ut) };
  }

  /** Illuminated fraction for the Moon vector already in `this.vec` at time ut. */
  private illuminationOfVec(ut: number): number {
    const m = this.vec;
    const s = this.sunVec;
    sunGeometricOfDate(ut, s);
    const hx = m[0]! - s[0]!;
    const hy = m[1]! - s[1]!;
    const hz = m[2]! - s[2]!;
    const dot = m[0]! * hx + m[1]! * hy + m[2]! * hz;
    return (1 + dot / (Math.hypot(m[0]!, m[1]!, m[2]!) * Math.hypot(hx, hy, hz))) / 2;
  }

  /** Moon's illuminated fraction, 0..1 (geocentric). @param ut - UT days since J2000. */
  moonIlluminatedFraction(ut: number): number {
    moonGeocentricOfDate(ut, this.vec);
    // Phase angle between the Earth->Moon and Sun->Moon (= Moon - Sun) vectors.
    return this.illuminationOfVec(ut);
  }

  /** Geocentric hour angle of the Sun, rad (unreduced). @param ut - UT days since J2000. */
  sunHourAngleRad(ut: number): number {
    sunGeocentricOfDate(ut, this.vec);
    return this.localSiderealRad(ut) - Math.atan2(this.vec[1]!, this.vec[0]!);
  }

  /** Geocentric hour angle of the Moon, rad (unreduced). @param ut - UT days since J2000. */
  moonHourAngleRad(ut: number): number {
    moonGeocentricOfDate(ut, this.vec);
    return this.localSiderealRad(ut) - Math.atan2(this.vec[1]!, this.vec[0]!);
  }
}
