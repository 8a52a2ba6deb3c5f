import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Phase } from '../../shared/phase';
import type { Plan } from '../../shared/plan/build-plan';
import type { RunOutcome, RunStatus } from '../../shared/runs/log-entry';
import type { Screening } from '../../shared/runs/screening';

export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare injuryId: string;
  declare athleteId: string;
  declare therapistId: string;
  declare phase: Phase;
  declare status: RunStatus;
  declare outcome: RunOutcome | null;
  declare plan: Plan;
  declare sequenceId: string | null;
  declare sequenceVersion: number | null;
  declare screening: Screening | null;
  declare redFlags: string[] | null;
  declare startedAt: Date | null;
  declare endedAt: Date | null;
  declare lastActivityAt: CreationOptional<Date>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Run.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        injuryId: { type: DataTypes.UUID, allowNull: false },
        athleteId: { type: DataTypes.UUID, allowNull: false },
        therapistId: { type: DataTypes.UUID, allowNull: false },
        phase: { type: DataTypes.STRING(20), allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false },
        outcome: { type: DataTypes.STRING(24), allowNull: true },
        plan: { type: DataTypes.JSONB, allowNull: false },
        sequenceId: { type: DataTypes.UUID, allowNull: true },
        sequenceVersion: { type: DataTypes.INTEGER, allowNull: true },
        screening: { type: DataTypes.JSONB, allowNull: true },
        redFlags: { type: DataTypes.JSONB, allowNull: true },
        startedAt: { type: DataTypes.DATE, allowNull: true },
        endedAt: { type: DataTypes.DATE, allowNull: true },
        lastActivityAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'runs' },
    );
  }
}
