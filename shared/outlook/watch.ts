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

/** Why a watch sends, or holds back, an e-mail whose lead time is due (see {@link watchOutlookDecision}). */
export type WatchOutlookReason =
  /** The watch sets no cloud limit: the outlook is shown, never decides. */
  | 'no-limit'
  /** A complete forecast is within the limit. */
  | 'met'
  /** No complete forecast (beyond the horizon, the service down or slow): sent, saying so. */
  | 'unknown'
  /** Cloudier than the limit: held back (the next scan asks again while the lead is current). */
  | 'not-met'
  /** Cloudier than the limit, but the on-the-day e-mail tells of a big change since the last one. */
  | 'changed';

/** What a watch does with the sky outlook of an e-mail that is due. */
export interface WatchOutlookDecision {
  /** Whether the e-mail goes now. */
  send: boolean;
  reason: WatchOutlookReason;
  /** The watch's condition; null when it sets no cloud limit. */
  condition: CloudConditionResult | null;
  /** The outlook against the one in the last e-mail sent for this lineup; null without one. */
  change: OutlookComparison | null;
  /** True when the outlook changed a lot since that e-mail: the e-mail says so ("still clear?"). */
  changedALot: boolean;
}

/**
 * Whether a watch's e-mail that is due goes out, given the sky outlook of its lineup window.
 *
 * - No cloud limit: it goes ('no-limit').
 * - A limit and a complete forecast within it: it goes ('met').
 * - A limit but no complete forecast (no forecast yet, the service down or slow): it goes and
 *   says the outlook is unknown ('unknown'), so a forecast failure never costs a reminder.
 * - A limit the forecast exceeds: held back ('not-met'), except the on-the-day e-mail (lead 0)
 *   when an earlier e-mail was sent for the lineup and the outlook changed a lot since
 *   ({@link outlookChangedALot}): that one goes as the "still clear?" update ('changed'), since
 *   whoever was told of a clear sky should hear that it clouded over.
 *
 * The earlier e-mail may have been for the same lineup found a few minutes off (the sightline was
 * nudged); its outlook is compared as if of this window.
 *
 * @param input.maxCloudPct - the watch's limit, % 0..100, or null for none
 * @param input.outlook - the outlook of the lineup window now
 * @param input.leadDays - the due lead time, whole days 0..366 (0 = on the day)
 * @param input.previous - the outlook in the last e-mail sent for this lineup, or null
 * @returns whether to send, why, and how the outlook compares with the earlier e-mail's
 * @throws RangeError when the limit or the lead time is out of range
 */
export function watchOutlookDecision(input: {
  maxCloudPct: number | null;
  outlook: SkyOutlook;
  leadDays: number;
  previous: SkyOutlook | null;
}): WatchOutlookDecision {
  const { maxCloudPct, outlook, leadDays, previous } = input;
  if (!Number.isInteger(leadDays) || leadDays < 0 || leadDays > 366) throw new RangeError(`leadDays must be an integer between 0 and 366 (got ${leadDays})`);
  const condition = maxCloudPct === null ? null : cloudCondition(outlook, maxCloudPct);
  const change = previous ? compareOutlooks({ ...previous, start: outlook.start, end: outlook.end }, outlook) : null;
  const changedALot = change?.changedALot ?? false;
  const decided = (send: boolean, reason: WatchOutlookReason): WatchOutlookDecision => ({ send, reason, condition, change, changedALot });
  if (condition === null) return decided(true, 'no-limit');
  if (condition === 'met') return decided(true, 'met');
  if (condition === 'unknown') return decided(true, 'unknown');
  if (leadDays === 0 && changedALot) return decided(true, 'changed');
  return decided(false, 'not-met');
}
