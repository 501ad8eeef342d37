import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { Photo, PhotoCalibration, PhotoExif, PhotoMimeType } from '../../shared/schemas/photo';

export class PhotoModel extends Model<InferAttributes<PhotoModel>, InferCreationAttributes<PhotoModel>> {
  declare id: string;
  declare sightlineId: string;
  declare ownerId: string;
  declare originalName: string;
  declare mimeType: PhotoMimeType;
  declare width: number;
  declare height: number;
  declare byteSize: number;
  declare originalKey: string;
  declare displayKey: string;
  declare thumbKey: string;
  declare exif: PhotoExif;
  declare hideGps: CreationOptional<boolean>;
  declare calibration: CreationOptional<PhotoCalibration | null>;
  declare createdAt: CreationOptional<Date>;

  /** The API shape; `showPrivate` (the owner) sees GPS and gets the original's address. */
  toPublic({ showPrivate }: { showPrivate: boolean }): Photo {
    const { gps, ...exif } = this.exif;
    const base = `/api/photos/${this.id}`;
    return {
      id: this.id,
      sightlineId: this.sightlineId,
      ownerId: this.ownerId,
      originalName: this.originalName,
      mimeType: this.mimeType,
      width: this.width,
      height: this.height,
      byteSize: this.byteSize,
      exif: gps && (showPrivate || !this.hideGps) ? { ...exif, gps } : exif,
      hideGps: this.hideGps,
      calibration: this.calibration ?? null,
      thumbUrl: `${base}/thumb`,
      displayUrl: `${base}/display`,
      originalUrl: showPrivate ? `${base}/original` : null,
      createdAt: this.createdAt.toISOString(),
    };
  }
}

export function initPhotoModel(sequelize: Sequelize): typeof PhotoModel {
  PhotoModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      sightlineId: { type: DataTypes.UUID, allowNull: false },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      originalName: { type: DataTypes.STRING(255), allowNull: false },
      mimeType: { type: DataTypes.STRING(40), allowNull: false },
      width: { type: DataTypes.INTEGER, allowNull: false },
      height: { type: DataTypes.INTEGER, allowNull: false },
      byteSize: { type: DataTypes.INTEGER, allowNull: false },
      originalKey: { type: DataTypes.STRING(120), allowNull: false },
      displayKey: { type: DataTypes.STRING(120), allowNull: false },
      thumbKey: { type: DataTypes.STRING(120), allowNull: false },
      exif: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      hideGps: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      calibration: { type: DataTypes.JSONB, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'photos', modelName: 'Photo', updatedAt: false },
  );
  return PhotoModel;
}
