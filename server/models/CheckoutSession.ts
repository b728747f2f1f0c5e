import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { centsColumn } from "./money";

/** A hosted checkout opened with the payment service for an order; its id is the service's. */
export class CheckoutSession extends Model<InferAttributes<CheckoutSession>, InferCreationAttributes<CheckoutSession>> {
  declare id: string;
  declare orderId: string;
  declare amountCents: number;
  declare currency: string;
  declare url: string;
  declare status: CreationOptional<"open" | "complete" | "expired">;
  declare idempotencyKey: string;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CheckoutSession.init(
      {
        id: { type: DataTypes.STRING(255), primaryKey: true },
        orderId: { type: DataTypes.UUID, allowNull: false },
        amountCents: centsColumn("amountCents"),
        currency: { type: DataTypes.STRING(3), allowNull: false },
        url: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: "open" },
        idempotencyKey: { type: DataTypes.STRING(120), allowNull: false, unique: true },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "checkout_sessions", modelName: "CheckoutSession" },
    );
  }
}
