import type { PaperSize } from "../../shared/schemas/shop-settings";
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export type OrganizationKind = "shop" | "customer";

export class Organization extends Model<InferAttributes<Organization>, InferCreationAttributes<Organization>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare kind: OrganizationKind;
  /** the paper its downloaded documents are laid out on */
  declare paperSize: CreationOptional<PaperSize>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Organization.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.STRING(200), allowNull: false },
        kind: { type: DataTypes.ENUM("shop", "customer"), allowNull: false },
        paperSize: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "A4" },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "organizations", modelName: "Organization" },
    );
  }
}
