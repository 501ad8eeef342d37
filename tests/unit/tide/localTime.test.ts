import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { isValidTimeZone, resolveLocalTime, type LocalWallTime } from '../../../shared/tide';

// Reference: the runtime's Intl.DateTimeFormat (ICU time-zone data) reads an instant as a local
// wall time. A wall time's instants are found by brute force: every instant wall - offset, for
// each UTC offset the zone shows on some day of 2027 (read with Intl, day by day), whose Intl
// reading is that wall time. The resolver (luxon zone offsets plus its own candidate logic) must
// return exactly that set.
const MS_PER_MINUTE = 60_000;
const formatters = new Map<string, Intl.DateTimeFormat>();
function intlReading(utcMs: number, timeZone: string): string {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-CA', {
      timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit',
      hour: '2-digit', minute: '2-digit', second: '2-digit',
    });
    formatters.set(timeZone, f);
  }
  const p = Object.fromEntries(f.formatToParts(new Date(utcMs)).map((x) => [x.type, x.value]));
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute}:${p.second}`;
}
function wallLabel(w: LocalWallTime): string {
  const p = (n: number) => String(n).padStart(2, '0');
  return `${w.year}-${p(w.month)}-${p(w.day)} ${p(w.hour)}:${p(w.minute)}:${p(w.second)}`;
}
function bruteForceInstants(w: LocalWallTime, timeZone: string): number[] {
  const wallMs = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
  const label = wallLabel(w);
  return [...yearScan(timeZone).offsetsMs]
    .map((offsetMs) => wallMs - offsetMs)
    .filter((u) => intlReading(u, timeZone) === label)
    .sort((a, b) => a - b);
}
function resolvedInstants(w: LocalWallTime, timeZone: string): number[] {
  const r = resolveLocalTime(w, timeZone);
  if (r.kind === 'nonexistent') return [];
  if (r.kind === 'unique') return [r.utcMs];
  return [r.earlierUtcMs, r.laterUtcMs];
}
function wallOf(ms: number): LocalWallTime {
  const d = new Date(ms);
  return {
    year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate(),
    hour: d.getUTCHours(), minute: d.getUTCMinutes(), second: d.getUTCSeconds(),
  };
}

// Zones with a 1 h change (both hemispheres), a 30 min change (Lord Howe), a 45 min offset with a
// change (Chatham), and none (Kolkata).
const ZONES = ['Europe/London', 'America/New_York', 'Australia/Sydney', 'Australia/Lord_Howe', 'Pacific/Chatham', 'Asia/Kolkata'];

const MS_PER_DAY = 86_400_000;
const scans = new Map<string, { offsetsMs: Set<number>; changeDays: number[] }>();
/** The zone's UTC offsets on the days of 2027 and the days (UTC midnight, ms) the offset changes, read with Intl. */
function yearScan(timeZone: string): { offsetsMs: Set<number>; changeDays: number[] } {
  const cached = scans.get(timeZone);
  if (cached) return cached;
  const offsetAt = (u: number) => Date.parse(`${intlReading(u, timeZone).replace(' ', 'T')}Z`) - u;
  const start = Date.UTC(2027, 0, 1);
  const offsets: number[] = [];
  for (let d = 0; d <= 365; d++) offsets.push(offsetAt(start + d * MS_PER_DAY));
  const changeDays = offsets.slice(1).flatMap((o, d) => (o !== offsets[d] ? [start + d * MS_PER_DAY] : []));
  const scan = { offsetsMs: new Set(offsets), changeDays };
  scans.set(timeZone, scan);
  return scan;
}

describe('resolveLocalTime against a brute-force Intl search', () => {
  it.each(ZONES)('%s: every quarter hour of the days around each 2027 offset change', (zone) => {
    const days = yearScan(zone).changeDays;
    expect(days.length).toBe(zone === 'Asia/Kolkata' ? 0 : 2);
    let ambiguous = 0;
    let nonexistent = 0;
    for (const day of days) {
      for (let m = -24 * 60; m < 48 * 60; m += 15) {
        const w = wallOf(day + m * MS_PER_MINUTE);
        const expected = bruteForceInstants(w, zone);
        expect(resolvedInstants(w, zone), `${zone} ${wallLabel(w)}`).toEqual(expected);
        if (expected.length === 2) ambiguous++;
        if (expected.length === 0) nonexistent++;
      }
    }
    // Each change creates a gap and an overlap as long as the change (in quarter hours).
    if (days.length > 0) {
      expect(ambiguous).toBeGreaterThan(0);
      expect(ambiguous).toBe(nonexistent);
    }
  });

  it('agrees on random wall times through the year', () => {
    fc.assert(fc.property(
      fc.constantFrom(...ZONES),
      fc.integer({ min: 0, max: 365 * 24 * 60 - 1 }),
      (zone, minuteOfYear) => {
        const w = wallOf(Date.UTC(2027, 0, 1) + minuteOfYear * MS_PER_MINUTE);
        expect(resolvedInstants(w, zone)).toEqual(bruteForceInstants(w, zone));
      },
    ), { numRuns: 300 });
  });
});

describe('resolveLocalTime: guards', () => {
  const ok: LocalWallTime = { year: 2027, month: 5, day: 4, hour: 3, minute: 12, second: 0 };
  it.each([
    ['month 13', { ...ok, month: 13 }],
    ['day 0', { ...ok, day: 0 }],
    ['30 February', { ...ok, month: 2, day: 30 }],
    ['hour 24', { ...ok, hour: 24 }],
    ['minute 60', { ...ok, minute: 60 }],
    ['a fractional second', { ...ok, second: 1.5 }],
    ['NaN year', { ...ok, year: Number.NaN }],
  ])('throws a RangeError on %s', (_label, wall) => {
    expect(() => resolveLocalTime(wall, 'Europe/London')).toThrow(RangeError);
  });

  it('throws a RangeError on an unknown zone', () => {
    expect(() => resolveLocalTime(ok, 'Mars/Olympus_Mons')).toThrow(RangeError);
  });

  it.each([
    ['Europe/London', true],
    ['UTC', true],
    ['Europe/Atlantis', false],
    ['', false],
    [42, false],
  ])('isValidTimeZone(%j) is %s', (zone, valid) => {
    expect(isValidTimeZone(zone)).toBe(valid);
  });
});
