/**
 * Input guards for the sky modules. Each throws a RangeError (with the argument's name) on NaN,
 * non-finite or out-of-range input, so callers get one error type for bad numbers.
 */
import type { EquatorialJ2000, ObserverSite } from '../schemas/geometry';

/** Lowest and highest ground elevation (metres) accepted for an observer, as in the geometry schemas. */
export const MIN_ELEVATION_M = -500;
export const MAX_ELEVATION_M = 9000;

/**
 * Checks that `value` is a finite number within [min, max] (inclusive) and returns it.
 * @param value the number to check
 * @param name the argument's name, used in the error message
 * @param min lowest allowed value (default -Infinity)
 * @param max highest allowed value (default +Infinity)
 * @throws RangeError when `value` is not a finite number in range
 */
export function assertFiniteInRange(value: unknown, name: string, min = -Infinity, max = Infinity): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)})`);
  }
  if (value < min || value > max) {
    throw new RangeError(`${name} must be between ${min} and ${max} (got ${value})`);
  }
  return value;
}

/**
 * Checks that `value` is a valid Date (not an Invalid Date) and returns it.
 * @throws RangeError when `value` is not a Date or its time is NaN
 */
export function assertValidDate(value: unknown, name: string): Date {
  if (!(value instanceof Date) || !Number.isFinite(value.getTime())) {
    throw new RangeError(`${name} must be a valid Date`);
  }
  return value;
}

/**
 * Checks an observer site: latitude -90..90 deg, longitude -180..180 deg (east positive),
 * elevation -500..9000 m above sea level.
 * @throws RangeError on a missing, non-finite or out-of-range field
 */
export function assertSite(site: unknown, name = 'site'): ObserverSite {
  if (site === null || typeof site !== 'object') throw new RangeError(`${name} must be an object`);
  const s = site as Record<string, unknown>;
  assertFiniteInRange(s.lat, `${name}.lat`, -90, 90);
  assertFiniteInRange(s.lon, `${name}.lon`, -180, 180);
  const elevationM = s.elevationM === undefined ? 0 : s.elevationM;
  assertFiniteInRange(elevationM, `${name}.elevationM`, MIN_ELEVATION_M, MAX_ELEVATION_M);
  return { lat: s.lat as number, lon: s.lon as number, elevationM: elevationM as number };
}

/**
 * Checks a J2000 position: RA 0 <= raHours < 24, Dec -90..90 deg.
 * @throws RangeError on a missing, non-finite or out-of-range field
 */
export function assertEquatorialJ2000(target: unknown, name = 'target'): EquatorialJ2000 {
  if (target === null || typeof target !== 'object') throw new RangeError(`${name} must be an object`);
  const t = target as Record<string, unknown>;
  assertFiniteInRange(t.raHours, `${name}.raHours`, 0, 24);
  if ((t.raHours as number) >= 24) throw new RangeError(`${name}.raHours must be below 24 (got ${String(t.raHours)})`);
  assertFiniteInRange(t.decDeg, `${name}.decDeg`, -90, 90);
  return { raHours: t.raHours as number, decDeg: t.decDeg as number };
}
