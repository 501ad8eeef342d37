/**
 * Guards of the sky's input shapes: an observer site and a J2000 position, used by the sky
 * modules, the lineup engine and the charts. Each throws a RangeError naming the field on a
 * missing, NaN or out-of-range value (wording of shared/guards.ts).
 */
import type { EquatorialJ2000, ObserverSite } from '../schemas/geometry';
import { assertFiniteInRange } from '../guards';

// The number and date guards live in shared/guards.ts; re-exported here because the sky's barrel
// and shared/chart expose them from this module.
export { assertFiniteInRange, assertValidDate } from '../guards';

/** Lowest ground elevation (metres above sea level) accepted for an observer, as in the geometry schemas. */
export const MIN_ELEVATION_M = -500;
/** Highest ground elevation (metres above sea level) accepted for an observer, as in the geometry schemas. */
export const MAX_ELEVATION_M = 9000;

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
