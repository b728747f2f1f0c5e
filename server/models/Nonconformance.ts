import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { NonconformanceDisposition } from "../../shared/schemas/quality";

/** What went wrong with a rejected lot, its cause and what is done with it (its trail is in events). */
export class Nonconformance extends Model<InferAttributes<Nonconformance>, InferCreationAttributes<Nonconformance>> {
  declare id: CreationOptional<string>;
  declare number: CreationOptional<string>;
  declare lotId: string;
  declare round: number;
  declare description: string;
  declare cause: CreationOptional<string | null>;
  declare disposition: CreationOptional<NonconformanceDisposition | null>;
  declare customerConsent: CreationOptional<string | null>;
  declare status: CreationOptional<"open" | "closed">;
  declare openedById: string | null;
  declare closedById: CreationOptional<string | null>;
  declare closedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Nonconformance.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        // from the database default (NC- and a sequence)
        number: { type: DataTypes.STRING(20), allowNull: true },
        lotId: { type: DataTypes.UUID, allowNull: false },
        round: { type: DataTypes.SMALLINT, allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false },
        cause: { type: DataTypes.TEXT, allowNull: true },
        disposition: { type: DataTypes.STRING(20), allowNull: true },
        customerConsent: { type: DataTypes.TEXT, allowNull: true },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "open" },
        openedById: { type: DataTypes.UUID, allowNull: true },
        closedById: { type: DataTypes.UUID, allowNull: true },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "nonconformances", modelName: "Nonconformance" },
    );
  }
}
