/**
 * How far ahead a sky outlook can be had, and which lineup windows are worth asking about.
 *
 * The forecast service gives hourly values from 00:00 UTC of the current day for
 * {@link FORECAST_HORIZON_DAYS} days (its documented maximum, which is what the server asks for).
 * The reach used here is the server's (server/forecast/forecast-service.ts): from 23:30 UTC the
 * day before (the first hour stands for the half hour either side of it) to 00:00 UTC
 * FORECAST_HORIZON_DAYS days after today. A window starting at or after that end has no forecast
 * yet, and the server answers 'no-forecast-yet' without asking the service; one that ended before
 * now is over.
 */
import { assertValidDate } from '../guards';
import { MS_PER_DAY, MS_PER_MINUTE } from '../units';
import { assertTimeWindows, type TimeWindow } from './summary';

/** Forecast days the server asks the service for (the service's documented maximum). */
export const FORECAST_HORIZON_DAYS = 16;

const HALF_HOUR_MS = 30 * MS_PER_MINUTE;

/** The stretch of time a forecast fetched at some instant can cover, Unix ms. */
export interface ForecastReach {
  startMs: number;
  endMs: number;
}

/**
 * The stretch a forecast fetched at `now` covers: 23:30 UTC the day before to 00:00 UTC
 * {@link FORECAST_HORIZON_DAYS} days after today.
 *
 * @param now - the current instant
 * @returns start and end, Unix ms
 * @throws RangeError when `now` is not a valid Date
 */
export function forecastReach(now: Date): ForecastReach {
  assertValidDate(now, 'now');
  const dayStart = Math.floor(now.getTime() / MS_PER_DAY) * MS_PER_DAY;
  return { startMs: dayStart - HALF_HOUR_MS, endMs: dayStart + FORECAST_HORIZON_DAYS * MS_PER_DAY };
}

/** Where a lineup window stands against the forecast's reach. */
export type WindowReach = 'within' | 'beyond' | 'over';

/**
 * Sorts lineup windows by the forecast's reach at `now`: 'within' (worth asking the server),
 * 'beyond' (starts at or after the reach's end: "no forecast yet") or 'over' (ended at or before
 * `now`). A window running when `now` falls inside it is 'within'.
 *
 * @param windows - lineup windows, each end after its start
 * @param now - the current instant
 * @returns one verdict per window, in order
 * @throws RangeError when `now` or a window is invalid
 */
export function windowReach(windows: readonly TimeWindow[], now: Date): WindowReach[] {
  const reach = forecastReach(now);
  assertTimeWindows(windows);
  const nowMs = now.getTime();
  return windows.map((w) => {
    if (w.end.getTime() <= nowMs) return 'over';
    if (w.start.getTime() >= reach.endMs) return 'beyond';
    return 'within';
  });
}
