import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Measurement extends Model<InferAttributes<Measurement>, InferCreationAttributes<Measurement>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare injuryId: string;
  declare takenAt: Date;
  declare girthInjuredCm: number | null;
  declare girthOtherCm: number | null;
  declare girthLandmark: string | null;
  declare girthDistanceCm: number | null;
  declare kneeFlexionDeg: number | null;
  declare painNprs: number | null;
  declare bruiseLengthCm: number | null;
  declare bruiseWidthCm: number | null;
  declare skinfoldMm: number | null;
  declare notes: string | null;
  declare recordedBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // A fresh object per attribute: Sequelize writes each attribute's column name into its definition.
    const cm = () => ({ type: DataTypes.DOUBLE, allowNull: true });
    Measurement.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        injuryId: { type: DataTypes.UUID, allowNull: false },
        takenAt: { type: DataTypes.DATE, allowNull: false },
        girthInjuredCm: cm(),
        girthOtherCm: cm(),
        girthLandmark: { type: DataTypes.STRING(120), allowNull: true },
        girthDistanceCm: cm(),
        kneeFlexionDeg: { type: DataTypes.INTEGER, allowNull: true },
        painNprs: { type: DataTypes.INTEGER, allowNull: true },
        bruiseLengthCm: cm(),
        bruiseWidthCm: cm(),
        skinfoldMm: cm(),
        notes: { type: DataTypes.TEXT, allowNull: true },
        recordedBy: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'measurements' },
    );
  }
}
