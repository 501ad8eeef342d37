import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  angularWidthDeg,
  curvatureRefractionDropM,
  EARTH_RADIUS_M,
  elevationAngleDeg,
  eyeElevationM,
  landmarkElevationAnglesDeg,
} from '../../../shared/geo/elevation';
import { destinationPoint } from '../../../shared/geo/geodesy';
import type { Landmark, Vantage } from '../../../shared/schemas/geometry';

/**
 * Independent oracle: the exact elevation angle on a sphere of effective radius R' = R / (1 - k)
 * (the model that the drop formula d^2 (1 - k) / (2R) expands to first order): eye at radius
 * R' + e, point at radius R' + p, central angle d / R'.
 */
function exactEffectiveSphereDeg(eye: number, point: number, d: number, k: number): number {
  const rEff = EARTH_RADIUS_M / (1 - k);
  const gamma = d / rEff;
  const x = (rEff + point) * Math.sin(gamma);
  const y = (rEff + point) * Math.cos(gamma) - (rEff + eye);
  return Math.atan2(y, x) * 180 / Math.PI;
}

describe('curvature and refraction drop', () => {
  // REFERENCES.md, Geodesy, "Curvature and refraction drop" (computed from d^2/(2R)(1-k),
  // R = 6371 km): 7.848 m without refraction, 6.828 m with k = 0.13, at 10 km. Published to 1 mm.
  it.each([
    [0, 7.848],
    [0.13, 6.828],
  ])('at 10 km with k = %s is %s m', (k, expected) => {
    expect(Math.abs(curvatureRefractionDropM(10_000, k) - expected)).toBeLessThan(0.0005);
  });

  it('uses k = 0.13 by default', () => {
    expect(curvatureRefractionDropM(10_000)).toBe(curvatureRefractionDropM(10_000, 0.13));
  });

  it('grows with the square of distance: 4x the drop at twice the distance', () => {
    expect(curvatureRefractionDropM(20_000) / curvatureRefractionDropM(10_000)).toBeCloseTo(4, 12);
  });

  it('vanishes at k = 1, where the ray bends with the Earth', () => {
    expect(curvatureRefractionDropM(50_000, 1)).toBe(0);
  });
});

describe('elevation angle of a point from the eye', () => {
  // Hand-worked (computed), R = 6 371 000 m, k = 0.13:
  //  a) top 100 m, eye 1.5 m, 1 km: drop = 1000^2 / 12 742 000 * 0.87 = 0.068278 m,
  //     tan = (100 - 0.068278 - 1.5) / 1000 = 0.0984317, angle = 5.621613 deg
  //  b) eye and point both 50 m, 10 km: drop 6.827814 m, angle = atan(-6.827814 / 10000) = -0.039120 deg
  //  c) sea-level point 1 km from an eye at 1.5 m: tan = -(1.5 + 0.068278) / 1000, angle = -0.089856 deg
  //  d) top 30 m, eye 11.5 m, 300 m: drop 0.006145 m, tan = 18.493855 / 300, angle = 3.527602 deg
  it.each([
    ['a landmark top 100 m high at 1 km from an eye at 1.5 m', 1.5, 100, 1000, 5.621613],
    ['a point level with the eye at 10 km', 50, 50, 10_000, -0.03912],
    ['a sea-level point 1 km from an eye at 1.5 m', 1.5, 0, 1000, -0.089856],
    ['a 30 m top at 300 m from an eye at 11.5 m', 11.5, 30, 300, 3.527602],
  ])('gives the hand-worked value for %s', (_situation, eye, point, d, expectedDeg) => {
    expect(Math.abs(elevationAngleDeg(eye, point, d) - expectedDeg)).toBeLessThan(1e-6);
  });

  it('raises a distant point when refraction is on (k = 0.13 against k = 0)', () => {
    expect(elevationAngleDeg(2, 60, 20_000, 0.13)).toBeGreaterThan(elevationAngleDeg(2, 60, 20_000, 0));
  });

  // Tolerances measured on 400 000 random cases and stated in shared/geo/elevation.ts: the drop
  // formula ignores that the horizontal run at height h is d (1 + h / R).
  // Regression: with the eye up to 3000 m the bound was met only to the 15th digit (0.0010000000000003
  // deg at 1585 m, -5 deg); the claim holds for eyes below 1000 m, the coastal and hill case.
  it('agrees with the exact effective-sphere geometry within 0.001 deg for angles under 5 deg, eye below 1000 m', () => {
    fc.assert(fc.property(
      fc.double({ min: 10, max: 50_000, noNaN: true }),
      fc.double({ min: -100, max: 1000, noNaN: true }),
      fc.double({ min: -300, max: 300, noNaN: true }),
      fc.double({ min: 0, max: 0.3, noNaN: true }),
      (d, eye, rise, k) => {
        const point = eye + rise;
        fc.pre(point >= -1000 && Math.abs(elevationAngleDeg(eye, point, d, k)) < 5);
        expect(Math.abs(elevationAngleDeg(eye, point, d, k) - exactEffectiveSphereDeg(eye, point, d, k))).toBeLessThan(0.001);
      },
    ), { numRuns: 500 });
  });

  it('agrees with the exact effective-sphere geometry within 0.005 deg at any angle below 1000 m', () => {
    fc.assert(fc.property(
      fc.double({ min: 1, max: 50_000, noNaN: true }),
      fc.double({ min: -100, max: 1000, noNaN: true }),
      fc.double({ min: -100, max: 1000, noNaN: true }),
      fc.double({ min: 0, max: 0.3, noNaN: true }),
      (d, eye, point, k) => {
        expect(Math.abs(elevationAngleDeg(eye, point, d, k) - exactEffectiveSphereDeg(eye, point, d, k))).toBeLessThan(0.005);
      },
    ), { numRuns: 500 });
  });
});

describe('landmark top and base from a vantage', () => {
  const vantage: Vantage = { lat: 52.1, lon: -7.1, elevationM: 30, cameraHeightM: 1.5 };
  const at = destinationPoint(vantage, 123, 1000);
  const landmark: Landmark = { lat: at.lat, lon: at.lon, baseElevationM: 0, heightM: 60, widthM: 20 };

  it('takes the eye as ground elevation plus camera height', () => {
    expect(eyeElevationM(vantage)).toBe(31.5);
  });

  it('measures the WGS84 distance to the landmark', () => {
    expect(Math.abs(landmarkElevationAnglesDeg(vantage, landmark).distanceM - 1000)).toBeLessThan(1e-6);
  });

  // Hand-worked (computed): eye 31.5 m, 1 km, drop 0.068278 m; top 60 m:
  // atan((60 - 0.068278 - 31.5) / 1000) = 1.628579 deg; base 0 m: atan(-31.568278 / 1000) = -1.808129 deg.
  it('sees a 60 m stack at 1 km from a 30 m cliff with its top at 1.628579 deg and base at -1.808129 deg', () => {
    const angles = landmarkElevationAnglesDeg(vantage, landmark);
    expect(Math.abs(angles.topDeg - 1.628579)).toBeLessThan(1e-5);
    expect(Math.abs(angles.baseDeg - -1.808129)).toBeLessThan(1e-5);
  });

  it('uses a given distance instead of measuring one', () => {
    const angles = landmarkElevationAnglesDeg(vantage, landmark, { distanceM: 2000, k: 0 });
    expect(angles.topDeg).toBe(elevationAngleDeg(31.5, 60, 2000, 0));
    expect(angles.distanceM).toBe(2000);
  });

  it('applies the schema default camera height of 1.5 m when it is missing', () => {
    const bare = { lat: 52.1, lon: -7.1, elevationM: 30 } as Vantage;
    expect(eyeElevationM(bare)).toBe(31.5);
  });
});

describe('angular width', () => {
  // Hand-worked (computed): 2 atan(20 / (2 * 500)) = 2 * 1.145763 deg = 2.291526 deg.
  it('gives 2.291526 deg for 20 m at 500 m', () => {
    expect(Math.abs(angularWidthDeg(20, 500) - 2.291526)).toBeLessThan(1e-6);
  });

  it('gives 90 deg for a width twice its distance', () => {
    expect(angularWidthDeg(200, 100)).toBeCloseTo(90, 10);
  });

  it('gives 0 for a landmark of no width', () => {
    expect(angularWidthDeg(0, 100)).toBe(0);
  });
});

describe('input guards', () => {
  const vantage: Vantage = { lat: 52.1, lon: -7.1, elevationM: 30, cameraHeightM: 1.5 };
  it.each([
    ['a distance of 0', () => elevationAngleDeg(0, 10, 0)],
    ['a NaN eye elevation', () => elevationAngleDeg(Number.NaN, 10, 100)],
    ['a refraction coefficient above 1', () => elevationAngleDeg(0, 10, 100, 1.2)],
    ['a NaN refraction coefficient', () => curvatureRefractionDropM(100, Number.NaN)],
    ['a negative drop distance', () => curvatureRefractionDropM(-1)],
    ['a negative width', () => angularWidthDeg(-1, 100)],
    ['a width over 10 km', () => angularWidthDeg(10_001, 100)],
    ['a latitude out of range in the vantage', () => eyeElevationM({ ...vantage, lat: 91 })],
    ['a vantage and landmark at the same spot', () => landmarkElevationAnglesDeg(vantage, { lat: 52.1, lon: -7.1, baseElevationM: 0, heightM: 10, widthM: 5 })],
    ['a NaN landmark height', () => landmarkElevationAnglesDeg(vantage, { lat: 52.2, lon: -7.1, baseElevationM: 0, heightM: Number.NaN, widthM: 5 })],
  ])('throws a RangeError on %s', (_situation, call) => {
    expect(call).toThrow(RangeError);
  });
});
