import { DataTypes, Model, literal, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { OrderStatus } from "../../shared/schemas/order";
import { centsColumn } from "./money";
import type { Organization } from "./Organization";
import type { Quote } from "./Quote";
import type { User } from "./User";

/** A customer's order of one quote; the money is the quote's, copied so the order stands alone. */
export class Order extends Model<InferAttributes<Order>, InferCreationAttributes<Order>> {
  declare id: CreationOptional<string>;
  /** from the document sequence, assigned by the insert */
  declare number: CreationOptional<number>;
  declare organizationId: string;
  declare createdById: string | null;
  declare quoteId: string;
  declare status: CreationOptional<OrderStatus>;
  declare purchaseOrder: string | null;
  declare deliveryAddress: string | null;
  /** YYYY-MM-DD */
  declare requestedDate: string | null;
  declare notes: string | null;
  declare quantity: number;
  declare unitPriceCents: number;
  declare totalCents: number;
  declare currency: string;
  declare requiredAttenuationDb: number;
  /** the AQL its lots are sampled at: the shop's default when the order was placed */
  declare aql: CreationOptional<number>;
  declare paidAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare organization?: NonAttribute<Organization>;
  declare quote?: NonAttribute<Quote>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    Order.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        number: { type: DataTypes.INTEGER, allowNull: false, unique: true, defaultValue: literal("nextval('order_number_seq')") },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        createdById: { type: DataTypes.UUID, allowNull: true },
        quoteId: { type: DataTypes.UUID, allowNull: false, unique: true },
        status: { type: DataTypes.STRING(30), allowNull: false, defaultValue: "awaiting_payment" },
        purchaseOrder: { type: DataTypes.STRING(60), allowNull: true },
        deliveryAddress: { type: DataTypes.TEXT, allowNull: true },
        requestedDate: { type: DataTypes.DATEONLY, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        quantity: { type: DataTypes.INTEGER, allowNull: false },
        unitPriceCents: centsColumn("unitPriceCents"),
        totalCents: centsColumn("totalCents"),
        currency: { type: DataTypes.STRING(3), allowNull: false },
        requiredAttenuationDb: { type: DataTypes.DOUBLE, allowNull: false, field: "required_attenuation_db" },
        aql: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.0 },
        paidAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "orders", modelName: "Order" },
    );
  }
}
