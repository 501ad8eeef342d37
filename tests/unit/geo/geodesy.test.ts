import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import geographiclib from 'geographiclib-geodesic';
import {
  destinationPoint,
  distanceM,
  geodesicInverse,
  initialBearingDeg,
  sphericalDestinationPoint,
  sphericalDistanceM,
  sphericalInitialBearingDeg,
} from '../../../shared/geo/geodesy';
import { angleDifferenceDeg } from '../../../shared/units';

const reference = geographiclib.Geodesic.WGS84;

/** Degrees-minutes-seconds to decimal degrees; the sign of the whole value is `sign`. */
function dms(sign: 1 | -1, d: number, m: number, s: number): number {
  return sign * (d + m / 60 + s / 3600);
}

const ARCSEC_DEG = 1 / 3600;

// Random short lines: a start anywhere (poles included), any azimuth, 1 m .. 50 km. The end
// point is made by the reference library's direct problem, so the exact answer is known.
const shortLine = fc.record({
  lat: fc.double({ min: -89.9, max: 89.9, noNaN: true }),
  lon: fc.double({ min: -180, max: 180, noNaN: true }),
  azimuthDeg: fc.double({ min: 0, max: 359.999, noNaN: true }),
  lengthM: fc.double({ min: 1, max: 50_000, noNaN: true }),
});

function endOf(line: { lat: number; lon: number; azimuthDeg: number; lengthM: number }) {
  const r = reference.Direct(line.lat, line.lon, line.azimuthDeg, line.lengthM);
  return { lat: r.lat2 as number, lon: ((((r.lon2 as number) + 180) % 360) + 360) % 360 - 180 };
}

describe('WGS84 geodesics against published lines', () => {
  // GDA Technical Manual v2.3 (ICSM), GRS80: Flinders Peak to Buninyong. GRS80 and WGS84 differ
  // in flattening by 1.6e-11; over 55 km that moves the result by far less than 1 um.
  const flindersPeak = { lat: dms(-1, 37, 57, 3.7203), lon: dms(1, 144, 25, 29.5244) };
  const buninyong = { lat: dms(-1, 37, 39, 10.1561), lon: dms(1, 143, 55, 35.3839) };

  it('gives the GDA Flinders Peak - Buninyong distance to 1 mm', () => {
    expect(Math.abs(distanceM(flindersPeak, buninyong) - 54_972.271)).toBeLessThan(0.001);
  });

  it('gives the GDA forward azimuth 306d52m05.37s to 0.01 arcsec', () => {
    const forward = dms(1, 306, 52, 5.37);
    expect(Math.abs(angleDifferenceDeg(initialBearingDeg(flindersPeak, buninyong), forward))).toBeLessThan(0.01 * ARCSEC_DEG);
  });

  it('gives the GDA reverse azimuth 127d10m25.07s to 0.01 arcsec', () => {
    const reverse = dms(1, 127, 10, 25.07);
    const line = geodesicInverse(flindersPeak, buninyong);
    expect(Math.abs(angleDifferenceDeg(line.finalBearingDeg + 180, reverse))).toBeLessThan(0.01 * ARCSEC_DEG);
  });

  it('gives the GDA end point back from the direct problem to 1 mm', () => {
    const end = destinationPoint(flindersPeak, dms(1, 306, 52, 5.37), 54_972.271);
    // 1 mm is about 9e-9 deg of latitude.
    expect(Math.abs(end.lat - buninyong.lat)).toBeLessThan(1e-8);
    expect(Math.abs(end.lon - buninyong.lon)).toBeLessThan(1.2e-8);
  });

  // GeographicLib test suite (geographiclib-js, geodesic/test/geodesictest.js), WGS84; the published
  // 18-digit values rounded to the nearest double (8 935 244.5604818305 m, 111.098748429560326 deg,
  // 129.289270889708762 deg).
  it('gives the GeographicLib test line (8 935 km) to 1 um and 1e-12 deg', () => {
    const line = geodesicInverse({ lat: 35.60777, lon: -139.44815 }, { lat: -11.17491, lon: -69.95921 });
    expect(Math.abs(line.distanceM - 8_935_244.560_481_83)).toBeLessThan(1e-6);
    expect(Math.abs(line.initialBearingDeg - 111.09874842956033)).toBeLessThan(1e-12);
    expect(Math.abs(line.finalBearingDeg - 129.28927088970877)).toBeLessThan(1e-12);
  });
});

describe('WGS84 geodesics on random short lines', () => {
  // The WGS84 functions delegate to geographiclib-geodesic, so these properties check our wiring
  // (argument order, units, bearing folding to 0..360, longitude folding) over the whole globe,
  // not the library itself; the published lines above check the numbers. Tolerance: 1 um in
  // distance and a bearing error that moves the far end sideways by less than 1 um, far above the
  // library's ~15 nm and the rounding of double-precision coordinates, far below anything that matters.
  it('recovers distance and bearing of random lines up to 50 km', () => {
    fc.assert(fc.property(shortLine, (line) => {
      const result = geodesicInverse(line, endOf(line));
      expect(Math.abs(result.distanceM - line.lengthM)).toBeLessThan(1e-6);
      const bearingErrorRad = Math.abs(angleDifferenceDeg(result.initialBearingDeg, line.azimuthDeg)) * Math.PI / 180;
      expect(bearingErrorRad * line.lengthM).toBeLessThan(1e-6);
      expect(result.initialBearingDeg).toBeGreaterThanOrEqual(0);
      expect(result.initialBearingDeg).toBeLessThan(360);
    }), { numRuns: 500 });
  });

  it('lands on the reference end point for random lines up to 50 km', () => {
    fc.assert(fc.property(shortLine, (line) => {
      const end = destinationPoint(line, line.azimuthDeg, line.lengthM);
      const gap = reference.Inverse(end.lat, end.lon, endOf(line).lat, endOf(line).lon).s12 as number;
      expect(gap).toBeLessThan(1e-6);
    }), { numRuns: 500 });
  });

  it('gives distance 0 and bearing 0 for coincident points', () => {
    const p = { lat: 52.1, lon: -7.1 };
    expect(geodesicInverse(p, p)).toEqual({ distanceM: 0, initialBearingDeg: 0, finalBearingDeg: 0 });
  });

  it('crosses the antimeridian with the short way round', () => {
    const line = geodesicInverse({ lat: 0, lon: 179.99 }, { lat: 0, lon: -179.99 });
    // 0.02 deg of equator: 2 * pi * 6 378 137 m * 0.02 / 360 = 2226.39 m (computed).
    expect(Math.abs(line.distanceM - 2226.39)).toBeLessThan(0.01);
    expect(Math.abs(line.initialBearingDeg - 90)).toBeLessThan(1e-9);
  });
});

describe('spherical (turf) helpers for map drawing', () => {
  // Tolerances a spherical method needs against the WGS84 geodesic on short lines (derived, then
  // confirmed by measurement on 300 000 random lines): turf's sphere (R = 6 371 008.8 m) against
  // the meridian radius of curvature at the equator, M = a (1 - e^2) = 6 335 439 m, gives the
  // largest distance error, R / M - 1 = 0.5614 %; the bearing error is largest on a 45 deg line at
  // the equator, asin((1 - q) / (1 + q)) with q = M / N = 1 - e^2, = 0.1924 deg.
  const DISTANCE_RELATIVE_TOLERANCE = 0.0057;
  const BEARING_TOLERANCE_DEG = 0.195;

  it('stays within 0.57 % and 0.195 deg of the WGS84 geodesic on random lines up to 50 km', () => {
    fc.assert(fc.property(shortLine, (line) => {
      const end = endOf(line);
      expect(Math.abs(sphericalDistanceM(line, end) / line.lengthM - 1)).toBeLessThan(DISTANCE_RELATIVE_TOLERANCE);
      expect(Math.abs(angleDifferenceDeg(sphericalInitialBearingDeg(line, end), line.azimuthDeg))).toBeLessThan(BEARING_TOLERANCE_DEG);
    }), { numRuns: 500 });
  });

  it('lands within 0.57 % of the line length plus the bearing error of the WGS84 end point', () => {
    fc.assert(fc.property(shortLine, (line) => {
      const end = sphericalDestinationPoint(line, line.azimuthDeg, line.lengthM);
      const gap = reference.Inverse(end.lat, end.lon, endOf(line).lat, endOf(line).lon).s12 as number;
      const allowedM = line.lengthM * (DISTANCE_RELATIVE_TOLERANCE + BEARING_TOLERANCE_DEG * Math.PI / 180);
      expect(gap).toBeLessThan(allowedM);
    }), { numRuns: 500 });
  });

  // GDA Technical Manual v2.3 (ICSM), Flinders Peak - Buninyong: a spherical method is off by
  // roughly 0.1-0.3 %, so the looser tolerances of a sphere apply (REFERENCES.md says so too).
  it('gives the GDA line within 0.3 % in distance and 0.2 deg in bearing', () => {
    const flindersPeak = { lat: dms(-1, 37, 57, 3.7203), lon: dms(1, 144, 25, 29.5244) };
    const buninyong = { lat: dms(-1, 37, 39, 10.1561), lon: dms(1, 143, 55, 35.3839) };
    expect(Math.abs(sphericalDistanceM(flindersPeak, buninyong) / 54_972.271 - 1)).toBeLessThan(0.003);
    expect(Math.abs(angleDifferenceDeg(sphericalInitialBearingDeg(flindersPeak, buninyong), dms(1, 306, 52, 5.37)))).toBeLessThan(0.2);
  });

  // GeographicLib test suite, long line: a sphere is off by up to ~0.5 % in distance and a few
  // tenths of a degree in bearing over thousands of km.
  it('gives the GeographicLib test line within 0.5 % and 0.3 deg', () => {
    const from = { lat: 35.60777, lon: -139.44815 };
    const to = { lat: -11.17491, lon: -69.95921 };
    expect(Math.abs(sphericalDistanceM(from, to) / 8_935_244.560_481_83 - 1)).toBeLessThan(0.005);
    expect(Math.abs(angleDifferenceDeg(sphericalInitialBearingDeg(from, to), 111.09874842956033))).toBeLessThan(0.3);
  });

  // Haversine with R = 6371 km (chrisveness/geodesy test/latlon-spherical-tests.js): Cambridge to
  // Paris 404 279 m, initial bearing 156.2 deg. turf's radius is 8.8 m larger (1.4 ppm, 0.56 m here),
  // so 1 m; the bearing is published to 0.1 deg, so 0.05 deg.
  it('gives the haversine Cambridge - Paris line: 404 279 m, 156.2 deg', () => {
    const cambridge = { lat: 52.205, lon: 0.119 };
    const paris = { lat: 48.857, lon: 2.351 };
    expect(Math.abs(sphericalDistanceM(cambridge, paris) - 404_279)).toBeLessThan(1);
    expect(Math.abs(sphericalInitialBearingDeg(cambridge, paris) - 156.2)).toBeLessThan(0.05);
  });
});

describe('input guards', () => {
  const good = { lat: 52, lon: -7 };
  it.each([
    ['NaN latitude', () => distanceM({ lat: Number.NaN, lon: 0 }, good)],
    ['latitude above 90', () => initialBearingDeg({ lat: 90.5, lon: 0 }, good)],
    ['longitude below -180', () => geodesicInverse(good, { lat: 0, lon: -181 })],
    ['negative distance', () => destinationPoint(good, 10, -1)],
    ['infinite bearing', () => destinationPoint(good, Number.POSITIVE_INFINITY, 10)],
    ['NaN distance for turf', () => sphericalDestinationPoint(good, 10, Number.NaN)],
    ['latitude below -90 for turf', () => sphericalDistanceM({ lat: -91, lon: 0 }, good)],
  ])('throws a RangeError on %s', (_situation, call) => {
    expect(call).toThrow(RangeError);
  });
});
