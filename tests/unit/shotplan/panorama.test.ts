import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { skyToPixel } from '../../../shared/projection/camera';
import { fieldOfView, heldFieldOfView } from '../../../shared/shotplan/framing';
import { frameAzimuthHalfWidthDeg, type PanoramaGrid, panoramaGrid, type PanoramaSpan, skySpanOf } from '../../../shared/shotplan/panorama';
import { normalizeDegrees360 } from '../../../shared/units';

const RAD = Math.PI / 180;
const FULL_FRAME = { widthMm: 36, heightMm: 24 };
/** 24 mm on 36 x 24 mm, landscape: tan(h/2) = 0.75, tan(v/2) = 0.5 exactly (73.74 x 53.13 deg). */
const F24_LANDSCAPE = heldFieldOfView(fieldOfView(24, FULL_FRAME), 'landscape');
/** The same held in portrait: tan(h/2) = 0.5, tan(v/2) = 0.75. */
const F24_PORTRAIT = heldFieldOfView(fieldOfView(24, FULL_FRAME), 'portrait');

/** Whether a direction lands inside a grid frame, through shared/projection's pinhole camera. */
function insideFrame(frame: { azimuthDeg: number; altitudeDeg: number }, fov: { horizontalDeg: number; verticalDeg: number }, azimuthDeg: number, altitudeDeg: number, slack = 1e-7): boolean {
  const k = 1000;
  const widthPx = 2 * k * Math.tan((fov.horizontalDeg / 2) * RAD);
  const heightPx = 2 * k * Math.tan((fov.verticalDeg / 2) * RAD);
  const p = skyToPixel({ ...frame, rollDeg: 0, horizontalFovDeg: fov.horizontalDeg, widthPx, heightPx }, { azimuthDeg, altitudeDeg });
  const s = slack * k;
  return p.inFront && p.x >= -s && p.x <= widthPx + s && p.y >= -s && p.y <= heightPx + s;
}

function covered(grid: PanoramaGrid, fov: { horizontalDeg: number; verticalDeg: number }, azimuthDeg: number, altitudeDeg: number): boolean {
  return grid.frames.some((f) => insideFrame(f, fov, azimuthDeg, altitudeDeg));
}

describe('frameAzimuthHalfWidthDeg: the azimuths a level frame covers along one altitude (pinhole x = f X / Z)', () => {
  it('a level frame covers h/2 either side along the horizon', () => {
    // computed: at altitude 0 with a level axis, X/Z = tan(azimuth offset), so the edge is at h/2.
    expect(frameAzimuthHalfWidthDeg(0, 40, 30, 0)).toBeCloseTo(20, 10);
  });

  it('a frame tilted up by v/2 covers atan(tan(h/2) cos(v/2)) either side along the horizon, its bottom edge', () => {
    // computed: 24 mm landscape, tan(h/2) = 0.75, cos(v/2) = 2/sqrt(5): atan(0.67082) = 33.8545 deg,
    // narrower than the 36.87 deg of a level frame (the keystone of a tilted rectilinear frame).
    expect(frameAzimuthHalfWidthDeg(F24_LANDSCAPE.verticalDeg / 2, F24_LANDSCAPE.horizontalDeg, F24_LANDSCAPE.verticalDeg, 0)).toBeCloseTo(33.8545, 4);
  });

  it('columns widen with altitude as 1/cos(alt) for a small frame', () => {
    // computed: a 2 x 2 deg frame at altitude 60 spans 2 / cos 60 deg = 4 deg of azimuth (small-angle rule).
    const w = 2 * frameAzimuthHalfWidthDeg(60, 2, 2, 60);
    expect(w / 4).toBeCloseTo(1, 3);
    expect(2 * frameAzimuthHalfWidthDeg(75, 2, 2, 75) / (2 / Math.cos(75 * RAD))).toBeCloseTo(1, 2);
  });

  it('is 0 outside the frame and 180 for a circle around the zenith inside it', () => {
    expect(frameAzimuthHalfWidthDeg(10, 40, 30, 40)).toBe(0);
    expect(frameAzimuthHalfWidthDeg(80, 40, 40, 89)).toBe(180);
  });

  it('property: the azimuth found is on the frame edge (inside just before, outside just after), fast-check', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -30, max: 89, noNaN: true }),
        fc.double({ min: 5, max: 120, noNaN: true }),
        fc.double({ min: 5, max: 120, noNaN: true }),
        fc.double({ min: -0.95, max: 0.95, noNaN: true }),
        (a, h, v, where) => {
          const alt = Math.max(-89, Math.min(89, a + (where * v) / 2));
          const w = frameAzimuthHalfWidthDeg(a, h, v, alt);
          expect(w).toBeGreaterThan(0);
          const frame = { azimuthDeg: 100, altitudeDeg: a };
          expect(insideFrame(frame, { horizontalDeg: h, verticalDeg: v }, 100 + w * (1 - 1e-6), alt)).toBe(true);
          if (w < 180) expect(insideFrame(frame, { horizontalDeg: h, verticalDeg: v }, 100 + w * (1 + 1e-4) + 1e-6, alt, 0)).toBe(false);
        },
      ),
      { numRuns: 300, seed: 3 },
    );
  });
});

describe('panoramaGrid: hand-worked grids', () => {
  it('a span smaller than one frame is one frame at its middle, across azimuth 0', () => {
    // 20 x 20 deg (350..10 az, 0..20 alt) inside a 73.7 x 53.1 deg frame.
    const g = panoramaGrid({ fromAzDeg: 350, toAzDeg: 10, bottomAltDeg: 0, topAltDeg: 20 }, F24_LANDSCAPE);
    expect([g.rowCount, g.maxColumns, g.frameCount]).toEqual([1, 1, 1]);
    expect(g.frames).toEqual([{ row: 0, column: 0, azimuthDeg: 0, altitudeDeg: 10 }]);
    expect(g.overlap).toBe(0.3);
  });

  it('two rows for 35 deg of altitude with a 50 mm landscape frame', () => {
    // computed: v = 26.99 deg, 35 deg > v so more than one row; rows stepped by at most
    // v (1 - 0.3) = 18.89 deg: ceil(35 / 18.89) = 2 rows, bands of 17.5 deg, frames at 8.75 and 26.25 deg;
    // the 10 deg of azimuth fits one 39.6 deg-wide column, pointed at its middle (5 deg).
    const g = panoramaGrid({ fromAzDeg: 0, toAzDeg: 10, bottomAltDeg: 0, topAltDeg: 35 }, heldFieldOfView(fieldOfView(50, FULL_FRAME), 'landscape'));
    expect(g.rowCount).toBe(2);
    expect(g.frames.map((f) => [f.azimuthDeg, f.altitudeDeg])).toEqual([[5, 8.75], [5, 26.25]]);
    expect(g.rows.map((r) => [r.bandBottomDeg, r.bandTopDeg])).toEqual([[0, 17.5], [17.5, 35]]);
    // Neighbouring rows overlap by v - 17.5 = 9.49 deg along the centre line, at least 30 % of v.
    expect(g.field.bottomAltDeg).toBeCloseTo(8.75 - 26.9915 / 2, 4);
    expect(g.field.topAltDeg).toBeCloseTo(26.25 + 26.9915 / 2, 4);
  });

  it('a full ring of one row: 10 frames 36 deg apart, none repeated at the wrap', () => {
    // computed: 24 mm portrait (tan(h/2) = 0.5, tan(v/2) = 0.75) from 0 to 30 deg altitude: one row
    // (30 < 73.7 deg) pointed at 15 deg. Along the horizon its side edge is at
    // atan(0.5 cos 15 deg) = 25.779 deg, at 30 deg altitude 25.779 + asin(0.06725) = 29.637 deg, so
    // W = 25.779, a frame covers 51.558 deg, columns step at most 0.7 x 51.558 = 36.09 deg:
    // ceil(360 / 36.09) = 10 columns, 36 deg apart.
    const g = panoramaGrid({ fromAzDeg: 0, toAzDeg: 0, fullCircle: true, bottomAltDeg: 0, topAltDeg: 30 }, F24_PORTRAIT);
    expect(frameAzimuthHalfWidthDeg(15, F24_PORTRAIT.horizontalDeg, F24_PORTRAIT.verticalDeg, 0)).toBeCloseTo(25.7788, 4);
    expect(frameAzimuthHalfWidthDeg(15, F24_PORTRAIT.horizontalDeg, F24_PORTRAIT.verticalDeg, 30)).toBeCloseTo(29.6365, 4);
    expect(g.rowCount).toBe(1);
    expect(g.frameCount).toBe(10);
    expect(g.rows[0]!.azimuthStepDeg).toBeCloseTo(36, 12);
    expect(g.frames.map((f) => Math.round(f.azimuthDeg))).toEqual([0, 36, 72, 108, 144, 180, 216, 252, 288, 324]);
    expect(g.field).toMatchObject({ azimuthDeg: 360, fullCircle: true });
  });

  it('a span crossing azimuth 0: two columns either side of north', () => {
    // computed: 24 mm landscape, 300..60 deg (120 deg) from 0 to 20 deg altitude: one row at 10 deg,
    // W = atan(0.75 cos 10 deg) = 36.450 deg along the horizon (38.63 deg at 20 deg altitude), so a
    // frame covers 72.90 deg; ceil((120 - 72.90) / (0.7 x 72.90)) + 1 = 2 columns, centres at
    // 300 + 36.45 = 336.45 and 336.45 + 47.10 = 23.55 deg (past north).
    const g = panoramaGrid({ fromAzDeg: 300, toAzDeg: 60, bottomAltDeg: 0, topAltDeg: 20 }, F24_LANDSCAPE);
    expect(g.frameCount).toBe(2);
    expect(g.frames[0]!.azimuthDeg).toBeCloseTo(336.4498, 3);
    expect(g.frames[1]!.azimuthDeg).toBeCloseTo(23.5502, 3);
    expect(g.field.azimuthDeg).toBeCloseTo(120, 9);
    for (const az of [300, 330, 0, 30, 60]) for (const alt of [0, 10, 20]) expect(covered(g, F24_LANDSCAPE, az, alt)).toBe(true);
  });

  it('a span from the horizon to the zenith ends with frames that hold the zenith', () => {
    const fov = heldFieldOfView(fieldOfView(50, FULL_FRAME), 'landscape');
    const g = panoramaGrid({ fromAzDeg: 0, toAzDeg: 0, fullCircle: true, bottomAltDeg: 0, topAltDeg: 90 }, fov);
    const top = g.rows[g.rows.length - 1]!;
    expect(top.altitudeDeg + fov.verticalDeg / 2).toBeGreaterThan(90);
    // Columns widen with altitude: the top row needs fewer frames than the bottom one.
    expect(top.columns).toBeLessThan(g.rows[0]!.columns);
    expect(g.rows.map((r) => r.columns)).toEqual([...g.rows.map((r) => r.columns)].sort((a, b) => b - a));
    expect(covered(g, fov, 123, 90)).toBe(true);
    expect(covered(g, fov, 250, 89.5)).toBe(true);
  });

  it('a vertical panorama (one azimuth) is one column per row', () => {
    const g = panoramaGrid({ fromAzDeg: 135, toAzDeg: 135, bottomAltDeg: -10, topAltDeg: 80 }, F24_PORTRAIT);
    expect(g.maxColumns).toBe(1);
    expect(g.frames.every((f) => f.azimuthDeg === 135)).toBe(true);
  });

  it.each([
    [{ fromAzDeg: 0, toAzDeg: 10, bottomAltDeg: 20, topAltDeg: 10 }, 0.3, /topAltDeg must be at least/],
    [{ fromAzDeg: -1, toAzDeg: 10, bottomAltDeg: 0, topAltDeg: 10 }, 0.3, /span.fromAzDeg/],
    [{ fromAzDeg: 0, toAzDeg: 10, bottomAltDeg: 0, topAltDeg: 95 }, 0.3, /span.topAltDeg/],
    [{ fromAzDeg: 0, toAzDeg: 10, bottomAltDeg: 0, topAltDeg: 10 }, 0.95, /overlap/],
    [{ fromAzDeg: 0, toAzDeg: 10, bottomAltDeg: 0, topAltDeg: 10 }, Number.NaN, /overlap/],
  ])('refuses %o at overlap %s', (span, overlap, message) => {
    expect(() => panoramaGrid(span as PanoramaSpan, F24_LANDSCAPE, overlap)).toThrow(message);
  });

  it('refuses a frame of 180 deg and a grid of more than 5000 frames', () => {
    expect(() => panoramaGrid({ fromAzDeg: 0, toAzDeg: 10, bottomAltDeg: 0, topAltDeg: 10 }, { horizontalDeg: 180, verticalDeg: 60 })).toThrow(RangeError);
    expect(() => panoramaGrid({ fromAzDeg: 0, toAzDeg: 0, fullCircle: true, bottomAltDeg: -90, topAltDeg: 90 }, { horizontalDeg: 1, verticalDeg: 1 })).toThrow(/5000 frames/);
  });
});

describe('panoramaGrid: properties (fast-check)', () => {
  const spanAndFrame = fc.record({
    h: fc.double({ min: 8, max: 110, noNaN: true }),
    v: fc.double({ min: 8, max: 110, noNaN: true }),
    fullCircle: fc.boolean(),
    fromAzDeg: fc.double({ min: 0, max: 359.9, noNaN: true }),
    widthDeg: fc.double({ min: 0, max: 300, noNaN: true }),
    bottomAltDeg: fc.double({ min: -30, max: 60, noNaN: true }),
    heightDeg: fc.double({ min: 0, max: 120, noNaN: true }),
    overlap: fc.double({ min: 0.05, max: 0.6, noNaN: true }),
  });

  it('every direction of the span lies inside at least one frame', () => {
    fc.assert(
      fc.property(spanAndFrame, fc.array(fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })), { minLength: 30, maxLength: 30 }), (c, samples) => {
        const top = Math.min(90, c.bottomAltDeg + c.heightDeg);
        const fov = { horizontalDeg: c.h, verticalDeg: c.v };
        const g = panoramaGrid({ fromAzDeg: c.fromAzDeg, toAzDeg: normalizeDegrees360(c.fromAzDeg + c.widthDeg), fullCircle: c.fullCircle, bottomAltDeg: c.bottomAltDeg, topAltDeg: top }, fov, c.overlap);
        const width = c.fullCircle ? 360 : c.widthDeg;
        // The span's corners and edges, and random directions inside it.
        const probes: Array<[number, number]> = [[0, 0], [0, 1], [1, 0], [1, 1], [0.5, 0], [0.5, 1], ...samples];
        for (const [x, y] of probes) {
          const az = normalizeDegrees360(c.fromAzDeg + x * width);
          const alt = c.bottomAltDeg + y * (top - c.bottomAltDeg);
          expect(covered(g, fov, az, alt)).toBe(true);
        }
      }),
      { numRuns: 150, seed: 21 },
    );
  });

  it('neighbouring frames are stepped by at most (1 - overlap) of a frame, and a ring closes without a repeated frame', () => {
    fc.assert(
      fc.property(spanAndFrame, (c) => {
        const top = Math.min(90, c.bottomAltDeg + c.heightDeg);
        const g = panoramaGrid({ fromAzDeg: c.fromAzDeg, toAzDeg: normalizeDegrees360(c.fromAzDeg + c.widthDeg), fullCircle: c.fullCircle, bottomAltDeg: c.bottomAltDeg, topAltDeg: top }, { horizontalDeg: c.h, verticalDeg: c.v }, c.overlap);
        expect(g.frameCount).toBe(g.frames.length);
        expect(g.frameCount).toBe(g.rows.reduce((n, r) => n + r.columns, 0));
        if (g.rowCount > 1) {
          const step = g.rows[1]!.altitudeDeg - g.rows[0]!.altitudeDeg;
          expect(step).toBeLessThanOrEqual(c.v * (1 - c.overlap) + 1e-9);
        }
        for (const r of g.rows) {
          if (r.columns > 1) expect(r.azimuthStepDeg).toBeLessThanOrEqual(r.frameAzimuthWidthDeg * (1 - c.overlap) + 1e-9);
          if (c.fullCircle && r.columns > 1) {
            expect(r.azimuthStepDeg * r.columns).toBeCloseTo(360, 9);
            const azimuths = g.frames.filter((f) => f.row === r.index).map((f) => f.azimuthDeg.toFixed(6));
            expect(new Set(azimuths).size).toBe(r.columns);
          }
        }
      }),
      { numRuns: 200, seed: 5 },
    );
  });
});

describe('skySpanOf', () => {
  it('takes the short way across north', () => {
    const s = skySpanOf([{ azimuthDeg: 350, altitudeDeg: 2 }, { azimuthDeg: 10, altitudeDeg: 40 }, { azimuthDeg: 355, altitudeDeg: 0 }]);
    expect(s).toEqual({ fromAzDeg: 350, toAzDeg: 10, azimuthWidthDeg: 20, bottomAltDeg: 0, topAltDeg: 40 });
  });

  it('a single direction has no width, and the span passes to panoramaGrid', () => {
    const s = skySpanOf([{ azimuthDeg: 200, altitudeDeg: 5 }]);
    expect(s.azimuthWidthDeg).toBe(0);
    expect(panoramaGrid(s, F24_LANDSCAPE).frameCount).toBe(1);
  });

  it('refuses empty input', () => {
    expect(() => skySpanOf([])).toThrow(RangeError);
    expect(() => skySpanOf([{ azimuthDeg: 10, altitudeDeg: 100 }])).toThrow(/directions\[0\]\.altitudeDeg/);
  });
});
