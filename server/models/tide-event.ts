import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { TideEvent, TideKind } from '../../shared/tide';

export class TideEventModel extends Model<InferAttributes<TideEventModel>, InferCreationAttributes<TideEventModel>> {
  declare id: CreationOptional<number>;
  declare sightlineId: string;
  declare at: Date;
  declare kind: TideKind;
  declare heightM: number | null;
  declare createdAt: CreationOptional<Date>;

  toPublic(): TideEvent {
    return { at: this.at.toISOString(), kind: this.kind, ...(this.heightM !== null ? { heightM: this.heightM } : {}) };
  }
}

export function initTideEventModel(sequelize: Sequelize): typeof TideEventModel {
  TideEventModel.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      sightlineId: { type: DataTypes.UUID, allowNull: false },
      at: { type: DataTypes.DATE, allowNull: false },
      kind: { type: DataTypes.ENUM('high', 'low'), allowNull: false },
      heightM: { type: DataTypes.DOUBLE, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'tide_events', modelName: 'TideEvent', updatedAt: false },
  );
  return TideEventModel;
}
