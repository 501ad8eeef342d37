import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute, type Sequelize } from 'sequelize';
import type { TargetRef } from '../../shared/schemas/lineup';
import type { Watch } from '../../shared/schemas/watch';
import { findTarget } from '../../shared/sky/catalogue';
import type { SightlineModel } from './sightline';

/** The name a target ref shows: the catalogue name, or the custom target's own name. */
export function targetRefName(target: TargetRef): string {
  return 'id' in target ? (findTarget(target.id)?.name ?? target.id) : target.name;
}

export class WatchModel extends Model<InferAttributes<WatchModel>, InferCreationAttributes<WatchModel>> {
  declare id: CreationOptional<string>;
  declare ownerId: string;
  declare sightlineId: string;
  declare target: TargetRef;
  declare minScore: number;
  declare minDurationMin: number;
  declare reachableOnly: boolean;
  declare weekdays: number[];
  declare leadDays: number[];
  declare paused: boolean;
  /** Cloud limit of the reminders, % 0..100 (mean total cloud over the lineup window); null: none. */
  declare maxCloudPct: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare sightline?: NonAttribute<SightlineModel>;

  /** The API shape; needs the sightline included. */
  toPublic(lastSentAt: Date | null = null): Watch {
    return {
      id: this.id,
      ownerId: this.ownerId,
      sightlineId: this.sightlineId,
      sightlineName: this.sightline?.name ?? '',
      timezone: this.sightline?.timezone ?? 'UTC',
      target: this.target,
      targetName: targetRefName(this.target),
      minScore: this.minScore,
      minDurationMin: this.minDurationMin,
      reachableOnly: this.reachableOnly,
      weekdays: [...this.weekdays].sort((a, b) => a - b),
      leadDays: [...this.leadDays].sort((a, b) => b - a),
      paused: this.paused,
      maxCloudPct: this.maxCloudPct ?? null,
      lastSentAt: lastSentAt?.toISOString() ?? null,
      createdAt: this.createdAt.toISOString(),
      updatedAt: this.updatedAt.toISOString(),
    };
  }
}

export function initWatchModel(sequelize: Sequelize): typeof WatchModel {
  WatchModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      sightlineId: { type: DataTypes.UUID, allowNull: false },
      target: { type: DataTypes.JSONB, allowNull: false },
      minScore: { type: DataTypes.DOUBLE, allowNull: false },
      minDurationMin: { type: DataTypes.DOUBLE, allowNull: false },
      reachableOnly: { type: DataTypes.BOOLEAN, allowNull: false },
      weekdays: { type: DataTypes.ARRAY(DataTypes.SMALLINT), allowNull: false },
      leadDays: { type: DataTypes.ARRAY(DataTypes.SMALLINT), allowNull: false },
      paused: { type: DataTypes.BOOLEAN, allowNull: false },
      maxCloudPct: { type: DataTypes.SMALLINT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'watches', modelName: 'Watch' },
  );
  return WatchModel;
}
