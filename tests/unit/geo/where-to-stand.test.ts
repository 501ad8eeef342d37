import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { landmarkElevationAnglesDeg } from '../../../shared/geo/elevation';
import { destinationPoint, initialBearingDeg } from '../../../shared/geo/geodesy';
import { angleDifferenceDeg } from '../../../shared/units';
import { distanceForElevationAngleM, whereToStand, whereToStandLine } from '../../../shared/geo/where-to-stand';
import type { Landmark, Vantage } from '../../../shared/schemas/geometry';

const stack: Landmark = { lat: 52.14, lon: -7.02, baseElevationM: 0, heightM: 60, widthM: 25 };

describe('distance for a wanted elevation angle', () => {
  // Hand-worked (computed) with c = (1 - 0.13) / (2 * 6 371 000) = 6.8278e-8 per m, solving
  // c d^2 + d tan(e) - H = 0:
  //  a) H = 60 - 1.5 = 58.5 m, e = 10 deg: d = 2H / (tan e + sqrt(tan^2 e + 4cH)) = 331.7274 m
  //     (flat Earth would say 58.5 / tan 10 deg = 331.7703 m)
  //  b) H = 98.5 m, e = 0: d = sqrt(H / c) = sqrt(98.5 * 12 742 000 / 0.87) = 37 981.95 m
  //  c) eye 100 m above a 20 m top, e = -5 deg: the nearer root, 915.0577 m
  it.each([
    ['a 60 m stack at 10 deg from an eye at 1.5 m', 60, 1.5, 10, 331.7274],
    ['a top 98.5 m above the eye seen level', 100, 1.5, 0, 37_981.95],
    ['a 20 m top seen 5 deg down from a 100 m cliff', 20, 100, -5, 915.0577],
  ])('gives the hand-worked distance for %s', (_situation, top, eye, angle, expectedM) => {
    expect(Math.abs((distanceForElevationAngleM(top, eye, angle) as number) - expectedM)).toBeLessThan(0.01);
  });

  it.each([
    ['the eye is above the top and the angle is positive', 20, 100, 2, 0.13],
    ['the eye is level with the top and the angle is positive', 50, 50, 1, 0.13],
    // From 80 m above the top, curvature sinks it at least 0.2678 deg below level: tan = -2 sqrt(c * 80).
    ['the eye is above the top and the angle is shallower than curvature allows', 20, 100, -0.2, 0.13],
    ['refraction cancels curvature (k = 1) and the angle points away from the top', 50, 10, -1, 1],
  ])('returns null when %s', (_situation, top, eye, angle, k) => {
    expect(distanceForElevationAngleM(top, eye, angle, k)).toBeNull();
  });

  it('gives the flat-Earth distance when refraction cancels curvature (k = 1)', () => {
    expect(distanceForElevationAngleM(60, 1.5, 10, 1)).toBeCloseTo(58.5 / Math.tan(10 * Math.PI / 180), 9);
  });
});

describe('where to stand', () => {
  const azimuth = 135;

  it('puts the spot on the far side of the landmark from the target, at the solved distance', () => {
    const spot = whereToStand(stack, azimuth, { groundElevationM: 0, cameraHeightM: 1.5 }, 10);
    expect(spot).not.toBeNull();
    expect(Math.abs((spot?.distanceM ?? 0) - 331.7274)).toBeLessThan(0.01);
    // Target to the south-east means standing north-west of the stack.
    expect(spot?.lat ?? 0).toBeGreaterThan(stack.lat);
    expect(spot?.lon ?? 0).toBeLessThan(stack.lon);
    expect(spot?.eyeElevationM).toBe(1.5);
  });

  // Seeing the 60 m top 0.2 deg below level takes curvature: about 64 km away (computed).
  it('returns null when the wanted angle needs a spot beyond the distance limit', () => {
    expect(whereToStand(stack, azimuth, { eyeElevationM: 1.5 }, -0.2)).toBeNull();
    const far = whereToStand(stack, azimuth, { eyeElevationM: 1.5 }, -0.2, { maxDistanceM: 200_000 });
    expect(Math.abs((far?.distanceM ?? 0) - 64_400)).toBeLessThan(100);
  });

  it('returns null when the eye is above the landmark top and the angle is positive', () => {
    expect(whereToStand(stack, azimuth, { eyeElevationM: 80 }, 3)).toBeNull();
  });

  // Regression for the meridian convergence: over a 20 km east-west line at 52 deg N, the naive
  // spot "azimuth + 180 from the landmark" is seen at a bearing about 0.23 deg off the target.
  it('corrects for meridian convergence where the naive back-bearing is 0.2 deg off', () => {
    const tall: Landmark = { ...stack, heightM: 800 };
    const spot = whereToStand(tall, 90, { eyeElevationM: 1.5 }, 2) as NonNullable<ReturnType<typeof whereToStand>>;
    expect(spot.distanceM).toBeGreaterThan(15_000);
    const naive = destinationPoint(tall, 270, spot.distanceM);
    expect(Math.abs(angleDifferenceDeg(initialBearingDeg(naive, tall), 90))).toBeGreaterThan(0.15);
    expect(Math.abs(angleDifferenceDeg(initialBearingDeg(spot, tall), 90))).toBeLessThan(1e-8);
  });

  // Round trip: stand at the spot, measure with the forward functions. The distance solves the same
  // model in closed form and the geodesics are accurate to nanometres, so 1e-6 deg (0.004 arcsec)
  // is ample and still catches any real slip.
  it('gives back the wanted angle and target azimuth within 1e-6 deg from the returned spot', () => {
    fc.assert(fc.property(
      fc.double({ min: -70, max: 70, noNaN: true }),
      fc.double({ min: -179, max: 179, noNaN: true }),
      fc.double({ min: 0, max: 359.999, noNaN: true }),
      fc.double({ min: 1, max: 600, noNaN: true }),
      fc.double({ min: 0, max: 300, noNaN: true }),
      fc.double({ min: 0, max: 30, noNaN: true }),
      fc.double({ min: 0, max: 0.3, noNaN: true }),
      (lat, lon, azimuth, heightM, groundM, angle, k) => {
        const landmark: Landmark = { lat, lon, baseElevationM: 0, heightM, widthM: 10 };
        const spot = whereToStand(landmark, azimuth, { groundElevationM: groundM, cameraHeightM: 1.5 }, angle, { k });
        fc.pre(spot !== null);
        if (spot === null) return;
        const vantage: Vantage = { lat: spot.lat, lon: spot.lon, elevationM: groundM, cameraHeightM: 1.5 };
        const seen = landmarkElevationAnglesDeg(vantage, landmark, { k });
        expect(Math.abs(seen.topDeg - angle)).toBeLessThan(1e-6);
        expect(Math.abs(angleDifferenceDeg(initialBearingDeg(vantage, landmark), azimuth))).toBeLessThan(1e-6);
        expect(Math.abs(seen.distanceM - spot.distanceM)).toBeLessThan(1e-6);
      },
    ), { numRuns: 300 });
  });
});

describe('a line of candidate spots', () => {
  const eye = { eyeElevationM: 1.5 };

  it('gives one spot per degree from 1 to 10, coming closer as the angle steepens', () => {
    const line = whereToStandLine(stack, 200, eye, { fromDeg: 1, toDeg: 10 });
    expect(line.map((s) => s.elevationAngleDeg)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    for (let i = 1; i < line.length; i += 1) {
      expect((line[i] as { distanceM: number }).distanceM).toBeLessThan((line[i - 1] as { distanceM: number }).distanceM);
    }
    for (const spot of line) {
      expect(Math.abs(angleDifferenceDeg(spot.bearingToLandmarkDeg, 200))).toBeLessThan(1e-9);
    }
  });

  it('runs downwards when from is above to, and includes the end despite rounding', () => {
    const line = whereToStandLine(stack, 200, eye, { fromDeg: 5, toDeg: 4, stepDeg: 0.1 });
    expect(line).toHaveLength(11);
    expect(line[0]?.elevationAngleDeg).toBe(5);
    expect(Math.abs((line[10]?.elevationAngleDeg ?? 0) - 4)).toBeLessThan(1e-9);
  });

  it('leaves out the angles that cannot be reached from an eye above the top', () => {
    const line = whereToStandLine(stack, 200, { eyeElevationM: 100 }, { fromDeg: -3, toDeg: 3 });
    expect(line.map((s) => s.elevationAngleDeg)).toEqual([-3, -2, -1]);
  });

  it('throws a RangeError when asked for too many spots', () => {
    expect(() => whereToStandLine(stack, 200, eye, { fromDeg: -80, toDeg: 80, stepDeg: 0.01 })).toThrow(RangeError);
  });
});

describe('input guards', () => {
  it.each([
    ['a NaN azimuth', () => whereToStand(stack, Number.NaN, { eyeElevationM: 1.5 }, 5)],
    ['an angle of 90 deg', () => whereToStand(stack, 10, { eyeElevationM: 1.5 }, 90)],
    ['a NaN eye elevation', () => whereToStand(stack, 10, { eyeElevationM: Number.NaN }, 5)],
    ['a camera height over 100 m', () => whereToStand(stack, 10, { groundElevationM: 0, cameraHeightM: 150 }, 5)],
    ['a maximum distance of 0', () => whereToStand(stack, 10, { eyeElevationM: 1.5 }, 5, { maxDistanceM: 0 })],
    ['a landmark latitude out of range', () => whereToStand({ ...stack, lat: -95 }, 10, { eyeElevationM: 1.5 }, 5)],
    ['a step of 0', () => whereToStandLine(stack, 10, { eyeElevationM: 1.5 }, { fromDeg: 1, toDeg: 2, stepDeg: 0 })],
    ['a refraction coefficient of -3', () => distanceForElevationAngleM(10, 1, 1, -3)],
  ])('throws a RangeError on %s', (_situation, call) => {
    expect(call).toThrow(RangeError);
  });
});
