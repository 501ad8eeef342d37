import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

/**
 * The sky outlook in watches: a watch's cloud limit (send only when the outlook's mean total cloud
 * over the lineup window is at most this many percent; NULL for no limit), and the outlook each
 * delivery's e-mail showed, so the on-the-day e-mail can tell when it changed a lot since.
 */
export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.addColumn('watches', 'max_cloud_pct', { type: DataTypes.SMALLINT, allowNull: true });
  await queryInterface.addColumn('watch_deliveries', 'outlook', { type: DataTypes.JSONB, allowNull: true });
  await sequelize.query(`
    ALTER TABLE watches
      ADD CONSTRAINT watches_max_cloud_pct CHECK (max_cloud_pct IS NULL OR max_cloud_pct BETWEEN 0 AND 100)
  `);
  await sequelize.query(`
    ALTER TABLE watch_deliveries
      ADD CONSTRAINT watch_deliveries_outlook CHECK (
        outlook IS NULL OR (jsonb_typeof(outlook) = 'object' AND outlook ? 'status' AND outlook ? 'start' AND outlook ? 'end'))
  `);
};

export const down: Migration['down'] = async ({ queryInterface, sequelize }) => {
  await sequelize.query('ALTER TABLE watch_deliveries DROP CONSTRAINT IF EXISTS watch_deliveries_outlook');
  await sequelize.query('ALTER TABLE watches DROP CONSTRAINT IF EXISTS watches_max_cloud_pct');
  await queryInterface.removeColumn('watch_deliveries', 'outlook');
  await queryInterface.removeColumn('watches', 'max_cloud_pct');
};
