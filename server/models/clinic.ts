import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Clinic extends Model<InferAttributes<Clinic>, InferCreationAttributes<Clinic>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare settings: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Clinic.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.STRING(160), allowNull: false },
        settings: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'clinics' },
    );
  }
}
