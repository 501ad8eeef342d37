import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { type SkyDirection, skyToPixel } from '../../../shared/projection/camera';
import { fieldOfView, fitInFrame, focalLengthForFovMm, heldFieldOfView, longestFittingFocalLength } from '../../../shared/shotplan/framing';
import { angleDifferenceDeg, normalizeDegrees360 } from '../../../shared/units';

const FULL_FRAME = { widthMm: 36, heightMm: 24 };
const RAD = Math.PI / 180;

describe('fieldOfView: FOV = 2 atan(d / 2f), pinhole model (Hartley & Zisserman, Multiple View Geometry, 2nd ed., ch. 6)', () => {
  it.each([
    // computed: 2 atan(18/14) = 104.2500, 2 atan(12/14) = 81.2026, 2 atan(21.6333/14) = 114.1821 deg.
    [14, 104.2500, 81.2026, 114.1821],
    // computed: 2 atan(18/24) = 73.7398 (the 3-4-5 triangle), 2 atan(12/24) = 53.1301, 2 atan(21.6333/24) = 84.0622 deg.
    [24, 73.7398, 53.1301, 84.0622],
    // computed: 2 atan(18/50) = 39.5978, 2 atan(12/50) = 26.9915, 2 atan(21.6333/50) = 46.7930 deg.
    [50, 39.5978, 26.9915, 46.7930],
  ])('%s mm on 36 x 24 mm: horizontal %s, vertical %s, diagonal %s deg', (f, h, v, d) => {
    const fov = fieldOfView(f, FULL_FRAME);
    expect(fov.horizontalDeg).toBeCloseTo(h, 4);
    expect(fov.verticalDeg).toBeCloseTo(v, 4);
    expect(fov.diagonalDeg).toBeCloseTo(d, 4);
  });

  it('14 mm on 36 x 24 mm is 104.3 deg across, to one decimal', () => {
    // computed from the pinhole formula: 2 atan(18/14) = 104.25 deg.
    expect(Number(fieldOfView(14, FULL_FRAME).horizontalDeg.toFixed(1))).toBe(104.3);
  });

  it('portrait swaps the angles across and up the held image', () => {
    const fov = fieldOfView(24, FULL_FRAME);
    expect(heldFieldOfView(fov, 'portrait')).toEqual({ horizontalDeg: fov.verticalDeg, verticalDeg: fov.horizontalDeg });
    expect(heldFieldOfView(fov, 'landscape')).toEqual({ horizontalDeg: fov.horizontalDeg, verticalDeg: fov.verticalDeg });
    expect(() => heldFieldOfView(fov, 'square' as never)).toThrow(RangeError);
  });

  it('focalLengthForFovMm inverts the pinhole relation', () => {
    // computed: a 90 deg angle over a 36 mm side needs f = 18 / tan(45 deg) = 18 mm.
    expect(focalLengthForFovMm(90, 36)).toBeCloseTo(18, 12);
    expect(focalLengthForFovMm(fieldOfView(50, FULL_FRAME).horizontalDeg, 36)).toBeCloseTo(50, 10);
    expect(() => focalLengthForFovMm(180, 36)).toThrow(RangeError);
    expect(() => focalLengthForFovMm(0, 36)).toThrow(RangeError);
  });

  it.each([[0], [Number.NaN], [6000]])('refuses a focal length of %s mm', (f) => {
    expect(() => fieldOfView(f, FULL_FRAME)).toThrow(RangeError);
  });

  it('refuses a sensor without a size', () => {
    expect(() => fieldOfView(24, { widthMm: 0, heightMm: 24 })).toThrow(RangeError);
    expect(() => fieldOfView(24, null as never)).toThrow(RangeError);
  });
});

describe('fitInFrame: hand-worked level-camera cases (pinhole model x = f X / Z)', () => {
  // Two points on the horizon 10 deg either side of north: a level camera facing north sees
  // each at X/Z = tan 10 deg, Y = 0, so the longest focal lengths are 18 / tan 10 deg = 102.08 mm
  // (landscape, 18 mm half-width) and 12 / tan 10 deg = 68.06 mm (portrait), computed.
  const acrossNorth: SkyDirection[] = [{ azimuthDeg: 350, altitudeDeg: 0 }, { azimuthDeg: 10, altitudeDeg: 0 }];

  it('a pair across azimuth 0 is framed facing north, 20 deg wide', () => {
    const fit = fitInFrame(acrossNorth, FULL_FRAME, 50);
    for (const o of [fit.landscape, fit.portrait]) {
      expect(Math.abs(angleDifferenceDeg(o.centre!.azimuthDeg, 0))).toBeLessThan(1e-6);
      // The fit changes only to second order with the pointing's altitude here (X/Z = tan 10 / cos alt).
      expect(o.centre!.altitudeDeg).toBeCloseTo(0, 4);
      expect(o.requiredHorizontalFovDeg).toBeCloseTo(20, 6);
      expect(o.requiredVerticalFovDeg).toBeCloseTo(0, 4);
    }
    expect(fit.landscape.longestFocalLengthMm).toBeCloseTo(102.083, 2);
    expect(fit.portrait.longestFocalLengthMm).toBeCloseTo(68.055, 2);
    expect(fit.fitsIn).toEqual(['landscape', 'portrait']);
  });

  it.each([
    [50, ['landscape', 'portrait']],
    [85, ['landscape']],
    [120, []],
  ])('at %s mm it fits in %j', (f, expected) => {
    expect(fitInFrame(acrossNorth, FULL_FRAME, f).fitsIn).toEqual(expected);
  });

  it('two points 20 deg apart across the zenith go into opposite corners of a frame pointed straight up', () => {
    // computed: at the zenith a level camera's azimuth turns the frame, so the pair can lie along the
    // diagonal: f = half-diagonal / tan 10 deg = 21.6333 / 0.176327 = 122.69 mm in either orientation.
    const pair: SkyDirection[] = [{ azimuthDeg: 0, altitudeDeg: 80 }, { azimuthDeg: 180, altitudeDeg: 80 }];
    const fit = fitInFrame(pair, FULL_FRAME, 100);
    for (const o of [fit.landscape, fit.portrait]) {
      expect(o.longestFocalLengthMm).toBeCloseTo(122.689, 2);
      expect(o.centre!.altitudeDeg).toBeGreaterThan(89.999);
    }
    expect(fit.fitsIn).toEqual(['landscape', 'portrait']);
  });

  it('points more than 180 deg apart cannot be in front of one camera', () => {
    const fit = fitInFrame([{ azimuthDeg: 0, altitudeDeg: 0 }, { azimuthDeg: 180, altitudeDeg: 0 }, { azimuthDeg: 90, altitudeDeg: -5 }, { azimuthDeg: 270, altitudeDeg: -5 }], FULL_FRAME, 14);
    expect(fit.landscape.centre).toBeNull();
    expect(fit.landscape.longestFocalLengthMm).toBeNull();
    expect(fit.fitsIn).toEqual([]);
  });

  it('refuses empty or bad points', () => {
    expect(() => fitInFrame([], FULL_FRAME, 24)).toThrow(RangeError);
    expect(() => fitInFrame([{ azimuthDeg: 400, altitudeDeg: 0 }], FULL_FRAME, 24)).toThrow(/points\[0\]\.azimuthDeg/);
    expect(() => fitInFrame([{ azimuthDeg: 10, altitudeDeg: Number.NaN }], FULL_FRAME, 24)).toThrow(RangeError);
  });
});

/** A landmark (base and top) and a target's path, crossing azimuth 0. */
const lineupAcrossNorth: SkyDirection[] = [
  { azimuthDeg: 358, altitudeDeg: 1 },
  { azimuthDeg: 358, altitudeDeg: 6 },
  ...Array.from({ length: 13 }, (_, i) => ({ azimuthDeg: normalizeDegrees360(350 + i * 1.5), altitudeDeg: 8 + i * 0.8 })),
];

/** Largest of |X/Z| / halfWidth and |Y/Z| / halfHeight over the points, through shared/projection's skyToPixel. */
function objective(points: readonly SkyDirection[], centre: SkyDirection, halfWidthMm: number, halfHeightMm: number): number {
  const pose = { ...centre, rollDeg: 0, horizontalFovDeg: 90, widthPx: 2, heightPx: 2 };
  let worst = 0;
  for (const p of points) {
    const q = skyToPixel(pose, p);
    if (!q.inFront) return Infinity;
    worst = Math.max(worst, Math.abs(q.x - 1) / halfWidthMm, Math.abs(1 - q.y) / halfHeightMm);
  }
  return worst;
}

function rotate(points: readonly SkyDirection[], byDeg: number): SkyDirection[] {
  return points.map((p) => ({ azimuthDeg: normalizeDegrees360(p.azimuthDeg + byDeg), altitudeDeg: p.altitudeDeg }));
}

describe('fitInFrame across the 0/360 wrap and in general', () => {
  it('a lineup crossing north frames the same as the same lineup turned 60 deg east', () => {
    const a = fitInFrame(lineupAcrossNorth, FULL_FRAME, 24);
    const b = fitInFrame(rotate(lineupAcrossNorth, 60), FULL_FRAME, 24);
    expect(a.landscape.longestFocalLengthMm!).toBeCloseTo(b.landscape.longestFocalLengthMm!, 3);
    expect(a.portrait.longestFocalLengthMm!).toBeCloseTo(b.portrait.longestFocalLengthMm!, 3);
    expect(angleDifferenceDeg(b.landscape.centre!.azimuthDeg, a.landscape.centre!.azimuthDeg)).toBeCloseTo(60, 3);
    // The pointing lies inside the lineup's azimuth range (350..8 deg), not on the far side of the circle.
    expect(Math.abs(angleDifferenceDeg(a.landscape.centre!.azimuthDeg, 359))).toBeLessThan(10);
  });

  it('at the longest focal length every point is inside the image, and a little longer leaves one out', () => {
    const fit = fitInFrame(lineupAcrossNorth, FULL_FRAME, 24);
    const f = fit.portrait.longestFocalLengthMm!;
    const inside = (focal: number) => {
      const pose = { ...fit.portrait.centre!, rollDeg: 0, horizontalFovDeg: fieldOfView(focal, FULL_FRAME).verticalDeg, widthPx: 2400, heightPx: 3600 };
      return lineupAcrossNorth.every((p) => {
        const q = skyToPixel(pose, p);
        return q.inFront && q.x >= -1e-6 && q.x <= 2400 + 1e-6 && q.y >= -1e-6 && q.y <= 3600 + 1e-6;
      });
    };
    expect(inside(f)).toBe(true);
    expect(inside(f * 1.01)).toBe(false);
  });

  it('property: no level pointing allows a longer focal length than the one found (fast-check)', () => {
    const direction = fc.record({
      azimuthDeg: fc.double({ min: 0, max: 359.999, noNaN: true }),
      altitudeDeg: fc.double({ min: -10, max: 90, noNaN: true }),
    });
    const cluster = fc.tuple(direction, fc.array(fc.tuple(fc.double({ min: -25, max: 25, noNaN: true }), fc.double({ min: -15, max: 15, noNaN: true })), { minLength: 1, maxLength: 8 }))
      .map(([c, offsets]) => offsets.map(([da, dh]) => ({ azimuthDeg: normalizeDegrees360(c.azimuthDeg + da), altitudeDeg: Math.max(-10, Math.min(90, c.altitudeDeg + dh)) })));
    fc.assert(
      fc.property(cluster, fc.array(direction, { minLength: 20, maxLength: 20 }), (points, probes) => {
        const fit = fitInFrame(points, FULL_FRAME, 14);
        const found = objective(points, fit.landscape.centre!, 18, 12);
        // The returned pointing achieves the focal length claimed (capped at 5000 mm) ...
        expect(fit.landscape.longestFocalLengthMm!).toBeCloseTo(Math.min(5000, 1 / found), 6);
        // ... and neither random pointings nor small moves around it do better.
        const near = [[0.01, 0], [-0.01, 0], [0, 0.01], [0, -0.01]].map(([a, h]) => ({
          azimuthDeg: normalizeDegrees360(fit.landscape.centre!.azimuthDeg + a!),
          altitudeDeg: Math.max(-90, Math.min(90, fit.landscape.centre!.altitudeDeg + h!)),
        }));
        for (const probe of [...probes, ...near]) expect(objective(points, probe, 18, 12)).toBeGreaterThanOrEqual(found * (1 - 1e-6));
      }),
      { numRuns: 60, seed: 8 },
    );
  });
});

describe('longestFittingFocalLength (the tightest framing that still holds everything)', () => {
  const acrossNorth: SkyDirection[] = [{ azimuthDeg: 350, altitudeDeg: 0 }, { azimuthDeg: 10, altitudeDeg: 0 }];

  it('a 14-24 mm zoom fits the horizon pair up to its long end, in landscape', () => {
    // Hand-worked above: landscape allows 102.08 mm, portrait 68.06 mm, both beyond 24 mm.
    const r = longestFittingFocalLength(acrossNorth, FULL_FRAME, { minMm: 14, maxMm: 24 });
    expect(r.focalLengthMm).toBe(24);
    expect(r.orientation).toBe('landscape');
  });

  it('a 70-200 mm zoom stops at 102.08 mm', () => {
    const r = longestFittingFocalLength(acrossNorth, FULL_FRAME, { minMm: 70, maxMm: 200 });
    expect(r.focalLengthMm).toBeCloseTo(102.083, 2);
    expect(r.orientation).toBe('landscape');
    expect(r.portrait.longestFocalLengthMm).toBeCloseTo(68.055, 2);
  });

  it('a 135 mm prime cannot hold it: no focal length, a panorama is needed', () => {
    const r = longestFittingFocalLength(acrossNorth, FULL_FRAME, { minMm: 135, maxMm: 135 });
    expect(r.focalLengthMm).toBeNull();
    expect(r.orientation).toBeNull();
  });

  it('a tall subject prefers portrait', () => {
    // computed: a vertical pair at alt 0 and 30 deg, pointed at alt 15: tan 15 deg = 0.2679 each way;
    // portrait's 18 mm half-height gives 18 / 0.2679 = 67.18 mm, landscape's 12 mm 44.78 mm.
    const r = longestFittingFocalLength([{ azimuthDeg: 120, altitudeDeg: 0 }, { azimuthDeg: 120, altitudeDeg: 30 }], FULL_FRAME, { minMm: 14, maxMm: 200 });
    expect(r.orientation).toBe('portrait');
    expect(r.focalLengthMm).toBeCloseTo(18 / Math.tan(15 * RAD), 2);
    expect(r.landscape.longestFocalLengthMm).toBeCloseTo(12 / Math.tan(15 * RAD), 2);
  });

  it('refuses a range whose ends are swapped', () => {
    expect(() => longestFittingFocalLength(acrossNorth, FULL_FRAME, { minMm: 24, maxMm: 14 })).toThrow(RangeError);
  });
});

describe('fitInFrame input limits', () => {
  it('refuses more than 2000 points', () => {
    const many = Array.from({ length: 2001 }, (_, i) => ({ azimuthDeg: (i * 0.01) % 360, altitudeDeg: 10 }));
    expect(() => fitInFrame(many, FULL_FRAME, 24)).toThrow(/at most 2000/);
  });
});
