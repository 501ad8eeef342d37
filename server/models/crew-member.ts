import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute, type Sequelize } from 'sequelize';
import type { CrewRole } from '../../shared/policy/sightline-policy';
import type { UserModel } from './user';

/** A person in a sightline's crew, with their role there. */
export class CrewMemberModel extends Model<InferAttributes<CrewMemberModel>, InferCreationAttributes<CrewMemberModel>> {
  declare sightlineId: string;
  declare userId: string;
  declare role: CrewRole;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare user?: NonAttribute<UserModel>;
}

export function initCrewMemberModel(sequelize: Sequelize): typeof CrewMemberModel {
  CrewMemberModel.init(
    {
      sightlineId: { type: DataTypes.UUID, primaryKey: true },
      userId: { type: DataTypes.UUID, primaryKey: true },
      role: { type: DataTypes.STRING(10), allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'crew_members', modelName: 'CrewMember' },
  );
  return CrewMemberModel;
}
