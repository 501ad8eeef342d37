import { describe, expect, it } from 'vitest';
import { cloudBars, summarizeOutlook, type ForecastHour, type ForecastOutlook, type HourlyForecast } from '../../../shared/outlook';

// An invented forecast; the stretches follow the rule documented in shared/outlook/summary.ts
// (an hour stands for the half hour either side of it), worked by hand below, and the bars are
// cross-checked against summarizeOutlook's mean, which weighs each hour by the same stretch.
const HOUR_MS = 3_600_000;
const START_MS = Date.UTC(2027, 5, 12, 6);
const CLOUD = [0, 15, 60, 35, 80, 5];

function hour(i: number): ForecastHour {
  return {
    time: new Date(START_MS + i * HOUR_MS).toISOString(),
    cloudCoverPct: CLOUD[i]!, cloudCoverLowPct: i, cloudCoverMidPct: null, cloudCoverHighPct: 2 * i,
    precipitationProbabilityPct: 10 * i, windSpeedMs: 2, windGustsMs: 4, relativeHumidityPct: 70, temperatureC: 8, dewPointC: 2,
  };
}
const forecast: HourlyForecast = { lat: -35, lon: 149.4, issuedAt: '2027-06-12T00:00:00.000Z', fetchedAt: '2027-06-12T00:05:00.000Z', hours: CLOUD.map((_c, i) => hour(i)) };

function outlookOf(start: string, end: string): ForecastOutlook {
  const o = summarizeOutlook(forecast, { start: new Date(start), end: new Date(end) });
  expect(o.status).toBe('forecast');
  return o as ForecastOutlook;
}

describe('cloudBars', () => {
  it('gives each hour the part of the window nearest to it', () => {
    // 07:10-09:40 UTC: 07h from 07:10 to 07:30, 08h 07:30-08:30, 09h 08:30-09:30, 10h 09:30-09:40.
    const bars = cloudBars(outlookOf('2027-06-12T07:10:00Z', '2027-06-12T09:40:00Z'));
    expect(bars.map((b) => [new Date(b.startMs).toISOString().slice(11, 16), new Date(b.endMs).toISOString().slice(11, 16), b.cloudPct])).toEqual([
      ['07:10', '07:30', 15],
      ['07:30', '08:30', 60],
      ['08:30', '09:30', 35],
      ['09:30', '09:40', 80],
    ]);
    expect(bars[1]).toMatchObject({ time: '2027-06-12T08:00:00.000Z', lowPct: 2, midPct: null, highPct: 4, precipitationProbabilityPct: 20 });
  });

  it('covers the window without gaps or overlaps, and its length-weighted mean is the outlook mean', () => {
    const o = outlookOf('2027-06-12T06:20:00Z', '2027-06-12T10:50:00Z');
    const bars = cloudBars(o);
    expect(bars[0]!.startMs).toBe(Date.parse(o.start));
    expect(bars.at(-1)!.endMs).toBe(Date.parse(o.end));
    for (let i = 1; i < bars.length; i += 1) expect(bars[i]!.startMs).toBe(bars[i - 1]!.endMs);
    const total = bars.reduce((s, b) => s + (b.endMs - b.startMs), 0);
    const mean = bars.reduce((s, b) => s + b.cloudPct * (b.endMs - b.startMs), 0) / total;
    expect(mean).toBeCloseTo(o.meanCloudPct, 1);
  });

  it('refuses an outlook whose end is not after its start', () => {
    const o = outlookOf('2027-06-12T07:10:00Z', '2027-06-12T09:40:00Z');
    expect(() => cloudBars({ ...o, end: o.start })).toThrow(RangeError);
    expect(() => cloudBars({ ...o, start: 'yesterday' })).toThrow(RangeError);
  });
});
