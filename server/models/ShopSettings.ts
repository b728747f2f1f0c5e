import type { AnnealWindow, Furnace } from "../../shared/shop-floor/anneal";
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize, type Transaction } from "sequelize";

/** The shop's own details: what its documents print and who its mails come from (one row). */
export class ShopSettings extends Model<InferAttributes<ShopSettings>, InferCreationAttributes<ShopSettings>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare address: string;
  declare email: string;
  declare phone: string;
  declare taxId: string;
  declare mailFrom: string;
  declare quoteTerms: string;
  /** the hydrogen furnaces and their heaviest loads */
  declare furnaces: CreationOptional<Furnace[]>;
  /** each alloy's final-anneal window */
  declare annealWindows: CreationOptional<AnnealWindow[]>;
  /** the AQL each new order takes (a column of the sampling tables) */
  declare defaultAql: CreationOptional<number>;
  declare updatedById: string | null;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ShopSettings.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, defaultValue: 1 },
        name: { type: DataTypes.STRING(200), allowNull: false },
        address: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        email: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        phone: { type: DataTypes.STRING(60), allowNull: false, defaultValue: "" },
        taxId: { type: DataTypes.STRING(60), allowNull: false, defaultValue: "" },
        mailFrom: { type: DataTypes.STRING(200), allowNull: false },
        quoteTerms: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        furnaces: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        annealWindows: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        defaultAql: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.0 },
        updatedById: { type: DataTypes.UUID, allowNull: true },
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "shop_settings", modelName: "ShopSettings", createdAt: false },
    );
  }

  /** The row (the migration inserts it). */
  static async current(transaction?: Transaction): Promise<ShopSettings> {
    const row = await ShopSettings.findByPk(1, { transaction });
    if (!row) throw new Error("shop_settings has no row: run the migrations");
    return row;
  }
}
