/**
 * When a watch's e-mail is due: which night a lineup belongs to, its night of the week, and the
 * lead time that is current at a given instant. Pure functions of their arguments (no clock, no
 * I/O), read in the site's time zone with luxon.
 */
import { DateTime } from 'luxon';
import type { Lineup } from '../../shared/schemas/lineup';
import { assertTimeZone, localDateOf } from '../../shared/sky/timezone';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/** Local hour (site's zone) from which a lead time's e-mail goes out on its day: mornings, not at midnight. */
export const SEND_LOCAL_HOUR = 9;

function assertDate(value: Date, name: string): Date {
  if (!(value instanceof Date) || Number.isNaN(value.getTime())) throw new RangeError(`${name} must be a valid Date`);
  return value;
}

/**
 * The night a lineup belongs to: the local date of its evening, i.e. of the instant 12 h before
 * its start (a lineup at 01:30 belongs to the night that began the evening before).
 * @param lineupStart start of the lineup (UTC)
 * @param timeZone IANA zone of the site
 * @returns local date 'YYYY-MM-DD'
 * @throws RangeError on an invalid date or zone
 */
export function nightOf(lineupStart: Date, timeZone: string): string {
  assertDate(lineupStart, 'lineupStart');
  return localDateOf(new Date(lineupStart.getTime() - 12 * HOUR_MS), timeZone);
}

/**
 * ISO 8601 weekday of a local date: 1 = Monday ... 7 = Sunday.
 * @param date local date 'YYYY-MM-DD'
 * @throws RangeError on a malformed date
 */
export function weekdayOf(date: string): number {
  const dt = DateTime.fromISO(date, { zone: 'UTC' });
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date) || !dt.isValid) throw new RangeError(`date must be YYYY-MM-DD (got ${date})`);
  return dt.weekday;
}

/**
 * When a lead time's e-mail becomes due: {@link SEND_LOCAL_HOUR}:00 local time, `leadDays` days
 * before the night's date (0 = on the day of the night's evening).
 * @param night local date of the night 'YYYY-MM-DD'
 * @param leadDays whole days, 0..366
 * @param timeZone IANA zone of the site
 * @returns the instant (UTC)
 * @throws RangeError on a malformed date, zone or lead
 */
export function leadDueAt(night: string, leadDays: number, timeZone: string): Date {
  if (!Number.isInteger(leadDays) || leadDays < 0 || leadDays > 366) throw new RangeError('leadDays must be a whole number 0..366');
  assertTimeZone(timeZone);
  weekdayOf(night);
  const due = DateTime.fromISO(`${night}T${String(SEND_LOCAL_HOUR).padStart(2, '0')}:00:00`, { zone: timeZone }).minus({ days: leadDays });
  return due.toJSDate();
}

/**
 * The lead time whose e-mail is current for a lineup at `now`: the shortest lead whose due time has
 * come, while the lineup has not begun. A longer lead that was missed (the scheduler was off) is
 * superseded by a shorter one that is due, so a late scan sends one e-mail, not several.
 * @param lineupStart start of the lineup (UTC)
 * @param leads lead times, days (any order)
 * @param timeZone IANA zone of the site
 * @param now the current instant
 * @returns the lead in days, or undefined when none is due or the lineup has begun
 * @throws RangeError on invalid arguments
 */
export function currentLead(lineupStart: Date, leads: readonly number[], timeZone: string, now: Date): number | undefined {
  assertDate(now, 'now');
  if (now.getTime() >= assertDate(lineupStart, 'lineupStart').getTime()) return undefined;
  const night = nightOf(lineupStart, timeZone);
  const due = leads.filter((lead) => leadDueAt(night, lead, timeZone).getTime() <= now.getTime());
  return due.length ? Math.min(...due) : undefined;
}

/**
 * The search range a scan uses for leads up to `maxLeadDays`: from the UTC midnight before the
 * previous day (so a lineup in progress is found whole, never clipped at the range start) to
 * whole UTC days after the longest lead's lineups (a lead is due at most maxLead + 2 days before
 * its lineup starts).
 * @param now the current instant
 * @param maxLeadDays longest lead time, days
 */
export function scanRange(now: Date, maxLeadDays: number): { from: Date; to: Date } {
  assertDate(now, 'now');
  const dayStart = Math.floor(now.getTime() / DAY_MS) * DAY_MS;
  return { from: new Date(dayStart - DAY_MS), to: new Date(dayStart + (maxLeadDays + 4) * DAY_MS) };
}

/** The conditions of a watch that a found lineup must meet. */
export interface WatchConditions {
  minScore: number;
  minDurationMin: number;
  reachableOnly: boolean;
  weekdays: readonly number[];
}

/**
 * Whether a lineup meets a watch's conditions: score, duration, tide status (with reachableOnly,
 * only 'reachable' passes: a sightline without a tide rule has no status and never matches) and
 * the night of the week (of the night's evening, site's zone).
 * @param lineup a lineup of the search answer
 * @param watch the watch's conditions
 * @param timeZone IANA zone of the site
 */
export function lineupMatchesWatch(lineup: Lineup, watch: WatchConditions, timeZone: string): boolean {
  if (lineup.score < watch.minScore || lineup.durationMin < watch.minDurationMin) return false;
  if (watch.reachableOnly && lineup.tideStatus !== 'reachable') return false;
  return watch.weekdays.includes(weekdayOf(nightOf(new Date(lineup.start), timeZone)));
}

/**
 * The lineup start a delivery is keyed by: rounded to the whole minute, so that the key does not
 * depend on sub-second differences between searches over different ranges.
 */
export function deliveryLineupStart(lineup: Pick<Lineup, 'start'>): Date {
  return new Date(Math.round(Date.parse(lineup.start) / 60_000) * 60_000);
}
