import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// Orders (one per quote; money copied from the quote) and the drawings attached to them.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  const now = sequelize.literal("now()");
  await qi.createTable("orders", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    number: { type: DataTypes.INTEGER, allowNull: false, unique: true },
    organization_id: { type: DataTypes.UUID, allowNull: false, references: { model: "organizations", key: "id" } },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    quote_id: { type: DataTypes.UUID, allowNull: false, unique: true, references: { model: "quotes", key: "id" } },
    status: { type: DataTypes.STRING(30), allowNull: false, defaultValue: "awaiting_payment" },
    purchase_order: { type: DataTypes.STRING(60), allowNull: true },
    delivery_address: { type: DataTypes.TEXT, allowNull: true },
    requested_date: { type: DataTypes.DATEONLY, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    quantity: { type: DataTypes.INTEGER, allowNull: false },
    unit_price_cents: { type: DataTypes.BIGINT, allowNull: false },
    total_cents: { type: DataTypes.BIGINT, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    required_attenuation_db: { type: DataTypes.DOUBLE, allowNull: false },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`
    alter table orders
      add constraint orders_status check (status in ('awaiting_payment','paid','released','shipped','cancelled','refunded')),
      add constraint orders_money check (quantity > 0 and total_cents = unit_price_cents * quantity);`);
  await qi.addIndex("orders", ["organization_id", "created_at"]);
  await qi.addIndex("orders", ["status", "created_at"]);

  await qi.createTable("order_files", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    order_id: { type: DataTypes.UUID, allowNull: false, references: { model: "orders", key: "id" }, onDelete: "CASCADE" },
    stored_file_id: { type: DataTypes.UUID, allowNull: false, unique: true, references: { model: "stored_files", key: "id" } },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await qi.addIndex("order_files", ["order_id"]);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable("order_files");
  await qi.dropTable("orders");
}
