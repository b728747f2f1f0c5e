import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// The shop's default AQL (the planner's setting) and each order's own AQL, copied from the default
// when the order is placed. Both must be a column of the ISO 2859-1 / Z1.4 tables.
// The columns as they stand in this migration (an applied migration never changes with the code).
const columns = "0.01,0.015,0.025,0.04,0.065,0.1,0.15,0.25,0.4,0.65,1,1.5,2.5,4,6.5,10,15,25,40,65,100,150,250,400,650,1000";

export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await qi.addColumn("shop_settings", "default_aql", { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.0 });
  await sequelize.query(`alter table shop_settings add constraint shop_settings_default_aql check (default_aql in (${columns}))`);
  await qi.addColumn("orders", "aql", { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.0 });
  await sequelize.query(`alter table orders add constraint orders_aql check (aql in (${columns}))`);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.removeColumn("orders", "aql");
  await qi.removeColumn("shop_settings", "default_aql");
}
