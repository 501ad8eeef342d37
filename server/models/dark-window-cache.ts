import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { DarkWindowSet } from '../../shared/lineup';

/** One site-year of dark windows for one set of sky conditions, as the engine computed them. */
export class DarkWindowCacheModel extends Model<InferAttributes<DarkWindowCacheModel>, InferCreationAttributes<DarkWindowCacheModel>> {
  declare id: CreationOptional<number>;
  declare siteKey: string;
  declare year: number;
  declare conditionsKey: string;
  declare engineVersion: number;
  declare windowSet: DarkWindowSet;
  declare createdAt: CreationOptional<Date>;
}

export function initDarkWindowCacheModel(sequelize: Sequelize): typeof DarkWindowCacheModel {
  DarkWindowCacheModel.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      siteKey: { type: DataTypes.STRING(64), allowNull: false },
      year: { type: DataTypes.INTEGER, allowNull: false },
      conditionsKey: { type: DataTypes.STRING(64), allowNull: false },
      engineVersion: { type: DataTypes.INTEGER, allowNull: false },
      windowSet: { type: DataTypes.JSONB, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'dark_window_cache', modelName: 'DarkWindowCache', updatedAt: false },
  );
  return DarkWindowCacheModel;
}
