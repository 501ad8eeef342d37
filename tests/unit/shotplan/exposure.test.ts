import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  framesForIntegration,
  npfFullSeconds,
  npfSimpleSeconds,
  rule500Seconds,
  suggestedSubExposureRange,
  timeAvailable,
  trackedStackPlan,
  untrackedLimits,
} from '../../../shared/shotplan/exposure';

const at = (iso: string) => new Date(iso);

describe('rule500Seconds (the 500 rule, common practice: t = 500 / (f x crop))', () => {
  it('24 mm on full frame gives 20.8 s', () => {
    // ../shared/REFERENCES.md, rules of thumb: 500 / 24 = 20.8 s (computed).
    expect(rule500Seconds(24, 1)).toBeCloseTo(20.833, 3);
  });

  it('14 mm at crop 1.5 gives 500 / 21 = 23.8 s', () => {
    // computed from the rule: 14 x 1.5 = 21 mm equivalent.
    expect(rule500Seconds(14, 1.5)).toBeCloseTo(23.810, 3);
  });

  it.each([[0, 1], [24, 0], [24, Number.NaN], [Number.POSITIVE_INFINITY, 1]])('refuses f = %s mm, crop %s', (f, c) => {
    expect(() => rule500Seconds(f, c)).toThrow(RangeError);
  });
});

describe('npfSimpleSeconds (NPF rule, F. Michaud 2016: t = (35 N + 30 p) / f)', () => {
  it('24 mm, f/2.8, 5.9 um gives 11.5 s', () => {
    // ../shared/REFERENCES.md, rules of thumb: (35 x 2.8 + 30 x 5.9) / 24 = 275 / 24 = 11.46 s (computed).
    expect(npfSimpleSeconds(2.8, 5.9, 24)).toBeCloseTo(11.458, 3);
    expect(Number(npfSimpleSeconds(2.8, 5.9, 24).toFixed(1))).toBe(11.5);
  });

  it('is shorter than the 500 rule for that lens on a full-frame body of small pixels', () => {
    // ../shared/REFERENCES.md: 11.5 s against 20.8 s for the same 24 mm lens.
    expect(npfSimpleSeconds(2.8, 5.9, 24)).toBeLessThan(rule500Seconds(24, 1));
  });

  it.each([[0.5, 5.9, 24], [2.8, 0.1, 24], [2.8, 5.9, 0], [Number.NaN, 5.9, 24]])('refuses N = %s, p = %s um, f = %s mm', (n, p, f) => {
    expect(() => npfSimpleSeconds(n, p, f)).toThrow(RangeError);
  });
});

describe('npfFullSeconds (constants from memory: tested for structure only)', () => {
  it('grows as 1 / cos(declination)', () => {
    // computed: cos 60 deg = 1/2, so the allowed time doubles from the equator to declination 60 deg.
    const equator = npfFullSeconds(2.8, 5.9, 24, 0);
    expect(npfFullSeconds(2.8, 5.9, 24, 60) / equator).toBeCloseTo(2, 10);
    expect(npfFullSeconds(2.8, 5.9, 24, -60)).toBeCloseTo(npfFullSeconds(2.8, 5.9, 24, 60), 10);
  });

  it('is of the same order as the simple form at the equator, and scales with k', () => {
    const full = npfFullSeconds(2.8, 5.9, 24, 0);
    const simple = npfSimpleSeconds(2.8, 5.9, 24);
    expect(full / simple).toBeGreaterThan(1 / 3);
    expect(full / simple).toBeLessThan(3);
    expect(npfFullSeconds(2.8, 5.9, 24, 0, 2) / full).toBeCloseTo(2, 12);
  });

  it('falls with focal length and rises with aperture number and pixel pitch, as the simple form does', () => {
    expect(npfFullSeconds(2.8, 5.9, 50, 0)).toBeLessThan(npfFullSeconds(2.8, 5.9, 24, 0));
    expect(npfFullSeconds(4, 5.9, 24, 0)).toBeGreaterThan(npfFullSeconds(2.8, 5.9, 24, 0));
    expect(npfFullSeconds(2.8, 8, 24, 0)).toBeGreaterThan(npfFullSeconds(2.8, 5.9, 24, 0));
  });

  it('refuses declinations beyond 89 deg, where 1/cos has no bound', () => {
    expect(() => npfFullSeconds(2.8, 5.9, 24, 90)).toThrow(/declinationDeg/);
    expect(() => npfFullSeconds(2.8, 5.9, 24, 0, 0)).toThrow(/k must be/);
  });

  it('untrackedLimits puts the three side by side, the full form only with a declination', () => {
    const inputs = { focalLengthMm: 24, fNumber: 2.8, cropFactor: 1, pixelPitchUm: 5.9 };
    expect(untrackedLimits(inputs)).toEqual({ rule500S: rule500Seconds(24, 1), npfSimpleS: npfSimpleSeconds(2.8, 5.9, 24), npfFullS: null });
    expect(untrackedLimits({ ...inputs, declinationDeg: -29 }).npfFullS).toBe(npfFullSeconds(2.8, 5.9, 24, -29));
    expect(() => untrackedLimits({ ...inputs, cropFactor: -1 })).toThrow(RangeError);
  });
});

describe('tracked stacks', () => {
  it('suggested sub-exposures (common practice) shorten as the focal length grows', () => {
    const ranges = [14, 50, 135, 400].map((f) => suggestedSubExposureRange(f));
    for (const r of ranges) {
      expect(r.basis).toBe('common practice');
      expect(r.minS).toBeLessThan(r.maxS);
    }
    for (let i = 1; i < ranges.length; i++) expect(ranges[i]!.maxS).toBeLessThan(ranges[i - 1]!.maxS);
  });

  it.each([
    // computed: 60 min / 120 s = 30 frames; 61 min needs a 31st; 10 min of 0.1 s frames is 6000 exactly.
    [3600, 120, 30],
    [3660, 120, 31],
    [600, 0.1, 6000],
    [30, 120, 1],
  ])('%s s in subs of %s s is %s frames', (total, sub, frames) => {
    expect(framesForIntegration(total, sub)).toBe(frames);
  });

  it('refuses a total or sub of 0', () => {
    expect(() => framesForIntegration(0, 60)).toThrow(RangeError);
    expect(() => framesForIntegration(600, 0)).toThrow(RangeError);
  });

  it('the time left ends at the lineup end or moonrise, whichever comes first', () => {
    const start = at('2027-06-10T23:00:00Z');
    const end = at('2027-06-11T01:00:00Z');
    expect(timeAvailable(start, end)).toEqual({ seconds: 7200, limitedBy: 'lineup-end', until: end });
    expect(timeAvailable(start, end, at('2027-06-11T00:30:00Z'))).toMatchObject({ seconds: 5400, limitedBy: 'moonrise' });
    expect(timeAvailable(start, end, at('2027-06-11T02:00:00Z'))).toMatchObject({ seconds: 7200, limitedBy: 'lineup-end' });
    expect(timeAvailable(at('2027-06-11T01:30:00Z'), end).seconds).toBe(0);
    expect(() => timeAvailable(new Date(Number.NaN), end)).toThrow(RangeError);
  });

  it('a stack that does not fit says how many frames do', () => {
    // computed: 20 subs of 120 s with 10 s between take 20 x 120 + 19 x 10 = 2590 s. Moonrise
    // 2000 s after the start: frame n ends at 130 n - 10, so 15 frames (1940 s) end in time, not 16 (2070 s).
    const plan = trackedStackPlan({
      subExposureS: 120,
      totalIntegrationS: 2400,
      frameGapS: 10,
      start: at('2027-06-10T23:00:00Z'),
      lineupEnd: at('2027-06-11T01:00:00Z'),
      moonrise: at('2027-06-10T23:33:20Z'),
    });
    expect(plan).toMatchObject({ frames: 20, durationS: 2590, fits: false, framesInTime: 15, integrationInTimeS: 1800 });
    expect(plan.available).toMatchObject({ seconds: 2000, limitedBy: 'moonrise' });
  });

  it('property: the frames in time end in time and one more would not (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 600, noNaN: true }),
        fc.integer({ min: 1, max: 100 }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        fc.integer({ min: 0, max: 20_000 }),
        (sub, frames, gap, availableS) => {
          const start = at('2027-06-10T23:00:00Z');
          const plan = trackedStackPlan({ subExposureS: sub, totalIntegrationS: sub * frames, frameGapS: gap, start, lineupEnd: new Date(start.getTime() + availableS * 1000) });
          const endOf = (n: number) => n * sub + (n - 1) * gap;
          if (plan.framesInTime > 0) expect(endOf(plan.framesInTime)).toBeLessThanOrEqual(availableS + 1e-6);
          if (plan.framesInTime < plan.frames) expect(endOf(plan.framesInTime + 1)).toBeGreaterThan(availableS - 1e-6);
          expect(plan.fits).toBe(plan.framesInTime === plan.frames);
        },
      ),
      { numRuns: 300, seed: 13 },
    );
  });
});
