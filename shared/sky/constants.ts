/**
 * Constants of the sky modules: altitude thresholds of the Sun and Moon events, as defined by the
 * US Naval Observatory (Almanac for Computers, 1990): sunrise/sunset when the Sun's centre is
 * 0.833 deg below the horizon (34' refraction + 16' semidiameter, airless altitude); civil,
 * nautical and astronomical twilight at -6, -12 and -18 deg (Sun's centre, no refraction); the
 * horizon refraction, the Moon's radii and the astronomical unit.
 */
import { KM_PER_AU } from 'astronomy-engine';

/** Sunrise/sunset: the Sun's centre at -0.833 deg true altitude (34' + 16', USNO), in degrees. */
export const SUNRISE_ALTITUDE_DEG = -50 / 60;
/** Civil twilight: the Sun's centre at -6 deg true altitude (USNO). */
export const CIVIL_TWILIGHT_ALTITUDE_DEG = -6;
/** Nautical twilight: the Sun's centre at -12 deg true altitude (USNO). */
export const NAUTICAL_TWILIGHT_ALTITUDE_DEG = -12;
/** Astronomical twilight: the Sun's centre at -18 deg true altitude (USNO). */
export const ASTRONOMICAL_TWILIGHT_ALTITUDE_DEG = -18;

/**
 * Standard refraction at the horizon used for rise/set events: 34 arcmin, in degrees (USNO;
 * astronomy-engine's REFRACTION_NEAR_HORIZON, which its SearchRiseSet uses at sea level).
 */
export const HORIZON_REFRACTION_DEG = 34 / 60;

/*
 * Two radii of the Moon, on purpose: they answer two questions. Both are astronomy-engine
 * 2.1.19's own constants (astronomy.js: MOON_MEAN_RADIUS_KM, MOON_EQUATORIAL_RADIUS_KM).
 */

/**
 * Mean radius of the Moon, km (IAU; astronomy-engine's MOON_MEAN_RADIUS_KM, the one it uses for
 * the Moon's apparent diameter): gives the apparent semidiameter shown for the Moon's size.
 */
export const MOON_MEAN_RADIUS_KM = 1737.4;

/**
 * Radius of the Moon for moonrise, moonset and "the Moon is down", km: its equatorial radius,
 * which astronomy-engine's SearchRiseSet puts on the upper limb (MOON_EQUATORIAL_RADIUS_KM). The
 * night report and the lineup engine both use it, so they mean the same moonrise as
 * SearchRiseSet; it lifts the limb 0.4 arcsec above the mean radius's.
 */
export const MOON_RISE_SET_RADIUS_KM = 1738.1;

/**
 * Kilometres per astronomical unit: astronomy-engine's KM_PER_AU (149 597 870.691 km, 9 m short of
 * the IAU 2012 value 149 597 870.7 km). The sky modules turn astronomy-engine's distances in AU
 * back into kilometres with it, so they get its own kilometres, as the lineup engine and
 * SearchRiseSet do.
 */
export const AU_KM: number = KM_PER_AU;

// The time and angle units live in shared/units.ts; re-exported so the sky's barrel keeps them.
export { DEG_PER_RAD, MS_PER_DAY, MS_PER_HOUR, MS_PER_MINUTE, RAD_PER_DEG } from '../units';
