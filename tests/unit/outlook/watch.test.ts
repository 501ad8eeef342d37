import { describe, expect, it } from 'vitest';
import {
  cloudCondition,
  compareOutlooks,
  OUTLOOK_CHANGE_MEAN_CLOUD_PCT,
  OUTLOOK_CHANGE_WITH_BADGE_PCT,
  outlookChangedALot,
  type CloudBadge,
  type ForecastOutlook,
  type SkyOutlook,
} from '../../../shared/outlook';

// The rules checked here are common practice (limits of our own on the okta scale, documented in
// shared/outlook/watch.ts); the expectations follow from those documented limits.
const START = '2027-05-10T21:00:00.000Z';
const END = '2027-05-10T23:00:00.000Z';

function forecastOutlook(meanCloudPct: number, badge: CloudBadge, complete = true): ForecastOutlook {
  return {
    status: 'forecast', start: START, end: END, issuedAt: '2027-05-10T06:00:00.000Z',
    hoursCovered: complete ? 3 : 2, hoursInWindow: 3, complete,
    meanCloudPct, maxCloudPct: Math.min(100, meanCloudPct + 10), badge, dewRisk: 'low',
    minDewPointSpreadC: 5, maxRelativeHumidityPct: 70, maxPrecipitationProbabilityPct: 0, maxWindSpeedMs: 2, maxWindGustsMs: 4,
    hours: [],
  };
}
const noForecastYet: SkyOutlook = { status: 'no-forecast-yet', start: START, end: END, issuedAt: '2027-05-10T06:00:00.000Z', horizonEnd: '2027-05-10T20:00:00.000Z' };
const unavailable: SkyOutlook = { status: 'unavailable', start: START, end: END, message: 'The forecast service did not answer' };

describe('cloudCondition ("at most N % cloud")', () => {
  it.each([
    [10, 20, 'met'],
    [20, 20, 'met'],
    [20.1, 20, 'not-met'],
    [0, 0, 'met'],
    [100, 100, 'met'],
    [35, 30, 'not-met'],
  ])('a complete forecast with mean %s %% against a limit of %s %% is %s', (mean, limit, expected) => {
    expect(cloudCondition(forecastOutlook(mean, mean <= 25 ? 'clear' : 'mixed'), limit)).toBe(expected);
  });

  it('is unknown without a complete forecast', () => {
    expect(cloudCondition(forecastOutlook(5, 'clear', false), 30)).toBe('unknown');
    expect(cloudCondition(noForecastYet, 30)).toBe('unknown');
    expect(cloudCondition(unavailable, 30)).toBe('unknown');
    expect(cloudCondition({ status: 'past', start: START, end: END }, 30)).toBe('unknown');
  });

  it.each([[-1], [101], [Number.NaN]])('refuses a limit of %s', (limit) => {
    expect(() => cloudCondition(forecastOutlook(10, 'clear'), limit)).toThrow(RangeError);
  });
});

describe('outlookChangedALot ("still clear?")', () => {
  it.each([
    ['clear 10 % to clear 15 %', 10, 'clear', 15, 'clear', false],
    ['clear 24 % to mixed 26 %: badge changed but only 2 points', 24, 'clear', 26, 'mixed', false],
    ['clear 10 % to mixed 30 %: badge changed and 20 points', 10, 'clear', 30, 'mixed', true],
    ['clear 5 % to mixed 20 %: exactly the badge-change limit', 5, 'clear', 5 + OUTLOOK_CHANGE_WITH_BADGE_PCT, 'mixed', true],
    ['mixed 30 % to mixed 54 %: same badge, 24 points', 30, 'mixed', 54, 'mixed', false],
    ['mixed 30 % to mixed 55 %: same badge, exactly the limit', 30, 'mixed', 30 + OUTLOOK_CHANGE_MEAN_CLOUD_PCT, 'mixed', true],
    ['cloudy 90 % to clear 10 %', 90, 'cloudy', 10, 'clear', true],
  ] as const)('%s: %s', (_label, m1, b1, m2, b2, expected) => {
    expect(outlookChangedALot(forecastOutlook(m1, b1), forecastOutlook(m2, b2))).toBe(expected);
  });

  it('reports the change and the badges', () => {
    expect(compareOutlooks(forecastOutlook(10, 'clear'), forecastOutlook(70, 'cloudy'))).toEqual({
      changedALot: true, meanCloudChangePct: 60, badgeBefore: 'clear', badgeAfter: 'cloudy',
    });
  });

  it('does not count a first forecast or an outage as a change in the sky', () => {
    expect(outlookChangedALot(noForecastYet, forecastOutlook(90, 'cloudy'))).toBe(false);
    expect(outlookChangedALot(forecastOutlook(5, 'clear'), unavailable)).toBe(false);
    expect(compareOutlooks(forecastOutlook(5, 'clear'), unavailable)).toEqual({ changedALot: false, meanCloudChangePct: null, badgeBefore: 'clear', badgeAfter: null });
  });

  it('refuses to compare outlooks of different windows', () => {
    const other = { ...forecastOutlook(10, 'clear'), end: '2027-05-11T00:00:00.000Z' };
    expect(() => compareOutlooks(forecastOutlook(10, 'clear'), other)).toThrow(RangeError);
  });
});
