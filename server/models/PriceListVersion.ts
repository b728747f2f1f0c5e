import {
  DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize,
} from "sequelize";
import type { PriceList } from "../../shared/schemas/pricing";
import type { ShopRatePart } from "../../shared/schemas/shop-rates";
import type { User } from "./User";

/** One version of the shop's price list, stock sheets and forming limits; never edited, only superseded. */
export class PriceListVersion extends Model<InferAttributes<PriceListVersion>, InferCreationAttributes<PriceListVersion>> {
  declare id: CreationOptional<string>;
  declare version: number;
  declare part: ShopRatePart;
  declare data: PriceList;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    PriceListVersion.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        version: { type: DataTypes.INTEGER, allowNull: false, unique: true },
        part: { type: DataTypes.STRING(40), allowNull: false },
        data: { type: DataTypes.JSONB, allowNull: false },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "price_lists", modelName: "PriceListVersion", updatedAt: false },
    );
  }

  /** The highest version: the list quotes are priced with now. */
  static current(options: { transaction?: import("sequelize").Transaction; lock?: boolean } = {}) {
    return PriceListVersion.findOne({ order: [["version", "DESC"]], transaction: options.transaction, lock: options.lock ? options.transaction?.LOCK.UPDATE : undefined });
  }
}
