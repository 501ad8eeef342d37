/**
 * Altitude thresholds of the Sun and Moon events, as defined by the US Naval Observatory
 * (Almanac for Computers, 1990): sunrise/sunset when the Sun's centre is 0.833 deg below the
 * horizon (34' refraction + 16' semidiameter, airless altitude); civil, nautical and astronomical
 * twilight at -6, -12 and -18 deg (Sun's centre, no refraction).
 */
export const SUNRISE_ALTITUDE_DEG = -50 / 60;
export const CIVIL_TWILIGHT_ALTITUDE_DEG = -6;
export const NAUTICAL_TWILIGHT_ALTITUDE_DEG = -12;
export const ASTRONOMICAL_TWILIGHT_ALTITUDE_DEG = -18;

/** Standard refraction at the horizon used for rise/set events: 34 arcmin, in degrees. */
export const HORIZON_REFRACTION_DEG = 34 / 60;

/** Mean radius of the Moon (IAU), in kilometres; gives its apparent semidiameter. */
export const MOON_RADIUS_KM = 1737.4;

/** Astronomical unit in kilometres (IAU 2012). */
export const AU_KM = 149_597_870.7;

// The time and angle units live in shared/units.ts; re-exported so the sky's barrel keeps them.
export { DEG_PER_RAD, MS_PER_DAY, MS_PER_HOUR, MS_PER_MINUTE, RAD_PER_DEG } from '../units';
