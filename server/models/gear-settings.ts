import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { GearSettings } from '../../shared/schemas/shot-plan';

/** A user's gear settings: whether a star tracker is available. No row means the defaults. */
export class GearSettingsModel extends Model<InferAttributes<GearSettingsModel>, InferCreationAttributes<GearSettingsModel>> {
  declare userId: string;
  declare starTrackerAvailable: boolean;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  toPublic(): GearSettings {
    return { starTrackerAvailable: this.starTrackerAvailable };
  }
}

export function initGearSettingsModel(sequelize: Sequelize): typeof GearSettingsModel {
  GearSettingsModel.init(
    {
      userId: { type: DataTypes.UUID, primaryKey: true },
      starTrackerAvailable: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'gear_settings', modelName: 'GearSettings' },
  );
  return GearSettingsModel;
}

