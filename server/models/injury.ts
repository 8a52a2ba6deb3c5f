import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Phase } from '../../shared/phase';
import type { CriterionResult } from '../../shared/clinical/return-to-activity';

export type StoredPhaseOverride = { phase: Phase; reason: string; by: string; at: string };
/** How the injury was closed: the return-to-activity check as it stood at closing. */
export type StoredClosure = {
  closedBy: string;
  allMet: boolean;
  criteria: CriterionResult[];
  measurement: { id: string | null; takenAt: string } | null;
  reason: string | null;
};

export class Injury extends Model<InferAttributes<Injury>, InferCreationAttributes<Injury>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare athleteId: string;
  declare region: string;
  declare side: 'left' | 'right';
  declare mechanismKind: string;
  declare mechanism: string | null;
  declare injuredAt: Date;
  declare haematomaType: CreationOptional<string>;
  declare previousQuadricepsInjury: CreationOptional<boolean>;
  declare kneeEffusion: CreationOptional<boolean>;
  declare treatmentStartedAt: Date | null;
  declare status: CreationOptional<'open' | 'closed'>;
  declare closedAt: Date | null;
  declare phaseOverride: StoredPhaseOverride | null;
  declare createdBy: string | null;
  declare nextRecheckAt: CreationOptional<Date | null>;
  declare recheckSetBy: CreationOptional<string | null>;
  declare reinjuryOfId: CreationOptional<string | null>;
  declare closure: CreationOptional<StoredClosure | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Injury.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        athleteId: { type: DataTypes.UUID, allowNull: false },
        region: { type: DataTypes.STRING(40), allowNull: false },
        side: { type: DataTypes.STRING(5), allowNull: false },
        mechanismKind: { type: DataTypes.STRING(20), allowNull: false },
        mechanism: { type: DataTypes.STRING(500), allowNull: true },
        injuredAt: { type: DataTypes.DATE, allowNull: false },
        haematomaType: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'not-known' },
        previousQuadricepsInjury: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        kneeEffusion: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        treatmentStartedAt: { type: DataTypes.DATE, allowNull: true },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'open' },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        phaseOverride: { type: DataTypes.JSONB, allowNull: true },
        createdBy: { type: DataTypes.UUID, allowNull: true },
        nextRecheckAt: { type: DataTypes.DATE, allowNull: true },
        recheckSetBy: { type: DataTypes.UUID, allowNull: true },
        reinjuryOfId: { type: DataTypes.UUID, allowNull: true },
        closure: { type: DataTypes.JSONB, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'injuries' },
    );
  }
}
