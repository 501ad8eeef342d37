/**
 * The sky outlook of a lineup window from an hourly forecast.
 *
 * Which hours a window uses: each forecast hour h stands for the instants nearest to it,
 * [h - 30 min, h + 30 min). A window [start, end] uses every hour whose stretch overlaps it for
 * some time, and each hour counts in the mean cloud cover by the length of that overlap (so a
 * 22:10-23:40 window weighs 22:00 by 20 min, 23:00 by 60 min and 00:00 by 10 min). The maximum
 * is over the same hours, unweighted.
 *
 * Badge thresholds (common practice; the limits are our own, set on the okta scale that weather
 * reports use for cloud amount, one okta = 12.5 %): 'clear' when the mean is at most 25 % (two
 * oktas, "few" clouds) and no hour is over 50 %; 'cloudy' when the mean is at least 62.5 % (five
 * oktas, "broken" or overcast); 'mixed' in between.
 *
 * A forecast covers its first hour - 30 min to its last hour + 30 min. A window starting at or
 * after that end gets 'no-forecast-yet'; one ending at or before that start gets 'past'. A window
 * that runs past the horizon is summarised on the hours there are, with `complete: false`.
 */
import { assertFiniteInRange, assertValidDate, parseOrThrow } from '../guards';
import { MS_PER_HOUR, MS_PER_MINUTE } from '../units';
import {
  hourlyForecastSchema,
  type CloudBadge,
  type DewRisk,
  type ForecastHour,
  type ForecastOutlook,
  type HourlyForecast,
  type SkyOutlook,
} from '../schemas/outlook';
import { dewRiskOfHour, worseDewRisk } from './dew';

/** Highest mean total cloud cover of a 'clear' window, % (two oktas; common practice). */
export const CLEAR_MAX_MEAN_CLOUD_PCT = 25;
/** Highest total cloud cover of any one hour in a 'clear' window, % (common practice). */
export const CLEAR_MAX_HOUR_CLOUD_PCT = 50;
/** Lowest mean total cloud cover of a 'cloudy' window, % (five oktas; common practice). */
export const CLOUDY_MIN_MEAN_CLOUD_PCT = 62.5;

/** Half the hourly step: each forecast hour stands for the instants this close to it. */
const HALF_HOUR_MS = 30 * MS_PER_MINUTE;

/** A lineup window, UTC instants, end after start. */
export interface TimeWindow {
  start: Date;
  end: Date;
}

/**
 * The badge for a window's cloud cover (thresholds in the module notes; common practice).
 *
 * @param meanCloudPct - mean total cloud cover over the window, %, 0..100
 * @param maxCloudPct - highest total cloud cover of any hour used, %, at least the mean and at most 100
 * @returns 'clear', 'mixed' or 'cloudy'
 * @throws RangeError when a value is not finite, out of 0..100, or the maximum is below the mean
 */
export function cloudBadge(meanCloudPct: number, maxCloudPct: number): CloudBadge {
  assertFiniteInRange(meanCloudPct, 'meanCloudPct', 0, 100);
  assertFiniteInRange(maxCloudPct, 'maxCloudPct', 0, 100);
  // Rounding in the mean may put it a hair above the maximum.
  if (maxCloudPct < meanCloudPct - 1e-9) throw new RangeError(`maxCloudPct must be at least meanCloudPct (got ${maxCloudPct} < ${meanCloudPct})`);
  if (meanCloudPct >= CLOUDY_MIN_MEAN_CLOUD_PCT) return 'cloudy';
  if (meanCloudPct <= CLEAR_MAX_MEAN_CLOUD_PCT && maxCloudPct <= CLEAR_MAX_HOUR_CLOUD_PCT) return 'clear';
  return 'mixed';
}

/** An hour on the hourly grid and how long the window spends nearest to it, ms. */
interface GridHour {
  timeMs: number;
  weightMs: number;
}

/** The hours of the hourly grid a window uses, with their weights (see the module notes). */
function gridHoursOf(startMs: number, endMs: number): GridHour[] {
  const hours: GridHour[] = [];
  const first = Math.floor((startMs + HALF_HOUR_MS) / MS_PER_HOUR) * MS_PER_HOUR;
  for (let h = first - MS_PER_HOUR; h <= endMs + HALF_HOUR_MS; h += MS_PER_HOUR) {
    const overlapMs = Math.min(h + HALF_HOUR_MS, endMs) - Math.max(h - HALF_HOUR_MS, startMs);
    if (overlapMs > 0) hours.push({ timeMs: h, weightMs: overlapMs });
  }
  return hours;
}

/** Rounds to one decimal, for percentages and degrees shown to people. */
function round1(value: number): number {
  return Math.round(value * 10) / 10;
}

function maxOf(values: (number | null)[]): number | null {
  let best: number | null = null;
  for (const v of values) if (v !== null && (best === null || v > best)) best = v;
  return best;
}

/**
 * Checks a list of lineup windows: each a pair of valid Dates with the end after the start.
 *
 * @param windows - the windows to check
 * @throws RangeError naming the first bad window
 */
export function assertTimeWindows(windows: readonly TimeWindow[]): void {
  if (!Array.isArray(windows)) throw new RangeError('windows must be a list');
  windows.forEach((window, index) => {
    assertValidDate(window?.start, `windows[${index}].start`);
    assertValidDate(window?.end, `windows[${index}].end`);
    if (window.end.getTime() <= window.start.getTime()) throw new RangeError(`windows[${index}].end must be after its start`);
  });
}

function summarizeWindow(forecast: HourlyForecast, byTime: Map<number, ForecastHour>, window: TimeWindow): SkyOutlook {
  const startMs = window.start.getTime();
  const endMs = window.end.getTime();
  const base = { start: window.start.toISOString(), end: window.end.toISOString() };
  const first = forecast.hours[0];
  const last = forecast.hours[forecast.hours.length - 1];
  if (!first || !last) return { status: 'no-forecast-yet', ...base, issuedAt: forecast.issuedAt, horizonEnd: null };
  if (startMs >= Date.parse(last.time) + HALF_HOUR_MS) {
    return { status: 'no-forecast-yet', ...base, issuedAt: forecast.issuedAt, horizonEnd: last.time };
  }
  if (endMs <= Date.parse(first.time) - HALF_HOUR_MS) return { status: 'past', ...base };

  const grid = gridHoursOf(startMs, endMs);
  const used: { hour: ForecastHour; weightMs: number }[] = [];
  for (const g of grid) {
    const hour = byTime.get(g.timeMs);
    if (hour) used.push({ hour, weightMs: g.weightMs });
  }
  if (used.length === 0) {
    return { status: 'unavailable', ...base, message: 'The forecast has no cloud cover for this window' };
  }

  let weighted = 0;
  let weights = 0;
  let maxCloud = 0;
  let dewRisk: DewRisk = 'unknown';
  let minSpread: number | null = null;
  for (const { hour, weightMs } of used) {
    weighted += hour.cloudCoverPct * weightMs;
    weights += weightMs;
    maxCloud = Math.max(maxCloud, hour.cloudCoverPct);
    const dew = dewRiskOfHour(hour);
    dewRisk = worseDewRisk(dewRisk, dew.risk);
    if (dew.spreadC !== null && (minSpread === null || dew.spreadC < minSpread)) minSpread = dew.spreadC;
  }
  const mean = Math.min(weighted / weights, maxCloud);
  const hours = used.map((u) => u.hour);
  const outlook: ForecastOutlook = {
    status: 'forecast',
    ...base,
    issuedAt: forecast.issuedAt,
    hoursCovered: used.length,
    hoursInWindow: grid.length,
    complete: used.length === grid.length,
    meanCloudPct: round1(mean),
    maxCloudPct: round1(maxCloud),
    badge: cloudBadge(mean, maxCloud),
    dewRisk,
    minDewPointSpreadC: minSpread === null ? null : round1(minSpread),
    maxRelativeHumidityPct: maxOf(hours.map((h) => h.relativeHumidityPct)),
    maxPrecipitationProbabilityPct: maxOf(hours.map((h) => h.precipitationProbabilityPct)),
    maxWindSpeedMs: maxOf(hours.map((h) => h.windSpeedMs)),
    maxWindGustsMs: maxOf(hours.map((h) => h.windGustsMs)),
    hours,
  };
  return outlook;
}

/**
 * The sky outlook of each window from one hourly forecast (rules in the module notes).
 *
 * @param forecast - the hourly forecast of the vantage's cell (checked against its schema; hours
 *   must be on whole UTC hours, sorted, without repeats)
 * @param windows - lineup windows, each end after its start
 * @returns one outlook per window, in the same order: 'forecast', 'no-forecast-yet', 'past', or
 *   'unavailable' when the forecast has a gap over the whole window
 * @throws RangeError when the forecast does not fit its schema or its hours, or a window is invalid
 */
export function summarizeOutlooks(forecast: HourlyForecast, windows: readonly TimeWindow[]): SkyOutlook[] {
  const checked = parseOrThrow('hourly forecast', hourlyForecastSchema, forecast);
  const byTime = new Map<number, ForecastHour>();
  let previous = -Infinity;
  checked.hours.forEach((hour, i) => {
    const t = Date.parse(hour.time);
    if (t % MS_PER_HOUR !== 0) throw new RangeError(`hours[${i}].time must be on a whole UTC hour (got ${hour.time})`);
    if (t <= previous) throw new RangeError(`hours[${i}].time must be after the hour before it (got ${hour.time})`);
    previous = t;
    byTime.set(t, hour);
  });
  assertTimeWindows(windows);
  return windows.map((w) => summarizeWindow(checked, byTime, w));
}

/**
 * The sky outlook of one window: {@link summarizeOutlooks} for a single window.
 *
 * @param forecast - the hourly forecast of the vantage's cell
 * @param window - the lineup window, end after start
 * @returns the window's outlook
 * @throws RangeError as {@link summarizeOutlooks}
 */
export function summarizeOutlook(forecast: HourlyForecast, window: TimeWindow): SkyOutlook {
  return summarizeOutlooks(forecast, [window])[0]!;
}

/**
 * The outlook of windows when no forecast could be had (service down, slow or not configured).
 *
 * @param windows - lineup windows, each end after its start
 * @param message - what to tell people, e.g. "The forecast service did not answer"
 * @returns one 'unavailable' outlook per window
 * @throws RangeError when a window is invalid
 */
export function unavailableOutlooks(windows: readonly TimeWindow[], message: string): SkyOutlook[] {
  assertTimeWindows(windows);
  return windows.map((w) => ({ status: 'unavailable', start: w.start.toISOString(), end: w.end.toISOString(), message }));
}
