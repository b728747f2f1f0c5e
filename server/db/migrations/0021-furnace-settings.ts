import type { QueryInterface, Sequelize } from "sequelize";

// The shop's hydrogen furnaces and each alloy's final-anneal window join the one-row shop
// settings. Seeded with the typical windows of domain.md section 5 [practice] and one placeholder
// furnace; the planner enters the shop's own. The values are written out here (a copy of
// shared/shop-floor/anneal.ts as it was) so that this migration's effect never changes.
const FURNACES = JSON.stringify([{ id: "H2-1", name: "Hydrogen furnace 1", maxLoad_kg: 250 }]);
const WINDOWS = JSON.stringify([
  {
    materialId: "ni80",
    peak_c: { min: 1100, max: 1180 },
    soak_min: { min: 120, max: 240 },
    dewPointMax_c: -40,
    coolingRate_c_per_h: { min: 100, max: 300 },
    source: "Typical final anneal of 80 % Ni-Fe-Mo [practice]; confirm with the producer's data and ASTM A753",
  },
  {
    materialId: "ni50",
    peak_c: { min: 1100, max: 1180 },
    soak_min: { min: 120, max: 240 },
    dewPointMax_c: -40,
    coolingRate_c_per_h: { min: 50, max: 500 },
    source: "As 80 % Ni-Fe [practice]; the wider cooling range reflects its lower sensitivity [memory]; confirm with the producer's data",
  },
]);

export async function up(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`alter table shop_settings add column furnaces jsonb not null default '[]', add column anneal_windows jsonb not null default '[]'`);
  await sequelize.query(`update shop_settings set furnaces = $1::jsonb, anneal_windows = $2::jsonb`, { bind: [FURNACES, WINDOWS] });
}

export async function down(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`alter table shop_settings drop column furnaces, drop column anneal_windows`);
}
