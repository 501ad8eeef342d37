import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

/**
 * Hourly forecasts as fetched from the forecast service, per forecast cell (position rounded to
 * 0.1 deg) and fetch time, so that page views and watches read the stored forecast and the service
 * is asked at most once per cell and update interval.
 */
export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.createTable('forecast_cache', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    cell_key: { type: DataTypes.STRING(32), allowNull: false },
    lat: { type: DataTypes.DOUBLE, allowNull: false },
    lon: { type: DataTypes.DOUBLE, allowNull: false },
    issued_at: { type: DataTypes.DATE, allowNull: false },
    fetched_at: { type: DataTypes.DATE, allowNull: false },
    forecast: { type: DataTypes.JSONB, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
  });
  // The unique key also serves "the newest row of a cell" (read backwards).
  await queryInterface.addConstraint('forecast_cache', {
    type: 'unique',
    fields: ['cell_key', 'fetched_at'],
    name: 'forecast_cache_cell_fetch',
  });
  await sequelize.query(`
    ALTER TABLE forecast_cache
      ADD CONSTRAINT forecast_cache_cell_key CHECK (cell_key ~ '^-?[0-9]{1,2}\\.[0-9],-?[0-9]{1,3}\\.[0-9]$'),
      ADD CONSTRAINT forecast_cache_position CHECK (lat BETWEEN -90 AND 90 AND lon >= -180 AND lon < 180),
      ADD CONSTRAINT forecast_cache_issued CHECK (issued_at <= fetched_at),
      ADD CONSTRAINT forecast_cache_forecast_object CHECK (jsonb_typeof(forecast) = 'object' AND jsonb_typeof(forecast -> 'hours') = 'array')
  `);
};

export const down: Migration['down'] = async ({ queryInterface }) => {
  await queryInterface.dropTable('forecast_cache');
};
