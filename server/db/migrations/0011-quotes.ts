import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// Quotes freeze everything a price rests on: the configuration, the prediction answer, the blanks,
// the whole price build-up and the price-list version it used, quantity, lead time and validity.
// Nothing of a quote changes after it is made (only the reminder stamp), so an order can trust it.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  const now = sequelize.literal("now()");
  await qi.createTable("quotes", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    number: { type: DataTypes.INTEGER, allowNull: false, unique: true },
    organization_id: { type: DataTypes.UUID, allowNull: false, references: { model: "organizations", key: "id" } },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    design_id: { type: DataTypes.UUID, allowNull: true, references: { model: "designs", key: "id" }, onDelete: "SET NULL" },
    requoted_from_id: { type: DataTypes.UUID, allowNull: true, references: { model: "quotes", key: "id" } },
    configuration: { type: DataTypes.JSONB, allowNull: false },
    prediction: { type: DataTypes.JSONB, allowNull: false },
    blank: { type: DataTypes.JSONB, allowNull: false },
    price: { type: DataTypes.JSONB, allowNull: false },
    price_list_id: { type: DataTypes.UUID, allowNull: false, references: { model: "price_lists", key: "id" } },
    price_list_version: { type: DataTypes.INTEGER, allowNull: false },
    quantity: { type: DataTypes.INTEGER, allowNull: false },
    unit_price_cents: { type: DataTypes.BIGINT, allowNull: false },
    total_cents: { type: DataTypes.BIGINT, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    mass_kg: { type: DataTypes.DOUBLE, allowNull: true },
    lead_time_working_days: { type: DataTypes.INTEGER, allowNull: false },
    validity_days: { type: DataTypes.INTEGER, allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    expiry_reminder_sent_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`
    alter table quotes
      add constraint quotes_positive check (quantity > 0 and unit_price_cents >= 0 and total_cents = unit_price_cents * quantity),
      add constraint quotes_currency check (currency ~ '^[A-Z]{3}$');`);
  await qi.addIndex("quotes", ["organization_id", "created_at"]);
  await qi.addIndex("quotes", ["expires_at"]);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable("quotes");
}
