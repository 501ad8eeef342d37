/**
 * The forecast cell of a position: latitude and longitude rounded to 0.1 deg.
 *
 * Why 0.1 deg: the forecast models behind a hosted service have grid spacings of about 1 to 25 km,
 * and 0.1 deg of latitude is about 11 km, so vantages in one cell get nearly the same forecast and
 * share one fetch and one cached row. It also keeps the exact vantage, which photographers often
 * keep to themselves, from leaving the machine: the service sees the cell, never the spot.
 */
import { assertFiniteInRange } from '../guards';

/** Size of a forecast cell, degrees of latitude and of longitude. */
export const FORECAST_CELL_DEG = 0.1;

/** A forecast cell: its centre (rounded position) and the key it is cached under. */
export interface ForecastCell {
  /** Latitude rounded to 0.1 deg, -90..90. */
  lat: number;
  /** Longitude rounded to 0.1 deg, -180..180 (exclusive of 180: the antimeridian is -180). */
  lon: number;
  /** `"<lat>,<lon>"` with one decimal each, e.g. `"50.6,-1.9"`. */
  key: string;
}

/** Rounds to one decimal, returning +0 rather than -0. */
function roundToCell(valueDeg: number): number {
  return Number((Math.round(valueDeg / FORECAST_CELL_DEG) * FORECAST_CELL_DEG).toFixed(1)) + 0;
}

/**
 * The forecast cell a position falls in (nearest 0.1 deg in each coordinate).
 *
 * @param latDeg - latitude in degrees, -90..90 (WGS84)
 * @param lonDeg - longitude in degrees, -180..180 (east positive)
 * @returns the cell's rounded position and cache key; 180 deg folds to -180 so both meet in one cell
 * @throws RangeError when a coordinate is not finite or out of range
 */
export function forecastCell(latDeg: number, lonDeg: number): ForecastCell {
  assertFiniteInRange(latDeg, 'latDeg', -90, 90);
  assertFiniteInRange(lonDeg, 'lonDeg', -180, 180);
  const lat = roundToCell(latDeg);
  let lon = roundToCell(lonDeg);
  if (lon >= 180) lon = -180;
  return { lat, lon, key: `${lat.toFixed(1)},${lon.toFixed(1)}` };
}
