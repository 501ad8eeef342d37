import { describe, expect, it } from 'vitest';
import { type CameraPose, type PixelPoint, skyToPixel } from '../../../shared/projection/camera';
import { frameOutline, galacticPlaneHorizontal, projectPolyline, runsAboveAltitude, svgPathData } from '../../../shared/projection/overlay';
import { galacticToEquatorialJ2000, targetHorizontal } from '../../../shared/sky';
import { angularSeparationDeg } from '../../../shared/projection/camera';

const RAD = Math.PI / 180;
/** Level camera looking north, 90 deg FOV, 3000 x 2000 px: f_px = 1500. */
const north: CameraPose = { azimuthDeg: 0, altitudeDeg: 0, rollDeg: 0, horizontalFovDeg: 90, widthPx: 3000, heightPx: 2000 };
/** The horizon all round, every 5 deg of azimuth from north. */
const horizon = Array.from({ length: 72 }, (_, i) => ({ azimuthDeg: i * 5, altitudeDeg: 0 }));

function xsIncrease(run: readonly PixelPoint[]): boolean {
  return run.every((p, i) => i === 0 || p.x > (run[i - 1] as PixelPoint).x);
}

describe('projectPolyline', () => {
  it('splits the horizon where it passes behind the camera and beyond the margin', () => {
    // computed: with margin 1 a point is kept while x <= 2 w, i.e. f_px tan(az) <= 4500 px,
    // tan(az) <= 3, az <= 71.57 deg: azimuths 0..70 and 290..355 are kept.
    const runs = projectPolyline(north, horizon);
    expect(runs).toHaveLength(2);
    expect(runs[0]).toHaveLength(15);
    expect(runs[1]).toHaveLength(14);
    for (const run of runs) expect(xsIncrease(run)).toBe(true);
    expect(runs[0]?.[0]?.x).toBeCloseTo(1500, 6);
    expect(runs[0]?.[14]?.x).toBeCloseTo(1500 + 1500 * Math.tan(70 * RAD), 6);
  });

  it('as a closed loop, joins the run across the end of the list into one left-to-right run', () => {
    const runs = projectPolyline(north, horizon, { closed: true });
    expect(runs).toHaveLength(1);
    expect(runs[0]).toHaveLength(29);
    expect(xsIncrease(runs[0] ?? [])).toBe(true);
  });

  it('never joins a point in front to one behind the camera', () => {
    // A great circle through the zenith: north horizon, zenith, south horizon, nadir, back.
    const meridian = Array.from({ length: 36 }, (_, i) => {
      const t = i * 10;
      return t <= 90 ? { azimuthDeg: 0, altitudeDeg: t } : t <= 270 ? { azimuthDeg: 180, altitudeDeg: 180 - t } : { azimuthDeg: 0, altitudeDeg: t - 360 };
    });
    const runs = projectPolyline(north, meridian, { closed: true });
    expect(runs).toHaveLength(1);
    for (const p of runs[0] ?? []) {
      expect(p.x).toBeCloseTo(1500, 6);
      expect(p.y).toBeGreaterThanOrEqual(-2000);
      expect(p.y).toBeLessThanOrEqual(4000);
    }
  });

  it('with margin 0 keeps only points inside the image', () => {
    // computed: |az| <= 45 deg is inside a 90 deg FOV: azimuths 0..45 and 315..355.
    const runs = projectPolyline(north, horizon, { margin: 0, closed: true });
    expect(runs).toHaveLength(1);
    expect(runs[0]).toHaveLength(19);
    for (const p of runs[0] ?? []) expect(p.x).toBeGreaterThanOrEqual(-1e-6);
  });

  it('returns nothing for a line wholly behind the camera', () => {
    const behind = Array.from({ length: 10 }, (_, i) => ({ azimuthDeg: 140 + i * 10, altitudeDeg: 5 }));
    expect(projectPolyline(north, behind)).toEqual([]);
  });

  it('refuses a bad point or margin with a RangeError', () => {
    expect(() => projectPolyline(north, [{ azimuthDeg: 0, altitudeDeg: Number.NaN }])).toThrow(RangeError);
    expect(() => projectPolyline(north, horizon, { margin: -1 })).toThrow(RangeError);
  });
});

describe('frameOutline', () => {
  const pose: CameraPose = { azimuthDeg: 180, altitudeDeg: 10, rollDeg: 0, horizontalFovDeg: 60, widthPx: 3000, heightPx: 2000 };
  const frame = { azimuthDeg: 180, halfWidthDeg: 10, bottomAltDeg: 0, topAltDeg: 20 };

  it('is one closed run through the four projected corners when the box is in view', () => {
    const runs = frameOutline(pose, frame, 8);
    expect(runs).toHaveLength(1);
    const run = runs[0] ?? [];
    expect(run).toHaveLength(33);
    expect(run[0]).toEqual(run[32]);
    const corners = [
      [170, 0],
      [190, 0],
      [190, 20],
      [170, 20],
    ] as const;
    corners.forEach(([azimuthDeg, altitudeDeg], i) => {
      const c = skyToPixel(pose, { azimuthDeg, altitudeDeg });
      expect(run[i * 8]?.x).toBeCloseTo(c.x, 9);
      expect(run[i * 8]?.y).toBeCloseTo(c.y, 9);
    });
    // computed: the box is symmetric about the axis's azimuth, so about the image's centre column.
    expect((run[0]?.x ?? 0) + (run[8]?.x ?? 0)).toBeCloseTo(3000, 6);
    expect(run[0]?.y ?? 0).toBeGreaterThan(run[24]?.y ?? 0);
  });

  it('wraps a box across north', () => {
    const runs = frameOutline({ ...pose, azimuthDeg: 0 }, { ...frame, azimuthDeg: 355 }, 4);
    expect(runs).toHaveLength(1);
    expect(runs[0]).toHaveLength(17);
  });

  it('refuses a box whose top is not above its bottom', () => {
    expect(() => frameOutline(pose, { ...frame, topAltDeg: 0 })).toThrow(RangeError);
    expect(() => frameOutline(pose, frame, 0)).toThrow(RangeError);
  });
});

describe('galacticPlaneHorizontal', () => {
  const site = { lat: -33.9, lon: 151.2, elevationM: 20 };
  const date = new Date('2026-06-15T12:00:00Z');

  it('every point lies 90 deg from the north galactic pole (galactic latitude 0)', () => {
    const pole = targetHorizontal(galacticToEquatorialJ2000(0, 90), site, date, { refraction: false });
    const plane = galacticPlaneHorizontal(site, date, 5, { refraction: false });
    expect(plane).toHaveLength(72);
    for (const p of plane) expect(angularSeparationDeg(p, pole)).toBeCloseTo(90, 4);
  });

  it('projects to straight lines (a gnomonic projection maps great circles to straight lines: Snyder, Map Projections: A Working Manual, USGS PP 1395)', () => {
    const plane = galacticPlaneHorizontal(site, date, 2, { refraction: false });
    const centre = plane[0];
    expect(centre).toBeDefined();
    const pose: CameraPose = { azimuthDeg: centre?.azimuthDeg ?? 0, altitudeDeg: centre?.altitudeDeg ?? 0, rollDeg: 15, horizontalFovDeg: 90, widthPx: 3000, heightPx: 2000 };
    const runs = projectPolyline(pose, plane, { closed: true });
    expect(runs).toHaveLength(1);
    const run = runs[0] ?? [];
    expect(run.length).toBeGreaterThan(20);
    const a = run[0] as PixelPoint;
    const b = run[run.length - 1] as PixelPoint;
    const length = Math.hypot(b.x - a.x, b.y - a.y);
    for (const p of run) {
      const distancePx = Math.abs((b.x - a.x) * (a.y - p.y) - (a.x - p.x) * (b.y - a.y)) / length;
      expect(distancePx).toBeLessThan(0.01);
    }
  });
});

describe('svgPathData', () => {
  it('writes one M ... L ... group per run, rounded, and skips single points', () => {
    const d = svgPathData([
      [{ x: 1.234, y: 2 }, { x: 3, y: 4.56 }],
      [{ x: 9, y: 9 }],
      [{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10.05 }],
    ]);
    expect(d).toBe('M1.2 2 L3 4.6 M0 0 L10 0 L10 10.1');
    expect(svgPathData([])).toBe('');
  });

  it('refuses a NaN coordinate', () => {
    expect(() => svgPathData([[{ x: 0, y: 0 }, { x: Number.NaN, y: 0 }]])).toThrow(RangeError);
  });
});

describe('runsAboveAltitude', () => {
  const at = (altitudes: number[]) => altitudes.map((altitudeDeg, i) => ({ azimuthDeg: i * 10, altitudeDeg }));

  it('keeps the whole loop, closed, when nothing is below the limit', () => {
    const loop = at([5, 10, 20, 10]);
    expect(runsAboveAltitude(loop, 0)).toEqual({ runs: [loop], closed: true });
  });

  it('joins the run that wraps past the end of the loop and drops single points', () => {
    // Altitudes: above at indices 0-1 and 5-6 (wrapping into 0-1), a lone point at 3.
    const loop = at([4, 3, -2, 1, -5, 2, 6]);
    const { runs, closed } = runsAboveAltitude(loop, 0);
    expect(closed).toBe(false);
    expect(runs.map((r) => r.map((p) => p.altitudeDeg))).toEqual([[2, 6, 4, 3]]);
  });

  it('returns no runs when the whole loop is below, and refuses a bad limit', () => {
    expect(runsAboveAltitude(at([-1, -2, -3]), 0)).toEqual({ runs: [], closed: false });
    expect(() => runsAboveAltitude(at([1, 2]), Number.NaN)).toThrow(RangeError);
    expect(() => runsAboveAltitude(at([1, 2]), 91)).toThrow(RangeError);
  });
});
