import { describe, expect, it } from 'vitest';
import { Body, Equator, Horizon, MakeTime, Observer } from 'astronomy-engine';
import { crossingsFromSamples, findThresholdCrossings, sampleWithExtrema } from '../../../shared/sky/crossings';

const MINUTE_MS = 60_000;

describe('Meeus 15.a: rise, transit and set of Venus at Boston, 1988-03-20', () => {
  // Meeus, Astronomical Algorithms 2nd ed., Example 15.a: Boston, lat 42d20m N, lon 71d05m W,
  // 1988-03-20: rise 12:25 UT, transit 19:41 UT, set 02:55 UT, h0 = -0.5667 deg (geometric
  // altitude of the centre; refraction 34', no semidiameter for a planet). Meeus works within the
  // UT day 1988-03-20, so the set is the one at 02:55 UT on the 20th. Tolerance 1 min
  // (REFERENCES.md). Venus is placed by astronomy-engine (topocentric, apparent of date); the
  // events are solved by Gnomon's crossing search.
  const boston = new Observer(42 + 20 / 60, -(71 + 5 / 60), 0);
  const venusAltitude = (ms: number): number => {
    const t = MakeTime(new Date(ms));
    const eq = Equator(Body.Venus, t, boston, true, true);
    return Horizon(t, boston, eq.ra, eq.dec).altitude;
  };
  const start = Date.parse('1988-03-20T00:00:00Z');
  const end = Date.parse('1988-03-21T00:00:00Z');

  it('finds the rise at 12:25 UT and the set at 02:55 UT within 1 min', () => {
    const crossings = findThresholdCrossings(venusAltitude, start, end, -0.5667);
    const rise = crossings.find((c) => c.direction === 'rising');
    const set = crossings.find((c) => c.direction === 'setting');
    expect(crossings).toHaveLength(2);
    expect(Math.abs((rise?.timeMs ?? 0) - Date.parse('1988-03-20T12:25:00Z'))).toBeLessThan(MINUTE_MS);
    expect(Math.abs((set?.timeMs ?? 0) - Date.parse('1988-03-20T02:55:00Z'))).toBeLessThan(MINUTE_MS);
  });

  // The transit is the highest point (to within seconds: Venus's declination changes by about
  // 1 deg a day, which moves the maximum by under 10 s at this latitude).
  it('finds the transit at 19:41 UT within 1 min', () => {
    const samples = sampleWithExtrema(venusAltitude, start, end, 20 * MINUTE_MS);
    const maxima = samples.extrema.filter((e) => e.kind === 'max');
    expect(maxima).toHaveLength(1);
    expect(Math.abs((maxima[0]?.timeMs ?? 0) - Date.parse('1988-03-20T19:41:00Z'))).toBeLessThan(MINUTE_MS);
  });
});

describe('crossing search on synthetic functions', () => {
  // Oracle: sin has known zeros at multiples of pi; here time in ms scaled to 1 h periods.
  const periodMs = 3_600_000;
  const wave = (ms: number): number => Math.sin((2 * Math.PI * ms) / periodMs);

  it('finds every zero crossing of a sine within 10 ms', () => {
    const crossings = findThresholdCrossings(wave, 100_000, 3 * periodMs + 100_000, 0, { stepMs: 5 * MINUTE_MS });
    expect(crossings.map((c) => c.direction)).toEqual(['setting', 'rising', 'setting', 'rising', 'setting', 'rising']);
    crossings.forEach((c, i) => expect(Math.abs(c.timeMs - ((i + 1) * periodMs) / 2)).toBeLessThan(10));
  });

  // A graze between two samples: a narrow dip below the threshold that no sample sees. The
  // extremum refinement must find it (this is the shape of a short astronomical night).
  it('finds a dip that falls between two samples', () => {
    const centre = 47 * MINUTE_MS;
    const dip = (ms: number): number => ((ms - centre) / (10 * MINUTE_MS)) ** 2 - 0.01; // below 0 for +-1 min
    const crossings = findThresholdCrossings(dip, 0, 120 * MINUTE_MS, 0, { stepMs: 20 * MINUTE_MS });
    expect(crossings.map((c) => c.direction)).toEqual(['setting', 'rising']);
    expect(Math.abs((crossings[0]?.timeMs ?? 0) - (centre - MINUTE_MS))).toBeLessThan(10);
    expect(Math.abs((crossings[1]?.timeMs ?? 0) - (centre + MINUTE_MS))).toBeLessThan(10);
  });

  // Validation: a dip shorter than the validation offset is not reported as two crossings.
  it('drops a graze shorter than the validation offset', () => {
    const centre = 47 * MINUTE_MS;
    const graze = (ms: number): number => ((ms - centre) / 1000) ** 2 - 0.25; // below 0 for +-0.5 s
    expect(findThresholdCrossings(graze, 0, 120 * MINUTE_MS, 0, { validationMs: 1000 })).toEqual([]);
    expect(findThresholdCrossings(graze, 0, 120 * MINUTE_MS, 0, { validationMs: 0 })).toHaveLength(2);
  });

  it('reuses one sampling for several thresholds', () => {
    const samples = sampleWithExtrema(wave, 0, periodMs, 5 * MINUTE_MS);
    expect(samples.extrema.map((e) => e.kind)).toEqual(['max', 'min']);
    expect(Math.abs((samples.extrema[0]?.timeMs ?? 0) - periodMs / 4)).toBeLessThan(1000);
    const half = crossingsFromSamples(wave, samples, 0.5);
    expect(half).toHaveLength(2);
    expect(Math.abs((half[0]?.timeMs ?? 0) - periodMs / 12)).toBeLessThan(10);
    expect(crossingsFromSamples(wave, samples, 2)).toEqual([]);
  });

  it.each([
    ['end before start', () => findThresholdCrossings(wave, 10, 5, 0)],
    ['NaN threshold', () => findThresholdCrossings(wave, 0, 10, Number.NaN)],
    ['zero step', () => findThresholdCrossings(wave, 0, 10, 0, { stepMs: 0 })],
    ['non-finite function', () => findThresholdCrossings(() => Number.NaN, 0, 10, 0)],
    ['too few samples', () => crossingsFromSamples(wave, { timesMs: [0], values: [0], extrema: [] }, 0)],
  ])('rejects %s with a RangeError', (_label, call) => {
    expect(call).toThrow(RangeError);
  });
});
