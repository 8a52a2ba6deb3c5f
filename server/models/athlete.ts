import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

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
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

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
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'athletes' },
    );
  }
}
