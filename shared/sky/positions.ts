/**
 * Where the Sun, the Moon and fixed J2000 targets stand in a site's sky, through astronomy-engine.
 *
 * - Horizon() wants right ascension/declination of date, so J2000 targets are first rotated to the
 *   true equator and equinox of date (precession + nutation, Rotation_EQJ_EQD). DefineStar is not
 *   used: it has only 8 slots. Annual aberration of targets (<= 20.5 arcsec) is ignored, well below
 *   the arcminute level planning needs.
 * - Sun and Moon are topocentric (parallax for the site, height in metres), apparent of date.
 * - Refraction, when asked for, is astronomy-engine's 'normal' model, which changes altitude only.
 * Azimuths are true, from north through east, 0 <= az < 360.
 */
import {
  Body,
  EclipticGeoMoon,
  Equator,
  EquatorFromVector,
  GeoVector,
  Horizon,
  Illumination,
  MakeTime,
  MoonPhase,
  Observer,
  RotateVector,
  Rotation_EQJ_EQD,
  SiderealTime,
  VectorFromSphere,
  Spherical,
  type AstroTime,
} from 'astronomy-engine';
import type { EquatorialJ2000, ObserverSite } from '../schemas/geometry';
import { assertFiniteInRange, assertValidDate } from '../guards';
import { DEG_PER_RAD, normalizeDegrees360 } from '../units';
import { AU_KM, MOON_MEAN_RADIUS_KM } from './constants';
import { assertEquatorialJ2000, assertSite } from './guards';

/** The bodies this module places: the Sun and the Moon. */
export type SkyBody = 'sun' | 'moon';

/** Options for horizontal positions. */
export interface HorizontalOptions {
  /** Apply standard atmospheric refraction to the altitude (default true: apparent altitude). */
  refraction?: boolean;
}

/** An equatorial position of date (true equator and equinox of the given instant). */
export interface EquatorOfDate {
  /** Right ascension of date, hours, 0 <= ra < 24. */
  raHours: number;
  /** Declination of date, degrees, -90..90. */
  decDeg: number;
}

/** A position in a site's sky. */
export interface HorizontalPosition {
  /** True azimuth, degrees from north through east, 0 <= az < 360. */
  azimuthDeg: number;
  /** Altitude above the horizon, degrees, -90..90 (apparent if refraction was applied). */
  altitudeDeg: number;
  /** Right ascension of date used for the position, hours (topocentric for Sun and Moon). */
  raHoursOfDate: number;
  /** Declination of date used for the position, degrees (topocentric for Sun and Moon). */
  decDegOfDate: number;
}

/** A Sun or Moon position, with its topocentric distance. */
export interface BodyPosition extends HorizontalPosition {
  /** Distance from the observer, kilometres. */
  distanceKm: number;
}

/** Moon illumination and phase. */
export interface MoonIllumination {
  /** Illuminated fraction of the disc, 0..1. */
  illuminatedFraction: number;
  /** Sun-Moon-Earth phase angle, degrees, 0 (full) .. 180 (new). */
  phaseAngleDeg: number;
  /** Geocentric ecliptic longitude of the Moon minus that of the Sun, degrees, 0 <= e < 360 (0 new, 90 first quarter, 180 full, 270 last quarter). */
  elongationDeg: number;
  /** True from new to full (elongation below 180 deg). */
  waxing: boolean;
  /** Conventional phase name (eight phases of 45 deg each, centred on the principal phases). */
  phaseName: MoonPhaseName;
}

/** The eight conventional Moon phase names. */
export type MoonPhaseName =
  | 'new moon'
  | 'waxing crescent'
  | 'first quarter'
  | 'waxing gibbous'
  | 'full moon'
  | 'waning gibbous'
  | 'last quarter'
  | 'waning crescent';

/** Mean synodic month, days (Meeus ch. 49). */
export const SYNODIC_MONTH_DAYS = 29.530588861;

/**
 * Half-width of the window in which a principal phase (new, first quarter, full, last quarter) is
 * named: half a day of the Moon's mean elongation motion, degrees (about 6.1 deg).
 */
export const PRINCIPAL_PHASE_HALF_WIDTH_DEG = 360 / SYNODIC_MONTH_DAYS / 2;

const PRINCIPAL_PHASES: ReadonlyArray<[number, MoonPhaseName]> = [
  [0, 'new moon'],
  [90, 'first quarter'],
  [180, 'full moon'],
  [270, 'last quarter'],
  [360, 'new moon'],
];

/** Builds an astronomy-engine observer from a checked site (height in metres above sea level). */
export function observerForSite(site: ObserverSite): Observer {
  const s = assertSite(site);
  return new Observer(s.lat, s.lon, s.elevationM);
}

/** astronomy-engine's refraction option for Horizon: 'normal' unless the caller turned refraction off. */
function horizonRefraction(options: HorizontalOptions): 'normal' | undefined {
  return options.refraction === false ? undefined : 'normal';
}

function bodyOf(body: SkyBody): Body {
  if (body === 'sun') return Body.Sun;
  if (body === 'moon') return Body.Moon;
  throw new RangeError(`body must be 'sun' or 'moon' (got ${String(body)})`);
}

/**
 * Topocentric apparent equatorial position of date of the Sun or the Moon.
 * @param body 'sun' or 'moon'
 * @param site observer (lat -90..90, lon -180..180 east positive, elevation -500..9000 m)
 * @param date instant (UTC)
 * @returns RA of date (hours), Dec of date (degrees) and distance (km)
 * @throws RangeError on invalid input
 */
export function bodyEquatorOfDate(body: SkyBody, site: ObserverSite, date: Date): EquatorOfDate & { distanceKm: number } {
  assertValidDate(date, 'date');
  const observer = observerForSite(site);
  const eq = Equator(bodyOf(body), date, observer, true, true);
  return { raHours: eq.ra, decDeg: eq.dec, distanceKm: eq.dist * AU_KM };
}

/**
 * Horizontal position of the Sun or the Moon for a site.
 * @param body 'sun' or 'moon'
 * @param site observer (lat -90..90, lon -180..180 east positive, elevation -500..9000 m)
 * @param date instant (UTC)
 * @param options refraction (default true: apparent altitude of the centre)
 * @returns azimuth/altitude of the body's centre, the RA/Dec of date used and its distance
 * @throws RangeError on invalid input
 */
export function bodyHorizontal(body: SkyBody, site: ObserverSite, date: Date, options: HorizontalOptions = {}): BodyPosition {
  assertValidDate(date, 'date');
  const observer = observerForSite(site);
  const time = MakeTime(date);
  const eq = Equator(bodyOf(body), time, observer, true, true);
  const hor = Horizon(time, observer, eq.ra, eq.dec, horizonRefraction(options));
  return {
    azimuthDeg: normalizeDegrees360(hor.azimuth),
    altitudeDeg: hor.altitude,
    raHoursOfDate: eq.ra,
    decDegOfDate: eq.dec,
    distanceKm: eq.dist * AU_KM,
  };
}

/** Horizontal position of the Sun's centre. See {@link bodyHorizontal}. */
export function sunHorizontal(site: ObserverSite, date: Date, options: HorizontalOptions = {}): BodyPosition {
  return bodyHorizontal('sun', site, date, options);
}

/** Horizontal position of the Moon's centre (topocentric). See {@link bodyHorizontal}. */
export function moonHorizontal(site: ObserverSite, date: Date, options: HorizontalOptions = {}): BodyPosition {
  return bodyHorizontal('moon', site, date, options);
}

function rotateJ2000ToDate(target: EquatorialJ2000, time: AstroTime): EquatorOfDate {
  const vJ2000 = VectorFromSphere(new Spherical(target.decDeg, target.raHours * 15, 1), time);
  const eq = EquatorFromVector(RotateVector(Rotation_EQJ_EQD(time), vJ2000));
  return { raHours: eq.ra, decDeg: eq.dec };
}

/**
 * Rotates a J2000 (ICRS) position to the true equator and equinox of date (precession and
 * nutation). The result drifts by about 50 arcsec a year, so it can be cached for weeks.
 * @param target J2000 position (RA 0..24 h, Dec -90..90 deg)
 * @param date instant (UTC)
 * @returns RA of date (hours) and Dec of date (degrees)
 * @throws RangeError on invalid input
 */
export function targetEquatorOfDate(target: EquatorialJ2000, date: Date): EquatorOfDate {
  const t = assertEquatorialJ2000(target);
  assertValidDate(date, 'date');
  return rotateJ2000ToDate(t, MakeTime(date));
}

/**
 * Horizontal position of a position of date (a thin wrapper of astronomy-engine's Horizon).
 * @param equatorOfDate RA of date (0..24 h) and Dec of date (-90..90 deg)
 * @param site observer (lat -90..90, lon -180..180 east positive, elevation -500..9000 m)
 * @param date instant (UTC)
 * @param options refraction (default true)
 * @throws RangeError on invalid input
 */
export function horizontalFromEquatorOfDate(
  equatorOfDate: EquatorOfDate,
  site: ObserverSite,
  date: Date,
  options: HorizontalOptions = {},
): HorizontalPosition {
  assertFiniteInRange(equatorOfDate?.raHours, 'equatorOfDate.raHours', 0, 24);
  assertFiniteInRange(equatorOfDate?.decDeg, 'equatorOfDate.decDeg', -90, 90);
  assertValidDate(date, 'date');
  const observer = observerForSite(site);
  const hor = Horizon(date, observer, equatorOfDate.raHours, equatorOfDate.decDeg, horizonRefraction(options));
  return {
    azimuthDeg: normalizeDegrees360(hor.azimuth),
    altitudeDeg: hor.altitude,
    raHoursOfDate: equatorOfDate.raHours,
    decDegOfDate: equatorOfDate.decDeg,
  };
}

/**
 * Horizontal position of a fixed J2000 target (a catalogue object or custom RA/Dec).
 * @param target J2000 position (RA 0..24 h, Dec -90..90 deg)
 * @param site observer (lat -90..90, lon -180..180 east positive, elevation -500..9000 m)
 * @param date instant (UTC)
 * @param options refraction (default true: apparent altitude)
 * @throws RangeError on invalid input
 */
export function targetHorizontal(target: EquatorialJ2000, site: ObserverSite, date: Date, options: HorizontalOptions = {}): HorizontalPosition {
  const t = assertEquatorialJ2000(target);
  assertValidDate(date, 'date');
  const observer = observerForSite(site);
  const time = MakeTime(date);
  const eq = rotateJ2000ToDate(t, time);
  const hor = Horizon(time, observer, eq.raHours, eq.decDeg, horizonRefraction(options));
  return { azimuthDeg: normalizeDegrees360(hor.azimuth), altitudeDeg: hor.altitude, raHoursOfDate: eq.raHours, decDegOfDate: eq.decDeg };
}

/**
 * Name of the Moon's phase for an elongation (Moon minus Sun ecliptic longitude): a principal phase
 * within {@link PRINCIPAL_PHASE_HALF_WIDTH_DEG} (half a day) of 0, 90, 180 or 270 deg, otherwise
 * waxing/waning crescent or gibbous.
 * @param elongationDeg degrees, any finite value (wrapped to 0..360)
 * @throws RangeError on NaN
 */
export function moonPhaseName(elongationDeg: number): MoonPhaseName {
  assertFiniteInRange(elongationDeg, 'elongationDeg');
  const e = normalizeDegrees360(elongationDeg);
  for (const [centre, name] of PRINCIPAL_PHASES) if (Math.abs(e - centre) <= PRINCIPAL_PHASE_HALF_WIDTH_DEG) return name;
  if (e < 90) return 'waxing crescent';
  if (e < 180) return 'waxing gibbous';
  if (e < 270) return 'waning gibbous';
  return 'waning crescent';
}

/**
 * Moon illumination (geocentric) and phase at an instant.
 * @param date instant (UTC)
 * @returns illuminated fraction 0..1, phase angle (deg), elongation (deg), waxing flag, phase name
 * @throws RangeError on an invalid date
 */
export function moonIllumination(date: Date): MoonIllumination {
  assertValidDate(date, 'date');
  const time = MakeTime(date);
  const info = Illumination(Body.Moon, time);
  const elongationDeg = MoonPhase(time);
  return {
    illuminatedFraction: info.phase_fraction,
    phaseAngleDeg: info.phase_angle,
    elongationDeg,
    waxing: elongationDeg < 180,
    phaseName: moonPhaseName(elongationDeg),
  };
}

/** Geocentric position of the Moon. */
export interface MoonGeocentric {
  /** Ecliptic longitude, true equinox of date, degrees 0..360. */
  eclipticLonDeg: number;
  /** Ecliptic latitude, degrees. */
  eclipticLatDeg: number;
  /** Centre-to-centre distance, kilometres. */
  distanceKm: number;
  /** Apparent right ascension of date, hours. */
  raHours: number;
  /** Apparent declination of date, degrees. */
  decDeg: number;
}

/**
 * Geocentric position of the Moon (ecliptic of date, and apparent equatorial of date).
 * @param date instant (UTC)
 * @throws RangeError on an invalid date
 */
export function moonGeocentric(date: Date): MoonGeocentric {
  assertValidDate(date, 'date');
  const time = MakeTime(date);
  const ecl = EclipticGeoMoon(time);
  const eq = EquatorFromVector(RotateVector(Rotation_EQJ_EQD(time), GeoVector(Body.Moon, time, true)));
  return { eclipticLonDeg: ecl.lon, eclipticLatDeg: ecl.lat, distanceKm: ecl.dist * AU_KM, raHours: eq.ra, decDeg: eq.dec };
}

/**
 * Apparent angular semidiameter of the Moon at a distance.
 * @param distanceKm observer-Moon distance in km, 300000..450000
 * @returns semidiameter in degrees (about 0.25-0.28)
 * @throws RangeError on NaN or out-of-range input
 */
export function moonSemidiameterDeg(distanceKm: number): number {
  assertFiniteInRange(distanceKm, 'distanceKm', 300_000, 450_000);
  return Math.asin(MOON_MEAN_RADIUS_KM / distanceKm) * DEG_PER_RAD;
}

/**
 * Greenwich apparent sidereal time (astronomy-engine SiderealTime).
 * @param date instant (UTC, taken as UT1)
 * @returns hours, 0 <= gast < 24
 * @throws RangeError on an invalid date
 */
export function greenwichSiderealTimeHours(date: Date): number {
  assertValidDate(date, 'date');
  return SiderealTime(date);
}

/**
 * Local apparent sidereal time at a longitude.
 * @param date instant (UTC)
 * @param lonDeg longitude, degrees east positive, -180..180
 * @returns hours, 0 <= last < 24
 * @throws RangeError on invalid input
 */
export function localSiderealTimeHours(date: Date, lonDeg: number): number {
  assertFiniteInRange(lonDeg, 'lonDeg', -180, 180);
  const h = (greenwichSiderealTimeHours(date) + lonDeg / 15) % 24;
  return h < 0 ? h + 24 : h;
}
