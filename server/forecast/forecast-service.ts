/**
 * The sky outlook of lineup windows at a position: the cell's forecast from PostgreSQL while it is
 * fresh, else one fetch from the forecast service shared by every request for that cell.
 *
 * The newest forecast of a cell is also kept in memory (up to 500 cells), so a page view within the
 * hour reads neither the service nor the database.
 *
 * Intervals:
 * - A stored forecast is reused for {@link FORECAST_REFRESH_INTERVAL_MS} (1 h) after it was
 *   fetched. The service blends national models whose runs arrive every 1 to 6 hours (its
 *   documentation lists hourly updates for the fastest of them), so asking a cell more often than
 *   hourly cannot bring a newer run; page views never reach the service, only the first lookup of
 *   a cell after the hour does.
 * - After a failed fetch the cell is not asked again for {@link FORECAST_FAILURE_BACKOFF_MS}
 *   (5 min): a service that is down or hanging costs one timeout per cell, not one per page.
 * - Meanwhile, and whenever a refetch fails, a stored forecast up to
 *   {@link FORECAST_MAX_STALE_MS} (12 h) old is used; the outlook carries its issue time, so the
 *   page can say how old it is. Older than that, or with none stored, the outlook is 'unavailable'.
 * - Windows that start beyond any forecast's reach (16 days from 00:00 UTC today) or ended before
 *   it starts never cause a fetch.
 */
import type { HourlyForecast, SkyOutlook } from '../../shared/schemas/outlook';
import { assertTimeWindows, forecastCell, summarizeOutlooks, type ForecastCell, type TimeWindow } from '../../shared/outlook';
import { MS_PER_DAY, MS_PER_HOUR, MS_PER_MINUTE } from '../../shared/units';
import type { UserModel } from '../models/user';
import type { SightlineService } from '../services/sightline-service';
import type { ForecastSource } from './client';
import { ForecastUnavailableError } from './errors';
import { ForecastStore, type StoredForecast } from './forecast-store';
import { FORECAST_DAYS } from './open-meteo';

/** How long a fetched forecast is reused before the service is asked again, ms (1 h). */
export const FORECAST_REFRESH_INTERVAL_MS = MS_PER_HOUR;
/** How long a cell is left alone after a failed fetch, ms (5 min). */
export const FORECAST_FAILURE_BACKOFF_MS = 5 * MS_PER_MINUTE;
/** Oldest stored forecast used when the service fails, ms (12 h). */
export const FORECAST_MAX_STALE_MS = 12 * MS_PER_HOUR;
/** Rows of a cell kept after a newer fetch, ms (1 day), for comparisons; older ones are deleted. */
export const FORECAST_KEEP_HISTORY_MS = MS_PER_DAY;

const HALF_HOUR_MS = 30 * MS_PER_MINUTE;
/** Cells whose newest forecast is also kept in memory, on top of PostgreSQL. */
const MEMORY_CELLS = 500;

export interface ForecastServiceOptions {
  /** The forecast service client; null when none is configured (every outlook is 'unavailable'). */
  source: ForecastSource | null;
  /** For the sightline outlooks (read access check). */
  sightlines?: SightlineService;
  /** The clock (tests give their own; the client should share it). */
  now?: () => Date;
  refreshIntervalMs?: number;
  failureBackoffMs?: number;
  maxStaleMs?: number;
  /** Where failed fetches are reported (default console.warn). */
  log?: (message: string) => void;
}

/** A forecast lookup: the forecast, and whether it is older than the refresh interval. */
export interface ForecastLookup extends StoredForecast {
  stale: boolean;
}

interface Failure {
  at: number;
  error: ForecastUnavailableError;
}

/** The sky outlook use cases: forecasts per cell, cached; outlooks per window that never throw on service failure. */
export class ForecastService {
  private readonly store = new ForecastStore();
  private readonly inFlight = new Map<string, Promise<ForecastLookup>>();
  private readonly failures = new Map<string, Failure>();
  /** The newest forecast per cell this process has seen, so fresh page views skip the database. */
  private readonly memory = new Map<string, StoredForecast>();
  private readonly source: ForecastSource | null;
  private readonly sightlines?: SightlineService;
  private readonly now: () => Date;
  private readonly refreshIntervalMs: number;
  private readonly failureBackoffMs: number;
  private readonly maxStaleMs: number;
  private readonly log: (message: string) => void;

  constructor(options: ForecastServiceOptions) {
    this.source = options.source;
    this.sightlines = options.sightlines;
    this.now = options.now ?? (() => new Date());
    this.refreshIntervalMs = options.refreshIntervalMs ?? FORECAST_REFRESH_INTERVAL_MS;
    this.failureBackoffMs = options.failureBackoffMs ?? FORECAST_FAILURE_BACKOFF_MS;
    this.maxStaleMs = options.maxStaleMs ?? FORECAST_MAX_STALE_MS;
    this.log = options.log ?? ((message) => console.warn(message));
  }

  /**
   * The forecast of the cell holding (lat, lon): stored and fresh, else fetched (one fetch per cell
   * at a time, shared by concurrent callers), else a stored one up to the stale limit.
   *
   * @throws ForecastUnavailableError when there is no usable forecast
   * @throws RangeError when the position is out of range
   */
  async forecastFor(lat: number, lon: number): Promise<ForecastLookup> {
    const cell = forecastCell(lat, lon);
    const running = this.inFlight.get(cell.key);
    if (running) return running;
    const lookup = this.lookup(cell).finally(() => { this.inFlight.delete(cell.key); });
    this.inFlight.set(cell.key, lookup);
    return lookup;
  }

  /**
   * The sky outlook of each window at (lat, lon), in order. Never throws because the forecast
   * service is down, slow, garbled or not configured: those windows say 'unavailable'.
   *
   * @param lat - latitude of the vantage, degrees
   * @param lon - longitude of the vantage, degrees
   * @param windows - lineup windows, each end after its start
   * @throws RangeError when the position or a window is invalid
   */
  async outlookFor(lat: number, lon: number, windows: readonly TimeWindow[]): Promise<SkyOutlook[]> {
    forecastCell(lat, lon);
    const nowMs = this.now().getTime();
    // The service's hours start at 00:00 UTC today and run FORECAST_DAYS days.
    const reachStart = Math.floor(nowMs / MS_PER_DAY) * MS_PER_DAY - HALF_HOUR_MS;
    const reachEnd = reachStart + HALF_HOUR_MS + FORECAST_DAYS * MS_PER_DAY;
    const beyondReach = (w: TimeWindow): SkyOutlook | undefined => {
      const base = { start: w.start.toISOString(), end: w.end.toISOString() };
      if (w.start.getTime() >= reachEnd) return { status: 'no-forecast-yet', ...base, issuedAt: null, horizonEnd: null };
      if (w.end.getTime() <= reachStart) return { status: 'past', ...base };
      return undefined;
    };
    assertTimeWindows(windows);
    const outside = windows.map(beyondReach);
    if (outside.every((o) => o !== undefined)) return outside as SkyOutlook[];

    try {
      const { forecast } = await this.forecastFor(lat, lon);
      return summarizeOutlooks(forecast, windows);
    } catch (error) {
      let message = 'The forecast is unavailable just now';
      if (error instanceof ForecastUnavailableError) message = error.publicMessage;
      else this.log(`Sky outlook failed: ${error instanceof Error ? error.stack ?? error.message : String(error)}`);
      return windows.map((w, i) => outside[i] ?? { status: 'unavailable', start: w.start.toISOString(), end: w.end.toISOString(), message });
    }
  }

  /**
   * The sky outlook of each window at a saved sightline's vantage.
   *
   * @throws AppError 404 when the user may not read the sightline (as SightlineService.get)
   */
  async outlookForSightline(user: UserModel, sightlineId: string, windows: readonly TimeWindow[]): Promise<SkyOutlook[]> {
    if (!this.sightlines) throw new Error('ForecastService was built without the sightline service');
    const sightline = await this.sightlines.get(user, sightlineId, 'read');
    return this.outlookFor(sightline.vantageLat, sightline.vantageLon, windows);
  }

  /** Deletes stored forecasts fetched more than `ageMs` ago (default two days); returns how many. */
  async pruneCache(ageMs = 2 * MS_PER_DAY): Promise<number> {
    return this.store.pruneFetchedBefore(new Date(this.now().getTime() - ageMs));
  }

  private remember(cell: ForecastCell, stored: StoredForecast): void {
    this.memory.delete(cell.key);
    if (this.memory.size >= MEMORY_CELLS) this.memory.delete(this.memory.keys().next().value!);
    this.memory.set(cell.key, stored);
  }

  private async lookup(cell: ForecastCell): Promise<ForecastLookup> {
    const remembered = this.memory.get(cell.key);
    if (remembered && this.now().getTime() - remembered.fetchedAt.getTime() < this.refreshIntervalMs) return { ...remembered, stale: false };
    const stored = await this.store.latest(cell);
    if (stored) this.remember(cell, stored);
    const nowMs = this.now().getTime();
    const ageMs = stored ? nowMs - stored.fetchedAt.getTime() : Infinity;
    if (stored && ageMs < this.refreshIntervalMs) return { ...stored, stale: false };
    const usable = stored && ageMs <= this.maxStaleMs ? { ...stored, stale: true } : undefined;

    if (!this.source) {
      if (usable) return usable;
      throw new ForecastUnavailableError('not-configured');
    }
    const failure = this.failures.get(cell.key);
    if (failure && nowMs - failure.at < this.failureBackoffMs) {
      if (usable) return usable;
      throw failure.error;
    }

    let forecast: HourlyForecast;
    try {
      forecast = await this.source.fetchHourly(cell.lat, cell.lon);
    } catch (error) {
      const unavailable = error instanceof ForecastUnavailableError
        ? error
        : new ForecastUnavailableError('network', error instanceof Error ? error.message : String(error), undefined, { cause: error });
      this.failures.set(cell.key, { at: this.now().getTime(), error: unavailable });
      this.log(`Forecast for cell ${cell.key} failed (${unavailable.kind}): ${unavailable.message}`);
      if (usable) return usable;
      throw unavailable;
    }
    this.failures.delete(cell.key);
    const fetched = { forecast, fetchedAt: new Date(forecast.fetchedAt) };
    this.remember(cell, fetched);
    try {
      await this.store.save(cell, forecast, FORECAST_KEEP_HISTORY_MS);
    } catch (error) {
      // The forecast is good even if it could not be kept; the next lookup fetches again.
      this.log(`Storing the forecast for cell ${cell.key} failed: ${error instanceof Error ? error.message : String(error)}`);
    }
    return { ...fetched, stale: false };
  }
}
