import { describe, expect, it } from 'vitest';
import { FORECAST_HORIZON_DAYS, forecastReach, windowReach } from '../../../shared/outlook';

// The reach follows the service's documented forecast range (https://open-meteo.com/en/docs:
// hourly data from 00:00 of today, forecast_days up to 16) and the server's rule in
// server/forecast/forecast-service.ts; the instants below are worked by hand from it.
const at = (iso: string) => new Date(iso);
const win = (start: string, end: string) => ({ start: at(start), end: at(end) });

describe('forecastReach', () => {
  it('runs from 23:30 UTC the day before to 00:00 UTC 16 days after today', () => {
    expect(FORECAST_HORIZON_DAYS).toBe(16);
    const r = forecastReach(at('2027-06-09T13:45:00Z'));
    expect(new Date(r.startMs).toISOString()).toBe('2027-06-08T23:30:00.000Z');
    expect(new Date(r.endMs).toISOString()).toBe('2027-06-25T00:00:00.000Z');
    // The same day at 00:00 UTC and at 23:59 UTC share one reach.
    expect(forecastReach(at('2027-06-09T00:00:00Z'))).toEqual(r);
    expect(forecastReach(at('2027-06-09T23:59:59Z'))).toEqual(r);
  });

  it('refuses an invalid instant', () => {
    expect(() => forecastReach(new Date(Number.NaN))).toThrow(RangeError);
  });
});

describe('windowReach', () => {
  const now = at('2027-06-09T13:45:00Z');
  it('sorts windows into within, beyond and over', () => {
    expect(windowReach([
      win('2027-06-09T10:00Z', '2027-06-09T12:00Z'), // ended before now
      win('2027-06-09T13:00Z', '2027-06-09T15:00Z'), // running now
      win('2027-06-20T10:00Z', '2027-06-20T12:00Z'), // in the reach
      win('2027-06-24T23:00Z', '2027-06-25T01:00Z'), // starts inside, ends outside: still asked
      win('2027-06-25T00:00Z', '2027-06-25T02:00Z'), // starts at the end: no forecast yet
      win('2027-07-30T10:00Z', '2027-07-30T12:00Z'),
    ], now)).toEqual(['over', 'within', 'within', 'within', 'beyond', 'beyond']);
  });

  it('refuses a window whose end is not after its start', () => {
    expect(() => windowReach([win('2027-06-10T10:00Z', '2027-06-10T10:00Z')], now)).toThrow(RangeError);
  });
});
