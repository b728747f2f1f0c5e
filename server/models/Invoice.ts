import { DataTypes, Model, literal, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { centsColumn } from "./money";

/** The invoice of a paid order, numbered when the payment arrived. */
export class Invoice extends Model<InferAttributes<Invoice>, InferCreationAttributes<Invoice>> {
  declare id: CreationOptional<string>;
  /** from the document sequence, assigned by the insert */
  declare number: CreationOptional<number>;
  declare orderId: string;
  declare paymentId: string;
  declare amountCents: number;
  declare currency: string;
  declare issuedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Invoice.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        number: { type: DataTypes.INTEGER, allowNull: false, unique: true, defaultValue: literal("nextval('invoice_number_seq')") },
        orderId: { type: DataTypes.UUID, allowNull: false, unique: true },
        paymentId: { type: DataTypes.UUID, allowNull: false },
        amountCents: centsColumn("amountCents"),
        currency: { type: DataTypes.STRING(3), allowNull: false },
        issuedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: "invoices", modelName: "Invoice", timestamps: false },
    );
  }
}
