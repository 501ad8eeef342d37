import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute, type Sequelize } from 'sequelize';
import type { OutingResponseModel } from './outing-response';
import type { UserModel } from './user';

/** A night the crew goes out to a sightline: where and when to meet, and what to bring. */
export class OutingModel extends Model<InferAttributes<OutingModel>, InferCreationAttributes<OutingModel>> {
  declare id: string;
  declare sightlineId: string;
  declare createdBy: string | null;
  /** 'YYYY-MM-DD', the local date of the night's evening. */
  declare night: string;
  declare lineupStart: Date | null;
  declare lineupEnd: Date | null;
  declare lineupPeak: Date | null;
  declare meetingLat: number;
  declare meetingLon: number;
  declare meetingAt: Date;
  declare meetingNote: CreationOptional<string>;
  declare gearNotes: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare creator?: NonAttribute<UserModel | null>;
  declare responses?: NonAttribute<OutingResponseModel[]>;
}

export function initOutingModel(sequelize: Sequelize): typeof OutingModel {
  OutingModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      sightlineId: { type: DataTypes.UUID, allowNull: false },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      night: { type: DataTypes.DATEONLY, allowNull: false },
      lineupStart: { type: DataTypes.DATE, allowNull: true },
      lineupEnd: { type: DataTypes.DATE, allowNull: true },
      lineupPeak: { type: DataTypes.DATE, allowNull: true },
      meetingLat: { type: DataTypes.DOUBLE, allowNull: false },
      meetingLon: { type: DataTypes.DOUBLE, allowNull: false },
      meetingAt: { type: DataTypes.DATE, allowNull: false },
      meetingNote: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      gearNotes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'outings', modelName: 'Outing' },
  );
  return OutingModel;
}
