/**
 * Dew point and dew risk on the lens.
 *
 * Saturation vapour pressure over water by the Magnus form with the constants of Alduchov and
 * Eskridge (1996), "Improved Magnus form approximation of saturation vapor pressure", J. Appl.
 * Meteor. 35, 601-609: e_s(T) = 6.1094 exp(17.625 T / (T + 243.04)) hPa, T in deg C. The paper
 * states it for -40..+50 deg C; outside that it is an extrapolation (still monotonic and smooth).
 * The dew point inverts it: with g = ln(RH / 100) + a T / (b + T), Td = b g / (a - g).
 *
 * The dew risk rule is common practice among night photographers, not a published standard: a lens
 * pointed at a clear sky cools a degree or two below the air by radiating to space, so dew forms
 * on it when the air is within about 2 deg C of its dew point, and may form within about 4 deg C.
 * Relative humidity stands in when no temperature is given: by the Magnus form, 90 % and 80 % are
 * spreads of about 1.4..1.7 and 3.0..3.6 deg C at 0..20 deg C, a little inside the two limits.
 */
import { assertFiniteInRange } from '../guards';
import type { DewRisk, ForecastHour } from '../schemas/outlook';

/** Magnus constant a (dimensionless), Alduchov and Eskridge (1996). */
export const MAGNUS_A = 17.625;
/** Magnus constant b, deg C, Alduchov and Eskridge (1996). */
export const MAGNUS_B_C = 243.04;
/** Saturation vapour pressure at 0 deg C in the Magnus form, hPa, Alduchov and Eskridge (1996). */
export const MAGNUS_E0_HPA = 6.1094;

/** Air temperatures accepted, deg C (the range of the forecast shape). */
const MIN_TEMPERATURE_C = -95;
const MAX_TEMPERATURE_C = 65;

/** Spread (temperature minus dew point) at or below which dew on the lens is likely, deg C (common practice). */
export const DEW_SPREAD_HIGH_C = 2;
/** Spread at or below which dew on the lens is possible, deg C (common practice). */
export const DEW_SPREAD_MODERATE_C = 4;
/** Relative humidity at or above which dew is likely when no spread is known, % (common practice). */
export const DEW_HUMIDITY_HIGH_PCT = 90;
/** Relative humidity at or above which dew is possible when no spread is known, % (common practice). */
export const DEW_HUMIDITY_MODERATE_PCT = 80;

/**
 * Saturation vapour pressure over liquid water (Magnus form, Alduchov and Eskridge 1996).
 *
 * @param temperatureC - air temperature, deg C, -95..65 (stated accuracy: -40..50)
 * @returns saturation vapour pressure, hPa
 * @throws RangeError when the temperature is not finite or out of range
 */
export function saturationVapourPressureHpa(temperatureC: number): number {
  assertFiniteInRange(temperatureC, 'temperatureC', MIN_TEMPERATURE_C, MAX_TEMPERATURE_C);
  return MAGNUS_E0_HPA * Math.exp((MAGNUS_A * temperatureC) / (MAGNUS_B_C + temperatureC));
}

/**
 * Dew point from air temperature and relative humidity (Magnus form, Alduchov and Eskridge 1996).
 *
 * @param temperatureC - air temperature, deg C, -95..65
 * @param relativeHumidityPct - relative humidity over water, %, above 0 and at most 100
 * @returns dew point, deg C (equal to the temperature at 100 %)
 * @throws RangeError when an argument is not finite or out of range
 */
export function dewPointC(temperatureC: number, relativeHumidityPct: number): number {
  assertFiniteInRange(temperatureC, 'temperatureC', MIN_TEMPERATURE_C, MAX_TEMPERATURE_C);
  assertFiniteInRange(relativeHumidityPct, 'relativeHumidityPct', 0, 100);
  if (relativeHumidityPct === 0) throw new RangeError('relativeHumidityPct must be above 0 and at most 100 (got 0)');
  const g = Math.log(relativeHumidityPct / 100) + (MAGNUS_A * temperatureC) / (MAGNUS_B_C + temperatureC);
  return (MAGNUS_B_C * g) / (MAGNUS_A - g);
}

/**
 * Relative humidity from air temperature and dew point (Magnus form, Alduchov and Eskridge 1996):
 * 100 e_s(Td) / e_s(T).
 *
 * @param temperatureC - air temperature, deg C, -95..65
 * @param dewPointTemperatureC - dew point, deg C, -95..65, at most the temperature
 * @returns relative humidity, %, 0..100
 * @throws RangeError when an argument is out of range or the dew point is above the temperature
 */
export function relativeHumidityFromDewPointPct(temperatureC: number, dewPointTemperatureC: number): number {
  const es = saturationVapourPressureHpa(temperatureC);
  const e = saturationVapourPressureHpa(dewPointTemperatureC);
  if (dewPointTemperatureC > temperatureC) {
    throw new RangeError(`dewPointTemperatureC must be at most temperatureC (got ${dewPointTemperatureC} > ${temperatureC})`);
  }
  return (100 * e) / es;
}

/** The dew risk of one hour and the spread it was judged on. */
export interface HourDewRisk {
  risk: DewRisk;
  /** Temperature minus dew point, deg C (never below 0); null when it cannot be known. */
  spreadC: number | null;
}

/**
 * Dew risk on the lens for one forecast hour (common practice, see the module notes): 'high' when
 * the spread is at most {@link DEW_SPREAD_HIGH_C} or, without a spread, humidity at least
 * {@link DEW_HUMIDITY_HIGH_PCT}; 'moderate' at most {@link DEW_SPREAD_MODERATE_C} or at least
 * {@link DEW_HUMIDITY_MODERATE_PCT}; 'low' otherwise; 'unknown' with neither. The dew point is the
 * service's own when given, else computed from temperature and humidity by the Magnus form.
 *
 * @param hour - temperature, dew point and relative humidity of the hour (each may be null)
 * @returns the risk and the spread used
 * @throws RangeError when a given value is out of the forecast shape's range
 */
export function dewRiskOfHour(hour: Pick<ForecastHour, 'temperatureC' | 'dewPointC' | 'relativeHumidityPct'>): HourDewRisk {
  const { temperatureC, relativeHumidityPct } = hour;
  if (relativeHumidityPct !== null) assertFiniteInRange(relativeHumidityPct, 'relativeHumidityPct', 0, 100);
  let dewPoint = hour.dewPointC;
  if (dewPoint !== null) assertFiniteInRange(dewPoint, 'dewPointC', MIN_TEMPERATURE_C, MAX_TEMPERATURE_C);
  if (temperatureC !== null) {
    assertFiniteInRange(temperatureC, 'temperatureC', MIN_TEMPERATURE_C, MAX_TEMPERATURE_C);
    if (dewPoint === null && relativeHumidityPct !== null && relativeHumidityPct > 0) dewPoint = dewPointC(temperatureC, relativeHumidityPct);
  }
  if (temperatureC !== null && dewPoint !== null) {
    // Models can put the dew point a hair above the temperature in fog: that is a spread of 0.
    const spreadC = Math.max(0, temperatureC - dewPoint);
    const risk: DewRisk = spreadC <= DEW_SPREAD_HIGH_C ? 'high' : spreadC <= DEW_SPREAD_MODERATE_C ? 'moderate' : 'low';
    return { risk, spreadC };
  }
  if (relativeHumidityPct !== null) {
    const risk: DewRisk = relativeHumidityPct >= DEW_HUMIDITY_HIGH_PCT ? 'high' : relativeHumidityPct >= DEW_HUMIDITY_MODERATE_PCT ? 'moderate' : 'low';
    return { risk, spreadC: null };
  }
  return { risk: 'unknown', spreadC: null };
}

const riskOrder: Record<DewRisk, number> = { unknown: 0, low: 1, moderate: 2, high: 3 };

/**
 * The worse of two dew risks ('unknown' counts as least, so any known hour decides).
 *
 * @param a - one risk
 * @param b - another risk
 * @returns the higher of the two
 */
export function worseDewRisk(a: DewRisk, b: DewRisk): DewRisk {
  return riskOrder[b] > riskOrder[a] ? b : a;
}
