import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.createTable('sightlines', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: sequelize.literal('gen_random_uuid()') },
    owner_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(100), allowNull: false },
    vantage_lat: { type: DataTypes.DOUBLE, allowNull: false },
    vantage_lon: { type: DataTypes.DOUBLE, allowNull: false },
    vantage_elevation_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    camera_height_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.5 },
    landmark_lat: { type: DataTypes.DOUBLE, allowNull: false },
    landmark_lon: { type: DataTypes.DOUBLE, allowNull: false },
    landmark_base_elevation_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    landmark_height_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    landmark_width_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    band_height_deg: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 20 },
    target_id: { type: DataTypes.STRING(40), allowNull: false, defaultValue: 'galactic-centre' },
    timezone: { type: DataTypes.STRING(64), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
  });
  await sequelize.query(`
    ALTER TABLE sightlines
      ADD CONSTRAINT sightlines_name_present CHECK (length(trim(name)) > 0),
      ADD CONSTRAINT sightlines_vantage_position CHECK (vantage_lat BETWEEN -90 AND 90 AND vantage_lon BETWEEN -180 AND 180),
      ADD CONSTRAINT sightlines_landmark_position CHECK (landmark_lat BETWEEN -90 AND 90 AND landmark_lon BETWEEN -180 AND 180),
      ADD CONSTRAINT sightlines_heights CHECK (camera_height_m >= 0 AND landmark_height_m >= 0 AND landmark_width_m >= 0),
      ADD CONSTRAINT sightlines_band CHECK (band_height_deg > 0 AND band_height_deg <= 90)
  `);
  await queryInterface.addIndex('sightlines', ['owner_id', 'name']);

  await sequelize.query(`CREATE TYPE field_note_kind AS ENUM ('access', 'tide', 'hazard', 'general')`);
  await queryInterface.createTable('field_notes', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: sequelize.literal('gen_random_uuid()') },
    sightline_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sightlines', key: 'id' }, onDelete: 'CASCADE' },
    author_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    kind: { type: 'field_note_kind', allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
  });
  await sequelize.query(`ALTER TABLE field_notes ADD CONSTRAINT field_notes_body CHECK (length(trim(body)) BETWEEN 1 AND 5000)`);
  await queryInterface.addIndex('field_notes', ['sightline_id', 'created_at']);
};

export const down: Migration['down'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.dropTable('field_notes');
  await sequelize.query('DROP TYPE IF EXISTS field_note_kind');
  await queryInterface.dropTable('sightlines');
};
