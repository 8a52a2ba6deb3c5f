import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { NoteStatus } from '../../shared/notes/responses';

/** A run's session note in SOAP form: drafted by Mendstep, edited and submitted by the therapist, signed off by a supervisor. */
export class SessionNote extends Model<InferAttributes<SessionNote>, InferCreationAttributes<SessionNote>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare runId: string;
  declare subjective: string;
  declare objective: string;
  declare assessment: string;
  declare plan: string;
  declare status: CreationOptional<NoteStatus>;
  declare createdBy: string | null;
  declare updatedBy: string | null;
  declare submittedBy: CreationOptional<string | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare signedBy: CreationOptional<string | null>;
  declare signedAt: CreationOptional<Date | null>;
  declare signOffComment: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SessionNote.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        subjective: { type: DataTypes.TEXT, allowNull: false },
        objective: { type: DataTypes.TEXT, allowNull: false },
        assessment: { type: DataTypes.TEXT, allowNull: false },
        plan: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'draft' },
        createdBy: { type: DataTypes.UUID, allowNull: true },
        updatedBy: { type: DataTypes.UUID, allowNull: true },
        submittedBy: { type: DataTypes.UUID, allowNull: true },
        submittedAt: { type: DataTypes.DATE, allowNull: true },
        signedBy: { type: DataTypes.UUID, allowNull: true },
        signedAt: { type: DataTypes.DATE, allowNull: true },
        signOffComment: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'session_notes' },
    );
  }
}
