/**
 * Hourly cloud bars of a lineup window: one bar per forecast hour the outlook used, spanning the
 * part of the window nearest to that hour (the hour h stands for [h - 30 min, h + 30 min), as in
 * ./summary.ts), for a small strip under the night chart.
 */
import { MS_PER_MINUTE } from '../units';
import type { ForecastOutlook } from '../schemas/outlook';

const HALF_HOUR_MS = 30 * MS_PER_MINUTE;

/** One bar: the stretch of the window an hour stands for, and that hour's cloud cover. */
export interface CloudBar {
  /** The forecast hour, ISO UTC. */
  time: string;
  /** The stretch of the window nearest to the hour, Unix ms (start before end). */
  startMs: number;
  endMs: number;
  /** Total cloud cover of the hour, %. */
  cloudPct: number;
  /** Low, mid and high cloud, % (null when the service gave none). */
  lowPct: number | null;
  midPct: number | null;
  highPct: number | null;
  /** Chance of precipitation in the hour before `time`, % (null when none given). */
  precipitationProbabilityPct: number | null;
}

/**
 * The cloud bars of a forecast outlook, in time order. Hours whose stretch misses the window
 * (none should) are left out; stretches never overlap.
 *
 * @param outlook - a 'forecast' outlook (its `hours` are the hours used for the window)
 * @returns the bars, clipped to the window
 * @throws RangeError when the window or an hour's time is not a valid instant, or the end is not after the start
 */
export function cloudBars(outlook: ForecastOutlook): CloudBar[] {
  const windowStart = Date.parse(outlook.start);
  const windowEnd = Date.parse(outlook.end);
  if (!Number.isFinite(windowStart) || !Number.isFinite(windowEnd)) throw new RangeError('outlook start and end must be ISO instants');
  if (windowEnd <= windowStart) throw new RangeError('outlook end must be after its start');
  const bars: CloudBar[] = [];
  for (const hour of outlook.hours) {
    const t = Date.parse(hour.time);
    if (!Number.isFinite(t)) throw new RangeError(`hour time must be an ISO instant (got ${hour.time})`);
    const startMs = Math.max(t - HALF_HOUR_MS, windowStart);
    const endMs = Math.min(t + HALF_HOUR_MS, windowEnd);
    if (endMs <= startMs) continue;
    bars.push({
      time: hour.time,
      startMs,
      endMs,
      cloudPct: hour.cloudCoverPct,
      lowPct: hour.cloudCoverLowPct,
      midPct: hour.cloudCoverMidPct,
      highPct: hour.cloudCoverHighPct,
      precipitationProbabilityPct: hour.precipitationProbabilityPct,
    });
  }
  return bars.sort((a, b) => a.startMs - b.startMs);
}
