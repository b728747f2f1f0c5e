import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";
import { materialRows0002 } from "../frozen/0002-material-rows";

// The materials library both engines read (shielding prediction, flat-blank mass and limits).
// Scalar properties are columns so they can be checked; the μ(B) curve and the per-value source
// tags are JSON. The five library rows are reference data the engines cannot work without, so
// the migration inserts them (as first written, frozen); the demo seed adds any that are missing.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  const now = sequelize.literal("now()");
  await qi.createTable("materials", {
    id: { type: DataTypes.STRING(40), primaryKey: true, allowNull: false },
    name: { type: DataTypes.STRING(200), allowNull: false },
    mu_initial: { type: DataTypes.DOUBLE, allowNull: false },
    mu_maximum: { type: DataTypes.DOUBLE, allowNull: false },
    saturation_t: { type: DataTypes.DOUBLE, allowNull: true },
    resistivity_ohm_m: { type: DataTypes.DOUBLE, allowNull: false },
    density_kg_m3: { type: DataTypes.DOUBLE, allowNull: false },
    mu_curve: { type: DataTypes.JSONB, allowNull: false },
    as_formed_factor: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
    source: { type: DataTypes.TEXT, allowNull: false },
    source_tags: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`
    alter table materials
      add constraint materials_mu_range check (mu_initial >= 1 and mu_maximum >= mu_initial),
      add constraint materials_positive check (resistivity_ohm_m > 0 and density_kg_m3 > 0 and (saturation_t is null or saturation_t > 0)),
      add constraint materials_as_formed check (as_formed_factor > 0 and as_formed_factor <= 1);`);
  await qi.bulkInsert(
    "materials",
    materialRows0002.map((r) => ({ ...r, mu_curve: JSON.stringify(r.mu_curve), source_tags: JSON.stringify(r.source_tags) })),
  );
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable("materials");
}
