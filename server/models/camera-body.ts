import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { CameraBody } from '../../shared/schemas/gear';
import type { CameraBodyRecord } from '../../shared/schemas/shot-plan';
import { deriveBody } from '../../shared/shotplan/gear';

/** A camera body in a user's gear. */
export class CameraBodyModel extends Model<InferAttributes<CameraBodyModel>, InferCreationAttributes<CameraBodyModel>> {
  declare id: CreationOptional<string>;
  declare ownerId: string;
  declare name: string;
  declare sensorWidthMm: number;
  declare sensorHeightMm: number;
  declare pixelPitchUm: number | null;
  declare widthPx: number | null;
  declare megapixels: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** The body as the gear schemas take it (no nulls). */
  toBody(): CameraBody {
    return {
      name: this.name,
      sensorWidthMm: this.sensorWidthMm,
      sensorHeightMm: this.sensorHeightMm,
      ...(this.pixelPitchUm !== null ? { pixelPitchUm: this.pixelPitchUm } : {}),
      ...(this.widthPx !== null ? { widthPx: this.widthPx } : {}),
      ...(this.megapixels !== null ? { megapixels: this.megapixels } : {}),
    };
  }

  /** The API shape, with crop factor and pixel figures derived. */
  toPublic(): CameraBodyRecord {
    return {
      id: this.id,
      name: this.name,
      sensorWidthMm: this.sensorWidthMm,
      sensorHeightMm: this.sensorHeightMm,
      pixelPitchUm: this.pixelPitchUm,
      widthPx: this.widthPx,
      megapixels: this.megapixels,
      derived: deriveBody(this.toBody()),
      createdAt: this.createdAt.toISOString(),
      updatedAt: this.updatedAt.toISOString(),
    };
  }
}

export function initCameraBodyModel(sequelize: Sequelize): typeof CameraBodyModel {
  CameraBodyModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(80), allowNull: false },
      sensorWidthMm: { type: DataTypes.DOUBLE, allowNull: false },
      sensorHeightMm: { type: DataTypes.DOUBLE, allowNull: false },
      pixelPitchUm: { type: DataTypes.DOUBLE, allowNull: true },
      widthPx: { type: DataTypes.INTEGER, allowNull: true },
      megapixels: { type: DataTypes.DOUBLE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'camera_bodies', modelName: 'CameraBody' },
  );
  return CameraBodyModel;
}
