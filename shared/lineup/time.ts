/**
 * Time scale used inside the lineup engine: Universal Time as fractional days since the J2000
 * epoch (2000-01-01T12:00:00Z), the same `ut` scale astronomy-engine uses (it equates UTC and UT1).
 */
import { assertValidDate } from '../guards';
import { MS_PER_DAY } from '../units';

/** Unix time in milliseconds of the J2000 epoch, 2000-01-01T12:00:00Z. */
export const J2000_UNIX_MS = Date.UTC(2000, 0, 1, 12, 0, 0);

/** Earliest instant the engine accepts: 1900-01-01T00:00:00Z (as Unix ms). */
export const ENGINE_MIN_UNIX_MS = Date.UTC(1900, 0, 1);

/** Latest instant the engine accepts: 2200-01-01T00:00:00Z (as Unix ms). */
export const ENGINE_MAX_UNIX_MS = Date.UTC(2200, 0, 1);

/** Longest search range in days: ten calendar years (3 leap days at most). */
export const MAX_RANGE_DAYS = 3653;

/**
 * Converts Unix milliseconds to UT days since J2000.
 * @param unixMs - Unix time in ms, finite.
 * @returns UT days since 2000-01-01T12:00Z (negative before it).
 */
export function unixMsToUtDays(unixMs: number): number {
  return (unixMs - J2000_UNIX_MS) / MS_PER_DAY;
}

/**
 * Converts UT days since J2000 to Unix milliseconds.
 * @param utDays - UT days since 2000-01-01T12:00Z, finite.
 * @returns Unix time in ms (fractional ms kept).
 */
export function utDaysToUnixMs(utDays: number): number {
  return utDays * MS_PER_DAY + J2000_UNIX_MS;
}

/**
 * Checks that a Date is valid and inside the engine's span (1900-2200) and returns it as Unix ms.
 * @param date - The instant to check.
 * @param name - Parameter name used in the error message.
 * @throws RangeError when the Date is invalid or outside 1900-01-01..2200-01-01.
 */
export function checkedUnixMs(date: Date, name: string): number {
  const ms = assertValidDate(date, name).getTime();
  if (ms < ENGINE_MIN_UNIX_MS || ms > ENGINE_MAX_UNIX_MS) {
    throw new RangeError(`${name} must lie between 1900-01-01 and 2200-01-01 UTC`);
  }
  return ms;
}

/**
 * Checks a UTC range: both ends valid, `from` before `to`, at most {@link MAX_RANGE_DAYS} long.
 * @returns The range as Unix ms.
 * @throws RangeError on an invalid, reversed or too long range.
 */
export function checkedRange(fromUtc: Date, toUtc: Date): { fromMs: number; toMs: number } {
  const fromMs = checkedUnixMs(fromUtc, 'fromUtc');
  const toMs = checkedUnixMs(toUtc, 'toUtc');
  if (!(toMs > fromMs)) throw new RangeError('toUtc must be after fromUtc');
  if (toMs - fromMs > MAX_RANGE_DAYS * MS_PER_DAY) {
    throw new RangeError(`The range must not exceed ${MAX_RANGE_DAYS} days (ten years)`);
  }
  return { fromMs, toMs };
}
