import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { QuoteConfiguration } from "../../shared/schemas/quote";
import type { User } from "./User";

/** A customer organisation's saved configuration, under a name. */
export class Design extends Model<InferAttributes<Design>, InferCreationAttributes<Design>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare createdById: string | null;
  declare name: string;
  declare configuration: QuoteConfiguration;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    Design.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        createdById: { type: DataTypes.UUID, allowNull: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        configuration: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "designs", modelName: "Design" },
    );
  }
}
