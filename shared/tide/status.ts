/**
 * When a spot with a tide rule can be reached, given the high and low waters of a tide table, and
 * the tide status of a lineup: reachable, cut off or unknown.
 *
 * Definitions (all intervals closed, instants in UTC):
 *
 * - **Window** of an event: for `around-low`, [L - hoursBefore, L + hoursAfter] around each low
 *   water L; for `except-around-high`, [H - hoursBefore, H + hoursAfter] around each high water H.
 *   An `around-low` spot is reachable exactly inside the low-water windows; an
 *   `except-around-high` spot is cut off exactly inside the high-water windows.
 * - **Covered span**: the tide times are taken as complete (every high and low water listed)
 *   between consecutive events at most {@link MAX_TIDE_EVENT_GAP_MIN} (14 h) apart. Before the
 *   first event, after the last one, and inside a longer gap, an unlisted high or low water may
 *   exist.
 * - **Decided**: an instant t lies in a known event's window (decided by that event), or no window
 *   can hold t except from events inside the covered span: t's window can only come from an event
 *   in [t - hoursAfter, t + hoursBefore], so t is decided when that whole span is covered. Each
 *   covered piece [a, b] thus decides [a + hoursAfter, b - hoursBefore] besides the known windows.
 * - **Reachable** instants: decided and reachable by the rule; **cut-off** instants: decided and
 *   not reachable; all others are **unknown**.
 */
import { assertValidDate, parseOrThrow } from '../guards';
import { MS_PER_HOUR, MS_PER_MINUTE } from '../units';
import { MAX_TIDE_EVENT_GAP_MIN } from './sequence';
import { mergeIntervals, overlapMs, subtractIntervals, type MsInterval } from './intervals';
import { tideEventSchema, tideRuleSchema, type TideEvent, type TideRule } from './schemas';

/** The tide status values of a lineup. */
export const TIDE_STATUSES = ['reachable', 'cut-off', 'unknown'] as const;
/** Tide status of a lineup: see {@link lineupTideStatus}. */
export type TideStatus = (typeof TIDE_STATUSES)[number];

/** Most tide events accepted in one call (decades of semidiurnal tides). */
export const MAX_TIDE_EVENTS = 100_000;

/** A closed UTC time interval, start <= end. */
export interface TideInterval {
  start: Date;
  end: Date;
}

/**
 * Where the tide times decide the rule: reachable and cut-off intervals, each sorted and disjoint;
 * the two lists share at most boundary instants. Any time in neither list is unknown.
 */
export interface TideAccess {
  reachable: TideInterval[];
  cutOff: TideInterval[];
}

/** The tide status of one lineup with the details a night timeline needs. */
export interface LineupTideStatus {
  /**
   * 'reachable': the whole lineup lies inside one reachable interval. 'cut-off': some part of the
   * lineup (more than an instant, or the instant itself for a lineup of no length) is decided cut
   * off. 'unknown': neither, so some part of it is not decided by the tide times.
   */
  status: TideStatus;
  /** The parts of the lineup that are reachable, clipped to [start, end]; sorted. */
  reachable: TideInterval[];
  /** The whole reachable interval holding the lineup start (not clipped), or null when there is none. */
  accessWindow: TideInterval | null;
  /**
   * When the tide cuts the spot off: the end of `accessWindow` when a cut-off interval follows it;
   * null when there is no access window, or when it ends only because the tide times end.
   */
  cutOffAt: Date | null;
}

/** Validated event instants (ms, sorted, repeats removed) of each kind. */
function checkedInstants(events: unknown): { allMs: number[]; highMs: number[]; lowMs: number[] } {
  if (!Array.isArray(events)) throw new RangeError('Tide events must be an array');
  if (events.length > MAX_TIDE_EVENTS) {
    throw new RangeError(`At most ${MAX_TIDE_EVENTS} tide events are accepted (got ${events.length})`);
  }
  const highMs: number[] = [];
  const lowMs: number[] = [];
  events.forEach((e: unknown, i) => {
    const event = parseOrThrow(`tide event ${i}`, tideEventSchema, e);
    const ms = Date.parse(event.at);
    if (!Number.isFinite(ms)) throw new RangeError(`Invalid tide event ${i}: at: not a valid time`);
    (event.kind === 'high' ? highMs : lowMs).push(ms);
  });
  const unique = (xs: number[]) => [...new Set(xs)].sort((a, b) => a - b);
  return { allMs: unique([...highMs, ...lowMs]), highMs: unique(highMs), lowMs: unique(lowMs) };
}

/** Covered pieces: runs of consecutive events at most MAX_TIDE_EVENT_GAP_MIN apart. */
function coveredSpans(allMs: readonly number[]): MsInterval[] {
  const maxGapMs = MAX_TIDE_EVENT_GAP_MIN * MS_PER_MINUTE;
  const spans: MsInterval[] = [];
  for (const t of allMs) {
    const last = spans[spans.length - 1];
    if (last !== undefined && t - last.endMs <= maxGapMs) last.endMs = t;
    else spans.push({ startMs: t, endMs: t });
  }
  return spans;
}

function toTideIntervals(list: readonly MsInterval[]): TideInterval[] {
  return list.map((iv) => ({ start: new Date(iv.startMs), end: new Date(iv.endMs) }));
}

/**
 * Where the tide times decide a tide rule (see the definitions at the top of this module).
 *
 * @param rule a tide rule (validated with the tide rule schema)
 * @param events high and low waters, any order, at most {@link MAX_TIDE_EVENTS}; repeated
 *   instants count once; a high and a low at the same instant both count
 * @returns reachable and cut-off intervals (UTC), each sorted and disjoint
 * @throws RangeError on an invalid rule or event
 */
export function tideAccess(rule: TideRule, events: readonly TideEvent[]): TideAccess {
  const r = parseOrThrow('tide rule', tideRuleSchema, rule);
  const { allMs, highMs, lowMs } = checkedInstants(events);
  const beforeMs = r.hoursBefore * MS_PER_HOUR;
  const afterMs = r.hoursAfter * MS_PER_HOUR;

  const windowCentres = r.mode === 'around-low' ? lowMs : highMs;
  const windows = mergeIntervals(windowCentres.map((t) => ({ startMs: t - beforeMs, endMs: t + afterMs })));
  const decidedOutsideWindows = coveredSpans(allMs)
    .map((s) => ({ startMs: s.startMs + afterMs, endMs: s.endMs - beforeMs }))
    .filter((s) => s.endMs > s.startMs);
  const outside = subtractIntervals(decidedOutsideWindows, windows);

  return r.mode === 'around-low'
    ? { reachable: toTideIntervals(windows), cutOff: toTideIntervals(outside) }
    : { reachable: toTideIntervals(outside), cutOff: toTideIntervals(windows) };
}

/**
 * The UTC intervals when the spot is reachable by the rule, as far as the tide times decide it
 * (see the definitions at the top of this module). Times outside these intervals are cut off or
 * unknown: {@link tideAccess} tells which.
 *
 * @param rule a tide rule
 * @param events high and low waters, any order
 * @returns sorted disjoint closed intervals
 * @throws RangeError on an invalid rule or event
 */
export function reachableIntervals(rule: TideRule, events: readonly TideEvent[]): TideInterval[] {
  return tideAccess(rule, events).reachable;
}

function toMsIntervals(list: unknown, name: string): MsInterval[] {
  if (!Array.isArray(list)) throw new RangeError(`${name} must be an array`);
  return list.map((iv: unknown, i) => {
    const { start, end } = (iv ?? {}) as Partial<TideInterval>;
    const startMs = assertValidDate(start, `${name}[${i}].start`).getTime();
    const endMs = assertValidDate(end, `${name}[${i}].end`).getTime();
    if (endMs < startMs) throw new RangeError(`${name}[${i}] ends before it starts`);
    return { startMs, endMs };
  });
}

/**
 * The tide status of a lineup from a precomputed {@link tideAccess} (for many lineups against one
 * set of tide times).
 *
 * @param access from {@link tideAccess}: sorted disjoint intervals
 * @param start lineup start (UTC)
 * @param end lineup end (UTC), not before `start`
 * @throws RangeError on invalid dates, `end` before `start`, or a malformed `access`
 */
export function lineupTideStatusFromAccess(access: TideAccess, start: Date, end: Date): LineupTideStatus {
  const startMs = assertValidDate(start, 'start').getTime();
  const endMs = assertValidDate(end, 'end').getTime();
  if (endMs < startMs) throw new RangeError('Lineup end must not be before its start');
  if (access === null || typeof access !== 'object') throw new RangeError('access must be an object');
  const reachable = toMsIntervals(access.reachable, 'access.reachable');
  const cutOff = toMsIntervals(access.cutOff, 'access.cutOff');
  const lineup: MsInterval = { startMs, endMs };

  const holdingStart = reachable.find((iv) => iv.startMs <= startMs && startMs <= iv.endMs) ?? null;
  const reachableParts = reachable
    .map((iv) => ({ startMs: Math.max(iv.startMs, startMs), endMs: Math.min(iv.endMs, endMs) }))
    .filter((iv) => iv.endMs > iv.startMs || (startMs === endMs && iv.endMs === iv.startMs));
  const cutOffAtMs = holdingStart !== null && cutOff.some((iv) => iv.startMs === holdingStart.endMs) ? holdingStart.endMs : null;

  let status: TideStatus;
  if (holdingStart !== null && endMs <= holdingStart.endMs) status = 'reachable';
  else if (cutOff.some((iv) => overlapMs(iv, lineup) > 0 || (startMs === endMs && iv.startMs <= startMs && startMs <= iv.endMs))) status = 'cut-off';
  else status = 'unknown';

  return {
    status,
    reachable: toTideIntervals(reachableParts),
    accessWindow: holdingStart === null ? null : toTideIntervals([holdingStart])[0]!,
    cutOffAt: cutOffAtMs === null ? null : new Date(cutOffAtMs),
  };
}

/**
 * The tide status of a lineup [start, end] under a tide rule:
 * - 'reachable' when the whole lineup lies inside one reachable interval;
 * - 'cut-off' when some part of it (more than an instant) is decided cut off: with `around-low`,
 *   a lineup reaching outside the low-water window it starts in (or lying between two windows) is
 *   cut off; with `except-around-high`, a lineup overlapping a high-water window is cut off;
 * - 'unknown' otherwise: part of the lineup is not decided because the tide times do not cover
 *   it (no events close enough before and after it for the rule's windows to be known).
 * Also returns the reachable parts of the lineup, the reachable interval holding its start and the
 * time the tide cuts the spot off (see {@link LineupTideStatus}).
 *
 * @param rule a tide rule
 * @param events high and low waters, any order
 * @param start lineup start (UTC)
 * @param end lineup end (UTC), not before `start`
 * @throws RangeError on an invalid rule, event or date, or `end` before `start`
 */
export function lineupTideStatus(rule: TideRule, events: readonly TideEvent[], start: Date, end: Date): LineupTideStatus {
  assertValidDate(start, 'start');
  assertValidDate(end, 'end');
  return lineupTideStatusFromAccess(tideAccess(rule, events), start, end);
}
