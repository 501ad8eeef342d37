import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatDecimalDegrees, formatDms, parseCoordinates } from '../../../shared/geo/coordinates';

// Expected values worked by hand: 52°07'24.2" = 52 + 7/60 + 24.2/3600 = 52.1233889 deg;
// 52° 07.404' = 52 + 7.404/60 = 52.1234 deg.
const DMS_LAT = 52 + 7 / 60 + 24.2 / 3600;
const DMS_LON = -(7 + 7 / 60 + 24.2 / 3600);
const DDM_LAT = 52 + 7.404 / 60;
const DDM_LON = -(7 + 7.404 / 60);

describe('parsing good coordinate pairs', () => {
  it.each([
    ['decimal with comma and space', '52.1234, -7.1234', 52.1234, -7.1234],
    ['decimal with a space only', '52.1234 -7.1234', 52.1234, -7.1234],
    ['decimal with comma and no space', '52.1234,-7.1234', 52.1234, -7.1234],
    ['decimal with a semicolon', '52.1234; -7.1234', 52.1234, -7.1234],
    ['decimal, southern and eastern', '-33.8568 151.2153', -33.8568, 151.2153],
    ['decimal with explicit plus signs', '+52.1234 +7.1234', 52.1234, 7.1234],
    ['decimal with suffix letters', '52.1234N 7.1234W', 52.1234, -7.1234],
    ['decimal with prefix letters', 'N 52.1234 W 7.1234', 52.1234, -7.1234],
    ['decimal with degree marks and letters', '52.1234° N, 7.1234° W', 52.1234, -7.1234],
    ['lower-case letters', '52.1234n 7.1234w', 52.1234, -7.1234],
    ['longitude first, told by letters', '7.1234W 52.1234N', 52.1234, -7.1234],
    ['one letter on the longitude only', '52.1234 7.1234W', 52.1234, -7.1234],
    ['labels and brackets', '(lat: 52.1234, lon: -7.1234)', 52.1234, -7.1234],
    ['decimal commas throughout', '52,1234 -7,1234', 52.1234, -7.1234],
    ['a comma between whole numbers', '52,7', 52, 7],
    ['DMS with ASCII marks', '52°07\'24.2"N 7°07\'24.2"W', DMS_LAT, DMS_LON],
    ['DMS with typographic marks', '52°07′24.2″N, 7°07′24.2″W', DMS_LAT, DMS_LON],
    ['DMS with spaces and curly quotes', '52° 07’ 24.2” N 7° 07’ 24.2” W', DMS_LAT, DMS_LON],
    ['DMS with two apostrophes for seconds', "52°07'24.2''N 7°07'24.2''W", DMS_LAT, DMS_LON],
    ['DMS without marks, comma-separated', '52 07 24.2 N, 7 07 24.2 W', DMS_LAT, DMS_LON],
    ['DMS without marks or letters', '52 07 24.2 -7 07 24.2', DMS_LAT, DMS_LON],
    ['DMS with prefix letters', 'N52°07\'24.2" W7°07\'24.2"', DMS_LAT, DMS_LON],
    ['DDM with letters', '52 07.404 N, 7 07.404 W', DDM_LAT, DDM_LON],
    ['DDM with marks and signs', '52°07.404\' -7°07.404\'', DDM_LAT, DDM_LON],
    ['DDM of four plain numbers', '52 07.404 7 07.404', DDM_LAT, -DDM_LON],
    ['a Unicode minus', '52.1234, \u22127.1234', 52.1234, -7.1234],
    ['the poles and the antimeridian', '-90, 180', -90, 180],
    ['zeros with a minus sign', '-0.0, 0', 0, 0],
  ])('reads %s: %s', (_situation, input, lat, lon) => {
    const result = parseCoordinates(input);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(Math.abs(result.lat - lat)).toBeLessThan(1e-12);
    expect(Math.abs(result.lon - lon)).toBeLessThan(1e-12);
  });
});

describe('parsing bad input', () => {
  it.each([
    ['nothing', '', /Type or paste/],
    ['only spaces', '   ', /Type or paste/],
    ['a single number', '52.1234', /only one/],
    ['three values', '52.1, -7.1, 30', /found 3/],
    ['a word', 'Hook Head', /Unexpected "H"/],
    ['latitude out of range', '95.2, 7.1', /Latitude 95.2 is out of range/],
    ['longitude out of range', '52.1, 190', /Longitude 190 is out of range/],
    ['the order swapped (longitude, latitude)', '-122.4, 37.8', /longitude, latitude order/],
    ['minutes of 60 or more', '52 61 00 N, 7 07 24 W', /minutes must be below 60, got 61/],
    ['seconds of 60 or more', '52°07\'60"N 7°07\'24"W', /seconds must be below 60, got 60/],
    ['decimal degrees followed by minutes', '52.5 07 N, 7 07 W', /degrees with a decimal part cannot be followed by minutes/],
    ['a minus sign with a hemisphere letter', '-52.1 N, 7.1 W', /both a minus sign and the letter N/],
    ['two latitudes', '52.1 N 7.1 S', /Both values are latitudes/],
    ['two longitudes', '52.1 E, 7.1 W', /Both values are longitudes/],
    ['minutes before degrees', '07\'52° N, 7 W', /degrees come after minutes/],
    ['a sign on the minutes', '52 -07 N, 7 07 W', /Only the degrees may carry a sign/],
    ['five plain numbers', '52 07 24 7 07', /separate them with a comma/],
    ['two hemisphere letters on one value', 'N52.1N, 7.1W', /two hemisphere letters/],
    ['a letter inside a value', '52 N 07, 7 W', /must stand before or after/],
    ['a stray mark', '52°°, 7', /unit mark without a number/],
    ['a very long paste', '1'.repeat(201), /too long/],
  ])('explains %s', (_situation, input, message) => {
    const result = parseCoordinates(input);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error).toMatch(message);
  });
});

describe('formatting', () => {
  it.each([
    [{ lat: DMS_LAT, lon: DMS_LON }, 1, '52°07\'24.2"N 7°07\'24.2"W'],
    [{ lat: -33.8568, lon: 151.2153 }, 1, '33°51\'24.5"S 151°12\'55.1"E'],
    // 59.96" rounds up: the carry goes into minutes and then degrees.
    [{ lat: 10 + 59 / 60 + 59.96 / 3600, lon: 0 }, 1, '11°00\'00.0"N 0°00\'00.0"E'],
    [{ lat: 0, lon: -0.5 }, 0, '0°00\'00"N 0°30\'00"W'],
  ])('writes %o as DMS with %s decimals: %s', (point, decimals, expected) => {
    expect(formatDms(point, decimals)).toBe(expected);
  });

  it.each([
    [{ lat: 52.1234, lon: -7.1234 }, 6, '52.123400, -7.123400'],
    [{ lat: -0.0000001, lon: 0 }, 4, '0.0000, 0.0000'],
    [{ lat: 90, lon: -180 }, 0, '90, -180'],
  ])('writes %o as decimal degrees with %s decimals: %s', (point, decimals, expected) => {
    expect(formatDecimalDegrees(point, decimals)).toBe(expected);
  });

  it('reads back its own DMS to within half the last digit (0.05 arcsec)', () => {
    fc.assert(fc.property(
      fc.double({ min: -90, max: 90, noNaN: true }),
      fc.double({ min: -180, max: 180, noNaN: true }),
      (lat, lon) => {
        const back = parseCoordinates(formatDms({ lat, lon }, 1));
        expect(back.ok).toBe(true);
        if (!back.ok) return;
        expect(Math.abs(back.lat - lat) * 3600).toBeLessThanOrEqual(0.05 + 1e-9);
        expect(Math.abs(back.lon - lon) * 3600).toBeLessThanOrEqual(0.05 + 1e-9);
      },
    ), { numRuns: 500 });
  });

  it('reads back its own decimal degrees to within half the last digit', () => {
    fc.assert(fc.property(
      fc.double({ min: -90, max: 90, noNaN: true }),
      fc.double({ min: -180, max: 180, noNaN: true }),
      (lat, lon) => {
        const back = parseCoordinates(formatDecimalDegrees({ lat, lon }, 6));
        expect(back.ok).toBe(true);
        if (!back.ok) return;
        expect(Math.abs(back.lat - lat)).toBeLessThanOrEqual(5e-7 + 1e-12);
        expect(Math.abs(back.lon - lon)).toBeLessThanOrEqual(5e-7 + 1e-12);
      },
    ), { numRuns: 500 });
  });

  it.each([
    ['a NaN latitude', () => formatDms({ lat: Number.NaN, lon: 0 })],
    ['a longitude beyond 180', () => formatDecimalDegrees({ lat: 0, lon: 181 })],
    ['too many decimals', () => formatDecimalDegrees({ lat: 0, lon: 0 }, 11)],
  ])('throws a RangeError on %s', (_situation, call) => {
    expect(call).toThrow(RangeError);
  });
});
