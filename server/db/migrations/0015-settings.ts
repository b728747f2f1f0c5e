import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// The shop's own details (one row: what documents print and who mails come from) and each
// organisation's paper size for the documents it downloads.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await qi.createTable("shop_settings", {
    id: { type: DataTypes.INTEGER, primaryKey: true, allowNull: false, defaultValue: 1 },
    name: { type: DataTypes.STRING(200), allowNull: false },
    address: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    email: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
    phone: { type: DataTypes.STRING(60), allowNull: false, defaultValue: "" },
    tax_id: { type: DataTypes.STRING(60), allowNull: false, defaultValue: "" },
    mail_from: { type: DataTypes.STRING(200), allowNull: false },
    quote_terms: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    updated_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal("now()") },
  });
  await sequelize.query(`alter table shop_settings add constraint shop_settings_one_row check (id = 1)`);
  await qi.bulkInsert("shop_settings", [
    {
      id: 1,
      name: "Fluxwright shield shop",
      mail_from: "Fluxwright <no-reply@fluxwright.test>",
      quote_terms:
        "Payment in advance by card. Prices exclude VAT and delivery. Lead time counts working days from payment. " +
        "Predicted attenuation is an engineering estimate, not a guarantee: the measured values on the lot's certificate rule.",
      updated_at: new Date(),
    },
  ]);
  await qi.addColumn("organizations", "paper_size", { type: DataTypes.STRING(10), allowNull: false, defaultValue: "A4" });
  await sequelize.query(`alter table organizations add constraint organizations_paper_size check (paper_size in ('A4','LETTER'))`);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.removeColumn("organizations", "paper_size");
  await qi.dropTable("shop_settings");
}
