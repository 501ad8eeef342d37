import { describe, expect, it } from 'vitest';
import { watchOutlookDecision, type CloudBadge, type ForecastOutlook, type SkyOutlook } from '../../../shared/outlook';

// The send rules checked here are the ones documented in shared/outlook/watch.ts (our own design,
// on the "changed a lot" limits there, which are common practice on the okta scale: 25 points is
// two oktas). The expectations follow from those documented rules.
const START = '2027-06-12T08:00:00.000Z';
const END = '2027-06-12T10:00:00.000Z';

function forecast(meanCloudPct: number, badge: CloudBadge, window: { start: string; end: string } = { start: START, end: END }): ForecastOutlook {
  return {
    status: 'forecast', ...window, issuedAt: '2027-06-12T00:00:00.000Z',
    hoursCovered: 3, hoursInWindow: 3, complete: true,
    meanCloudPct, maxCloudPct: meanCloudPct, badge, dewRisk: 'low',
    minDewPointSpreadC: 6, maxRelativeHumidityPct: 60, maxPrecipitationProbabilityPct: 0, maxWindSpeedMs: 2, maxWindGustsMs: 3,
    hours: [],
  };
}
const unavailable: SkyOutlook = { status: 'unavailable', start: START, end: END, message: 'The forecast service had a problem' };
const noneYet: SkyOutlook = { status: 'no-forecast-yet', start: START, end: END, issuedAt: null, horizonEnd: null };
const clear = forecast(10, 'clear');
const cloudy = forecast(90, 'cloudy');

describe('watchOutlookDecision', () => {
  it('sends whatever the sky when the watch sets no limit, and still reports the change', () => {
    const d = watchOutlookDecision({ maxCloudPct: null, outlook: cloudy, leadDays: 0, previous: clear });
    expect(d).toMatchObject({ send: true, reason: 'no-limit', condition: null, changedALot: true });
    expect(d.change?.meanCloudChangePct).toBe(80);
  });

  it('sends under a clear outlook within the limit and holds back under a cloudy one', () => {
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: clear, leadDays: 3, previous: null })).toMatchObject({ send: true, reason: 'met', condition: 'met', change: null });
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: cloudy, leadDays: 3, previous: null })).toMatchObject({ send: false, reason: 'not-met', condition: 'not-met' });
    // Exactly at the limit counts as within it ("at most").
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: forecast(30, 'mixed'), leadDays: 3, previous: null }).send).toBe(true);
  });

  it('sends with the outlook unknown when there is no usable forecast, so a failure never costs a reminder', () => {
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: unavailable, leadDays: 3, previous: null })).toMatchObject({ send: true, reason: 'unknown', condition: 'unknown' });
    expect(watchOutlookDecision({ maxCloudPct: 0, outlook: noneYet, leadDays: 0, previous: clear })).toMatchObject({ send: true, reason: 'unknown', changedALot: false });
  });

  it('lets the on-the-day e-mail through as a "still clear?" update when the sky clouded over since the last e-mail', () => {
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: cloudy, leadDays: 0, previous: clear })).toMatchObject({ send: true, reason: 'changed', changedALot: true });
    // Not for a longer lead, and not without a big change.
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: cloudy, leadDays: 1, previous: clear })).toMatchObject({ send: false, reason: 'not-met' });
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: forecast(40, 'mixed'), leadDays: 0, previous: forecast(28, 'mixed') })).toMatchObject({ send: false, changedALot: false });
    // An earlier e-mail without a forecast is no baseline: a first forecast is not a change in the sky.
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: cloudy, leadDays: 0, previous: unavailable })).toMatchObject({ send: false, changedALot: false });
  });

  it('compares with an earlier e-mail of the same lineup found a few minutes off', () => {
    const nudged = forecast(10, 'clear', { start: '2027-06-12T08:03:00.000Z', end: '2027-06-12T10:02:00.000Z' });
    expect(watchOutlookDecision({ maxCloudPct: 30, outlook: cloudy, leadDays: 0, previous: nudged })).toMatchObject({ send: true, reason: 'changed' });
  });

  it.each([[-1], [101], [Number.NaN]])('refuses a limit of %s', (limit) => {
    expect(() => watchOutlookDecision({ maxCloudPct: limit, outlook: clear, leadDays: 0, previous: null })).toThrow(RangeError);
  });

  it.each([[-1], [1.5], [367]])('refuses a lead time of %s days', (lead) => {
    expect(() => watchOutlookDecision({ maxCloudPct: 30, outlook: clear, leadDays: lead, previous: null })).toThrow(RangeError);
  });
});
