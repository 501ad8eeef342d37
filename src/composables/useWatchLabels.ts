import { WEEKDAYS, weekdayNames, type Watch, type WatchDeliveryStatus } from '../../shared/schemas/watch';
import { durationText } from './useLineupTime';

/** One lead time in words: 0 is 'on the day', 1 'one day before', n 'n days before'. */
export function leadDayLabel(days: number): string {
  if (days === 0) return 'on the day';
  return days === 1 ? '1 day before' : `${days} days before`;
}

/** Lead times largest first, e.g. '3 days before, on the day'. */
export function leadTimesText(leadDays: readonly number[]): string {
  return [...leadDays].sort((a, b) => b - a).map(leadDayLabel).join(', ');
}

/** Nights of the week allowed: 'Every night', or 'Fri, Sat' (ISO weekday of the evening). */
export function weekdaysText(weekdays: readonly number[]): string {
  const set = new Set(weekdays);
  if (WEEKDAYS.every((d) => set.has(d))) return 'Every night';
  return WEEKDAYS.filter((d) => set.has(d)).map((d) => weekdayNames[d - 1]).join(', ');
}

/** A score 0..1 as a whole percentage, '30 %'. */
export function percentText(score: number): string {
  return `${Math.round(score * 100)} %`;
}

/** The conditions of a watch as short parts, for a table cell. */
export function conditionParts(w: Pick<Watch, 'minScore' | 'minDurationMin' | 'reachableOnly' | 'weekdays'> & Partial<Pick<Watch, 'maxCloudPct'>>): string[] {
  const parts = [`score ≥ ${percentText(w.minScore)}`, `≥ ${durationText(w.minDurationMin)}`];
  if (w.reachableOnly) parts.push('reachable by the tide only');
  if (w.maxCloudPct !== null && w.maxCloudPct !== undefined) parts.push(`cloud ≤ ${w.maxCloudPct} %`);
  parts.push(weekdaysText(w.weekdays));
  return parts;
}

/** Words and tag type for the state of one e-mail. */
export const DELIVERY_STATUS: Record<WatchDeliveryStatus, { label: string; type: 'default' | 'info' | 'success' | 'warning' | 'error' }> = {
  pending: { label: 'Waiting', type: 'info' },
  sending: { label: 'Sending', type: 'info' },
  sent: { label: 'Sent', type: 'success' },
  failed: { label: 'Failed', type: 'error' },
  skipped: { label: 'Skipped', type: 'warning' },
};
