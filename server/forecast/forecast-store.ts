import { Op } from 'sequelize';
import { hourlyForecastSchema, type HourlyForecast } from '../../shared/schemas/outlook';
import type { ForecastCell } from '../../shared/outlook';
import { ForecastCacheModel } from '../models/forecast-cache';

/** A stored forecast and when it was fetched. */
export interface StoredForecast {
  forecast: HourlyForecast;
  fetchedAt: Date;
}

/** Forecasts kept in PostgreSQL (table forecast_cache), one row per cell and fetch. */
export class ForecastStore {
  /** The newest forecast of the cell, or undefined when there is none (or the row no longer parses). */
  async latest(cell: ForecastCell): Promise<StoredForecast | undefined> {
    const row = await ForecastCacheModel.findOne({ where: { cellKey: cell.key }, order: [['fetchedAt', 'DESC']] });
    if (!row) return undefined;
    const parsed = hourlyForecastSchema.safeParse(row.forecast);
    // A row from an older shape is a miss, not an error: the next fetch replaces it.
    return parsed.success ? { forecast: parsed.data, fetchedAt: row.fetchedAt } : undefined;
  }

  /**
   * Stores a fetched forecast and deletes the cell's rows fetched more than `keepMs` before it.
   * Two fetches of one cell at the same instant (two app copies) keep one row.
   */
  async save(cell: ForecastCell, forecast: HourlyForecast, keepMs: number): Promise<void> {
    const fetchedAt = new Date(forecast.fetchedAt);
    await ForecastCacheModel.bulkCreate([{
      cellKey: cell.key, lat: cell.lat, lon: cell.lon,
      issuedAt: new Date(forecast.issuedAt), fetchedAt, forecast,
    }], { ignoreDuplicates: true });
    await ForecastCacheModel.destroy({ where: { cellKey: cell.key, fetchedAt: { [Op.lt]: new Date(fetchedAt.getTime() - keepMs) } } });
  }

  /** Deletes every row fetched before `before`; returns how many went. For a periodic clean-up. */
  async pruneFetchedBefore(before: Date): Promise<number> {
    return ForecastCacheModel.destroy({ where: { fetchedAt: { [Op.lt]: before } } });
  }
}
