import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { UploadKind } from '../../shared/uploads/uploads';

/** An uploaded file's record; the bytes live in the storage driver under `storageKey`. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<string>;
  declare clinicId: string;
  declare kind: UploadKind;
  declare measurementId: string | null;
  declare injuryId: string | null;
  declare athleteId: string;
  declare storageKey: string;
  declare contentType: string;
  declare byteSize: number;
  declare sha256: string;
  declare originalName: string | null;
  declare uploadedBy: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Upload.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        clinicId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(24), allowNull: false },
        measurementId: { type: DataTypes.UUID, allowNull: true },
        injuryId: { type: DataTypes.UUID, allowNull: true },
        athleteId: { type: DataTypes.UUID, allowNull: false },
        storageKey: { type: DataTypes.STRING(300), allowNull: false },
        contentType: { type: DataTypes.STRING(100), allowNull: false },
        byteSize: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.STRING(64), allowNull: false },
        originalName: { type: DataTypes.STRING(255), allowNull: true },
        uploadedBy: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'uploads', updatedAt: false },
    );
  }
}
