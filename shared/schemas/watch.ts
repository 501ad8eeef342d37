import { z } from 'zod';
import { targetRefSchema } from './lineup';

/**
 * Watches: "tell me when this sightline lines up". A watch names a saved sightline, a target and
 * conditions; the server scans for its coming lineups and sends one e-mail per lineup and lead
 * time, and lists them in the owner's calendar feed.
 */

/** Nights of the week as ISO 8601 weekday numbers: 1 = Monday ... 7 = Sunday. */
export const WEEKDAYS = [1, 2, 3, 4, 5, 6, 7] as const;
export const weekdayNames = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'] as const;

/** Largest lead time, days before the night. */
export const MAX_LEAD_DAYS = 30;
/** Most lead times on one watch. */
export const MAX_LEAD_TIMES = 4;

export const DEFAULT_WATCH_MIN_SCORE = 0.3;
export const DEFAULT_WATCH_MIN_DURATION_MIN = 5;
export const DEFAULT_LEAD_DAYS: readonly number[] = [3, 0];

const weekdaysSchema = z.array(
  z.number({ error: 'A night of the week is a number 1 (Monday) to 7 (Sunday)' }).int().min(1, 'Nights of the week are 1 (Monday) to 7 (Sunday)').max(7, 'Nights of the week are 1 (Monday) to 7 (Sunday)'),
  { error: 'Give the nights of the week as a list of numbers 1 (Monday) to 7 (Sunday)' },
)
  .min(1, 'Allow at least one night of the week')
  .refine((days) => new Set(days).size === days.length, { message: 'Each night of the week once' })
  .transform((days) => [...days].sort((a, b) => a - b));

const leadDaysSchema = z.array(
  z.number({ error: 'A lead time is a whole number of days' }).int('A lead time is a whole number of days').min(0, 'A lead time is 0 (on the day) or more days before').max(MAX_LEAD_DAYS, `A lead time is at most ${MAX_LEAD_DAYS} days`),
  { error: 'Give the lead times as a list of days before the night, e.g. [3, 0]' },
)
  .min(1, 'Give at least one lead time')
  .max(MAX_LEAD_TIMES, `At most ${MAX_LEAD_TIMES} lead times`)
  .refine((days) => new Set(days).size === days.length, { message: 'Each lead time once' })
  .transform((days) => [...days].sort((a, b) => b - a));

const minScoreSchema = z.number({ error: 'Minimum score is a number from 0 to 1' }).finite().min(0, 'Minimum score is from 0 to 1').max(1, 'Minimum score is from 0 to 1');
const minDurationSchema = z.number({ error: 'Minimum duration is a number of minutes' }).finite().min(0, 'Minimum duration is 0 to 1440 minutes').max(1440, 'Minimum duration is 0 to 1440 minutes');
const MAX_CLOUD_MESSAGE = 'The cloud limit is a whole percentage from 0 to 100';
/** At most this much cloud (mean total cloud cover over the lineup window, %), or null for no limit. */
const maxCloudSchema = z.number({ error: MAX_CLOUD_MESSAGE }).int(MAX_CLOUD_MESSAGE).min(0, MAX_CLOUD_MESSAGE).max(100, MAX_CLOUD_MESSAGE).nullable();

/** The conditions a watch's lineups must meet (beyond a dark sky: Sun below -18 deg and the Moon down). */
const watchConditionShape = {
  /** Lowest lineup score, 0..1. */
  minScore: minScoreSchema,
  /** Shortest lineup, minutes. */
  minDurationMin: minDurationSchema,
  /** Only lineups whose tide status is 'reachable' (sightlines with a tide rule; others never match). */
  reachableOnly: z.boolean({ error: 'Say true or false' }),
  /** Allowed nights, ISO weekday of the night's evening in the site's time zone, sorted. */
  weekdays: weekdaysSchema,
  /** Days before the night's evening to send the e-mail (0 = on the day), sorted largest first. */
  leadDays: leadDaysSchema,
  paused: z.boolean({ error: 'Say true or false' }),
  /**
   * Send only when the sky outlook's mean total cloud cover over the lineup window is at most
   * this, % 0..100 (null: no limit). Without a usable forecast (beyond the horizon, service down)
   * the e-mail is sent anyway and says the outlook is unknown; see shared/outlook/watch.ts.
   */
  maxCloudPct: maxCloudSchema,
};

/** POST /api/watches */
export const watchInputSchema = z.strictObject({
  sightlineId: z.uuid({ error: 'Choose a saved sightline' }),
  /** Same shape as the lineup search's target; default: the sightline's usual target. */
  target: targetRefSchema.optional(),
  minScore: watchConditionShape.minScore.default(DEFAULT_WATCH_MIN_SCORE),
  minDurationMin: watchConditionShape.minDurationMin.default(DEFAULT_WATCH_MIN_DURATION_MIN),
  reachableOnly: watchConditionShape.reachableOnly.default(false),
  weekdays: watchConditionShape.weekdays.default([...WEEKDAYS]),
  leadDays: watchConditionShape.leadDays.default([...DEFAULT_LEAD_DAYS]),
  paused: watchConditionShape.paused.default(false),
  maxCloudPct: watchConditionShape.maxCloudPct.default(null),
});
export type WatchInput = z.infer<typeof watchInputSchema>;
/** What a client sends (defaults optional). */
export type WatchInputBody = z.input<typeof watchInputSchema>;

/** PATCH /api/watches/:id: any of the fields (pause is `{ paused: true }`); the sightline stays. */
export const watchUpdateSchema = z.strictObject({
  target: targetRefSchema.optional(),
  minScore: watchConditionShape.minScore.optional(),
  minDurationMin: watchConditionShape.minDurationMin.optional(),
  reachableOnly: watchConditionShape.reachableOnly.optional(),
  weekdays: watchConditionShape.weekdays.optional(),
  leadDays: watchConditionShape.leadDays.optional(),
  paused: watchConditionShape.paused.optional(),
  /** null removes the limit. */
  maxCloudPct: watchConditionShape.maxCloudPct.optional(),
}).refine((v) => Object.values(v).some((x) => x !== undefined), { message: 'Nothing to change', path: ['_'] });
export type WatchUpdate = z.infer<typeof watchUpdateSchema>;
export type WatchUpdateBody = z.input<typeof watchUpdateSchema>;

/** A watch as the API returns it. */
export const watchSchema = z.object({
  id: z.uuid(),
  ownerId: z.uuid(),
  sightlineId: z.uuid(),
  sightlineName: z.string(),
  /** IANA time zone of the sightline: weekdays and lead times are read in it. */
  timezone: z.string(),
  target: targetRefSchema,
  targetName: z.string(),
  minScore: z.number(),
  minDurationMin: z.number(),
  reachableOnly: z.boolean(),
  weekdays: z.array(z.number().int().min(1).max(7)),
  leadDays: z.array(z.number().int().min(0)),
  paused: z.boolean(),
  /** Cloud limit of the reminders, % (mean total cloud over the lineup window); null: none. */
  maxCloudPct: z.number().int().min(0).max(100).nullable(),
  /** When the last e-mail of this watch went out (ISO), null before the first. */
  lastSentAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Watch = z.infer<typeof watchSchema>;

export const watchResponseSchema = z.object({ watch: watchSchema });
export const watchListResponseSchema = z.object({ watches: z.array(watchSchema) });

/** GET /api/watches?sightlineId=... lists the watches of one sightline only. */
export const watchListQuerySchema = z.object({
  sightlineId: z.uuid({ error: 'Not a valid sightline id' }).optional(),
});

/** State of one e-mail of a watch: one per lineup and lead time. */
export const watchDeliveryStatuses = ['pending', 'sending', 'sent', 'failed', 'skipped'] as const;
export type WatchDeliveryStatus = (typeof watchDeliveryStatuses)[number];

export const watchDeliverySchema = z.object({
  id: z.uuid(),
  watchId: z.uuid(),
  /** Start of the lineup (ISO UTC, whole minute). */
  lineupStart: z.string(),
  leadDays: z.number().int(),
  /**
   * pending: waiting for the sender; sending: claimed by a sender; sent: accepted by the SMTP server;
   * failed: gave up after the retries; skipped: the lineup began before it could be sent.
   */
  status: z.enum(watchDeliveryStatuses),
  attempts: z.number().int(),
  sentAt: z.string().nullable(),
  /** Message-ID header of the e-mail (deterministic per delivery). */
  messageId: z.string(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
});
export type WatchDelivery = z.infer<typeof watchDeliverySchema>;
/** GET /api/watches/:id/deliveries: newest first. */
export const watchDeliveryListResponseSchema = z.object({ deliveries: z.array(watchDeliverySchema) });

/** GET /api/watches/unsubscribe?token=... and POST /api/watches/unsubscribe { token } (also ?token=). */
export const unsubscribeRequestSchema = z.object({
  token: z.string({ error: 'The link has no token' }).trim().min(1, 'The link has no token').max(2000, 'The token is too long'),
});

/** What an unsubscribe link shows before and after it is used (no sign-in needed). */
export const unsubscribeStateSchema = z.object({
  watch: z.object({
    id: z.uuid(),
    sightlineName: z.string(),
    targetName: z.string(),
    paused: z.boolean(),
  }),
  /** True once this link has been used (it works once). */
  used: z.boolean(),
  usedAt: z.string().nullable(),
});
export type UnsubscribeState = z.infer<typeof unsubscribeStateSchema>;
/** POST answers 200 with the new state; a second use answers 409 with code 'conflict'. */
export const unsubscribeResponseSchema = unsubscribeStateSchema;

/** GET /api/calendar/feed and POST /api/calendar/feed/rotate: the signed-in user's secret feed. */
export const calendarFeedSchema = z.object({
  /** Full https/http address to give a calendar app (contains the secret). */
  url: z.string(),
  /** Since when this secret works (ISO). */
  createdAt: z.string(),
});
export type CalendarFeed = z.infer<typeof calendarFeedSchema>;
export const calendarFeedResponseSchema = z.object({ feed: calendarFeedSchema });
