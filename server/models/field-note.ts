import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute, type Sequelize } from 'sequelize';
import type { FieldNote } from '../../shared/schemas/sightline';
import type { UserModel } from './user';

export class FieldNoteModel extends Model<InferAttributes<FieldNoteModel>, InferCreationAttributes<FieldNoteModel>> {
  declare id: CreationOptional<string>;
  declare sightlineId: string;
  declare authorId: string | null;
  declare kind: FieldNote['kind'];
  declare body: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<UserModel | null>;

  toPublic(): FieldNote {
    return {
      id: this.id,
      sightlineId: this.sightlineId,
      authorId: this.authorId,
      authorName: this.author?.name ?? 'former member',
      kind: this.kind,
      body: this.body,
      createdAt: this.createdAt.toISOString(),
      updatedAt: this.updatedAt.toISOString(),
    };
  }
}

export function initFieldNoteModel(sequelize: Sequelize): typeof FieldNoteModel {
  FieldNoteModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      sightlineId: { type: DataTypes.UUID, allowNull: false },
      authorId: { type: DataTypes.UUID, allowNull: true },
      kind: { type: DataTypes.ENUM('access', 'tide', 'hazard', 'general'), allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'field_notes', modelName: 'FieldNote' },
  );
  return FieldNoteModel;
}
