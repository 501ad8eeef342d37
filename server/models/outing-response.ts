import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { OutingAnswer } from '../../shared/schemas/outing';

/** One crew member's answer to an outing. */
export class OutingResponseModel extends Model<InferAttributes<OutingResponseModel>, InferCreationAttributes<OutingResponseModel>> {
  declare outingId: string;
  declare userId: string;
  declare answer: OutingAnswer;
  declare note: CreationOptional<string>;
  declare updatedAt: CreationOptional<Date>;
}

export function initOutingResponseModel(sequelize: Sequelize): typeof OutingResponseModel {
  OutingResponseModel.init(
    {
      outingId: { type: DataTypes.UUID, primaryKey: true },
      userId: { type: DataTypes.UUID, primaryKey: true },
      answer: { type: DataTypes.STRING(10), allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'outing_responses', modelName: 'OutingResponse', createdAt: false },
  );
  return OutingResponseModel;
}
