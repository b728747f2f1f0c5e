import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** An uploaded or generated file: drawings, mill certificates, furnace charts, documents. */
export class StoredFile extends Model<InferAttributes<StoredFile>, InferCreationAttributes<StoredFile>> {
  declare id: CreationOptional<string>;
  declare organizationId: string | null;
  declare uploadedById: string | null;
  declare purpose: string;
  declare filename: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare storageKey: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    StoredFile.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: true },
        uploadedById: { type: DataTypes.UUID, allowNull: true },
        purpose: { type: DataTypes.STRING(60), allowNull: false },
        filename: { type: DataTypes.STRING(255), allowNull: false },
        contentType: { type: DataTypes.STRING(120), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.STRING(64), allowNull: false },
        storageKey: { type: DataTypes.STRING(255), allowNull: false, unique: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "stored_files", modelName: "StoredFile" },
    );
  }
}
