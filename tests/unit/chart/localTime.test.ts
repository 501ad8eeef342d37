import { describe, expect, it } from 'vitest';
import { localClock, localHourTicks, nightDateOf } from '../../../shared/chart';

const HOUR_MS = 3_600_000;

describe('nightDateOf', () => {
  it.each([
    // The night of a date runs from its local noon to the next local noon (as nightReport's window).
    ['2027-05-04T00:30:00Z', 'Europe/London', '2027-05-03'], // 01:30 BST
    ['2027-05-03T21:00:00Z', 'Europe/London', '2027-05-03'], // 22:00 BST
    ['2027-05-04T11:30:00Z', 'Europe/London', '2027-05-04'], // 12:30 BST
    ['2027-05-04T10:59:00Z', 'Europe/London', '2027-05-03'], // 11:59 BST
    // 14:00 UTC is 00:00 the next day in Sydney (AEST, UTC+10): still the previous evening's night.
    ['2027-07-10T14:00:00Z', 'Australia/Sydney', '2027-07-10'],
    ['2027-07-10T01:00:00Z', 'Australia/Sydney', '2027-07-09'], // 11:00 AEST, before noon
  ])('%s in %s is in the night of %s', (iso, zone, date) => {
    expect(nightDateOf(new Date(iso), zone)).toBe(date);
  });

  it('rejects an invalid date or zone', () => {
    expect(() => nightDateOf(new Date(Number.NaN), 'Europe/London')).toThrow(RangeError);
    expect(() => nightDateOf(new Date(), 'Mars/Olympus')).toThrow(RangeError);
  });
});

describe('localClock', () => {
  it('reads the site zone, not the machine zone, and rounds to the minute', () => {
    expect(localClock(new Date('2027-05-04T00:30:29Z'), 'Europe/London')).toBe('01:30');
    expect(localClock(new Date('2027-05-04T00:30:31Z'), 'Europe/London')).toBe('01:31');
    expect(localClock(new Date('2027-05-04T00:30:00Z'), 'America/New_York')).toBe('20:30');
  });
});

describe('localHourTicks', () => {
  it('puts a tick on every full local hour within the span', () => {
    const start = Date.parse('2027-05-03T19:20:00Z'); // 20:20 BST
    const ticks = localHourTicks(start, start + 4 * HOUR_MS, 'Europe/London');
    expect(ticks.map((t) => t.label)).toEqual(['21:00', '22:00', '23:00', '00:00']);
    expect(ticks[0]!.atMs).toBe(Date.parse('2027-05-03T20:00:00Z'));
    for (let i = 1; i < ticks.length; i++) expect(ticks[i]!.atMs - ticks[i - 1]!.atMs).toBe(HOUR_MS);
  });

  it('skips the hour the clocks jump over (Europe/London, 2027-03-28 01:00 GMT -> 02:00 BST)', () => {
    // EU summer time starts on the last Sunday of March at 01:00 UTC (Directive 2000/84/EC).
    const start = Date.parse('2027-03-27T23:30:00Z');
    const ticks = localHourTicks(start, start + 3 * HOUR_MS, 'Europe/London');
    expect(ticks.map((t) => t.label)).toEqual(['00:00', '02:00', '03:00']);
  });

  it('keeps only hours that are multiples of everyHours', () => {
    const start = Date.parse('2027-05-03T17:00:00Z'); // 18:00 BST; the end, 06:00 BST, is included
    expect(localHourTicks(start, start + 12 * HOUR_MS, 'Europe/London', 3).map((t) => t.hour)).toEqual([18, 21, 0, 3, 6]);
  });

  it.each([
    [0, -1, 'Europe/London', 1],
    [0, 8 * 24 * HOUR_MS, 'Europe/London', 1],
    [0, HOUR_MS, 'Europe/London', 5],
    [Number.NaN, HOUR_MS, 'Europe/London', 1],
  ])('rejects start %s, end %s, %s, every %s h', (a, b, zone, every) => {
    expect(() => localHourTicks(a, b, zone, every)).toThrow(RangeError);
  });
});
