import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { OutboundStatus, StoredAttachment } from '../../shared/mail/outbox';

/** A message waiting in (or sent from) the outbox; written in the same transaction as what caused it. */
export class OutboundEmail extends Model<InferAttributes<OutboundEmail>, InferCreationAttributes<OutboundEmail>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare kind: string;
  declare dedupeKey: string | null;
  declare toAddress: string;
  declare subject: string;
  declare text: string;
  declare html: string | null;
  declare attachments: CreationOptional<StoredAttachment[]>;
  declare messageId: string;
  declare status: CreationOptional<OutboundStatus>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: CreationOptional<Date>;
  declare discardAfter: Date | null;
  declare lastError: CreationOptional<string | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    OutboundEmail.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        dedupeKey: { type: DataTypes.STRING(200), allowNull: true },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        html: { type: DataTypes.TEXT, allowNull: true },
        attachments: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        messageId: { type: DataTypes.STRING(300), allowNull: false },
        status: { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        discardAfter: { type: DataTypes.DATE, allowNull: true },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'outbound_emails' },
    );
  }
}
