import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare userId: string | null;
  declare action: string;
  declare recordType: string;
  declare recordId: string | null;
  declare detail: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: true },
        action: { type: DataTypes.STRING(80), allowNull: false },
        recordType: { type: DataTypes.STRING(40), allowNull: false },
        recordId: { type: DataTypes.STRING(64), allowNull: true },
        detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'audit_events', updatedAt: false },
    );
  }
}
