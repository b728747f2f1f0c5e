import {
  DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize, type Transaction,
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
  static current(options: { transaction?: Transaction } = {}) {
    return PriceListVersion.findOne({ order: [["version", "DESC"]], transaction: options.transaction });
  }

  /**
   * Holds the right to add the next version until the transaction ends. A row lock cannot do it:
   * a waiting saver would wake on the old newest row and collide on its version number. The
   * advisory lock is taken before the newest row is read, so each saver reads its predecessor's
   * version and writes the one after it.
   */
  static async lockForNextVersion(transaction: Transaction): Promise<void> {
    await PriceListVersion.sequelize!.query("select pg_advisory_xact_lock(hashtext('price_lists'))", { transaction });
  }
}
