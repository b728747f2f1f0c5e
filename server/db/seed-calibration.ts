import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { MeasuredDesign, MeasuredLot } from "../../shared/calibration";
import { syntheticLots } from "../../shared/calibration/synthetic";
import { libraryMuOf } from "../../shared/calibration/fit";
import { materialLibrary } from "../../shared/physics/materials";

// The demo scenario's measured lots (invented: made by the engine from chosen parameters plus
// noise, never real data): two alloys and routes (rolled and seam-welded 80 % nickel-iron cans,
// bent 50 % nickel-iron boxes) with enough lots for the calibration to beat
// the library in cross-validation and for the control charts to give a capability. One lot of
// 80 % nickel-iron was re-annealed badly (it reads far low and was rejected) and one part was
// knocked after the anneal, so the page has outliers to show.

const can = (diameter: number, length: number, t: number, layers = 1): MeasuredDesign => ({
  shape: "cylinder", ends: "closed", method: "rolled", dimensions_mm: { diameter, length },
  layers: Array.from({ length: layers }, (_, i) => ({ material: "ni80", thickness_mm: t, ...(i < layers - 1 ? { gap_mm: 6 } : {}) })),
});
const box = (width: number, depth: number, height: number, t: number): MeasuredDesign => ({
  shape: "box", method: "bent", dimensions_mm: { width, depth, height }, layers: [{ material: "ni50", thickness_mm: t }],
});

/** Required attenuation as a customer would ask: a round figure some dB under what the shop reaches. */
const requiredUnder = (predicted_db: number) => Math.max(10, Math.floor((predicted_db - 6) / 2) * 2);

export function demoMeasuredLots(now = new Date()): MeasuredLot[] {
  const start = new Date(now.getTime() - 80 * 86_400_000).toISOString();
  const ni80 = syntheticLots({
    key: { material: "ni80", method: "rolled", construction: "closed-can" },
    mu_effective: 0.55 * libraryMuOf(materialLibrary, "ni80")!, ceiling_db: 62,
    designs: [can(40, 80, 1), can(80, 150, 0.5), can(30, 60, 1, 2)], frequencies_hz: [10, 60, 400],
    lots: 26, partsPerLot: 5, partNoise_db: 0.6, lotNoise_db: 1.1, requiredAttenuation_db: (_d, p) => requiredUnder(p),
    seed: 80, start, lotShifts: { 17: -14 }, numberPrefix: "L80",
  });
  ni80[17] = { ...ni80[17], disposition: "rejected", parts: ni80[17].parts.map((p) => ({ ...p, disposition: "rejected" })) };
  const knocked = ni80[9].parts[3];
  ni80[9].parts[3] = { ...knocked, measured_db: Math.round((knocked.measured_db - 11) * 100) / 100 };
  const ni50 = syntheticLots({
    key: { material: "ni50", method: "bent", construction: "box" },
    mu_effective: 0.7 * libraryMuOf(materialLibrary, "ni50")!, ceiling_db: 50,
    designs: [box(60, 50, 40, 1), box(120, 90, 60, 1.5), box(80, 80, 50, 0.8)], frequencies_hz: [10, 60, 150],
    lots: 22, partsPerLot: 4, partNoise_db: 0.8, lotNoise_db: 1.2, requiredAttenuation_db: (_d, p) => requiredUnder(p),
    seed: 50, start: new Date(now.getTime() - 75 * 86_400_000).toISOString(), numberPrefix: "L50",
  });
  // spread over the same weeks: one lot every three days or so
  const spaced = (lots: MeasuredLot[], days: number, offset: number) =>
    lots.map((l, i) => ({ ...l, decidedAt: new Date(now.getTime() - (offset + (lots.length - 1 - i) * days) * 86_400_000).toISOString() }));
  return [...spaced(ni80, 3, 1), ...spaced(ni50, 3.5, 2)];
}

/** Inserts the demo's measured lots when they are not there yet; the caller refits after the commit. */
export async function seedMeasuredLots(props: { sequelize: Sequelize; transaction: Transaction; now?: Date }): Promise<string[]> {
  const { sequelize, transaction } = props;
  const [have] = await sequelize.query<{ n: number }>("select count(*)::int as n from measured_lot_records where number like 'L80-%' or number like 'L50-%'", { type: QueryTypes.SELECT, transaction });
  if (have.n > 0) return [];
  const lots = demoMeasuredLots(props.now);
  for (const lot of lots) {
    const [row] = await sequelize.query<{ lot_id: string }>(
      `insert into measured_lot_records (number, disposition, decided_at, required_attenuation_db, design) values ($1, $2, $3, $4, $5) returning lot_id`,
      { type: QueryTypes.SELECT, transaction, bind: [lot.number, lot.disposition, lot.decidedAt, lot.requiredAttenuation_db, JSON.stringify(lot.parts[0].design)] },
    );
    const values = lot.parts.map((_, i) => `($1, $${i * 5 + 2}, $${i * 5 + 3}, $${i * 5 + 4}, $${i * 5 + 5}, $${i * 5 + 6})`).join(", ");
    await sequelize.query(`insert into measured_part_records (lot_id, serial, frequency_hz, applied_field_ut, orientation, attenuation_db) values ${values}`, {
      transaction, bind: [row.lot_id, ...lot.parts.flatMap((p) => [p.serial, p.frequency_hz, p.appliedField_uT, p.orientation ?? "transverse", p.measured_db])],
    });
  }
  return [`${lots.length} measured lots (two alloys)`];
}
