import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { LogEntryType } from '../../shared/runs/log-entry';

export class RunLogEntry extends Model<InferAttributes<RunLogEntry>, InferCreationAttributes<RunLogEntry>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare runId: string;
  declare idempotencyKey: string;
  declare bodyHash: string;
  declare seq: number | null;
  declare type: LogEntryType;
  declare stepIndex: number | null;
  declare kind: string | null;
  declare plannedSeconds: number | null;
  declare actualSeconds: number | null;
  declare at: Date;
  declare reason: string | null;
  declare detail: string | null;
  declare recordedBy: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RunLogEntry.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        idempotencyKey: { type: DataTypes.UUID, allowNull: false },
        bodyHash: { type: DataTypes.STRING(64), allowNull: false },
        seq: { type: DataTypes.INTEGER, allowNull: true },
        type: { type: DataTypes.STRING(24), allowNull: false },
        stepIndex: { type: DataTypes.INTEGER, allowNull: true },
        kind: { type: DataTypes.STRING(32), allowNull: true },
        plannedSeconds: { type: DataTypes.INTEGER, allowNull: true },
        actualSeconds: { type: DataTypes.INTEGER, allowNull: true },
        at: { type: DataTypes.DATE, allowNull: false },
        reason: { type: DataTypes.STRING(500), allowNull: true },
        detail: { type: DataTypes.STRING(500), allowNull: true },
        recordedBy: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'run_log_entries', updatedAt: false },
    );
  }
}
