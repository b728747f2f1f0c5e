// Cable holes and their collars (chimneys). A collar of length L round a hole of diameter d is a
// tube below cut-off: the field that enters it decays as exp(−j·L/a), a = d/2. Where the collar
// points relative to the field is rarely known at the design stage, so the weak case is taken:
// j = 2.405 (field along the collar) for a high-μ collar, 1.841 (field across it) for a
// conducting one at AC; the collar is of the innermost layer's material. [derived]

import type { PredictionWarning } from "./saturation";
import { collarAttenuation_db, collarLengthFor_mm } from "./thin";

export interface HoleInput {
  diameter_mm: number;
  /** 0 or absent: a plain hole */
  collarLength_mm?: number;
}

/** One cable hole and its collar, in the order given. */
export interface HoleResult {
  index: number;
  diameter_mm: number;
  collarLength_mm: number;
  /** the collar's own attenuation in the weak direction */
  collarAttenuation_db: number;
  /** the collar length whose own attenuation reaches the as-built walls' figure */
  neededCollarLength_mm: number;
  /** the decay constant j used for this collar (weak case) */
  decayRoot: number;
}

/** A hole is reported as limiting the shield when it costs at least this much of the walls' figure. */
const HOLE_LIMITED_DB = 1;

export function holeResults(holes: HoleInput[], wall_db: number, rootFor: (diameter_mm: number) => number): HoleResult[] {
  return holes.map((h, index) => {
    const collarLength_mm = h.collarLength_mm ?? 0;
    const root = rootFor(h.diameter_mm);
    return {
      index,
      diameter_mm: h.diameter_mm,
      collarLength_mm,
      collarAttenuation_db: collarAttenuation_db(collarLength_mm, h.diameter_mm, root),
      neededCollarLength_mm: collarLengthFor_mm(wall_db, h.diameter_mm, root),
      decayRoot: root,
    };
  });
}

/**
 * The holes' leak beside the walls, as 1/|S| to add:
 *   Σ_i (A_hole,i / A_wall)·exp(−j·L_i/a_i)
 * with A_wall the innermost layer's inside surface. The area ratio stands for the share of the
 * enclosure's surface the hole replaces (a plain hole, L = 0, lets through its share of the
 * outside field; a small hole in a large shield then costs little); the collar's decay
 * multiplies it. Leaks are added in phase, the worst case. A collar long enough to reach the
 * walls' figure on its own costs under 0.1 dB, so the needed length is a length with margin.
 * An estimate: the real leakage depends on where the hole sits in the field. [derived]
 */
export function holeLeak(holes: HoleResult[], wallArea_mm2: number): number {
  return holes.reduce((sum, h) => {
    const share = Math.min(1, (Math.PI * h.diameter_mm ** 2) / 4 / wallArea_mm2);
    return sum + share * Math.exp(-(h.collarAttenuation_db * Math.LN10) / 20);
  }, 0);
}

const fmtMm = (x: number) => String(+x.toPrecision(3));
/** A length to ask for: rounded up (0.1 mm below 100 mm, else whole mm), so asking for it clears the warning. */
export const roundUpLength_mm = (x: number): number => (x < 100 ? +(Math.ceil(x * 10) / 10).toFixed(1) : Math.ceil(x));

export function holeWarnings(holes: HoleResult[], wall_db: number, A: number): PredictionWarning[] {
  const out: PredictionWarning[] = [];
  for (const h of holes) {
    if (h.collarLength_mm >= h.neededCollarLength_mm) continue;
    const size = `Hole ${h.index + 1} (Ø ${fmtMm(h.diameter_mm)} mm)`;
    const have = h.collarLength_mm > 0 ? `its ${fmtMm(h.collarLength_mm)} mm collar gives about ${h.collarAttenuation_db.toFixed(0)} dB` : "it has no collar";
    out.push({
      code: "SHORT_COLLAR",
      message: `${size}: ${have}, short of the ${wall_db.toFixed(0)} dB the built walls are expected to give. Make the collar at least ${roundUpLength_mm(h.neededCollarLength_mm)} mm long (${fmtMm(h.neededCollarLength_mm / h.diameter_mm)} hole diameters), or the hole limits the shield.`,
    });
  }
  if (holes.length && wall_db - A >= HOLE_LIMITED_DB)
    out.push({
      code: "HOLE_LIMITED",
      message: `The cable hole${holes.length === 1 ? "" : "s"} limit${holes.length === 1 ? "s" : ""} the shield: with ${holes.length === 1 ? "it" : "them"} the estimate is ${A.toFixed(1)} dB instead of the walls' ${wall_db.toFixed(1)} dB. Longer collars bring it back.`,
    });
  return out;
}
