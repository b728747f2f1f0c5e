/**
 * What the shop can make a blank from, said before anyone asks for a price: a blank larger than
 * every stock sheet the shop keeps (of its alloy and gauge), a gauge it does not stock, and a
 * part beyond the forming limits it works to. Pure: the caller passes the current stock list.
 */
import type { BlankResult } from "./index";
import type { Warning } from "./types";

/** Nickel-iron thicker than this is not practically formed (drawn or bent) [practice]. */
export const NICKEL_IRON_FORMING_LIMIT_MM = 3;

export interface StockSheetSize {
  materialId: string;
  thickness_mm: number;
  width_mm: number;
  length_mm: number;
}

const mm = (x: number) => `${+x.toFixed(1)} mm`;
const sameGauge = (a: number, b: number) => Math.abs(a - b) < 1e-6;

/** Every separate blank of the part (a can's wall and caps, a box and its lid), by name, with its footprint. */
function blanksOf(r: BlankResult): Array<{ name: string; length_mm: number; width_mm: number; size: string }> {
  if (r.method === "drawn") return [{ name: "disc blank", length_mm: r.blank.diameter_mm, width_mm: r.blank.diameter_mm, size: `Ø ${mm(r.blank.diameter_mm)}` }];
  if (r.method === "rolled")
    return [
      { name: "wall blank", length_mm: r.blank.length_mm, width_mm: r.blank.width_mm, size: `${mm(r.blank.length_mm)} × ${mm(r.blank.width_mm)}` },
      { name: "end disc", length_mm: r.endCaps[0].diameter_mm, width_mm: r.endCaps[0].diameter_mm, size: `Ø ${mm(r.endCaps[0].diameter_mm)}` },
    ];
  const out = [{ name: "cross-shaped blank", length_mm: r.blank.length_mm, width_mm: r.blank.width_mm, size: `${mm(r.blank.length_mm)} × ${mm(r.blank.width_mm)}` }];
  if (r.lid) out.push({ name: "lid blank", length_mm: r.lid.blank.length_mm, width_mm: r.lid.blank.width_mm, size: `${mm(r.lid.blank.length_mm)} × ${mm(r.lid.blank.width_mm)}` });
  return out;
}

const fits = (b: { length_mm: number; width_mm: number }, s: StockSheetSize) =>
  (b.length_mm <= s.length_mm && b.width_mm <= s.width_mm) || (b.length_mm <= s.width_mm && b.width_mm <= s.length_mm);

/**
 * Warnings for a computed blank against the shop's stock sheets and forming limits. `materialId`
 * null: no material chosen, so the blank is checked against every sheet the shop keeps.
 */
export function shopLimitWarnings(props: { result: BlankResult; thickness_mm: number; materialId: string | null; stockSheets: readonly StockSheetSize[]; bendRadius_mm?: number }): Warning[] {
  const { result, thickness_mm: t, materialId, stockSheets } = props;
  const warnings: Warning[] = [];
  const ofMaterial = materialId ? stockSheets.filter((s) => s.materialId === materialId) : stockSheets;
  const ofGauge = ofMaterial.filter((s) => sameGauge(s.thickness_mm, t));
  const what = materialId ? `${materialId} ${mm(t)}` : `${mm(t)} sheet`;
  if (materialId && ofMaterial.length > 0 && ofGauge.length === 0) {
    const gauges = [...new Set(ofMaterial.map((s) => s.thickness_mm))].sort((a, b) => a - b).map((g) => String(+g.toFixed(2)));
    warnings.push({ code: "GAUGE_NOT_STOCKED", message: `The shop keeps no ${materialId} sheet ${mm(t)} thick (it stocks ${gauges.join(", ")} mm): sheet for this part is bought in, which adds time and cost.` });
  }
  const sheets = ofGauge.length ? ofGauge : ofMaterial.length ? ofMaterial : stockSheets;
  if (sheets.length > 0) {
    const largest = sheets.reduce((a, s) => (s.width_mm * s.length_mm > a.width_mm * a.length_mm ? s : a));
    for (const b of blanksOf(result)) {
      if (!sheets.some((s) => fits(b, s))) {
        warnings.push({
          code: "LARGER_THAN_STOCK",
          message: `The ${b.name} (${b.size}) is larger than any stock sheet of ${what} the shop keeps (the largest is ${mm(largest.width_mm)} × ${mm(largest.length_mm)}): it needs a special sheet, a welded construction or a smaller part.`,
        });
      }
    }
  }
  const nickelIron = materialId ? materialId.startsWith("ni") : false;
  if (nickelIron && t > NICKEL_IRON_FORMING_LIMIT_MM) {
    warnings.push({ code: "BEYOND_FORMING_LIMIT", message: `${mm(t)} nickel-iron is beyond the forming limits the shop works to (about ${NICKEL_IRON_FORMING_LIMIT_MM} mm): use more, thinner layers.` });
  }
  // (too many draws for a drawn can: the engine's own DRAW_STAGES_EXCESSIVE warning says so)
  // the tightest inside bend nickel-iron takes without cracking: one sheet thickness [practice]
  const r = props.bendRadius_mm;
  if (result.method === "bent" && nickelIron && r !== undefined && r < t) {
    warnings.push({ code: "BEYOND_FORMING_LIMIT", message: `A bend radius under one sheet thickness (${mm(r)} for ${mm(t)}) is beyond the forming limits the shop works to for nickel-iron: it may crack at the bends.` });
  }
  return warnings;
}
