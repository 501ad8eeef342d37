/**
 * Local clock readings for chart axes and labels: everything in the site's IANA zone, whatever the
 * zone of the machine drawing the chart.
 */
import { DateTime } from 'luxon';
import { assertFiniteInRange, assertValidDate } from '../sky/guards';
import { assertTimeZone, toLocalInstant } from '../sky/timezone';

/** Local hour at and after which an instant belongs to the night starting that evening (noon). */
export const NIGHT_STARTS_AT_LOCAL_HOUR = 12;

const MS_PER_HOUR = 3_600_000;

/**
 * The night an instant belongs to, as the local date of its evening: from local noon of a date to
 * local noon of the next (the span of shared/sky's nightReport). 01:30 on 4 May is in the night of
 * 3 May.
 * @param instant - a valid Date
 * @param timeZone - IANA zone of the site
 * @returns 'YYYY-MM-DD'
 * @throws RangeError on an invalid date or zone
 */
export function nightDateOf(instant: Date, timeZone: string): string {
  assertValidDate(instant, 'instant');
  assertTimeZone(timeZone);
  let dt = DateTime.fromJSDate(instant, { zone: timeZone });
  if (dt.hour < NIGHT_STARTS_AT_LOCAL_HOUR) dt = dt.minus({ days: 1 });
  return dt.toISODate() ?? '';
}

/**
 * Local clock time 'HH:mm' (24 h), rounded to the nearest minute.
 * @param instant - a valid Date
 * @param timeZone - IANA zone
 * @throws RangeError on an invalid date or zone
 */
export function localClock(instant: Date, timeZone: string): string {
  assertValidDate(instant, 'instant');
  assertTimeZone(timeZone);
  const ms = Math.round(instant.getTime() / 60_000) * 60_000;
  return DateTime.fromMillis(ms, { zone: timeZone }).toFormat('HH:mm');
}

/**
 * Short zone label at an instant ('GMT', 'BST', 'CEST', 'GMT+3' ...), as shared/sky names it.
 * @throws RangeError on an invalid date or zone
 */
export function zoneLabelAt(instant: Date, timeZone: string): string {
  return toLocalInstant(instant, timeZone).zoneLabel;
}

/** A tick on a time axis at a full local hour. */
export interface HourTick {
  /** Instant, Unix ms. */
  atMs: number;
  /** Local hour 0..23. */
  hour: number;
  /** 'HH:00'. */
  label: string;
}

/**
 * The full local hours within [startMs, endMs] whose hour is a multiple of `everyHours`, in
 * time order. Across a daylight-saving change an hour label may repeat or be skipped, as the
 * site's clocks do.
 * @param startMs - start, Unix ms, finite
 * @param endMs - end, Unix ms, finite, after start, at most 7 days later
 * @param timeZone - IANA zone
 * @param everyHours - 1, 2, 3, 4, 6 or 12 (default 1)
 * @throws RangeError on invalid input
 */
export function localHourTicks(startMs: number, endMs: number, timeZone: string, everyHours = 1): HourTick[] {
  assertFiniteInRange(startMs, 'startMs');
  assertFiniteInRange(endMs, 'endMs', startMs, startMs + 7 * 24 * MS_PER_HOUR);
  assertTimeZone(timeZone);
  if (![1, 2, 3, 4, 6, 12].includes(everyHours)) throw new RangeError(`everyHours must be 1, 2, 3, 4, 6 or 12 (got ${everyHours})`);
  const ticks: HourTick[] = [];
  let dt = DateTime.fromMillis(startMs, { zone: timeZone }).startOf('hour');
  if (dt.toMillis() < startMs) dt = dt.plus({ hours: 1 });
  for (; dt.toMillis() <= endMs; dt = dt.plus({ hours: 1 })) {
    if (dt.hour % everyHours === 0) ticks.push({ atMs: dt.toMillis(), hour: dt.hour, label: dt.toFormat('HH:00') });
  }
  return ticks;
}
