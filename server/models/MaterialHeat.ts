import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { StoredFile } from "./StoredFile";

/** A heat of sheet as received: the mill's heat number, alloy, gauge, supplier, quantity and mill certificate. */
export class MaterialHeat extends Model<InferAttributes<MaterialHeat>, InferCreationAttributes<MaterialHeat>> {
  declare id: CreationOptional<string>;
  declare heatNumber: string;
  declare materialId: string;
  declare thicknessMm: number;
  declare supplier: string;
  declare quantity: number;
  declare unit: "sheets" | "kg";
  /** YYYY-MM-DD */
  declare receivedOn: CreationOptional<string>;
  declare receivedById: string | null;
  declare millCertificateFileId: CreationOptional<string | null>;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare millCertificate?: NonAttribute<StoredFile | null>;

  static initModel(sequelize: Sequelize) {
    MaterialHeat.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        heatNumber: { type: DataTypes.STRING(40), allowNull: false },
        materialId: { type: DataTypes.STRING(40), allowNull: false },
        thicknessMm: { type: DataTypes.DOUBLE, allowNull: false, field: "thickness_mm" },
        supplier: { type: DataTypes.STRING(200), allowNull: false },
        quantity: { type: DataTypes.DOUBLE, allowNull: false },
        unit: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "sheets" },
        receivedOn: { type: DataTypes.DATEONLY, allowNull: false, defaultValue: DataTypes.NOW },
        receivedById: { type: DataTypes.UUID, allowNull: true },
        millCertificateFileId: { type: DataTypes.UUID, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "material_heats", modelName: "MaterialHeat" },
    );
  }
}
