import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// Invoices: one per paid order, numbered from their own sequence when the payment arrives.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`create sequence invoice_number_seq start 1001`);
  await qi.createTable("invoices", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    number: { type: DataTypes.INTEGER, allowNull: false, unique: true },
    order_id: { type: DataTypes.UUID, allowNull: false, unique: true, references: { model: "orders", key: "id" } },
    payment_id: { type: DataTypes.UUID, allowNull: false, references: { model: "payments", key: "id" } },
    amount_cents: { type: DataTypes.BIGINT, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    issued_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal("now()") },
  });
}

export async function down(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await qi.dropTable("invoices");
  await sequelize.query(`drop sequence if exists invoice_number_seq`);
}
