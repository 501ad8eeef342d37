import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute, type Sequelize } from 'sequelize';
import type { Sightline } from '../../shared/schemas/sightline';
import type { TideRule } from '../../shared/tide';
import type { UserModel } from './user';
import type { SightlineRole } from '../../shared/policy/sightline-policy';

export class SightlineModel extends Model<InferAttributes<SightlineModel>, InferCreationAttributes<SightlineModel>> {
  declare id: CreationOptional<string>;
  declare ownerId: string;
  declare name: string;
  declare vantageLat: number;
  declare vantageLon: number;
  declare vantageElevationM: number;
  declare cameraHeightM: number;
  declare landmarkLat: number;
  declare landmarkLon: number;
  declare landmarkBaseElevationM: number;
  declare landmarkHeightM: number;
  declare landmarkWidthM: number;
  declare bandHeightDeg: number;
  declare targetId: string;
  declare timezone: string;
  declare tideRule: CreationOptional<TideRule | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare owner?: NonAttribute<UserModel>;
  /** The role of the person who loaded it (set by SightlineService). */
  declare viewerRole?: NonAttribute<SightlineRole>;

  toPublic(): Sightline {
    return {
      id: this.id,
      name: this.name,
      ownerId: this.ownerId,
      ownerName: this.owner?.name ?? '',
      vantage: { lat: this.vantageLat, lon: this.vantageLon, elevationM: this.vantageElevationM, cameraHeightM: this.cameraHeightM },
      landmark: {
        lat: this.landmarkLat, lon: this.landmarkLon, baseElevationM: this.landmarkBaseElevationM,
        heightM: this.landmarkHeightM, widthM: this.landmarkWidthM,
      },
      bandHeightDeg: this.bandHeightDeg,
      targetId: this.targetId,
      timezone: this.timezone,
      tideRule: this.tideRule ?? null,
      myRole: this.viewerRole ?? 'owner',
      createdAt: this.createdAt.toISOString(),
      updatedAt: this.updatedAt.toISOString(),
    };
  }
}

const double = (defaultValue?: number) => ({ type: DataTypes.DOUBLE, allowNull: false, ...(defaultValue !== undefined ? { defaultValue } : {}) });

export function initSightlineModel(sequelize: Sequelize): typeof SightlineModel {
  SightlineModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(100), allowNull: false },
      vantageLat: double(),
      vantageLon: double(),
      vantageElevationM: double(0),
      cameraHeightM: double(1.5),
      landmarkLat: double(),
      landmarkLon: double(),
      landmarkBaseElevationM: double(0),
      landmarkHeightM: double(0),
      landmarkWidthM: double(0),
      bandHeightDeg: double(20),
      targetId: { type: DataTypes.STRING(40), allowNull: false, defaultValue: 'galactic-centre' },
      timezone: { type: DataTypes.STRING(64), allowNull: false },
      tideRule: { type: DataTypes.JSONB, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'sightlines', modelName: 'Sightline' },
  );
  return SightlineModel;
}
