import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { calibrateFromLandmark, rollFromHorizonDeg } from '../../../shared/projection/calibrate';
import { type CameraPose, horizontalFovDeg, pixelToSky, skyToPixel } from '../../../shared/projection/camera';
import { angleDifferenceDeg, normalizeDegrees360 } from '../../../shared/units';

// All checks here are computed: a known pose makes a synthetic click (the landmark's pixel) and
// synthetic horizon points, and the calibration must recover the pose.

function expectPoseClose(actual: CameraPose, expected: CameraPose, toleranceDeg: number): void {
  expect(Math.abs(angleDifferenceDeg(actual.azimuthDeg, expected.azimuthDeg))).toBeLessThan(toleranceDeg);
  expect(Math.abs(actual.altitudeDeg - expected.altitudeDeg)).toBeLessThan(toleranceDeg);
  expect(Math.abs(angleDifferenceDeg(actual.rollDeg, expected.rollDeg))).toBeLessThan(toleranceDeg);
}

const base: CameraPose = { azimuthDeg: 200, altitudeDeg: 8, rollDeg: 0, horizontalFovDeg: horizontalFovDeg(24, 36), widthPx: 6000, heightPx: 4000 };

describe('calibrateFromLandmark', () => {
  it.each([
    ['level, landmark at the centre', { altitudeDeg: 0 }, { x: 3000, y: 2000 }],
    ['tilted up, landmark low right', { altitudeDeg: 25 }, { x: 4500, y: 3500 }],
    ['tilted down, landmark top left', { altitudeDeg: -10 }, { x: 300, y: 200 }],
    ['steep up, landmark near the centre', { altitudeDeg: 60 }, { x: 3200, y: 2100 }],
    ['rolled 12 deg, landmark off centre', { altitudeDeg: 5, rollDeg: 12 }, { x: 1000, y: 2600 }],
    ['pointing across north, landmark right', { azimuthDeg: 355, altitudeDeg: 15 }, { x: 5800, y: 1800 }],
  ])('%s: recovers the pose within 0.01 deg with a residual under 0.01 px', (_label, overrides, click) => {
    const truth = { ...base, ...overrides };
    const landmark = pixelToSky(truth, click);
    const result = calibrateFromLandmark({ clickPx: click, landmark, horizontalFovDeg: truth.horizontalFovDeg, widthPx: 6000, heightPx: 4000, rollDeg: truth.rollDeg });
    expectPoseClose(result.pose, truth, 0.01);
    expect(result.residualPx).toBeLessThan(0.01);
    expect(result.pose.horizontalFovDeg).toBe(truth.horizontalFovDeg);
  });

  it('recovers random poses from a random click (fast-check)', () => {
    // Axis within 30 deg of the horizon and FOV up to 90 deg: the landmark then never lies past
    // the zenith in the camera's vertical plane, where a second pose would fit the click too.
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 359.999, noNaN: true }),
        fc.double({ min: -30, max: 30, noNaN: true }),
        fc.double({ min: -45, max: 45, noNaN: true }),
        fc.double({ min: 5, max: 90, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (azimuthDeg, altitudeDeg, rollDeg, fov, fx, fy) => {
          const truth: CameraPose = { azimuthDeg, altitudeDeg, rollDeg, horizontalFovDeg: fov, widthPx: 4000, heightPx: 3000 };
          const click = { x: fx * 4000, y: fy * 3000 };
          const landmark = pixelToSky(truth, click);
          const result = calibrateFromLandmark({ clickPx: click, landmark, horizontalFovDeg: fov, widthPx: 4000, heightPx: 3000, rollDeg });
          expectPoseClose(result.pose, truth, 0.01);
          expect(result.residualPx).toBeLessThan(0.01);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('takes the roll from two horizon points and then recovers the pointing', () => {
    const truth = { ...base, altitudeDeg: 12, rollDeg: -7.5 };
    const a = skyToPixel(truth, { azimuthDeg: 185, altitudeDeg: 0 });
    const b = skyToPixel(truth, { azimuthDeg: 218, altitudeDeg: 0 });
    const click = { x: 2500, y: 1400 };
    const landmark = pixelToSky(truth, click);
    const result = calibrateFromLandmark({ clickPx: click, landmark, horizontalFovDeg: truth.horizontalFovDeg, widthPx: 6000, heightPx: 4000, rollDeg: 30, horizonPx: [a, b] });
    expectPoseClose(result.pose, truth, 0.01);
    expect(result.residualPx).toBeLessThan(0.01);
  });

  it('reports a residual when no pose can put the landmark at the click', () => {
    // Landmark almost at the zenith but clicked on the image's right edge of a 120 deg FOV:
    // a ray 60 deg off the axis cannot reach 89.9 deg altitude with a level right axis.
    const result = calibrateFromLandmark({ clickPx: { x: 6000, y: 2000 }, landmark: { azimuthDeg: 10, altitudeDeg: 89.9 }, horizontalFovDeg: 120, widthPx: 6000, heightPx: 4000 });
    expect(result.residualPx).toBeGreaterThan(100);
    expect(result.pose.altitudeDeg).toBeCloseTo(90, 6);
  });

  it.each([
    ['a NaN click', { clickPx: { x: Number.NaN, y: 0 } }],
    ['a landmark altitude of 95 deg', { landmark: { azimuthDeg: 10, altitudeDeg: 95 } }],
    ['a FOV of 179.5 deg', { horizontalFovDeg: 179.5 }],
    ['an image width of 0', { widthPx: 0 }],
    ['a roll of 200 deg', { rollDeg: 200 }],
    ['two horizon points at the same pixel', { horizonPx: [{ x: 10, y: 10 }, { x: 10.2, y: 10.2 }] as const }],
  ])('refuses %s with a RangeError', (_label, bad) => {
    const input = { clickPx: { x: 3000, y: 2000 }, landmark: { azimuthDeg: 10, altitudeDeg: 3 }, horizontalFovDeg: 60, widthPx: 6000, heightPx: 4000, ...bad };
    expect(() => calibrateFromLandmark(input)).toThrow(RangeError);
  });
});

describe('rollFromHorizonDeg', () => {
  it.each([
    // computed: pixel y runs down, so a horizon rising to the right has y falling with x.
    [{ x: 0, y: 100 }, { x: 100, y: 0 }, 45],
    [{ x: 100, y: 0 }, { x: 0, y: 100 }, 45],
    [{ x: 0, y: 0 }, { x: 100, y: 0 }, 0],
    [{ x: 0, y: 0 }, { x: 1000, y: 176.32698 }, -10],
    [{ x: 0, y: 0 }, { x: 0, y: 50 }, 90],
  ])('from %o and %o the roll is %s deg', (a, b, expected) => {
    expect(rollFromHorizonDeg(a, b)).toBeCloseTo(expected, 4);
  });

  it('matches the roll of a synthetic camera for any pointing (a level great circle projects to a line tilted by the roll)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 359.999, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        fc.double({ min: -80, max: 80, noNaN: true }),
        (azimuthDeg, altitudeDeg, rollDeg) => {
          const pose: CameraPose = { azimuthDeg, altitudeDeg, rollDeg, horizontalFovDeg: 60, widthPx: 3000, heightPx: 2000 };
          const a = skyToPixel(pose, { azimuthDeg: normalizeDegrees360(azimuthDeg - 10), altitudeDeg: 0 });
          const b = skyToPixel(pose, { azimuthDeg: normalizeDegrees360(azimuthDeg + 10), altitudeDeg: 0 });
          expect(a.inFront && b.inFront).toBe(true);
          expect(rollFromHorizonDeg(a, b)).toBeCloseTo(rollDeg, 6);
        },
      ),
      { numRuns: 300 },
    );
  });
});
