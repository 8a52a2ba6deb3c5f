import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A message the local fake SMTP server received, kept whole (RFC 5322 source); never used in production. */
export class MailboxMessage extends Model<InferAttributes<MailboxMessage>, InferCreationAttributes<MailboxMessage>> {
  declare id: CreationOptional<string>;
  declare clinicId: string | null;
  declare messageId: string | null;
  declare envelopeFrom: string | null;
  declare recipients: string[];
  declare subject: string | null;
  declare raw: Buffer;
  declare byteSize: number;
  declare receivedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    MailboxMessage.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: true },
        messageId: { type: DataTypes.STRING(300), allowNull: true },
        envelopeFrom: { type: DataTypes.STRING(254), allowNull: true },
        recipients: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        subject: { type: DataTypes.STRING(500), allowNull: true },
        raw: { type: DataTypes.BLOB, allowNull: false },
        byteSize: { type: DataTypes.INTEGER, allowNull: false },
        receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'mailbox_messages', timestamps: false },
    );
  }
}
