import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute, type Sequelize } from 'sequelize';
import type { Lineup, TargetRef } from '../../shared/schemas/lineup';
import type { WatchDelivery, WatchDeliveryStatus } from '../../shared/schemas/watch';
import type { WatchModel } from './watch';

/** What the scan found, kept with the delivery so the e-mail shows the lineup it was sent for. */
export interface DeliverySnapshot {
  lineup: Lineup;
  timezone: string;
  target: TargetRef & { name: string };
}

export class WatchDeliveryModel extends Model<InferAttributes<WatchDeliveryModel>, InferCreationAttributes<WatchDeliveryModel>> {
  declare id: string;
  declare watchId: string;
  declare lineupStart: Date;
  declare leadDays: number;
  declare status: CreationOptional<WatchDeliveryStatus>;
  declare snapshot: DeliverySnapshot;
  declare messageId: string;
  declare attempts: CreationOptional<number>;
  declare claimedAt: CreationOptional<Date | null>;
  declare claimToken: CreationOptional<string | null>;
  declare recipient: CreationOptional<string | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare lastError: CreationOptional<string | null>;
  declare unsubscribeUsedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare watch?: NonAttribute<WatchModel>;

  toPublic(): WatchDelivery {
    return {
      id: this.id,
      watchId: this.watchId,
      lineupStart: this.lineupStart.toISOString(),
      leadDays: this.leadDays,
      status: this.status,
      attempts: this.attempts,
      sentAt: this.sentAt?.toISOString() ?? null,
      messageId: this.messageId,
      lastError: this.lastError,
      createdAt: this.createdAt.toISOString(),
    };
  }
}

export function initWatchDeliveryModel(sequelize: Sequelize): typeof WatchDeliveryModel {
  WatchDeliveryModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      watchId: { type: DataTypes.UUID, allowNull: false },
      lineupStart: { type: DataTypes.DATE, allowNull: false },
      leadDays: { type: DataTypes.SMALLINT, allowNull: false },
      status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'pending' },
      snapshot: { type: DataTypes.JSONB, allowNull: false },
      messageId: { type: DataTypes.STRING(200), allowNull: false },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      claimedAt: { type: DataTypes.DATE, allowNull: true },
      claimToken: { type: DataTypes.UUID, allowNull: true },
      recipient: { type: DataTypes.STRING(254), allowNull: true },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      lastError: { type: DataTypes.TEXT, allowNull: true },
      unsubscribeUsedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'watch_deliveries', modelName: 'WatchDelivery' },
  );
  return WatchDeliveryModel;
}
