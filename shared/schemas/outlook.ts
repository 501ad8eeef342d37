import { z } from 'zod';
import { isoInstantSchema } from './lineup';
import { latitudeSchema, longitudeSchema } from './geometry';

/**
 * The sky outlook: an hourly forecast as Gnomon keeps it (whatever service it came from), and the
 * per-window summary shown beside a lineup. Units are in the field names: Pct (percent 0..100),
 * Ms (metres per second), C (degrees Celsius). Instants are ISO 8601 UTC strings.
 */

/** Most hours one forecast holds: 16 days and a spare day. */
export const MAX_FORECAST_HOURS = 17 * 24;
/** Most lineup windows asked for in one outlook request. */
export const MAX_OUTLOOK_WINDOWS = 100;
/** Longest lineup window an outlook is made for, hours (a lineup lies within one night). */
export const MAX_OUTLOOK_WINDOW_HOURS = 48;

const percentSchema = z.number().finite().min(0).max(100);
/** Wind and gusts at 10 m, m/s: 0 up to well beyond any measured surface gust (113 m/s). */
const windSchema = z.number().finite().min(0).max(150);
/** Air temperature and dew point at 2 m, deg C, within the range ever measured near the surface. */
const airTemperatureSchema = z.number().finite().min(-95).max(65);

/**
 * One forecast hour. The service's values are instants at `time` (cloud, humidity, temperature,
 * wind), except precipitation probability and gusts, which describe the hour before `time`.
 * Only total cloud cover is always present; every other field is null when the service gave none.
 */
export const forecastHourSchema = z.object({
  time: z.iso.datetime({ offset: false }),
  cloudCoverPct: percentSchema,
  cloudCoverLowPct: percentSchema.nullable(),
  cloudCoverMidPct: percentSchema.nullable(),
  cloudCoverHighPct: percentSchema.nullable(),
  precipitationProbabilityPct: percentSchema.nullable(),
  windSpeedMs: windSchema.nullable(),
  windGustsMs: windSchema.nullable(),
  relativeHumidityPct: percentSchema.nullable(),
  temperatureC: airTemperatureSchema.nullable(),
  dewPointC: airTemperatureSchema.nullable(),
});
export type ForecastHour = z.infer<typeof forecastHourSchema>;

/**
 * An hourly forecast for one forecast cell (see `forecastCell` in shared/outlook): hours sorted by
 * time, one hour apart or more (gaps are hours the service gave no cloud cover for).
 * `issuedAt` is when the forecast was made as far as Gnomon knows it: the model run when the
 * service names it, otherwise the time it was fetched (never later than `fetchedAt`).
 */
export const hourlyForecastSchema = z.object({
  lat: latitudeSchema,
  lon: longitudeSchema,
  issuedAt: z.iso.datetime({ offset: false }),
  fetchedAt: z.iso.datetime({ offset: false }),
  hours: z.array(forecastHourSchema).max(MAX_FORECAST_HOURS),
});
export type HourlyForecast = z.infer<typeof hourlyForecastSchema>;

/** The badge of a window: see `cloudBadge` in shared/outlook for the thresholds. */
export const cloudBadges = ['clear', 'mixed', 'cloudy'] as const;
export type CloudBadge = (typeof cloudBadges)[number];

/** Dew risk on the lens over a window: see `dewRiskOfHour` in shared/outlook for the rule. */
export const dewRisks = ['low', 'moderate', 'high', 'unknown'] as const;
export type DewRisk = (typeof dewRisks)[number];

/** What an outlook can say about a window. */
export const outlookStatuses = ['forecast', 'no-forecast-yet', 'past', 'unavailable'] as const;
export type OutlookStatus = (typeof outlookStatuses)[number];

const windowFields = {
  /** The lineup window, ISO UTC. */
  start: z.iso.datetime({ offset: false }),
  end: z.iso.datetime({ offset: false }),
};

/** A window the forecast covers (wholly, or in part when `complete` is false). */
export const forecastOutlookSchema = z.object({
  status: z.literal('forecast'),
  ...windowFields,
  issuedAt: z.iso.datetime({ offset: false }),
  /** Forecast hours used for the window (the hours nearest its instants). */
  hoursCovered: z.number().int().min(1),
  /** Hours the window spans on the hourly grid; more than hoursCovered when the forecast ends inside it. */
  hoursInWindow: z.number().int().min(1),
  complete: z.boolean(),
  meanCloudPct: percentSchema,
  maxCloudPct: percentSchema,
  badge: z.enum(cloudBadges),
  dewRisk: z.enum(dewRisks),
  /** Smallest temperature minus dew point over the window, deg C; null without temperature and humidity. */
  minDewPointSpreadC: z.number().finite().nullable(),
  maxRelativeHumidityPct: percentSchema.nullable(),
  maxPrecipitationProbabilityPct: percentSchema.nullable(),
  maxWindSpeedMs: windSchema.nullable(),
  maxWindGustsMs: windSchema.nullable(),
  /** The hours used, for cloud bars with the numbers on hover. */
  hours: z.array(forecastHourSchema),
});
export type ForecastOutlook = z.infer<typeof forecastOutlookSchema>;

/** The window starts after the last forecast hour: say "no forecast yet" rather than guess. */
export const noForecastYetOutlookSchema = z.object({
  status: z.literal('no-forecast-yet'),
  ...windowFields,
  /** When the forecast was made; null when none was fetched (the window is beyond any forecast's reach). */
  issuedAt: z.iso.datetime({ offset: false }).nullable(),
  /** The last forecast hour (null when the forecast held no hours). */
  horizonEnd: z.iso.datetime({ offset: false }).nullable(),
});

/** The window ended before the forecast's first hour. */
export const pastOutlookSchema = z.object({
  status: z.literal('past'),
  ...windowFields,
});

/** The forecast service failed or is not configured; the planner goes on without it. */
export const unavailableOutlookSchema = z.object({
  status: z.literal('unavailable'),
  ...windowFields,
  message: z.string(),
});

/** The sky outlook of one lineup window. */
export const skyOutlookSchema = z.discriminatedUnion('status', [
  forecastOutlookSchema,
  noForecastYetOutlookSchema,
  pastOutlookSchema,
  unavailableOutlookSchema,
]);
export type SkyOutlook = z.infer<typeof skyOutlookSchema>;

/** Adds an issue at `path` unless `end` is after `start` by at most MAX_OUTLOOK_WINDOW_HOURS. */
function checkWindowSpan(start: unknown, end: unknown, ctx: z.RefinementCtx, path: string): void {
  // Instants that failed their own check are reported there.
  if (!(start instanceof Date) || !(end instanceof Date)) return;
  const spanMs = end.getTime() - start.getTime();
  if (spanMs <= 0) ctx.addIssue({ code: 'custom', path: [path], message: 'The end must be after the start' });
  else if (spanMs > MAX_OUTLOOK_WINDOW_HOURS * 3_600_000) {
    ctx.addIssue({ code: 'custom', path: [path], message: `A window is at most ${MAX_OUTLOOK_WINDOW_HOURS} hours long` });
  }
}

/** A lineup window in a request: ISO instants (a date alone is midnight UTC), end after start. */
export const outlookWindowSchema = z.object({
  start: isoInstantSchema,
  end: isoInstantSchema,
}).superRefine((w, ctx) => checkWindowSpan(w.start, w.end, ctx, 'end'));
export type OutlookWindow = z.infer<typeof outlookWindowSchema>;

/**
 * POST /api/outlook: the outlook of lineup windows at a saved sightline's vantage (read access
 * needed) or at a typed vantage position.
 */
export const outlookRequestSchema = z.object({
  sightlineId: z.uuid({ error: 'Not a valid sightline id' }).optional(),
  vantage: z.object({ lat: latitudeSchema, lon: longitudeSchema }).optional(),
  windows: z.array(outlookWindowSchema, { error: 'Give the windows as a list' })
    .min(1, 'Give at least one window')
    .max(MAX_OUTLOOK_WINDOWS, `At most ${MAX_OUTLOOK_WINDOWS} windows at once`),
}).superRefine((r, ctx) => {
  if (!r.sightlineId && !r.vantage) ctx.addIssue({ code: 'custom', path: ['sightlineId'], message: 'Give a sightline or a vantage position' });
  if (r.sightlineId && r.vantage) ctx.addIssue({ code: 'custom', path: ['vantage'], message: 'Give a sightline or a vantage position, not both' });
});
export type OutlookRequest = z.infer<typeof outlookRequestSchema>;
/** What a client sends (instants as strings). */
export type OutlookRequestBody = z.input<typeof outlookRequestSchema>;

/** GET /api/sightlines/:id/outlook?from=&to=: one window. */
export const sightlineOutlookQuerySchema = z.object({
  from: isoInstantSchema,
  to: isoInstantSchema,
}).superRefine((q, ctx) => checkWindowSpan(q.from, q.to, ctx, 'to'));

/** The answer of both outlook routes: one outlook per window, in the order asked, and the caution. */
export const outlookResponseSchema = z.object({
  outlooks: z.array(skyOutlookSchema),
  caution: z.string(),
});
export type OutlookResponse = z.infer<typeof outlookResponseSchema>;
