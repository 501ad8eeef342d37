import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import type { OutboxSummary } from '../../shared/schemas/outbox';

/** One message as the local SMTP fake received it: envelope, subject and the raw source. */
export class OutboxMessageModel extends Model<InferAttributes<OutboxMessageModel>, InferCreationAttributes<OutboxMessageModel>> {
  declare id: CreationOptional<string>;
  declare messageId: string | null;
  declare envelopeFrom: string;
  declare envelopeTo: string[];
  declare subject: string;
  declare raw: Buffer;
  declare sizeBytes: number;
  declare receivedAt: CreationOptional<Date>;

  toSummary(): OutboxSummary {
    return {
      id: this.id,
      messageId: this.messageId,
      envelopeFrom: this.envelopeFrom,
      envelopeTo: this.envelopeTo,
      subject: this.subject,
      sizeBytes: this.sizeBytes,
      receivedAt: this.receivedAt.toISOString(),
    };
  }
}

export function initOutboxMessageModel(sequelize: Sequelize): typeof OutboxMessageModel {
  OutboxMessageModel.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      messageId: { type: DataTypes.STRING(998), allowNull: true },
      envelopeFrom: { type: DataTypes.STRING(320), allowNull: false },
      envelopeTo: { type: DataTypes.ARRAY(DataTypes.STRING(320)), allowNull: false },
      subject: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      raw: { type: DataTypes.BLOB, allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'outbox_messages', modelName: 'OutboxMessage', timestamps: false },
  );
  return OutboxMessageModel;
}
