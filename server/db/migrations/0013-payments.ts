import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// Payment: the checkout sessions opened with the payment service, the money received and paid
// back (one row each; refunds are their own rows), and every webhook event id processed, so a
// replayed event changes nothing.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  const now = sequelize.literal("now()");
  await qi.createTable("checkout_sessions", {
    id: { type: DataTypes.STRING(255), primaryKey: true, allowNull: false },
    order_id: { type: DataTypes.UUID, allowNull: false, references: { model: "orders", key: "id" } },
    amount_cents: { type: DataTypes.BIGINT, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    url: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: "open" },
    idempotency_key: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await qi.addIndex("checkout_sessions", ["order_id", "created_at"]);

  await qi.createTable("payments", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    order_id: { type: DataTypes.UUID, allowNull: false, references: { model: "orders", key: "id" } },
    kind: { type: DataTypes.STRING(10), allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false },
    amount_cents: { type: DataTypes.BIGINT, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    /** the payment service's id: payment intent for a payment, refund id for a refund */
    provider_reference: { type: DataTypes.STRING(255), allowNull: true, unique: true },
    checkout_session_id: { type: DataTypes.STRING(255), allowNull: true, references: { model: "checkout_sessions", key: "id" } },
    reason: { type: DataTypes.TEXT, allowNull: true },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`
    alter table payments
      add constraint payments_kind check ((kind = 'payment' and status = 'succeeded') or (kind = 'refund' and status = 'refunded')),
      add constraint payments_amount check (amount_cents > 0);
    create unique index payments_one_per_session on payments (checkout_session_id) where kind = 'payment';`);
  await qi.addIndex("payments", ["order_id", "created_at"]);

  await qi.createTable("webhook_events", {
    id: { type: DataTypes.STRING(255), primaryKey: true, allowNull: false },
    type: { type: DataTypes.STRING(100), allowNull: false },
    /** processed | ignored | duplicate-free outcomes: amount_mismatch, order_not_payable, unknown_session, not_paid */
    outcome: { type: DataTypes.STRING(40), allowNull: false },
    order_id: { type: DataTypes.UUID, allowNull: true, references: { model: "orders", key: "id" } },
    payload: { type: DataTypes.JSONB, allowNull: false },
    received_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await qi.addIndex("webhook_events", ["order_id"]);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable("webhook_events");
  await qi.dropTable("payments");
  await qi.dropTable("checkout_sessions");
}
