import { DateTime } from 'luxon';
import { localClock, nightDateOf, zoneLabelAt } from '../../shared/chart';

/**
 * A night by its evening and the morning after: 'Mon 3/4 May 2027', 'Sat 31 Jul/1 Aug 2027'
 * (calendar dates, no zone involved).
 */
export function nightLabel(date: string): string {
  const evening = DateTime.fromISO(date, { zone: 'UTC' });
  const morning = evening.plus({ days: 1 });
  if (morning.month === evening.month) return `${evening.toFormat('ccc d')}/${morning.toFormat('d LLL yyyy')}`;
  if (morning.year === evening.year) return `${evening.toFormat('ccc d LLL')}/${morning.toFormat('d LLL yyyy')}`;
  return `${evening.toFormat('ccc d LLL yyyy')}/${morning.toFormat('d LLL yyyy')}`;
}

/** 'HH:mm' in the site zone for an ISO instant. */
export function clockOf(iso: string | Date, timeZone: string): string {
  return localClock(iso instanceof Date ? iso : new Date(iso), timeZone);
}

/** Zone abbreviation at an ISO instant in the site zone ('BST'). */
export function zoneOf(iso: string | Date, timeZone: string): string {
  return zoneLabelAt(iso instanceof Date ? iso : new Date(iso), timeZone);
}

/** The night (local date of its evening) of an ISO instant. */
export function nightOf(iso: string | Date, timeZone: string): string {
  return nightDateOf(iso instanceof Date ? iso : new Date(iso), timeZone);
}

/** 'Europe/London (GMT)': the zone with its label now, for headers. */
export function zoneHeading(timeZone: string, at: Date = new Date()): string {
  return `${timeZone} (${zoneLabelAt(at, timeZone)})`;
}

/** Duration in minutes as '1 h 05 min' or '42 min'. */
export function durationText(minutes: number): string {
  const m = Math.round(minutes);
  if (m < 60) return `${m} min`;
  return `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min`;
}

/** The browser's own IANA zone, for times that belong to no site (e-mails received, feed made). */
export function browserZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}
