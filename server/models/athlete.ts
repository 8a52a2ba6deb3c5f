import { DataTypes, Model, QueryTypes, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize, type Transaction } from 'sequelize';
import { AppError } from '../errors';

export const athleteErasedMessage = "This athlete's personal data was erased: nothing new can be recorded for them.";

const erasedAtOf = {
  athleteId: 'SELECT erased_at FROM athletes WHERE id = :id',
  injuryId: 'SELECT a.erased_at FROM injuries i JOIN athletes a ON a.id = i.athlete_id WHERE i.id = :id',
  runId: 'SELECT a.erased_at FROM runs r JOIN athletes a ON a.id = r.athlete_id WHERE r.id = :id',
} as const;

export class Athlete extends Model<InferAttributes<Athlete>, InferCreationAttributes<Athlete>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare name: string;
  declare yearOfBirth: number;
  declare sport: string;
  declare position: string | null;
  declare email: string | null;
  declare consentToTreatment: CreationOptional<boolean>;
  declare consentRecordedBy: string | null;
  declare consentRecordedAt: Date | null;
  declare notes: string | null;
  declare guardianName: CreationOptional<string | null>;
  declare guardianConsentRecordedBy: CreationOptional<string | null>;
  declare guardianConsentRecordedAt: CreationOptional<Date | null>;
  /** Set when the athlete used the opt-out link of an e-mail: no further e-mails go to them. */
  declare emailOptedOutAt: CreationOptional<Date | null>;
  /** Set when an admin erased the athlete's personal data; the record stays for the clinic's figures. */
  declare erasedAt: CreationOptional<Date | null>;
  declare erasedBy: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /**
   * Erased athletes get no new clinical records (docs/decisions/0090-athlete-export-and-erasure.md): the models' beforeCreate
   * hooks call this, so every path that adds an injury, run, measurement, file or note is covered at once.
   */
  static async refuseIfErased(link: { athleteId: string } | { injuryId: string } | { runId: string }, transaction?: Transaction | null): Promise<void> {
    const [key, id] = Object.entries(link)[0] as [keyof typeof erasedAtOf, string];
    const rows = await Athlete.sequelize!.query<{ erased_at: Date | null }>(erasedAtOf[key], { replacements: { id }, type: QueryTypes.SELECT, transaction: transaction ?? undefined });
    if (rows[0]?.erased_at) throw AppError.conflict(athleteErasedMessage, 'athlete_erased');
  }

  static initModel(sequelize: Sequelize) {
    Athlete.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        yearOfBirth: { type: DataTypes.INTEGER, allowNull: false },
        sport: { type: DataTypes.STRING(80), allowNull: false },
        position: { type: DataTypes.STRING(80), allowNull: true },
        email: { type: DataTypes.STRING(254), allowNull: true },
        consentToTreatment: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        consentRecordedBy: { type: DataTypes.UUID, allowNull: true },
        consentRecordedAt: { type: DataTypes.DATE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        guardianName: { type: DataTypes.STRING(120), allowNull: true },
        guardianConsentRecordedBy: { type: DataTypes.UUID, allowNull: true },
        guardianConsentRecordedAt: { type: DataTypes.DATE, allowNull: true },
        emailOptedOutAt: { type: DataTypes.DATE, allowNull: true },
        erasedAt: { type: DataTypes.DATE, allowNull: true },
        erasedBy: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'athletes' },
    );
  }
}
