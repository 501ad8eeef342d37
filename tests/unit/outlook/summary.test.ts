import { describe, expect, it } from 'vitest';
import {
  CLEAR_MAX_HOUR_CLOUD_PCT,
  CLEAR_MAX_MEAN_CLOUD_PCT,
  CLOUDY_MIN_MEAN_CLOUD_PCT,
  cloudBadge,
  skyOutlookSchema,
  summarizeOutlook,
  summarizeOutlooks,
  unavailableOutlooks,
  type ForecastHour,
  type ForecastOutlook,
  type HourlyForecast,
  type SkyOutlook,
} from '../../../shared/outlook';

// A fixed, invented forecast: 13 hours from 2027-05-10 18:00 UTC to 2027-05-11 06:00 UTC.
// Expected means below are worked by hand from the weighting rule in shared/outlook/summary.ts
// (each hour stands for the half hour either side of it); badges follow the documented
// thresholds (common practice, on the okta scale: 25 % = two oktas, 62.5 % = five oktas).
const CLOUD = [80, 70, 10, 5, 0, 20, 40, 60, 90, 100, 100, 50, 30];
const START_MS = Date.UTC(2027, 4, 10, 18);
const HOUR_MS = 3_600_000;

function hour(i: number, overrides: Partial<ForecastHour> = {}): ForecastHour {
  return {
    time: new Date(START_MS + i * HOUR_MS).toISOString(),
    cloudCoverPct: CLOUD[i]!,
    cloudCoverLowPct: null,
    cloudCoverMidPct: null,
    cloudCoverHighPct: null,
    precipitationProbabilityPct: null,
    windSpeedMs: null,
    windGustsMs: null,
    relativeHumidityPct: null,
    temperatureC: 10,
    dewPointC: 4,
    ...overrides,
  };
}

function forecast(hours: ForecastHour[] = CLOUD.map((_c, i) => hour(i))): HourlyForecast {
  return { lat: 50.6, lon: -1.9, issuedAt: '2027-05-10T06:00:00.000Z', fetchedAt: '2027-05-10T06:12:00.000Z', hours };
}

const at = (iso: string) => new Date(iso);
const win = (start: string, end: string) => ({ start: at(start), end: at(end) });

function asForecast(o: SkyOutlook): ForecastOutlook {
  expect(o.status).toBe('forecast');
  return o as ForecastOutlook;
}

describe('cloudBadge (thresholds: common practice)', () => {
  it.each([
    [0, 0, 'clear'],
    [CLEAR_MAX_MEAN_CLOUD_PCT, CLEAR_MAX_HOUR_CLOUD_PCT, 'clear'],
    [25.1, 30, 'mixed'],
    [20, 50.1, 'mixed'],
    [62.4, 90, 'mixed'],
    [CLOUDY_MIN_MEAN_CLOUD_PCT, 70, 'cloudy'],
    [100, 100, 'cloudy'],
  ])('mean %s %%, max %s %% is %s', (mean, max, badge) => {
    expect(cloudBadge(mean, max)).toBe(badge);
  });

  it.each([[Number.NaN, 10], [-1, 10], [10, 101], [50, 40]])('refuses mean %s with max %s', (mean, max) => {
    expect(() => cloudBadge(mean, max)).toThrow(RangeError);
  });
});

describe('summarizeOutlook on the fixed forecast', () => {
  it.each([
    // 21:00-23:00: 21h 30 min at 5 %, 22h 60 min at 0 %, 23h 30 min at 20 % -> 750/120 = 6.25 %.
    ['21:00-23:00', win('2027-05-10T21:00Z', '2027-05-10T23:00Z'), 6.3, 20, 'clear', 3],
    // 22:10-23:40: 22h 20 min at 0, 23h 60 min at 20, 00h 10 min at 40 -> 1600/90 = 17.78 %.
    ['22:10-23:40', win('2027-05-10T22:10Z', '2027-05-10T23:40Z'), 17.8, 40, 'clear', 3],
    // 20:00-01:00: (10x30 + 5x60 + 0x60 + 20x60 + 40x60 + 60x30) / 300 = 20 %, but 01h is at 60 %.
    ['20:00-01:00', win('2027-05-10T20:00Z', '2027-05-11T01:00Z'), 20, 60, 'mixed', 6],
    // 23:00-01:00: (20x30 + 40x60 + 60x30) / 120 = 40 %.
    ['23:00-01:00', win('2027-05-10T23:00Z', '2027-05-11T01:00Z'), 40, 60, 'mixed', 3],
    // 02:00-04:00: (90x30 + 100x60 + 100x30) / 120 = 97.5 %.
    ['02:00-04:00', win('2027-05-11T02:00Z', '2027-05-11T04:00Z'), 97.5, 100, 'cloudy', 3],
    // 18:50-19:10: 19h alone, 20 min at 70 %.
    ['18:50-19:10', win('2027-05-10T18:50Z', '2027-05-10T19:10Z'), 70, 70, 'cloudy', 1],
  ])('%s: mean %s %%, max %s %%, %s over %s hours', (_label, w, mean, max, badge, hours) => {
    const o = asForecast(summarizeOutlook(forecast(), w));
    expect(o.meanCloudPct).toBe(mean);
    expect(o.maxCloudPct).toBe(max);
    expect(o.badge).toBe(badge);
    expect(o.hoursCovered).toBe(hours);
    expect(o.hoursInWindow).toBe(hours);
    expect(o.complete).toBe(true);
    expect(o.hours).toHaveLength(hours);
    expect(o.issuedAt).toBe('2027-05-10T06:00:00.000Z');
    expect(o.start).toBe(w.start.toISOString());
    expect(skyOutlookSchema.parse(o)).toEqual(o);
  });

  it('reports the worst dew risk, the smallest spread and the maxima of the hours used', () => {
    const hours = CLOUD.map((_c, i) => hour(i));
    hours[3] = hour(3, { temperatureC: 8, dewPointC: 7, relativeHumidityPct: 93, windSpeedMs: 2.5, windGustsMs: 6, precipitationProbabilityPct: 5 });
    hours[4] = hour(4, { temperatureC: 7, dewPointC: 4, relativeHumidityPct: 81, windSpeedMs: 4, windGustsMs: 5.5, precipitationProbabilityPct: 12 });
    const o = asForecast(summarizeOutlook(forecast(hours), win('2027-05-10T21:00Z', '2027-05-10T23:00Z')));
    // 21h: spread 1 deg C (high, rule: common practice); 22h: 3 (moderate); 23h: 6 (low).
    expect(o.dewRisk).toBe('high');
    expect(o.minDewPointSpreadC).toBe(1);
    expect(o.maxRelativeHumidityPct).toBe(93);
    expect(o.maxWindSpeedMs).toBe(4);
    expect(o.maxWindGustsMs).toBe(6);
    expect(o.maxPrecipitationProbabilityPct).toBe(12);
  });

  it('says unknown dew risk and null maxima when the service gave no humidity, temperature or wind', () => {
    const hours = CLOUD.map((_c, i) => hour(i, { temperatureC: null, dewPointC: null }));
    const o = asForecast(summarizeOutlook(forecast(hours), win('2027-05-10T21:00Z', '2027-05-10T23:00Z')));
    expect(o.dewRisk).toBe('unknown');
    expect(o.minDewPointSpreadC).toBeNull();
    expect(o.maxWindSpeedMs).toBeNull();
    expect(o.maxRelativeHumidityPct).toBeNull();
  });
});

describe('summarizeOutlook at the edges of the forecast', () => {
  it('says "no forecast yet" for a window starting half an hour or more after the last hour', () => {
    const o = summarizeOutlook(forecast(), win('2027-05-11T06:30Z', '2027-05-11T08:00Z'));
    expect(o).toEqual({
      status: 'no-forecast-yet',
      start: '2027-05-11T06:30:00.000Z',
      end: '2027-05-11T08:00:00.000Z',
      issuedAt: '2027-05-10T06:00:00.000Z',
      horizonEnd: '2027-05-11T06:00:00.000Z',
    });
  });

  it('summarises a window running past the horizon on the hours there are, marked incomplete', () => {
    // 06:20-07:00: 06h for 10 min (in the forecast), 07h for 30 min (beyond it).
    const o = asForecast(summarizeOutlook(forecast(), win('2027-05-11T06:20Z', '2027-05-11T07:00Z')));
    expect(o.complete).toBe(false);
    expect(o.hoursCovered).toBe(1);
    expect(o.hoursInWindow).toBe(2);
    expect(o.meanCloudPct).toBe(30);
  });

  it('says past for a window that ended before the forecast begins', () => {
    expect(summarizeOutlook(forecast(), win('2027-05-10T16:00Z', '2027-05-10T17:30Z')).status).toBe('past');
    // Ten minutes nearer 18:00 than 17:30, so 18h covers part of it.
    expect(summarizeOutlook(forecast(), win('2027-05-10T16:00Z', '2027-05-10T17:40Z')).status).toBe('forecast');
  });

  it('says no forecast yet, with no horizon, when the forecast holds no hours', () => {
    const o = summarizeOutlook(forecast([]), win('2027-05-10T21:00Z', '2027-05-10T23:00Z'));
    expect(o.status).toBe('no-forecast-yet');
    expect(o.status === 'no-forecast-yet' && o.horizonEnd).toBeNull();
  });

  it('says unavailable for a window wholly inside a gap of the forecast', () => {
    const hours = CLOUD.map((_c, i) => hour(i)).filter((_h, i) => i < 3 || i > 6);
    const o = summarizeOutlook(forecast(hours), win('2027-05-10T21:40Z', '2027-05-10T23:50Z'));
    expect(o.status).toBe('unavailable');
  });
});

describe('summarizeOutlooks', () => {
  it('answers each window in order from one forecast', () => {
    const list = summarizeOutlooks(forecast(), [
      win('2027-05-11T02:00Z', '2027-05-11T04:00Z'),
      win('2027-05-12T21:00Z', '2027-05-12T23:00Z'),
      win('2027-05-10T21:00Z', '2027-05-10T23:00Z'),
    ]);
    expect(list.map((o) => o.status)).toEqual(['forecast', 'no-forecast-yet', 'forecast']);
    expect(list.map((o) => (o.status === 'forecast' ? o.badge : null))).toEqual(['cloudy', null, 'clear']);
  });

  it.each([
    ['an hour off the whole hour', () => forecast([hour(0, { time: '2027-05-10T18:30:00.000Z' })])],
    ['hours out of order', () => forecast([hour(1), hour(0)])],
    ['a repeated hour', () => forecast([hour(0), hour(0)])],
    ['cloud over 100 %', () => forecast([hour(0, { cloudCoverPct: 120 })])],
    ['a time with an offset', () => forecast([hour(0, { time: '2027-05-10T19:00:00+01:00' })])],
  ])('refuses a forecast with %s', (_label, make) => {
    expect(() => summarizeOutlooks(make(), [win('2027-05-10T21:00Z', '2027-05-10T23:00Z')])).toThrow(RangeError);
  });

  it.each([
    ['an end before the start', { start: at('2027-05-10T23:00Z'), end: at('2027-05-10T21:00Z') }],
    ['an empty window', { start: at('2027-05-10T23:00Z'), end: at('2027-05-10T23:00Z') }],
    ['an invalid date', { start: new Date(Number.NaN), end: at('2027-05-10T23:00Z') }],
  ])('refuses %s', (_label, w) => {
    expect(() => summarizeOutlooks(forecast(), [w])).toThrow(RangeError);
  });
});

describe('unavailableOutlooks', () => {
  it('gives one unavailable outlook per window with the message', () => {
    const list = unavailableOutlooks([win('2027-05-10T21:00Z', '2027-05-10T23:00Z')], 'The forecast service did not answer');
    expect(list).toEqual([{ status: 'unavailable', start: '2027-05-10T21:00:00.000Z', end: '2027-05-10T23:00:00.000Z', message: 'The forecast service did not answer' }]);
    expect(() => unavailableOutlooks([{ start: at('2027-05-10T23:00Z'), end: at('2027-05-10T21:00Z') }], 'x')).toThrow(RangeError);
  });
});
