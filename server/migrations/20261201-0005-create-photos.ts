import { DataTypes } from 'sequelize';
import type { Migration } from '../db/migrator';

/** Reference photos of a sightline: the row points at three stored files (original, display, thumb). */
export const up: Migration['up'] = async ({ queryInterface, sequelize }) => {
  await queryInterface.createTable('photos', {
    id: { type: DataTypes.UUID, primaryKey: true },
    sightline_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sightlines', key: 'id' }, onDelete: 'CASCADE' },
    owner_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    mime_type: { type: DataTypes.STRING(40), allowNull: false },
    width: { type: DataTypes.INTEGER, allowNull: false },
    height: { type: DataTypes.INTEGER, allowNull: false },
    byte_size: { type: DataTypes.INTEGER, allowNull: false },
    original_key: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    display_key: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    thumb_key: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    exif: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    hide_gps: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    calibration: { type: DataTypes.JSONB, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal('now()') },
  });
  await sequelize.query(`
    ALTER TABLE photos
      ADD CONSTRAINT photos_original_name CHECK (length(original_name) BETWEEN 1 AND 255),
      ADD CONSTRAINT photos_mime_type CHECK (mime_type IN ('image/jpeg', 'image/png', 'image/webp', 'image/heif', 'image/avif')),
      ADD CONSTRAINT photos_dimensions CHECK (width > 0 AND height > 0),
      ADD CONSTRAINT photos_byte_size CHECK (byte_size > 0),
      ADD CONSTRAINT photos_exif_object CHECK (jsonb_typeof(exif) = 'object'),
      ADD CONSTRAINT photos_calibration_object CHECK (calibration IS NULL OR jsonb_typeof(calibration) = 'object')
  `);
  await queryInterface.addIndex('photos', ['sightline_id', 'created_at']);
};

export const down: Migration['down'] = async ({ queryInterface }) => {
  await queryInterface.dropTable('photos');
};
