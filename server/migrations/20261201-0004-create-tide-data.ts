import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

/** A sightline's tide rule, and the tide times (high and low waters) pasted for it. */
export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.addColumn('sightlines', 'tide_rule', { type: DataTypes.JSONB, allowNull: true });
  await sequelize.query(`CREATE TYPE tide_kind AS ENUM ('high', 'low')`);
  await queryInterface.createTable('tide_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    sightline_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sightlines', key: 'id' }, onDelete: 'CASCADE' },
    at: { type: DataTypes.DATE, allowNull: false },
    kind: { type: 'tide_kind', allowNull: false },
    height_m: { type: DataTypes.DOUBLE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
  });
  await queryInterface.addConstraint('tide_events', { type: 'unique', fields: ['sightline_id', 'at'], name: 'tide_events_one_per_instant' });
  await sequelize.query('ALTER TABLE tide_events ADD CONSTRAINT tide_events_height CHECK (height_m IS NULL OR height_m BETWEEN -20 AND 20)');
};

export const down: Migration['down'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.dropTable('tide_events');
  await sequelize.query('DROP TYPE IF EXISTS tide_kind');
  await queryInterface.removeColumn('sightlines', 'tide_rule');
};
