import { describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { skyToPixel, type SkyDirection } from '../../../shared/projection/camera';
import { NPF_FULL_CONSTANTS } from '../../../shared/shotplan/exposure';
import { buildShotPlan, loopRunNear, roundDownExposureS, ShotPlanInputError, type ShotPlanInputs } from '../../../shared/shotplan/plan';
import { PLAN_NOT_PROMISE } from '../../../shared/shotplan/cautions';
import { findTarget } from '../../../shared/sky/catalogue';
import { TIDE_CAUTION } from '../../../shared/tide/caution';

const RAD = Math.PI / 180;
const galacticCentre = findTarget('galactic-centre')!;

/**
 * An invented sightline on a real coastline (50.58 N, 4.91 W, Europe/London) and one of its
 * lineups of the galactic centre, as the lineup search (shared/lineup) found it for the night of
 * 30 April 2027, rounded to the second. The shot plan takes these times as given.
 */
const base: ShotPlanInputs = {
  sightline: {
    id: 'fixture',
    name: 'Kestrel Stack from the south cove',
    timezone: 'Europe/London',
    vantage: { lat: 50.5755, lon: -4.9115, elevationM: 3, cameraHeightM: 1.5 },
    landmark: { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 60 },
    hasTideRule: false,
  },
  target: { id: galacticCentre.id, name: galacticCentre.name, raHours: galacticCentre.raHours, decDeg: galacticCentre.decDeg },
  lineup: { start: new Date('2027-05-01T01:26:34Z'), peak: new Date('2027-05-01T01:43:56Z'), end: new Date('2027-05-01T01:57:39Z') },
  body: { id: 'body', name: 'Night body', sensorWidthMm: 36, sensorHeightMm: 24, pixelPitchUm: 5.9 },
  lens: { id: 'lens', name: 'Wide zoom', zoomMinMm: 14, zoomMaxMm: 24, widestApertureF: 2.8 },
  focalLengthMm: 24,
  tracked: false,
  starTrackerAvailable: false,
  sky: { frameGapS: 2 },
  foreground: { frames: 3, exposureS: 120, first: false },
  panorama: { mode: 'auto', overlap: 0.3, orientation: 'portrait', cover: 'target-path', skyTopAltDeg: 60, frameGapS: 5 },
  blockGapS: 60,
  tide: null,
  now: new Date('2027-04-20T12:00:00Z'),
};

const plan24 = buildShotPlan(base);

/** True when the direction lands inside the frame of a level camera at the pointing. */
function inFrame(d: SkyDirection, pointing: SkyDirection, fov: { horizontalDeg: number; verticalDeg: number }): boolean {
  const widthPx = 1000;
  const heightPx = (widthPx * Math.tan((fov.verticalDeg / 2) * RAD)) / Math.tan((fov.horizontalDeg / 2) * RAD);
  const p = skyToPixel({ ...pointing, rollDeg: 0, horizontalFovDeg: fov.horizontalDeg, widthPx, heightPx }, d);
  return p.inFront && p.x >= -1e-6 && p.x <= widthPx + 1e-6 && p.y >= -1e-6 && p.y <= heightPx + 1e-6;
}

describe('buildShotPlan: framing', () => {
  it('gives the field of view of the chosen focal length from the pinhole formula', () => {
    const plan14 = buildShotPlan({ ...base, focalLengthMm: 14 });
    // Pinhole model (Hartley & Zisserman ch. 6): 2 atan(36 / (2 x 14)) = 104.25 deg, to one decimal 104.3.
    expect(plan14.framing.fov.horizontalDeg).toBeCloseTo(2 * Math.atan(18 / 14) / RAD, 9);
    expect(Number(plan14.framing.fov.horizontalDeg.toFixed(1))).toBe(104.3);
    // computed: 2 atan(18/24) = 73.74 deg, 2 atan(12/24) = 53.13 deg.
    expect(plan24.framing.fov.horizontalDeg).toBeCloseTo(73.7398, 4);
    expect(plan24.framing.fov.verticalDeg).toBeCloseTo(53.1301, 4);
  });

  it('fits the landmark and the target\'s path in one frame at 24 mm, with the zoom\'s long end as the longest that fits', () => {
    expect(plan24.framing.fitsIn).toEqual(['landscape', 'portrait']);
    expect(plan24.framing.longestFitting.focalLengthMm).toBe(24);
    expect(plan24.panorama).toBeNull();
    // The aim holds every point: the landmark's top, base and sides and the sampled path.
    const aim = plan24.framing.landscape.centre!;
    for (const p of [...plan24.landmarkView.points, ...plan24.track]) {
      expect(inFrame(p, aim, { horizontalDeg: plan24.framing.fov.horizontalDeg, verticalDeg: plan24.framing.fov.verticalDeg })).toBe(true);
    }
    // The path runs from the lineup start to its end.
    expect(plan24.track[0]!.at).toBe('2027-05-01T01:26:34.000Z');
    expect(plan24.track.at(-1)!.at).toBe('2027-05-01T01:57:39.000Z');
  });

  it('lays out a panorama grid when one frame is not enough, covering every point', () => {
    const plan = buildShotPlan({ ...base, lens: { id: 'tele', name: 'Long prime', focalLengthMm: 300, widestApertureF: 4 }, focalLengthMm: undefined });
    expect(plan.framing.fitsIn).toEqual([]);
    expect(plan.framing.longestFitting.focalLengthMm).toBeNull();
    const grid = plan.panorama!;
    expect(grid.reason).toBe('does-not-fit');
    expect(grid.frameCount).toBe(grid.frames.length);
    expect(grid.frameCount).toBeGreaterThan(1);
    expect(grid.rows.reduce((n, r) => n + r.columns, 0)).toBe(grid.frameCount);
    for (const p of [...plan.landmarkView.points, ...plan.track]) {
      expect(grid.frames.some((f) => inFrame(p, f, grid.frameFov))).toBe(true);
    }
    // One panorama-row block per row on the timeline.
    expect(plan.timeline.blocks.filter((b) => b.kind === 'panorama-row')).toHaveLength(grid.rowCount);
  });

  it('covers the galactic plane from the horizon up to the altitude asked for', () => {
    const plan = buildShotPlan({ ...base, panorama: { ...base.panorama, mode: 'always', cover: 'galactic-plane', skyTopAltDeg: 30 } });
    const grid = plan.panorama!;
    expect(grid).toMatchObject({ reason: 'asked', cover: 'galactic-plane', note: null });
    expect(grid.span.topAltDeg).toBeLessThanOrEqual(30);
    expect(grid.span.topAltDeg).toBeGreaterThan(20);
  });
});

describe('buildShotPlan: exposure', () => {
  it('shows the 500 rule and the NPF rule side by side', () => {
    // ../shared/REFERENCES.md, rules of thumb: 500 / 24 = 20.8 s (common practice); NPF simple
    // (F. Michaud, 2016) (35 x 2.8 + 30 x 5.9) / 24 = 11.5 s.
    expect(Number(plan24.exposure.untracked.rule500S.toFixed(1))).toBe(20.8);
    expect(Number(plan24.exposure.untracked.npfSimpleS.toFixed(1))).toBe(11.5);
    // The full form with the target's declination (constants from memory, see shared/shotplan/exposure.ts).
    const c = NPF_FULL_CONSTANTS;
    expect(plan24.exposure.untracked.npfFullS).toBeCloseTo((c.aperture * 2.8 + c.focal * 24 + c.pitch * 5.9) / (24 * Math.cos(galacticCentre.decDeg * RAD)), 9);
  });

  it('stacks untracked frames at the stricter limit rounded down, 300 s in all by default', () => {
    expect(plan24.exposure.sky).toMatchObject({ tracked: false, subExposureS: 11, totalIntegrationS: 300, frames: Math.ceil(300 / 11), fits: true });
    expect(plan24.exposure.sky.durationS).toBe(28 * 11 + 27 * 2);
    expect(plan24.exposure.sky.available.limitedBy).toBe('lineup-end');
    // From the stack's start (the lineup start) to the lineup end: 31 min 05 s.
    expect(plan24.exposure.sky.available.seconds).toBeCloseTo(31 * 60 + 5, 6);
  });

  it('warns when a tracked stack runs past the end of the lineup, and when there is no tracker', () => {
    const plan = buildShotPlan({ ...base, tracked: true, sky: { subExposureS: 120, totalIntegrationS: 3600, frameGapS: 2 } });
    const stack = plan.exposure.sky;
    expect(stack).toMatchObject({ tracked: true, frames: 30, durationS: 30 * 120 + 29 * 2, fits: false });
    // Frames n end at n x 120 + (n - 1) x 2 s; 1865 s are available, so 15 fit (15 x 122 - 2 = 1828 s).
    expect(stack.framesInTime).toBe(15);
    const warning = plan.timeline.warnings.find((w) => w.blockLabel === 'Sky stack (tracked)')!;
    expect(warning.deadline).toBe('lineup-end');
    expect(warning.overrunS).toBeCloseTo(30 * 120 + 29 * 2 - (31 * 60 + 5), 6);
    expect(warning.message).toBe(`Sky stack (tracked) ends ${Math.ceil(warning.overrunS / 60)} min after the end of the lineup.`);
    expect(plan.cautions).toContain(warning.message);
    expect(plan.cautions).toContain('This plan tracks the sky, but your gear lists no star tracker.');
    expect(plan.exposure.trackedSubRange).toEqual({ minS: 60, maxS: 240, basis: 'common practice' });
  });
});

describe('buildShotPlan: the night\'s timeline', () => {
  it('puts the night\'s events in time order around the lineup', () => {
    const kinds = plan24.timeline.events.map((e) => e.kind);
    const times = plan24.timeline.events.map((e) => Date.parse(e.at));
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    expect(kinds[0]).toBe('astronomical-dusk');
    expect(kinds.indexOf('lineup-start')).toBeLessThan(kinds.indexOf('lineup-peak'));
    expect(kinds.indexOf('lineup-peak')).toBeLessThan(kinds.indexOf('lineup-end'));
    expect(kinds.indexOf('lineup-end')).toBeLessThan(kinds.indexOf('astronomical-dawn'));
    expect(plan24.night).toBe('2027-04-30');
  });

  it('lays the blocks out one after another from the lineup start with a minute between them', () => {
    const [sky, foreground] = plan24.timeline.blocks;
    expect(sky).toMatchObject({ kind: 'sky-stack', start: '2027-05-01T01:26:34.000Z' });
    expect(Date.parse(foreground!.start) - Date.parse(sky!.end)).toBe(60_000);
    expect(foreground).toMatchObject({ kind: 'foreground', label: 'Foreground frames (3)', durationS: 3 * 120 + 2 * 2 });
    expect(plan24.timeline.warnings).toEqual([]);
  });

  it('takes the tide cut-off as a deadline and says it in the site\'s time', () => {
    const cutOff = new Date('2027-05-01T02:10:00Z');
    const plan = buildShotPlan({
      ...base,
      sightline: { ...base.sightline, hasTideRule: true },
      tide: { status: 'reachable', cutOffAt: cutOff },
      foreground: { frames: 20, exposureS: 300, first: false },
    });
    const event = plan.timeline.events.find((e) => e.kind === 'tide-cut-off')!;
    expect(event.at).toBe(cutOff.toISOString());
    const warning = plan.timeline.warnings.find((w) => w.deadline === 'tide-cut-off')!;
    expect(warning.blockLabel).toBe('Foreground frames (20)');
    // The site's clock from the IANA time zone database (luxon): 02:10 UTC is 03:10 BST on 1 May 2027.
    const local = DateTime.fromJSDate(cutOff, { zone: 'Europe/London' }).toFormat('yyyy-MM-dd HH:mm');
    expect(local).toBe('2027-05-01 03:10');
    expect(plan.cautions[0]).toBe(`The tide cuts the spot off from ${local} BST: leave before then.`);
    expect(plan.cautions).toContain(TIDE_CAUTION);
    expect(plan.cautions.at(-1)).toBe(PLAN_NOT_PROMISE);
  });
});

describe('buildShotPlan: input it cannot plan', () => {
  it.each([
    [{ focalLengthMm: 35 }, 'focalLengthMm', /zooms from 14 to 24 mm/],
    [{ fNumber: 1.4 }, 'fNumber', /opens to f\/2.8/],
    [{ lineup: { start: base.lineup.end, peak: base.lineup.peak, end: base.lineup.start } }, 'lineup.end', /end after it starts/],
    [{ lineup: { ...base.lineup, peak: new Date('2027-05-01T03:00:00Z') } }, 'lineup.peak', /between the start and the end/],
    [{ tracked: true, sky: { subExposureS: 3600, totalIntegrationS: 43_200, frameGapS: 600 } }, 'sky.totalIntegrationS', /12 h|43200/],
  ])('names the field for %j', (change, field, message) => {
    let caught: unknown;
    try { buildShotPlan({ ...base, ...change } as ShotPlanInputs); } catch (error) { caught = error; }
    expect(caught).toBeInstanceOf(ShotPlanInputError);
    expect((caught as ShotPlanInputError).field).toBe(field);
    expect((caught as Error).message).toMatch(message);
  });
});

describe('roundDownExposureS', () => {
  it.each([[11.458, 11], [20.83, 20], [1, 1], [0.57, 0.5], [0.04, 0.1], [3600, 3600]])('%s s is set as %s s', (s, expected) => {
    expect(roundDownExposureS(s)).toBe(expected);
  });
  it.each([[0], [-1], [Number.NaN]])('refuses %s', (s) => {
    expect(() => roundDownExposureS(s)).toThrow(RangeError);
  });
});

describe('loopRunNear', () => {
  // A loop round the sky at one azimuth per point: altitude 40 sin(az), so two runs lie in 0..20 deg.
  const loop = Array.from({ length: 36 }, (_, i) => ({ azimuthDeg: i * 10, altitudeDeg: 40 * Math.sin(i * 10 * RAD) }));

  it('returns the run within the band that holds the point nearest the direction', () => {
    const rising = loopRunNear(loop, 0, 20, { azimuthDeg: 15, altitudeDeg: 10 });
    // 40 sin(az) <= 20 for az in [0, 30] and [150, 180]: the first run, worked by hand.
    expect(rising.map((p) => p.azimuthDeg)).toEqual([0, 10, 20, 30]);
    const setting = loopRunNear(loop, 0, 20, { azimuthDeg: 170, altitudeDeg: 5 });
    expect(setting.map((p) => p.azimuthDeg)).toEqual([150, 160, 170, 180]);
  });

  it('joins a run across the loop\'s end and returns nothing when no point is in the band', () => {
    const low = loopRunNear(loop, -25, 0, { azimuthDeg: 355, altitudeDeg: -3 });
    // 40 sin(az) in [-25, 0] (worked by hand): 190..210 (-6.9 to -20) and 330..350 (-20 to -6.9)
    // with 0 (0) after the loop's end joined to them; 180 gives +5e-15 in floating point, just out.
    expect(low.map((p) => p.azimuthDeg)).toEqual([330, 340, 350, 0]);
    expect(loopRunNear(loop, 60, 90, { azimuthDeg: 90, altitudeDeg: 40 })).toEqual([]);
    expect(() => loopRunNear(loop, 30, 10, { azimuthDeg: 0, altitudeDeg: 0 })).toThrow(RangeError);
  });
});
