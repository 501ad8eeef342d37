import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/** One site-year of dark windows, as flat [start, end, start, end, ...] Unix milliseconds. */
export class DarkWindowCacheModel extends Model<InferAttributes<DarkWindowCacheModel>, InferCreationAttributes<DarkWindowCacheModel>> {
  declare id: CreationOptional<number>;
  declare siteKey: string;
  declare year: number;
  declare conditionsKey: string;
  declare engineVersion: number;
  declare windows: number[];
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
      windows: { type: DataTypes.JSONB, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'dark_window_cache', modelName: 'DarkWindowCache', updatedAt: false },
  );
  return DarkWindowCacheModel;
}
