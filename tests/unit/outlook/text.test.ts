import { describe, expect, it } from 'vitest';
import { outlookFacts, outlookLabel, outlookSummary, type ForecastOutlook, type SkyOutlook } from '../../../shared/outlook';

// Times: Australia/Sydney is UTC+10 (AEST) in June, without daylight saving (IANA tz database).
// The numbers shown are the outlook's own, rounded as the module notes say.
const TZ = 'Australia/Sydney';
const base = { start: '2027-06-12T08:00:00.000Z', end: '2027-06-12T10:00:00.000Z' };
const hours = [
  { time: '2027-06-12T08:00:00.000Z', cloudCoverPct: 10, cloudCoverLowPct: 4, cloudCoverMidPct: null, cloudCoverHighPct: 12, precipitationProbabilityPct: 0, windSpeedMs: 2.1, windGustsMs: 5, relativeHumidityPct: 81, temperatureC: 6, dewPointC: 3 },
  { time: '2027-06-12T09:00:00.000Z', cloudCoverPct: 20, cloudCoverLowPct: 9, cloudCoverMidPct: null, cloudCoverHighPct: 7, precipitationProbabilityPct: 5, windSpeedMs: 3.4, windGustsMs: 6.25, relativeHumidityPct: 88, temperatureC: 5, dewPointC: 3.1 },
];
const clear: ForecastOutlook = {
  status: 'forecast', ...base, issuedAt: '2027-06-12T00:00:00.000Z', hoursCovered: 2, hoursInWindow: 3, complete: false,
  meanCloudPct: 13.4, maxCloudPct: 20, badge: 'clear', dewRisk: 'high', minDewPointSpreadC: 1.9,
  maxRelativeHumidityPct: 88, maxPrecipitationProbabilityPct: 5, maxWindSpeedMs: 3.4, maxWindGustsMs: 6.25, hours,
};

describe('outlook in words', () => {
  it('labels each status', () => {
    const list: SkyOutlook[] = [
      clear,
      { status: 'no-forecast-yet', ...base, issuedAt: null, horizonEnd: null },
      { status: 'unavailable', ...base, message: 'x' },
      { status: 'past', ...base },
    ];
    expect(list.map(outlookLabel)).toEqual(['clear', 'no forecast yet', 'forecast unavailable', 'lineup over']);
  });

  it('gives every number of a forecast, with the issue time in the site zone', () => {
    expect(outlookFacts(clear, TZ)).toEqual([
      { label: 'Cloud', value: 'mean 13 %, highest hour 20 %' },
      { label: 'Low / mid / high', value: 'up to 9 % / – / 12 %' },
      { label: 'Rain chance', value: 'up to 5 %' },
      { label: 'Wind', value: 'up to 3.4 m/s, gusts 6.3 m/s' },
      { label: 'Humidity', value: 'up to 88 %' },
      { label: 'Dew risk', value: 'high, air within 1.9 °C of its dew point' },
      { label: 'Covers', value: "2 of the window's 3 hours (the forecast ends inside it)" },
      // 00:00 UTC is 10:00 AEST.
      { label: 'Forecast made', value: '2027-06-12 10:00 AEST' },
    ]);
    expect(outlookSummary(clear)).toBe('clear: mean cloud 13 % (highest hour 20 %) over 2 of 3 hours, dew risk high');
  });

  it('says where the forecast ends, and why it is unavailable', () => {
    expect(outlookFacts({ status: 'no-forecast-yet', ...base, issuedAt: '2027-05-20T00:00:00.000Z', horizonEnd: '2027-06-04T23:00:00.000Z' }, TZ)).toEqual([
      { label: 'Forecast', value: 'not yet: it reaches to 2027-06-05 09:00 AEST' },
      { label: 'Forecast made', value: '2027-05-20 10:00 AEST' },
    ]);
    const down: SkyOutlook = { status: 'unavailable', ...base, message: 'The forecast service did not answer in time' };
    expect(outlookFacts(down, TZ)).toEqual([{ label: 'Forecast', value: 'unavailable: The forecast service did not answer in time' }]);
    expect(outlookSummary(down)).toBe('forecast unavailable: The forecast service did not answer in time');
  });

  it('refuses an invalid zone', () => {
    expect(() => outlookFacts(clear, 'Mars/Olympus')).toThrow(RangeError);
  });
});
