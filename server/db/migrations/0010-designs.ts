import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// Saved designs: a customer organisation's named configurations (the quote configuration's JSON).
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  const now = sequelize.literal("now()");
  await qi.createTable("designs", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    organization_id: { type: DataTypes.UUID, allowNull: false, references: { model: "organizations", key: "id" } },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    name: { type: DataTypes.STRING(120), allowNull: false },
    configuration: { type: DataTypes.JSONB, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await qi.addIndex("designs", ["organization_id", "updated_at"]);
  await sequelize.query(`create index designs_name_lower on designs (organization_id, lower(name))`);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable("designs");
}
