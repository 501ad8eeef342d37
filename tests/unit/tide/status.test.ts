import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DateTime } from 'luxon';
import {
  lineupTideStatus,
  lineupTideStatusFromAccess,
  reachableIntervals,
  tideAccess,
  type TideEvent,
  type TideInterval,
  type TideRule,
} from '../../../shared/tide';

// The cases below are hand-worked checks of the definitions in shared/tide/status.ts (windows,
// covered span, decided instants), not reference values: there is no outside source for a tide
// rule's outcome. Times are local in Europe/London in May 2027 (BST, UTC+1).
const ZONE = 'Europe/London';
/** A local time in Europe/London, 'YYYY-MM-DD HH:mm', as a Date. */
function local(text: string): Date {
  const dt = DateTime.fromFormat(text, 'yyyy-MM-dd HH:mm', { zone: ZONE });
  if (!dt.isValid) throw new Error(`bad test time ${text}`);
  return dt.toJSDate();
}
function ev(kind: 'high' | 'low', text: string): TideEvent {
  return { at: local(text).toISOString(), kind };
}
function iv(start: string, end: string): TideInterval {
  return { start: local(start), end: local(end) };
}
const D3 = '2027-05-03';
const D4 = '2027-05-04';
const D5 = '2027-05-05';

// One day of tides (invented times with the usual ~6 h 12 min spacing, 'common practice'):
// H 05-03 20:58, L 05-04 03:12, H 09:25, L 15:40, H 21:55. All gaps <= 14 h, so the covered span
// is 05-03 20:58 .. 05-04 21:55.
const DAY: TideEvent[] = [
  ev('high', `${D3} 20:58`),
  ev('low', `${D4} 03:12`),
  ev('high', `${D4} 09:25`),
  ev('low', `${D4} 15:40`),
  ev('high', `${D4} 21:55`),
];

// Rule A: reachable from 2 h before to 1.5 h after low water.
//   Low-water windows: 03:12 - 2 h = 01:12 .. 03:12 + 1.5 h = 04:42; 15:40 -> 13:40 .. 17:10.
//   Decided outside windows: covered 20:58 .. 21:55 shrunk by 1.5 h at the start (a low at most
//   1.5 h before t could make t reachable) and 2 h at the end: 05-03 22:28 .. 05-04 19:55.
//   Reachable = the windows; cut off = 05-03 22:28-05-04 01:12, 04:42-13:40, 17:10-19:55.
const AROUND_LOW: TideRule = { mode: 'around-low', hoursBefore: 2, hoursAfter: 1.5 };

// Rule B: cut off from 1 h before to 2 h after high water.
//   High-water windows: 05-03 19:58-22:58, 05-04 08:25-11:25, 20:55-23:55 (cut off).
//   Decided outside windows: covered shrunk by 2 h at the start and 1 h at the end:
//   05-03 22:58 .. 05-04 20:55. Reachable = that minus the windows: 05-03 22:58-05-04 08:25 and
//   11:25-20:55.
const EXCEPT_HIGH: TideRule = { mode: 'except-around-high', hoursBefore: 1, hoursAfter: 2 };

describe('tideAccess: hand-worked day', () => {
  it('around low water: reachable inside the low-water windows, cut off between them', () => {
    const access = tideAccess(AROUND_LOW, DAY);
    expect(access.reachable).toEqual([iv(`${D4} 01:12`, `${D4} 04:42`), iv(`${D4} 13:40`, `${D4} 17:10`)]);
    expect(access.cutOff).toEqual([
      iv(`${D3} 22:28`, `${D4} 01:12`),
      iv(`${D4} 04:42`, `${D4} 13:40`),
      iv(`${D4} 17:10`, `${D4} 19:55`),
    ]);
    expect(reachableIntervals(AROUND_LOW, DAY)).toEqual(access.reachable);
  });

  it('except around high water: cut off inside the high-water windows, reachable between them', () => {
    const access = tideAccess(EXCEPT_HIGH, DAY);
    expect(access.cutOff).toEqual([
      iv(`${D3} 19:58`, `${D3} 22:58`),
      iv(`${D4} 08:25`, `${D4} 11:25`),
      iv(`${D4} 20:55`, `${D4} 23:55`),
    ]);
    expect(access.reachable).toEqual([iv(`${D3} 22:58`, `${D4} 08:25`), iv(`${D4} 11:25`, `${D4} 20:55`)]);
  });

  it('gives the same intervals whatever the order of the events', () => {
    const shuffled = [DAY[3]!, DAY[0]!, DAY[4]!, DAY[2]!, DAY[1]!];
    expect(tideAccess(AROUND_LOW, shuffled)).toEqual(tideAccess(AROUND_LOW, DAY));
  });

  it('merges overlapping windows of a wide rule into one interval', () => {
    // 6 h before and 6.5 h after each low: 03:12 -> 21:12 (05-03) .. 09:42; 15:40 -> 09:40 .. 22:10.
    // The two windows overlap (09:40 < 09:42) and merge.
    const wide: TideRule = { mode: 'around-low', hoursBefore: 6, hoursAfter: 6.5 };
    expect(reachableIntervals(wide, DAY)).toEqual([iv(`${D3} 21:12`, `${D4} 22:10`)]);
  });

  it('with no tide events nothing is decided', () => {
    expect(tideAccess(AROUND_LOW, [])).toEqual({ reachable: [], cutOff: [] });
    expect(tideAccess(EXCEPT_HIGH, [])).toEqual({ reachable: [], cutOff: [] });
  });

  it('a gap over 14 h between events is not covered', () => {
    // L 03:12 and H 05-05 09:25 are 30 h 13 min apart: only the low-water window is decided.
    const events = [ev('low', `${D4} 03:12`), ev('high', `${D5} 09:25`)];
    expect(tideAccess(AROUND_LOW, events)).toEqual({ reachable: [iv(`${D4} 01:12`, `${D4} 04:42`)], cutOff: [] });
  });
});

describe('lineupTideStatus around low water (2 h before to 1.5 h after; window 01:12-04:42)', () => {
  const window = iv(`${D4} 01:12`, `${D4} 04:42`);
  it.each([
    // [lineup start, end, status, reachable parts, access window, cut-off time]
    ['01:30', '02:00', 'reachable', [['01:30', '02:00']], window, '04:42'],
    ['01:15', '04:30', 'reachable', [['01:15', '04:30']], window, '04:42'],
    ['01:20', '04:40', 'reachable', [['01:20', '04:40']], window, '04:42'],
    ['01:12', '04:42', 'reachable', [['01:12', '04:42']], window, '04:42'],
    // Starts 12 min before the window opens: cut off at the start, reachable from 01:12.
    ['01:00', '02:00', 'cut-off', [['01:12', '02:00']], null, null],
    // Runs 18 min past the window: cut off from 04:42.
    ['04:00', '05:00', 'cut-off', [['04:00', '04:42']], window, '04:42'],
    // Starts as the window closes.
    ['04:42', '05:00', 'cut-off', [], window, '04:42'],
    // Between the two low-water windows.
    ['06:00', '07:00', 'cut-off', [], null, null],
    // Spanning a whole cut-off stretch from one window to the next.
    ['04:00', '14:00', 'cut-off', [['04:00', '04:42'], ['13:40', '14:00']], window, '04:42'],
  ])('lineup %s-%s is %s', (start, end, status, parts, accessWindow, cutOffAt) => {
    const result = lineupTideStatus(AROUND_LOW, DAY, local(`${D4} ${start}`), local(`${D4} ${end}`));
    expect(result.status).toBe(status);
    expect(result.reachable).toEqual(parts.map(([s, e]) => iv(`${D4} ${s}`, `${D4} ${e}`)));
    expect(result.accessWindow).toEqual(accessWindow);
    expect(result.cutOffAt).toEqual(cutOffAt === null ? null : local(`${D4} ${cutOffAt}`));
  });

  it.each([
    // After the last event (H 21:55): no later low is listed, so nothing after 19:55 is decided.
    [`${D5} 00:00`, `${D5} 01:00`, 'unknown'],
    // Before the first decided instant (05-03 22:28).
    [`${D3} 21:30`, `${D3} 22:00`, 'unknown'],
    // Half decided cut off (19:00-19:55), half unknown: part of it is known cut off.
    [`${D4} 19:00`, `${D4} 20:30`, 'cut-off'],
  ])('lineup %s-%s at the edge of the tide times is %s', (start, end, status) => {
    const result = lineupTideStatus(AROUND_LOW, DAY, local(start), local(end));
    expect(result.status).toBe(status);
    expect(result.reachable).toEqual([]);
    expect(result.cutOffAt).toBeNull();
  });

  it('a reachable lineup whose window ends where the tide times end has no cut-off time', () => {
    // Events H 05-03 20:58 and L 03:12 only: window 01:12-04:42 is known, after 04:42 nothing is.
    const events = DAY.slice(0, 2);
    const inside = lineupTideStatus(AROUND_LOW, events, local(`${D4} 02:00`), local(`${D4} 03:00`));
    expect(inside).toEqual({
      status: 'reachable',
      reachable: [iv(`${D4} 02:00`, `${D4} 03:00`)],
      accessWindow: iv(`${D4} 01:12`, `${D4} 04:42`),
      cutOffAt: null,
    });
    // Running past 04:42 into the unknown: not wholly reachable, not known cut off.
    expect(lineupTideStatus(AROUND_LOW, events, local(`${D4} 04:00`), local(`${D4} 05:00`)).status).toBe('unknown');
  });

  it('with no tide times every lineup is unknown', () => {
    const result = lineupTideStatus(AROUND_LOW, [], local(`${D4} 01:30`), local(`${D4} 02:00`));
    expect(result).toEqual({ status: 'unknown', reachable: [], accessWindow: null, cutOffAt: null });
  });
});

describe('lineupTideStatus except around high water (1 h before to 2 h after)', () => {
  const morning = iv(`${D3} 22:58`, `${D4} 08:25`);
  const afternoon = iv(`${D4} 11:25`, `${D4} 20:55`);
  it.each([
    [`${D4} 02:00`, `${D4} 04:00`, 'reachable', [[`${D4} 02:00`, `${D4} 04:00`]], morning, `${D4} 08:25`],
    [`${D3} 23:30`, `${D4} 00:30`, 'reachable', [[`${D3} 23:30`, `${D4} 00:30`]], morning, `${D4} 08:25`],
    // Ends exactly as the high-water window opens: shares only an instant with it.
    [`${D4} 07:00`, `${D4} 08:25`, 'reachable', [[`${D4} 07:00`, `${D4} 08:25`]], morning, `${D4} 08:25`],
    // Touches the high-water window 08:25-11:25 for 5 min.
    [`${D4} 07:30`, `${D4} 08:30`, 'cut-off', [[`${D4} 07:30`, `${D4} 08:25`]], morning, `${D4} 08:25`],
    // Inside the high-water window.
    [`${D4} 09:00`, `${D4} 10:00`, 'cut-off', [], null, null],
    // Starts inside the window, ends after it: cut off at the start.
    [`${D4} 11:00`, `${D4} 12:00`, 'cut-off', [[`${D4} 11:25`, `${D4} 12:00`]], null, null],
    // Runs into the evening high-water window (20:55-23:55).
    [`${D4} 20:00`, `${D4} 21:00`, 'cut-off', [[`${D4} 20:00`, `${D4} 20:55`]], afternoon, `${D4} 20:55`],
    // After the last high-water window (ends 23:55): no later high is listed.
    [`${D5} 00:30`, `${D5} 01:30`, 'unknown', [], null, null],
  ])('lineup %s-%s is %s', (start, end, status, parts, accessWindow, cutOffAt) => {
    const result = lineupTideStatus(EXCEPT_HIGH, DAY, local(start), local(end));
    expect(result.status).toBe(status);
    expect(result.reachable).toEqual(parts.map(([s, e]) => iv(s!, e!)));
    expect(result.accessWindow).toEqual(accessWindow);
    expect(result.cutOffAt).toEqual(cutOffAt === null ? null : local(cutOffAt));
  });
});

describe('lineupTideStatus: a lineup of no length', () => {
  it.each([
    [AROUND_LOW, '02:00', 'reachable'],
    [AROUND_LOW, '06:00', 'cut-off'],
    [EXCEPT_HIGH, '09:00', 'cut-off'],
    [EXCEPT_HIGH, '12:00', 'reachable'],
  ])('an instant lineup at %s under rule %# is %s', (rule, at, status) => {
    const t = local(`${D4} ${at}`);
    expect(lineupTideStatus(rule, DAY, t, t).status).toBe(status);
  });
});

// Pointwise oracle written straight from the definitions, compared with the interval algebra on
// random rules and tide times. Events fall on whole minutes and rule hours on quarter hours, so
// probing at whole minutes + 30 s never hits a boundary.
describe('tideAccess agrees with the pointwise definitions', () => {
  const MIN = 60_000;
  const H = 3_600_000;
  const T0 = Date.UTC(2027, 4, 4);
  it('on random rules and tide times', () => {
    fc.assert(fc.property(
      fc.constantFrom('around-low' as const, 'except-around-high' as const),
      fc.integer({ min: 0, max: 48 }),
      fc.integer({ min: 1, max: 48 }),
      fc.array(fc.record({ minute: fc.integer({ min: 0, max: 3 * 24 * 60 }), high: fc.boolean() }), { maxLength: 14 }),
      fc.array(fc.integer({ min: -12 * 60, max: 4 * 24 * 60 }), { minLength: 20, maxLength: 20 }),
      (mode, q1, q2, raw, probes) => {
        const rule: TideRule = { mode, hoursBefore: q1 / 4, hoursAfter: q2 / 4 };
        const events: TideEvent[] = raw.map((e) => ({ at: new Date(T0 + e.minute * MIN).toISOString(), kind: e.high ? 'high' : 'low' }));
        const access = tideAccess(rule, events);
        const all = [...new Set(raw.map((e) => T0 + e.minute * MIN))].sort((a, b) => a - b);
        const centres = raw.filter((e) => e.high === (mode === 'except-around-high')).map((e) => T0 + e.minute * MIN);
        const b = rule.hoursBefore * H;
        const a = rule.hoursAfter * H;
        // Covered runs: consecutive events at most 14 h apart.
        const runs: [number, number][] = [];
        for (const t of all) {
          const last = runs[runs.length - 1];
          if (last !== undefined && t - last[1] <= 14 * H) last[1] = t;
          else runs.push([t, t]);
        }
        const covered = (lo: number, hi: number) => runs.some(([s, e]) => s <= lo && hi <= e);
        const inside = (list: TideInterval[], t: number) => list.some((x) => x.start.getTime() <= t && t <= x.end.getTime());
        for (const p of probes) {
          const t = T0 + p * MIN + 30_000;
          const inWindow = centres.some((c) => c - b <= t && t <= c + a);
          const decided = inWindow || covered(t - a, t + b);
          const reachableByRule = mode === 'around-low' ? inWindow : !inWindow;
          expect(inside(access.reachable, t)).toBe(decided && reachableByRule);
          expect(inside(access.cutOff, t)).toBe(decided && !reachableByRule);
        }
      },
    ), { numRuns: 300 });
  });
});

describe('lineupTideStatus: input guards', () => {
  const start = local(`${D4} 01:30`);
  const end = local(`${D4} 02:00`);
  it.each([
    ['a rule with an unknown mode', { mode: 'sometimes', hoursBefore: 1, hoursAfter: 1 }, /Invalid tide rule: mode/],
    ['a rule with 13 h before', { mode: 'around-low', hoursBefore: 13, hoursAfter: 1 }, /hoursBefore: Hours before low water must be between 0 and 12/],
    ['a rule with NaN hours', { mode: 'except-around-high', hoursBefore: 1, hoursAfter: Number.NaN }, /hoursAfter/],
  ])('throws a RangeError on %s', (_label, rule, message) => {
    expect(() => lineupTideStatus(rule as TideRule, DAY, start, end)).toThrow(RangeError);
    expect(() => lineupTideStatus(rule as TideRule, DAY, start, end)).toThrow(message);
  });

  it.each([
    ['events that are not an array', 'L 03:12' as unknown as TideEvent[]],
    ['an event with a local time', [{ at: '2027-05-04T03:12:00+01:00', kind: 'low' }] as TideEvent[]],
    ['an event with an unknown kind', [{ at: '2027-05-04T02:12:00Z', kind: 'slack' }] as unknown as TideEvent[]],
  ])('throws a RangeError on %s', (_label, events) => {
    expect(() => lineupTideStatus(AROUND_LOW, events, start, end)).toThrow(RangeError);
  });

  it.each([
    ['an invalid start', new Date(Number.NaN), end],
    ['an end before the start', end, start],
    ['a start that is not a Date', '2027-05-04' as unknown as Date, end],
  ])('throws a RangeError on %s', (_label, s, e) => {
    expect(() => lineupTideStatus(AROUND_LOW, DAY, s, e)).toThrow(RangeError);
  });

  it('lineupTideStatusFromAccess gives the same answer as lineupTideStatus', () => {
    const access = tideAccess(EXCEPT_HIGH, DAY);
    const s = local(`${D4} 07:30`);
    const e = local(`${D4} 08:30`);
    expect(lineupTideStatusFromAccess(access, s, e)).toEqual(lineupTideStatus(EXCEPT_HIGH, DAY, s, e));
  });

  it('lineupTideStatusFromAccess rejects a malformed access', () => {
    expect(() => lineupTideStatusFromAccess({ reachable: [{ start: end, end: start }], cutOff: [] }, start, end)).toThrow(RangeError);
  });
});
