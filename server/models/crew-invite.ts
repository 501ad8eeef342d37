import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute, type Sequelize } from 'sequelize';
import type { CrewRole } from '../../shared/policy/sightline-policy';
import type { CrewInvite, InviteStatus } from '../../shared/schemas/crew';
import type { UserModel } from './user';

/** An e-mail invite into a sightline's crew. The link's token is signed and names this row. */
export class CrewInviteModel extends Model<InferAttributes<CrewInviteModel>, InferCreationAttributes<CrewInviteModel>> {
  declare id: string;
  declare sightlineId: string;
  declare email: string;
  declare role: CrewRole;
  declare invitedBy: string | null;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedBy: CreationOptional<string | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare inviter?: NonAttribute<UserModel | null>;

  statusAt(now: Date): InviteStatus {
    if (this.acceptedAt) return 'accepted';
    if (this.revokedAt) return 'revoked';
    return this.expiresAt.getTime() <= now.getTime() ? 'expired' : 'pending';
  }

  toPublic(now: Date): CrewInvite {
    return {
      id: this.id,
      email: this.email,
      role: this.role,
      invitedByName: this.inviter?.name ?? 'former member',
      status: this.statusAt(now),
      expiresAt: this.expiresAt.toISOString(),
      createdAt: this.createdAt.toISOString(),
    };
  }
}

export function initCrewInviteModel(sequelize: Sequelize): typeof CrewInviteModel {
  CrewInviteModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      sightlineId: { type: DataTypes.UUID, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.STRING(10), allowNull: false },
      invitedBy: { type: DataTypes.UUID, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      acceptedBy: { type: DataTypes.UUID, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'crew_invites', modelName: 'CrewInvite', updatedAt: false },
  );
  return CrewInviteModel;
}
