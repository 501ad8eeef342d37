/**
 * Magnetic declination for the date of the shoot, so the app can show the magnetic bearing beside
 * the true one (people line up on site with a compass).
 *
 * The field comes from the World Magnetic Model 2025 (NOAA/BGS, valid 2025.0-2030.0) through
 * magvar 2.2.0. geomag 1.0.0 was not usable: it hard-codes the WMM2020 coefficients in its bundle
 * and evaluates them at the current clock time, with no way to pass another model or a date.
 * magvar takes the date (a Date, converted to a decimal year in UTC, or a decimal year) and the
 * height (km) directly, so no extra code is needed. Its quirks, all harmless here:
 * - it rounds D and I to 0.01 deg, the precision of the official test values;
 * - it reads the height as above the WGS84 ellipsoid while we pass height above sea level: the
 *   geoid is within about 110 m of the ellipsoid, and D changes by thousandths of a degree per km;
 * - outside 2025.0-2030.0 it still answers (a linear extrapolation of the secular variation) and
 *   prints one console.warn per process; we return the value with `withinModelValidity: false`
 *   and a warning, and the caller decides what to show;
 * - it is pure JavaScript with no Node APIs, so it runs in the browser (CommonJS, bundled by Vite).
 * When WMM2030 is published, the model (and this module's checks) must be updated.
 */
import { magneticField, MODEL_EPOCH, MODEL_VALID_UNTIL } from 'magvar';
import type { GeoPoint } from './geodesy';
import { assertFiniteInRange, assertValidDate } from '../guards';
import { normalizeDegrees360 } from '../units';

/** Name of the geomagnetic model used. */
export const MAGNETIC_MODEL_NAME = 'WMM2025';
/** First decimal year of the model's validity (inclusive). */
export const MAGNETIC_MODEL_VALID_FROM_YEAR: number = MODEL_EPOCH;
/** Decimal year at which the model's validity ends (exclusive). */
export const MAGNETIC_MODEL_VALID_UNTIL_YEAR: number = MODEL_VALID_UNTIL;
/**
 * Horizontal field strength below which a compass is unreliable, nT: the WMM "blackout zone"
 * around the magnetic poles (H < 2000 nT; from memory, WMM2020/2025 technical reports).
 */
export const COMPASS_BLACKOUT_HORIZONTAL_NT = 2000;
/** Horizontal field strength below which a compass needs caution, nT (WMM "caution zone", from memory). */
export const COMPASS_CAUTION_HORIZONTAL_NT = 6000;
/** Heights accepted, metres: the WMM's own range, -1 km to 850 km. */
const MIN_HEIGHT_M = -1_000;
const MAX_HEIGHT_M = 850_000;
/** Dates accepted, as decimal years: a broad sanity range (the model is valid only 2025.0-2030.0). */
const MIN_DECIMAL_YEAR = 1900;
const MAX_DECIMAL_YEAR = 2100;

/** Where to evaluate the field: latitude and longitude (deg) and height above sea level (m, default 0). */
export type MagneticPosition = GeoPoint & { heightM?: number };

/** Magnetic declination at a place and date, with the model's validity. */
export interface MagneticDeclination {
  /** Declination D: angle from true north to magnetic north, degrees, east positive, to 0.01. */
  declinationDeg: number;
  /** Inclination (dip) I, degrees, down positive, to 0.01. */
  inclinationDeg: number;
  /** Horizontal field strength H, nT: a compass is unreliable where it is weak. */
  horizontalIntensityNT: number;
  /** The decimal year the field was computed for (UTC). */
  decimalYear: number;
  /** Which model gave the value. */
  model: typeof MAGNETIC_MODEL_NAME;
  /** True when the date lies in the model's validity, 2025.0 <= year < 2030.0. */
  withinModelValidity: boolean;
  /** False near the magnetic poles, where H < 2000 nT (the WMM blackout zone). */
  compassReliable: boolean;
  /** Human-readable warnings (date outside the model, compass unreliable or doubtful); empty when none. */
  warnings: string[];
}

function toDecimalYearInput(when: Date | number): Date | number {
  if (when instanceof Date) return assertValidDate(when, 'date');
  return assertFiniteInRange(when, 'decimal year', MIN_DECIMAL_YEAR, MAX_DECIMAL_YEAR);
}

/**
 * Magnetic declination (and inclination) from WMM2025 at a place, height and date.
 * Undefined at the geographic poles (the value there is meaningless).
 *
 * @param position - latitude -90..90 deg, longitude -180..180 deg, heightM above sea level in
 *   metres, -1000..850000 (the WMM's range), default 0
 * @param when - the instant, as a Date (taken in UTC) or a decimal year (e.g. 2027.5), 1900..2100;
 *   outside 2025.0-2030.0 the value is an extrapolation, flagged by `withinModelValidity`
 * @returns declination and inclination in degrees, horizontal intensity, validity and warnings
 * @throws RangeError on NaN or out-of-range input, or an invalid Date
 */
export function magneticDeclination(position: MagneticPosition, when: Date | number): MagneticDeclination {
  if (position === null || typeof position !== 'object') {
    throw new RangeError('position must be an object with lat, lon (deg) and heightM (m)');
  }
  const lat = assertFiniteInRange(position.lat, 'lat (deg)', -90, 90);
  const lon = assertFiniteInRange(position.lon, 'lon (deg)', -180, 180);
  const heightM = assertFiniteInRange(position.heightM ?? 0, 'heightM', MIN_HEIGHT_M, MAX_HEIGHT_M);
  const field = magneticField(lat, lon, heightM / 1000, toDecimalYearInput(when));
  const withinModelValidity = field.decimalYear >= MODEL_EPOCH && field.decimalYear < MODEL_VALID_UNTIL;
  const warnings: string[] = [];
  if (!withinModelValidity) {
    warnings.push(
      `The date (${field.decimalYear.toFixed(2)}) is outside ${MAGNETIC_MODEL_NAME}'s validity `
      + `(${MODEL_EPOCH.toFixed(1)}-${MODEL_VALID_UNTIL.toFixed(1)}): the declination is extrapolated and may be inaccurate.`,
    );
  }
  const compassReliable = field.h >= COMPASS_BLACKOUT_HORIZONTAL_NT;
  if (!compassReliable) {
    warnings.push('Too close to a magnetic pole: a compass is unreliable here (horizontal field below 2000 nT).');
  } else if (field.h < COMPASS_CAUTION_HORIZONTAL_NT) {
    warnings.push('Near a magnetic pole: compass readings may be off (horizontal field below 6000 nT).');
  }
  return {
    declinationDeg: field.declination,
    inclinationDeg: field.inclination,
    horizontalIntensityNT: field.h,
    decimalYear: field.decimalYear,
    model: MAGNETIC_MODEL_NAME,
    withinModelValidity,
    compassReliable,
    warnings,
  };
}

/**
 * Magnetic bearing (what a compass reads) from a true bearing: true minus declination.
 *
 * @param trueBearingDeg - true bearing, degrees, any finite value
 * @param declinationDeg - declination, degrees east positive, -180..180
 * @returns magnetic bearing in degrees, `[0, 360)`
 * @throws RangeError on NaN or out-of-range input
 */
export function magneticBearingDeg(trueBearingDeg: number, declinationDeg: number): number {
  assertFiniteInRange(trueBearingDeg, 'trueBearingDeg');
  assertFiniteInRange(declinationDeg, 'declinationDeg', -180, 180);
  return normalizeDegrees360(trueBearingDeg - declinationDeg);
}

/**
 * True bearing from a compass (magnetic) bearing: magnetic plus declination. For frames typed
 * in from a compass reading.
 *
 * @param magneticBearing - magnetic bearing, degrees, any finite value
 * @param declinationDeg - declination, degrees east positive, -180..180
 * @returns true bearing in degrees, `[0, 360)`
 * @throws RangeError on NaN or out-of-range input
 */
export function trueBearingFromMagneticDeg(magneticBearing: number, declinationDeg: number): number {
  assertFiniteInRange(magneticBearing, 'magneticBearingDeg');
  assertFiniteInRange(declinationDeg, 'declinationDeg', -180, 180);
  return normalizeDegrees360(magneticBearing + declinationDeg);
}
