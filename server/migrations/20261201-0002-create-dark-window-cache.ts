import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

/**
 * Dark windows per site (rounded position), calendar year (UTC) and sky conditions, so repeated
 * searches at a site skip the Sun and Moon work.
 */
export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.createTable('dark_window_cache', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    site_key: { type: DataTypes.STRING(64), allowNull: false },
    year: { type: DataTypes.INTEGER, allowNull: false },
    conditions_key: { type: DataTypes.STRING(64), allowNull: false },
    engine_version: { type: DataTypes.INTEGER, allowNull: false },
    window_set: { type: DataTypes.JSONB, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
  });
  await queryInterface.addConstraint('dark_window_cache', {
    type: 'unique',
    fields: ['site_key', 'year', 'conditions_key', 'engine_version'],
    name: 'dark_window_cache_key',
  });
  await sequelize.query('ALTER TABLE dark_window_cache ADD CONSTRAINT dark_window_cache_year CHECK (year BETWEEN 1900 AND 2200)');
};

export const down: Migration['down'] = async ({ queryInterface }) => {
  await queryInterface.dropTable('dark_window_cache');
};
