import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

/**
 * Gear per user: camera bodies, lenses and the gear settings (whether a star tracker is at hand).
 * The CHECK constraints hold the bounds of shared/schemas/gear.ts; names are unique per user,
 * ignoring case and surrounding spaces.
 */
export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  const now = { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') };
  const owner = { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' };

  await queryInterface.createTable('camera_bodies', {
    id: { type: DataTypes.UUID, primaryKey: true },
    owner_id: owner,
    name: { type: DataTypes.STRING(80), allowNull: false },
    sensor_width_mm: { type: DataTypes.DOUBLE, allowNull: false },
    sensor_height_mm: { type: DataTypes.DOUBLE, allowNull: false },
    pixel_pitch_um: { type: DataTypes.DOUBLE, allowNull: true },
    width_px: { type: DataTypes.INTEGER, allowNull: true },
    megapixels: { type: DataTypes.DOUBLE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await sequelize.query(`
    ALTER TABLE camera_bodies
      ADD CONSTRAINT camera_bodies_name CHECK (length(btrim(name)) BETWEEN 1 AND 80 AND name = btrim(name)),
      ADD CONSTRAINT camera_bodies_sensor CHECK (
        sensor_width_mm BETWEEN 1 AND 100 AND sensor_height_mm BETWEEN 1 AND 100 AND sensor_height_mm <= sensor_width_mm),
      ADD CONSTRAINT camera_bodies_pixel_pitch CHECK (pixel_pitch_um IS NULL OR pixel_pitch_um BETWEEN 0.5 AND 50),
      ADD CONSTRAINT camera_bodies_width_px CHECK (width_px IS NULL OR width_px BETWEEN 100 AND 100000),
      ADD CONSTRAINT camera_bodies_megapixels CHECK (megapixels IS NULL OR megapixels BETWEEN 0.1 AND 1000),
      ADD CONSTRAINT camera_bodies_pixel_figure CHECK (pixel_pitch_um IS NOT NULL OR width_px IS NOT NULL OR megapixels IS NOT NULL)
  `);
  await sequelize.query('CREATE UNIQUE INDEX camera_bodies_name_per_owner ON camera_bodies (owner_id, lower(name))');

  await queryInterface.createTable('lenses', {
    id: { type: DataTypes.UUID, primaryKey: true },
    owner_id: owner,
    name: { type: DataTypes.STRING(80), allowNull: false },
    focal_length_mm: { type: DataTypes.DOUBLE, allowNull: true },
    zoom_min_mm: { type: DataTypes.DOUBLE, allowNull: true },
    zoom_max_mm: { type: DataTypes.DOUBLE, allowNull: true },
    widest_aperture_f: { type: DataTypes.DOUBLE, allowNull: false },
    created_at: now,
    updated_at: now,
  });
  await sequelize.query(`
    ALTER TABLE lenses
      ADD CONSTRAINT lenses_name CHECK (length(btrim(name)) BETWEEN 1 AND 80 AND name = btrim(name)),
      ADD CONSTRAINT lenses_prime_or_zoom CHECK (
        (focal_length_mm IS NOT NULL AND zoom_min_mm IS NULL AND zoom_max_mm IS NULL)
        OR (focal_length_mm IS NULL AND zoom_min_mm IS NOT NULL AND zoom_max_mm IS NOT NULL AND zoom_max_mm > zoom_min_mm)),
      ADD CONSTRAINT lenses_focal_length CHECK (
        (focal_length_mm IS NULL OR focal_length_mm BETWEEN 1 AND 5000)
        AND (zoom_min_mm IS NULL OR zoom_min_mm BETWEEN 1 AND 5000)
        AND (zoom_max_mm IS NULL OR zoom_max_mm BETWEEN 1 AND 5000)),
      ADD CONSTRAINT lenses_widest_aperture CHECK (widest_aperture_f BETWEEN 0.7 AND 32)
  `);
  await sequelize.query('CREATE UNIQUE INDEX lenses_name_per_owner ON lenses (owner_id, lower(name))');

  await queryInterface.createTable('gear_settings', {
    user_id: { ...owner, primaryKey: true },
    star_tracker_available: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: now,
    updated_at: now,
  });
};

export const down: Migration['down'] = async ({ queryInterface }) => {
  await queryInterface.dropTable('gear_settings');
  await queryInterface.dropTable('lenses');
  await queryInterface.dropTable('camera_bodies');
};
