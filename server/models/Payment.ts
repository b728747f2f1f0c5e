import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { centsColumn } from "./money";

/** Money received for an order ("payment") or paid back ("refund"); refunds are rows of their own. */
export class Payment extends Model<InferAttributes<Payment>, InferCreationAttributes<Payment>> {
  declare id: CreationOptional<string>;
  declare orderId: string;
  declare kind: "payment" | "refund";
  declare status: "succeeded" | "refunded";
  declare amountCents: number;
  declare currency: string;
  declare providerReference: string | null;
  declare checkoutSessionId: string | null;
  declare reason: string | null;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Payment.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        orderId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(10), allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false },
        amountCents: centsColumn("amountCents"),
        currency: { type: DataTypes.STRING(3), allowNull: false },
        providerReference: { type: DataTypes.STRING(255), allowNull: true, unique: true },
        checkoutSessionId: { type: DataTypes.STRING(255), allowNull: true },
        reason: { type: DataTypes.TEXT, allowNull: true },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "payments", modelName: "Payment", updatedAt: false },
    );
  }
}

/** Received and refunded cents of an order's payment rows. */
export function paymentTotals(rows: Payment[]): { paid: number; refunded: number } {
  let paid = 0;
  let refunded = 0;
  for (const p of rows) {
    if (p.kind === "payment") paid += p.amountCents;
    else refunded += p.amountCents;
  }
  return { paid, refunded };
}
