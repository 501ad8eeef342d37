import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { HourlyForecast } from '../../shared/schemas/outlook';

/** One hourly forecast of one forecast cell, as fetched at `fetchedAt`. */
export class ForecastCacheModel extends Model<InferAttributes<ForecastCacheModel>, InferCreationAttributes<ForecastCacheModel>> {
  declare id: CreationOptional<number>;
  /** `forecastCell(lat, lon).key`, e.g. "50.6,-1.9". */
  declare cellKey: string;
  declare lat: number;
  declare lon: number;
  declare issuedAt: Date;
  declare fetchedAt: Date;
  declare forecast: HourlyForecast;
  declare createdAt: CreationOptional<Date>;
}

export function initForecastCacheModel(sequelize: Sequelize): typeof ForecastCacheModel {
  ForecastCacheModel.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      cellKey: { type: DataTypes.STRING(32), allowNull: false },
      lat: { type: DataTypes.DOUBLE, allowNull: false },
      lon: { type: DataTypes.DOUBLE, allowNull: false },
      issuedAt: { type: DataTypes.DATE, allowNull: false },
      fetchedAt: { type: DataTypes.DATE, allowNull: false },
      forecast: { type: DataTypes.JSONB, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'forecast_cache', modelName: 'ForecastCache', updatedAt: false },
  );
  return ForecastCacheModel;
}
