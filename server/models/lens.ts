import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { Lens } from '../../shared/schemas/gear';
import type { LensRecord } from '../../shared/schemas/shot-plan';
import { lensFocalRange } from '../../shared/shotplan/gear';

/** A lens in a user's gear: a prime (focal length) or a zoom (both ends). */
export class LensModel extends Model<InferAttributes<LensModel>, InferCreationAttributes<LensModel>> {
  declare id: CreationOptional<string>;
  declare ownerId: string;
  declare name: string;
  declare focalLengthMm: number | null;
  declare zoomMinMm: number | null;
  declare zoomMaxMm: number | null;
  declare widestApertureF: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** The lens as the gear schemas take it (no nulls). */
  toLens(): Lens {
    return {
      name: this.name,
      ...(this.focalLengthMm !== null ? { focalLengthMm: this.focalLengthMm } : {}),
      ...(this.zoomMinMm !== null ? { zoomMinMm: this.zoomMinMm } : {}),
      ...(this.zoomMaxMm !== null ? { zoomMaxMm: this.zoomMaxMm } : {}),
      widestApertureF: this.widestApertureF,
    };
  }

  /** The API shape, with the focal range. */
  toPublic(): LensRecord {
    return {
      id: this.id,
      name: this.name,
      focalLengthMm: this.focalLengthMm,
      zoomMinMm: this.zoomMinMm,
      zoomMaxMm: this.zoomMaxMm,
      widestApertureF: this.widestApertureF,
      range: lensFocalRange(this.toLens()),
      createdAt: this.createdAt.toISOString(),
      updatedAt: this.updatedAt.toISOString(),
    };
  }
}

export function initLensModel(sequelize: Sequelize): typeof LensModel {
  LensModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(80), allowNull: false },
      focalLengthMm: { type: DataTypes.DOUBLE, allowNull: true },
      zoomMinMm: { type: DataTypes.DOUBLE, allowNull: true },
      zoomMaxMm: { type: DataTypes.DOUBLE, allowNull: true },
      widestApertureF: { type: DataTypes.DOUBLE, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'lenses', modelName: 'Lens' },
  );
  return LensModel;
}
