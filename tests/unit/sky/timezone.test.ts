import { describe, expect, it } from 'vitest';
import {
  assertLocalDate,
  assertTimeZone,
  formatLocalTime,
  localDateOf,
  localMidnightAfter,
  nightSpanUtc,
  timeZoneForSite,
  toLocalInstant,
} from '../../../shared/sky/timezone';

const HOUR_MS = 3_600_000;

describe('time zone of a site (tz-lookup)', () => {
  // Zones from the IANA time zone database boundaries (tz-lookup), for the sites used in the
  // night tests: south-west Ireland, the Greenwich meridian at 60 N (Shetland), Orlando, Canberra.
  it.each([
    [52.1, -7.0, 'Europe/Dublin'],
    [60, 0, 'Europe/London'],
    [28.538, -81.379, 'America/New_York'],
    [-35.3, 149.1, 'Australia/Sydney'],
    [52, -1, 'Europe/London'],
  ])('(%s, %s) is in %s', (lat, lon, zone) => {
    expect(timeZoneForSite(lat, lon)).toBe(zone);
  });

  // Open ocean: nautical zones 'Etc/GMT±h' (IANA Etc zones, sign inverted by POSIX convention).
  it('gives an Etc zone in the open ocean', () => {
    expect(timeZoneForSite(0, -140)).toMatch(/^Etc\/GMT[+-]\d+$/);
  });

  it.each([
    [91, 0],
    [0, -181],
    [Number.NaN, 0],
  ])('rejects (%s, %s)', (lat, lon) => {
    expect(() => timeZoneForSite(lat, lon)).toThrow(RangeError);
  });
});

describe('local times', () => {
  // Irish Standard Time is UTC+1 in summer (IANA tz database, Europe/Dublin).
  it('reads an instant in the site zone with its offset and label', () => {
    const inst = toLocalInstant(new Date('2027-05-20T00:30:12.8Z'), 'Europe/Dublin');
    expect(inst.local).toBe('2027-05-20T01:30:13+01:00');
    expect(inst.zoneLabel).toBe('IST');
    expect(inst.timeZone).toBe('Europe/Dublin');
    expect(inst.utc.toISOString()).toBe('2027-05-20T00:30:12.800Z');
  });

  it.each([
    ['2027-01-15T12:00:00Z', 'Europe/London', '2027-01-15 12:00 GMT'],
    ['2027-07-15T12:00:00Z', 'Europe/London', '2027-07-15 13:00 BST'],
    ['2021-11-07T10:21:30Z', 'America/New_York', '2021-11-07 05:22 EST'],
    ['2027-06-15T12:00:00Z', 'Australia/Sydney', '2027-06-15 22:00 AEST'],
  ])('formats %s in %s as %s (rounded to the minute)', (iso, zone, text) => {
    expect(formatLocalTime(new Date(iso), zone)).toBe(text);
  });

  it('formats with seconds on request', () => {
    expect(formatLocalTime(new Date('2027-05-20T00:30:12.8Z'), 'Europe/Dublin', true)).toBe('2027-05-20 01:30:13 IST');
  });

  it('gives the local calendar date of an instant', () => {
    expect(localDateOf(new Date('2027-05-19T23:30:00Z'), 'Europe/Dublin')).toBe('2027-05-20');
    expect(localDateOf(new Date('2027-05-19T23:30:00Z'), 'UTC')).toBe('2027-05-19');
  });
});

describe('night spans', () => {
  it('runs from local noon to local noon (24 h on an ordinary day)', () => {
    const span = nightSpanUtc('2027-05-19', 'Europe/Dublin');
    expect(span.start.toISOString()).toBe('2027-05-19T11:00:00.000Z');
    expect(span.end.toISOString()).toBe('2027-05-20T11:00:00.000Z');
  });

  // US daylight saving time ended on 2021-11-07 at 02:00 EDT (IANA tz database, America/New_York),
  // and the EU one on 2027-10-31 at 01:00 UTC; it began in the US on 2027-03-14.
  it.each([
    ['2021-11-06', 'America/New_York', 25],
    ['2027-10-30', 'Europe/London', 25],
    ['2027-03-13', 'America/New_York', 23],
  ])('spans the daylight-saving change of the night of %s in %s (%s h)', (date, zone, hours) => {
    const span = nightSpanUtc(date, zone);
    expect((span.end.getTime() - span.start.getTime()) / HOUR_MS).toBe(hours);
  });

  it('gives local midnight after a date', () => {
    expect(localMidnightAfter('2027-05-19', 'Europe/Dublin').toISOString()).toBe('2027-05-19T23:00:00.000Z');
    expect(localMidnightAfter('2027-06-15', 'Australia/Sydney').toISOString()).toBe('2027-06-15T14:00:00.000Z');
  });
});

describe('guards', () => {
  it.each(['2027-02-30', '2027-5-19', '19-05-2027', '', 'yesterday'])('rejects the date %j', (date) => {
    expect(() => assertLocalDate(date)).toThrow(RangeError);
    expect(() => nightSpanUtc(date, 'UTC')).toThrow(RangeError);
  });

  it('accepts a leap day', () => {
    expect(assertLocalDate('2028-02-29')).toBe('2028-02-29');
  });

  it.each(['Mars/Olympus_Mons', '', 42])('rejects the zone %j', (zone) => {
    expect(() => assertTimeZone(zone)).toThrow(RangeError);
  });

  // luxon reads these as zones too, but they are not IANA names (the machine's own zone, a fixed
  // offset): a site's time zone is always an IANA name, as tz-lookup gives it.
  it.each(['local', 'system', 'UTC+3'])('rejects the luxon specifier %j, which is not an IANA zone', (zone) => {
    expect(() => assertTimeZone(zone)).toThrow(RangeError);
  });

  it.each(['UTC', 'Europe/Dublin', 'Etc/GMT-3', 'Australia/Sydney'])('accepts the IANA zone %j', (zone) => {
    expect(assertTimeZone(zone)).toBe(zone);
  });

  it('rejects an invalid instant', () => {
    expect(() => toLocalInstant(new Date(Number.NaN), 'UTC')).toThrow(RangeError);
    expect(() => formatLocalTime(new Date(Number.NaN), 'UTC')).toThrow(RangeError);
  });
});
