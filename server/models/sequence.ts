import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Phase } from '../../shared/phase';
import type { Sequence as SequenceBody } from '../../shared/plan/sequence';

/** One saved version of a clinic's sequence for a phase; a save adds a version, runs keep theirs. */
export class Sequence extends Model<InferAttributes<Sequence>, InferCreationAttributes<Sequence>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare phase: Phase;
  declare version: number;
  declare steps: SequenceBody['steps'];
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Sequence.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        phase: { type: DataTypes.STRING(20), allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false },
        steps: { type: DataTypes.JSONB, allowNull: false },
        createdBy: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sequences', updatedAt: false },
    );
  }
}
