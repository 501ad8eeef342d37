import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

/** A user's secret calendar feed address; rotating it replaces the secret. */
export class CalendarFeedModel extends Model<InferAttributes<CalendarFeedModel>, InferCreationAttributes<CalendarFeedModel>> {
  declare userId: string;
  declare secret: string;
  declare createdAt: CreationOptional<Date>;
}

export function initCalendarFeedModel(sequelize: Sequelize): typeof CalendarFeedModel {
  CalendarFeedModel.init(
    {
      userId: { type: DataTypes.UUID, primaryKey: true },
      secret: { type: DataTypes.STRING(64), allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'calendar_feeds', modelName: 'CalendarFeed', updatedAt: false },
  );
  return CalendarFeedModel;
}
