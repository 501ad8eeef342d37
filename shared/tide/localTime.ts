/**
 * Reading a local wall-clock time in an IANA zone as a UTC instant, telling apart the three cases
 * a daylight-saving change creates: a time that exists once, a time that does not exist (clocks go
 * forward over it) and a time that exists twice (clocks go back over it).
 *
 * Own code on top of luxon's zone data: luxon's DateTime.fromObject silently moves a nonexistent
 * time forward and picks one of the two readings of an ambiguous time without saying so, and the
 * tide-times parser has to report both cases per line.
 */
import { IANAZone } from 'luxon';
import { assertIntegerInRange } from '../guards';
import { assertTimeZone, isCalendarDate } from '../sky/timezone';
import { MS_PER_DAY, MS_PER_MINUTE } from '../units';

/** A local calendar date and wall-clock time (second resolution). */
export interface LocalWallTime {
  /** Year, 1..9999. */
  year: number;
  /** Month, 1..12. */
  month: number;
  /** Day of the month, 1..31 (and valid for the month). */
  day: number;
  /** Hour, 0..23. */
  hour: number;
  /** Minute, 0..59. */
  minute: number;
  /** Second, 0..59. */
  second: number;
}

/** How a local wall time maps to UTC in a zone. */
export type LocalTimeResolution =
  | { kind: 'unique'; utcMs: number }
  | { kind: 'ambiguous'; earlierUtcMs: number; laterUtcMs: number }
  | { kind: 'nonexistent' };

/**
 * Resolves a local wall time in `timeZone` to UTC.
 *
 * The candidate UTC offsets are the zone's offsets one day before and one day after the wall time
 * (read as if it were UTC); a candidate offset is kept when the zone really has that offset at the
 * instant it gives. No kept offset: the time does not exist; two: it is ambiguous (earlier and
 * later instants returned). This assumes at most one offset change within about two days, which
 * holds for real zones' daylight-saving rules.
 *
 * @param wall local date and time; fields in the ranges of {@link LocalWallTime}
 * @param timeZone IANA zone name
 * @throws RangeError on an unknown zone, a field out of range or a date not on the calendar
 */
export function resolveLocalTime(wall: LocalWallTime, timeZone: string): LocalTimeResolution {
  assertTimeZone(timeZone);
  assertIntegerInRange(wall.year, 'year', 1, 9999);
  assertIntegerInRange(wall.month, 'month', 1, 12);
  assertIntegerInRange(wall.day, 'day', 1, 31);
  assertIntegerInRange(wall.hour, 'hour', 0, 23);
  assertIntegerInRange(wall.minute, 'minute', 0, 59);
  assertIntegerInRange(wall.second, 'second', 0, 59);
  if (!isCalendarDate(wall.year, wall.month, wall.day)) {
    throw new RangeError(`${wall.year}-${wall.month}-${wall.day} is not a calendar date`);
  }

  const asUtc = new Date(Date.UTC(2000, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second));
  asUtc.setUTCFullYear(wall.year);
  const wallMs = asUtc.getTime();

  const zone = IANAZone.create(timeZone);
  const candidateOffsetsMin = new Set([zone.offset(wallMs - MS_PER_DAY), zone.offset(wallMs + MS_PER_DAY)]);
  const instants: number[] = [];
  for (const offsetMin of candidateOffsetsMin) {
    const utcMs = wallMs - offsetMin * MS_PER_MINUTE;
    if (zone.offset(utcMs) === offsetMin) instants.push(utcMs);
  }
  instants.sort((a, b) => a - b);

  const [first, second] = instants;
  if (first === undefined) return { kind: 'nonexistent' };
  if (second === undefined) return { kind: 'unique', utcMs: first };
  return { kind: 'ambiguous', earlierUtcMs: first, laterUtcMs: second };
}
