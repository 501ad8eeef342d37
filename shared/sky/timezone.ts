/**
 * Time zones of sites: the IANA zone for a coordinate (tz-lookup), the checks of zone names and
 * local calendar dates that every module uses (the tide-times parser too), and local-time
 * conversions (luxon), so every sky event can be shown in the site's own clock time.
 */
import { DateTime, IANAZone } from 'luxon';
import tzLookup from 'tz-lookup';
import { assertFiniteInRange, assertValidDate } from '../guards';
import { MS_PER_MINUTE, MS_PER_SECOND } from '../units';

/** An instant with its site's zone: the UTC Date plus the local reading of it. */
export interface LocalInstant {
  /** The instant (a JS Date is always UTC inside). */
  utc: Date;
  /** IANA zone of the site, e.g. 'Europe/Dublin'. */
  timeZone: string;
  /** Local time in ISO 8601 with the UTC offset, rounded to the second, e.g. '2027-05-20T01:18:22+01:00'. */
  local: string;
  /**
   * Short zone label at that instant as the ICU data names it in an English locale, e.g. 'IST',
   * 'BST', 'EDT', 'AEST'; 'GMT+3' style when no locale has an abbreviation.
   */
  zoneLabel: string;
}

/** A local calendar date, 'YYYY-MM-DD'. */
export type LocalDateString = string;

const LOCAL_DATE_RE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * English locales tried in turn for a zone abbreviation: ICU names a zone (e.g. 'IST' for
 * Europe/Dublin, 'AEST' for Australia/Sydney) only in the locale of its own country.
 */
const LABEL_LOCALES = ['en-US', 'en-GB', 'en-IE', 'en-CA', 'en-AU', 'en-NZ', 'en-IN', 'en-ZA'];
const GMT_OFFSET_LABEL_RE = /^(GMT|UTC)([+-]\d|$)/;

function zoneLabel(dt: DateTime): string {
  let fallback: string | null = null;
  for (const locale of LABEL_LOCALES) {
    const label = dt.setLocale(locale).offsetNameShort;
    if (label === null) continue;
    if (!GMT_OFFSET_LABEL_RE.test(label) || dt.offset === 0) return label;
    fallback ??= label;
  }
  return fallback ?? dt.toFormat('ZZ');
}

/**
 * IANA time zone for a coordinate (tz-lookup; open sea gets an 'Etc/GMT±h' zone).
 * @param lat latitude, degrees, -90..90
 * @param lon longitude, degrees east positive, -180..180
 * @returns IANA zone name
 * @throws RangeError on NaN or out-of-range input
 */
export function timeZoneForSite(lat: number, lon: number): string {
  assertFiniteInRange(lat, 'lat', -90, 90);
  assertFiniteInRange(lon, 'lon', -180, 180);
  return tzLookup(lat, lon);
}

/**
 * Zone names already found valid: luxon's check builds an Intl formatter each time (about 0.2 ms),
 * which would dominate parsing a long tide table. Bounded (there are about 600 IANA names).
 */
const knownValidZones = new Set<string>();
const MAX_CACHED_ZONES = 1000;

/**
 * Whether `timeZone` is an IANA zone name known to the runtime's time-zone data (e.g.
 * 'Europe/London', 'UTC', 'Etc/GMT-3'). luxon's other zone specifiers ('local', 'system',
 * 'UTC+3') are not IANA names and are not accepted: a site's clock is never the machine's own.
 * @param timeZone the value to check
 * @returns true for a known IANA zone name
 */
export function isValidTimeZone(timeZone: unknown): timeZone is string {
  if (typeof timeZone !== 'string' || timeZone.length === 0) return false;
  if (knownValidZones.has(timeZone)) return true;
  const valid = IANAZone.isValidZone(timeZone);
  if (valid && knownValidZones.size < MAX_CACHED_ZONES) knownValidZones.add(timeZone);
  return valid;
}

/**
 * Checks an IANA zone name (see {@link isValidTimeZone}) and returns it.
 * @param timeZone the value to check
 * @returns the zone name
 * @throws RangeError when it is not a known IANA zone name
 */
export function assertTimeZone(timeZone: unknown): string {
  if (!isValidTimeZone(timeZone)) {
    throw new RangeError(`timeZone must be a valid IANA zone (got ${String(timeZone)})`);
  }
  return timeZone;
}

/**
 * Whether year/month/day name a real calendar date (proleptic Gregorian), e.g. not 2027-02-30.
 * @param year 1..9999 (0 is accepted as 1 BC); month 1..12; day 1..31
 * @returns true for a date on the calendar
 */
export function isCalendarDate(year: number, month: number, day: number): boolean {
  if (![year, month, day].every(Number.isInteger) || month < 1 || month > 12 || day < 1) return false;
  const d = new Date(Date.UTC(2000, month - 1, day));
  d.setUTCFullYear(year);
  return d.getUTCMonth() === month - 1 && d.getUTCDate() === day;
}

/**
 * Checks a local date string 'YYYY-MM-DD' (a real calendar date) and returns it.
 * @throws RangeError on a malformed or impossible date
 */
export function assertLocalDate(date: unknown): LocalDateString {
  if (typeof date !== 'string') throw new RangeError('date must be a string YYYY-MM-DD');
  const m = LOCAL_DATE_RE.exec(date);
  if (!m) throw new RangeError(`date must be YYYY-MM-DD (got ${date})`);
  if (!isCalendarDate(Number(m[1]), Number(m[2]), Number(m[3]))) throw new RangeError(`date is not a calendar date (got ${date})`);
  return date;
}

/**
 * The local reading of an instant in a zone.
 * @param utc instant
 * @param timeZone IANA zone
 * @returns the instant, the zone, local ISO 8601 time with offset (seconds) and a short zone label
 * @throws RangeError on an invalid date or zone
 */
export function toLocalInstant(utc: Date, timeZone: string): LocalInstant {
  assertValidDate(utc, 'utc');
  assertTimeZone(timeZone);
  const dt = DateTime.fromMillis(Math.round(utc.getTime() / MS_PER_SECOND) * MS_PER_SECOND, { zone: timeZone });
  return {
    utc: new Date(utc.getTime()),
    timeZone,
    local: dt.toISO({ suppressMilliseconds: true, includeOffset: true }) ?? '',
    zoneLabel: zoneLabel(dt),
  };
}

/**
 * A human-readable local time with its zone label, e.g. '2027-05-20 01:18 IST', rounded to the
 * nearest minute (or second with `withSeconds`).
 * @param utc instant
 * @param timeZone IANA zone
 * @param withSeconds show seconds (default false)
 * @throws RangeError on an invalid date or zone
 */
export function formatLocalTime(utc: Date, timeZone: string, withSeconds = false): string {
  assertValidDate(utc, 'utc');
  assertTimeZone(timeZone);
  const unitMs = withSeconds ? MS_PER_SECOND : MS_PER_MINUTE;
  const dt = DateTime.fromMillis(Math.round(utc.getTime() / unitMs) * unitMs, { zone: timeZone });
  return `${dt.toFormat(withSeconds ? 'yyyy-MM-dd HH:mm:ss' : 'yyyy-MM-dd HH:mm')} ${zoneLabel(dt)}`;
}

/**
 * The local calendar date of an instant in a zone, 'YYYY-MM-DD'.
 * @throws RangeError on an invalid date or zone
 */
export function localDateOf(utc: Date, timeZone: string): LocalDateString {
  assertValidDate(utc, 'utc');
  assertTimeZone(timeZone);
  return DateTime.fromJSDate(utc, { zone: timeZone }).toISODate() ?? '';
}

/**
 * The UTC span of the night that starts on the evening of a local date: from local noon of that
 * date to local noon of the next date (23, 24 or 25 hours across a daylight-saving change).
 * @param date local date 'YYYY-MM-DD'
 * @param timeZone IANA zone
 * @returns start and end instants (UTC Dates)
 * @throws RangeError on a malformed date or unknown zone
 */
export function nightSpanUtc(date: LocalDateString, timeZone: string): { start: Date; end: Date } {
  assertLocalDate(date);
  assertTimeZone(timeZone);
  const noon = DateTime.fromISO(`${date}T12:00:00`, { zone: timeZone });
  const nextNoon = noon.plus({ days: 1 });
  return { start: noon.toJSDate(), end: nextNoon.toJSDate() };
}

/**
 * Local midnight at the end of a local date (00:00 of the next date) as a UTC instant.
 * @param date local date 'YYYY-MM-DD'
 * @param timeZone IANA zone
 * @throws RangeError on a malformed date or unknown zone
 */
export function localMidnightAfter(date: LocalDateString, timeZone: string): Date {
  assertLocalDate(date);
  assertTimeZone(timeZone);
  return DateTime.fromISO(`${date}T00:00:00`, { zone: timeZone }).plus({ days: 1 }).toJSDate();
}
