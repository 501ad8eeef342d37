/**
 * The sky outlook in watches: the "at most N % cloud" condition of a reminder, and whether a newer
 * outlook differs enough from the one sent to warrant a "still clear?" update.
 *
 * The condition is judged on the window's mean total cloud cover (the number the badge is made
 * from). Only a complete forecast decides it: with no forecast yet, a forecast that ends inside the
 * window, or the service unavailable, the answer is 'unknown' and the watch decides what to do.
 *
 * "Changed a lot" (common practice; the limits are our own, on the okta scale, one okta = 12.5 %):
 * the mean cloud cover moved by at least {@link OUTLOOK_CHANGE_MEAN_CLOUD_PCT} percentage points
 * (two oktas), or the badge changed and the mean moved by at least
 * {@link OUTLOOK_CHANGE_WITH_BADGE_PCT} points (so 24 % and 26 % either side of the 'clear' limit do
 * not count). Only two forecasts can differ a lot: a first forecast after "no forecast yet", or an
 * outage, is not a change in the sky.
 */
import { assertFiniteInRange } from '../guards';
import type { CloudBadge, SkyOutlook } from '../schemas/outlook';

/** A change of mean cloud cover that counts as a lot on its own, percentage points (two oktas; common practice). */
export const OUTLOOK_CHANGE_MEAN_CLOUD_PCT = 25;
/** A change of mean cloud cover that counts as a lot when the badge changed too, percentage points (common practice). */
export const OUTLOOK_CHANGE_WITH_BADGE_PCT = 15;

/** Whether an outlook meets a watch's cloud condition. */
export type CloudConditionResult = 'met' | 'not-met' | 'unknown';

/**
 * Whether the outlook meets "at most `maxCloudPct` % cloud" (rules in the module notes).
 *
 * @param outlook - the window's sky outlook
 * @param maxCloudPct - the watch's limit on mean total cloud cover, %, 0..100
 * @returns 'met' when a complete forecast's mean is at most the limit, 'not-met' when above it,
 *   'unknown' without a complete forecast
 * @throws RangeError when the limit is not finite or out of 0..100
 */
export function cloudCondition(outlook: SkyOutlook, maxCloudPct: number): CloudConditionResult {
  assertFiniteInRange(maxCloudPct, 'maxCloudPct', 0, 100);
  if (outlook.status !== 'forecast' || !outlook.complete) return 'unknown';
  return outlook.meanCloudPct <= maxCloudPct ? 'met' : 'not-met';
}

/** How a newer outlook of the same window compares with an older one. */
export interface OutlookComparison {
  /** True when the two differ a lot (see the module notes). */
  changedALot: boolean;
  /** Newer mean cloud minus older, percentage points; null unless both are forecasts. */
  meanCloudChangePct: number | null;
  badgeBefore: CloudBadge | null;
  badgeAfter: CloudBadge | null;
}

/**
 * Compares an older and a newer outlook of the same window (rules in the module notes).
 *
 * @param before - the outlook that was sent (or last seen)
 * @param after - the newer outlook
 * @returns the change of mean cloud, the badges, and whether that is a lot
 * @throws RangeError when the two are of different windows
 */
export function compareOutlooks(before: SkyOutlook, after: SkyOutlook): OutlookComparison {
  if (Date.parse(before.start) !== Date.parse(after.start) || Date.parse(before.end) !== Date.parse(after.end)) {
    throw new RangeError('compareOutlooks needs two outlooks of the same window');
  }
  const badgeBefore = before.status === 'forecast' ? before.badge : null;
  const badgeAfter = after.status === 'forecast' ? after.badge : null;
  if (before.status !== 'forecast' || after.status !== 'forecast') {
    return { changedALot: false, meanCloudChangePct: null, badgeBefore, badgeAfter };
  }
  const change = Math.round((after.meanCloudPct - before.meanCloudPct) * 10) / 10;
  const size = Math.abs(change);
  const changedALot = size >= OUTLOOK_CHANGE_MEAN_CLOUD_PCT || (badgeBefore !== badgeAfter && size >= OUTLOOK_CHANGE_WITH_BADGE_PCT);
  return { changedALot, meanCloudChangePct: change, badgeBefore, badgeAfter };
}

/**
 * True when a newer outlook of the window differs a lot from an older one ({@link compareOutlooks}).
 *
 * @param before - the outlook that was sent (or last seen)
 * @param after - the newer outlook
 * @returns whether a "still clear?" update is due
 * @throws RangeError when the two are of different windows
 */
export function outlookChangedALot(before: SkyOutlook, after: SkyOutlook): boolean {
  return compareOutlooks(before, after).changedALot;
}
