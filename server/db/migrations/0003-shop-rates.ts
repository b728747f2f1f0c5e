import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// Shop rates as one versioned document per row: `data` is a whole PriceList (rates, stock
// sheets and forming limits together, validated by priceListSchema). One document rather than
// three tables because a quote must be re-priceable from exactly what it was priced with: it
// points to one version, and sheets and forming limits feed the price as much as the rates do.
// Every edit inserts the next version; rows are never changed (a trigger refuses it). The
// current list is the highest version.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await qi.createTable("price_lists", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    version: { type: DataTypes.INTEGER, allowNull: false, unique: true },
    /** which part the version changed: seed | price-list | stock-sheets | forming-limits */
    part: { type: DataTypes.STRING(40), allowNull: false },
    data: { type: DataTypes.JSONB, allowNull: false },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal("now()") },
  });
  await sequelize.query(`
    create function price_lists_append_only() returns trigger language plpgsql as $$
    begin raise exception 'price list versions are append-only'; end $$;
    create trigger price_lists_no_update before update or delete on price_lists
      for each row execute function price_lists_append_only();`);
}

export async function down(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`drop trigger if exists price_lists_no_update on price_lists; drop function if exists price_lists_append_only()`);
  await qi.dropTable("price_lists");
}
