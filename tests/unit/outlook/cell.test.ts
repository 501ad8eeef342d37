import { describe, expect, it } from 'vitest';
import { FORECAST_CELL_DEG, forecastCell, OUTLOOK_CAUTION } from '../../../shared/outlook';

describe('forecastCell', () => {
  it.each([
    // Rounding to the nearest 0.1 deg, worked by hand.
    [50.6001, -1.9502, 50.6, -2, '50.6,-2.0'],
    [50.64, -1.94, 50.6, -1.9, '50.6,-1.9'],
    [-33.86, 151.21, -33.9, 151.2, '-33.9,151.2'],
    [0.04, -0.04, 0, 0, '0.0,0.0'],
    [90, 180, 90, -180, '90.0,-180.0'],
    [-89.99, 179.97, -90, -180, '-90.0,-180.0'],
    [12.3456, -179.96, 12.3, -180, '12.3,-180.0'],
  ])('(%s, %s) is the cell (%s, %s) keyed %s', (lat, lon, cellLat, cellLon, key) => {
    const cell = forecastCell(lat, lon);
    expect(cell).toEqual({ lat: cellLat, lon: cellLon, key });
    expect(Object.is(cell.lat, -0) || Object.is(cell.lon, -0)).toBe(false);
  });

  it('puts positions less than half a cell apart in one cell', () => {
    expect(FORECAST_CELL_DEG).toBe(0.1);
    expect(forecastCell(50.61, -1.91).key).toBe(forecastCell(50.58, -1.87).key);
    expect(forecastCell(50.64, -1.91).key).not.toBe(forecastCell(50.66, -1.91).key);
  });

  it.each([[Number.NaN, 0], [91, 0], [0, -181], [0, Infinity]])('refuses (%s, %s)', (lat, lon) => {
    expect(() => forecastCell(lat, lon)).toThrow(RangeError);
  });
});

describe('OUTLOOK_CAUTION', () => {
  it('says a forecast is no promise and names the cold', () => {
    expect(OUTLOOK_CAUTION).toMatch(/not a promise/);
    expect(OUTLOOK_CAUTION).toMatch(/cold/);
  });
});
