/**
 * The year view: twelve months of nights, each with the best lineup score of the night and
 * whether the night has any astronomical darkness at all. Nights are local (noon to noon in the
 * site's zone), named by the date of their evening.
 */
import { DateTime } from 'luxon';
import { assertFiniteInRange, assertValidDate } from '../sky/guards';
import { assertLocalDate, assertTimeZone, nightSpanUtc } from '../sky/timezone';
import type { MsInterval } from './intervals';
import { nightDateOf } from './localTime';

/** Most months a year view may show. */
export const MAX_YEAR_VIEW_MONTHS = 24;

const MONTH_RE = /^(\d{4})-(\d{2})$/;

/** One night of the year view. */
export interface YearNight {
  /** Local date of the evening, 'YYYY-MM-DD'. */
  date: string;
  /** Day of the month, 1..31. */
  day: number;
  /** ISO weekday of the evening, 1 (Monday) .. 7 (Sunday). */
  weekday: number;
  /** Best lineup score of the night, 0..1, or null when the night has no lineup. */
  bestScore: number | null;
  /** Number of lineups in the night. */
  lineupCount: number;
  /** False when the Sun stays above the darkness limit all night; null when not known. */
  hasDarkness: boolean | null;
}

/** One month row of the year view. */
export interface YearMonth {
  year: number;
  /** 1..12. */
  month: number;
  /** 'YYYY-MM'. */
  key: string;
  nights: YearNight[];
}

/**
 * Checks a month 'YYYY-MM' (years 1900..2200) and returns its year and month.
 * @throws RangeError on a malformed month
 */
export function parseMonth(month: string): { year: number; month: number } {
  if (typeof month !== 'string') throw new RangeError('month must be a string YYYY-MM');
  const m = MONTH_RE.exec(month);
  if (!m) throw new RangeError(`month must be YYYY-MM (got ${month})`);
  const year = Number(m[1]);
  const mon = Number(m[2]);
  if (year < 1900 || year > 2200 || mon < 1 || mon > 12) throw new RangeError(`month must be a real month in 1900..2200 (got ${month})`);
  return { year, month: mon };
}

function checkMonths(months: number): number {
  if (!Number.isInteger(months) || months < 1 || months > MAX_YEAR_VIEW_MONTHS) {
    throw new RangeError(`months must be an integer 1..${MAX_YEAR_VIEW_MONTHS} (got ${months})`);
  }
  return months;
}

/**
 * The local dates of the nights of `months` months from `startMonth`, grouped by month.
 * @param startMonth - first month 'YYYY-MM'
 * @param months - number of months, integer 1..24 (default 12)
 * @throws RangeError on invalid input
 */
export function monthsOfNights(startMonth: string, months = 12): Array<{ year: number; month: number; key: string; dates: string[] }> {
  const first = parseMonth(startMonth);
  checkMonths(months);
  const out: Array<{ year: number; month: number; key: string; dates: string[] }> = [];
  let dt = DateTime.fromObject({ year: first.year, month: first.month, day: 1 }, { zone: 'UTC' });
  for (let i = 0; i < months; i++, dt = dt.plus({ months: 1 })) {
    const dates: string[] = [];
    for (let d = dt; d.month === dt.month; d = d.plus({ days: 1 })) dates.push(d.toISODate()!);
    out.push({ year: dt.year, month: dt.month, key: dt.toFormat('yyyy-MM'), dates });
  }
  return out;
}

/**
 * The UTC span covered by a year view: local noon of the first date to local noon after the last
 * date (the first night's start to the last night's end).
 * @param startMonth - first month 'YYYY-MM'
 * @param months - integer 1..24 (default 12)
 * @param timeZone - IANA zone of the site
 * @throws RangeError on invalid input
 */
export function yearViewRange(startMonth: string, months: number, timeZone: string): { from: Date; to: Date } {
  const all = monthsOfNights(startMonth, months);
  const firstDate = all[0]!.dates[0]!;
  const lastMonth = all[all.length - 1]!;
  const lastDate = lastMonth.dates[lastMonth.dates.length - 1]!;
  return { from: nightSpanUtc(firstDate, timeZone).start, to: nightSpanUtc(lastDate, timeZone).end };
}

/**
 * Best score and number of lineups per night.
 * @param lineups - lineups with their start (ISO instant or Date) and score 0..1
 * @param timeZone - IANA zone of the site
 * @returns night date 'YYYY-MM-DD' -> best score and count
 * @throws RangeError on an invalid start, score or zone
 */
export function bestScoresByNight(
  lineups: ReadonlyArray<{ start: string | Date; score: number }>,
  timeZone: string,
): Map<string, { bestScore: number; count: number }> {
  assertTimeZone(timeZone);
  const out = new Map<string, { bestScore: number; count: number }>();
  lineups.forEach((l, i) => {
    const start = l.start instanceof Date ? l.start : new Date(l.start);
    assertValidDate(start, `lineups[${i}].start`);
    const score = assertFiniteInRange(l.score, `lineups[${i}].score`, 0, 1);
    const date = nightDateOf(start, timeZone);
    const seen = out.get(date);
    if (seen) {
      seen.bestScore = Math.max(seen.bestScore, score);
      seen.count += 1;
    } else out.set(date, { bestScore: score, count: 1 });
  });
  return out;
}

/**
 * Which nights have any darkness: a night (local noon to noon) has darkness when a window of
 * `windows` overlaps it by more than an instant.
 * @param windows - dark windows, Unix ms, each start <= end (e.g. computeDarkWindows' windows, with
 *   the Moon ignored for plain astronomical darkness)
 * @param dates - local dates 'YYYY-MM-DD'
 * @param timeZone - IANA zone of the site
 * @returns the dates that have darkness
 * @throws RangeError on an invalid window, date or zone
 */
export function nightsWithDarkness(windows: readonly MsInterval[], dates: readonly string[], timeZone: string): Set<string> {
  assertTimeZone(timeZone);
  windows.forEach((w, i) => {
    assertFiniteInRange(w?.startMs, `windows[${i}].startMs`);
    assertFiniteInRange(w.endMs, `windows[${i}].endMs`, w.startMs);
  });
  const sorted = [...windows].sort((a, b) => a.startMs - b.startMs);
  const out = new Set<string>();
  for (const date of dates) {
    // nightSpanUtc's span (local noon to local noon), without checking the zone again per date.
    assertLocalDate(date);
    const noon = DateTime.fromISO(`${date}T12:00:00`, { zone: timeZone });
    const from = noon.toMillis();
    const to = noon.plus({ days: 1 }).toMillis();
    // Binary search for the first window ending after the night starts.
    let lo = 0;
    let hi = sorted.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (sorted[mid]!.endMs <= from) lo = mid + 1;
      else hi = mid;
    }
    const w = sorted[lo];
    if (w && w.startMs < to && w.endMs > from) out.add(date);
  }
  return out;
}

/** ISO weekday (1 Monday .. 7 Sunday) of a checked calendar date 'YYYY-MM-DD'. */
function isoWeekday(date: string): number {
  const day = new Date(Date.UTC(Number(date.slice(0, 4)), Number(date.slice(5, 7)) - 1, Number(date.slice(8, 10)))).getUTCDay();
  return day === 0 ? 7 : day;
}

/** What {@link yearHeatmap} is built from. */
export interface YearHeatmapInput {
  /** First month 'YYYY-MM'. */
  startMonth: string;
  /** Number of months, integer 1..24 (default 12). */
  months?: number;
  /** IANA zone of the site. */
  timeZone: string;
  /** The lineups found over the year (start ISO instant or Date, score 0..1). */
  lineups: ReadonlyArray<{ start: string | Date; score: number }>;
  /** Windows of astronomical darkness over the year, Unix ms; omit when not known. */
  darkness?: readonly MsInterval[];
}

/**
 * The months and nights of a year view with each night's best score and darkness.
 * @throws RangeError on invalid input
 */
export function yearHeatmap(input: YearHeatmapInput): YearMonth[] {
  const timeZone = assertTimeZone(input.timeZone);
  const months = monthsOfNights(input.startMonth, input.months ?? 12);
  const scores = bestScoresByNight(input.lineups, timeZone);
  const allDates = months.flatMap((m) => m.dates);
  const dark = input.darkness ? nightsWithDarkness(input.darkness, allDates, timeZone) : null;
  return months.map((m) => ({
    year: m.year,
    month: m.month,
    key: m.key,
    nights: m.dates.map((date) => {
      const s = scores.get(date);
      return {
        date,
        day: Number(date.slice(8, 10)),
        weekday: isoWeekday(date),
        bestScore: s?.bestScore ?? null,
        lineupCount: s?.count ?? 0,
        hasDarkness: dark ? dark.has(date) : null,
      };
    }),
  }));
}
