/**
 * Deep-drawn cup (one closed end): blank diameter by equal mid-surface areas, and the draw
 * stages the press needs.
 *
 * Mid-surface dimensions: d = inside diameter + T, h = inside height + trim + T/2,
 * r = inside corner radius + T/2. Bottom flat disc + quarter torus (Pappus) + cylinder wall:
 *   π/4·D² = π(d/2 − r)² + 2π((d/2 − r) + 2r/π)(πr/2) + πd(h − r)
 *   ⇒ D = √(d² + 4dh − (8 − 2π)·d·r + (12 − 4π)·r²)          [derived]
 * Sharp corner (r = 0): D = √(d² + 4dh), the die-design handbooks' form. [pub]
 * Thickness is taken as unchanged through the draw (thinning at the corner and thickening at
 * the rim roughly cancel), which is why the trim allowance is needed at all.
 */
import type { FormingLimits } from "../schemas/pricing";
import { FabricationInputError, requireNonNegative, requirePositive, type Warning } from "./types";

export interface DrawLimits {
  /** limiting first-draw ratio D/d₁, 1.8–2.0 [practice] */
  firstDrawRatio: number;
  /** limiting redraw ratio dᵢ₋₁/dᵢ, 1.2–1.4 [practice] */
  redrawRatio: number;
  /** nickel-iron work-hardens: process anneal between draws [practice] */
  processAnnealBetweenDraws: boolean;
}

/** Defaults mid-range of the trade's bands [practice]; nickel-iron anneals between draws. */
export const DEFAULT_DRAW_LIMITS: DrawLimits = { firstDrawRatio: 1.9, redrawRatio: 1.3, processAnnealBetweenDraws: true };

/** More stages than this and a rolled, seam-welded can is usually cheaper [practice]. */
export const MAX_REASONABLE_DRAW_STAGES = 4;

export interface DrawnCupInput {
  insideDiameter_mm: number;
  insideHeight_mm: number;
  thickness_mm: number;
  /** inside corner radius between bottom and wall; 0 = sharp */
  cornerRadius_mm?: number;
  /** added to the height before the blank is sized, trimmed off after the last draw */
  trim_mm?: number;
  limits?: DrawLimits | FormingLimits;
}

export interface DrawStage {
  stage: number;
  /** punch diameter = inside diameter of the cup after this stage */
  punchDiameter_mm: number;
  /** mean (mid-surface) diameter after this stage */
  meanDiameter_mm: number;
  /** reduction ratio of this stage on mean diameters: D/d₁, then dᵢ₋₁/dᵢ */
  ratio: number;
  /** a process anneal follows this stage */
  annealAfter: boolean;
}

export interface DrawnCupResult {
  blankDiameter_mm: number;
  /** blank area = cup mid-surface area */
  area_mm2: number;
  mean: { d_mm: number; h_mm: number; r_mm: number };
  /** overall D/d on mean diameters */
  drawRatio: number;
  drawStages: DrawStage[];
  processAnneals: number;
  warnings: Warning[];
}

/** Blank diameter from mid-surface d, h, r (all mm). */
export function cupBlankDiameter(d: number, h: number, r = 0): number {
  return Math.sqrt(d * d + 4 * d * h - (8 - 2 * Math.PI) * d * r + (12 - 4 * Math.PI) * r * r);
}

/** Mid-surface area of the cup: disc + quarter torus + wall (the closed form before the square root). */
export function cupMidSurfaceArea(d: number, h: number, r = 0): number {
  const rc = d / 2 - r; // radius of the flat bottom
  return Math.PI * rc * rc + 2 * Math.PI * (rc + (2 * r) / Math.PI) * ((Math.PI * r) / 2) + Math.PI * d * (h - r);
}

/**
 * Stages: the first draw goes as far as the first-draw limit allows; the remaining reduction
 * d₁ → d is split evenly over the fewest redraws that stay within the redraw limit (even
 * splitting keeps every redraw below the limit instead of leaving one near-limit stage).
 */
export function planDrawStages(blankDiameter_mm: number, meanDiameter_mm: number, thickness_mm: number, limits: DrawLimits): DrawStage[] {
  const { firstDrawRatio: b1, redrawRatio: br } = limits;
  if (!(b1 > 1) || !(br > 1)) throw new FabricationInputError("limits", "Draw ratio limits must be more than 1.");
  const total = blankDiameter_mm / meanDiameter_mm;
  const means: number[] = [];
  // 1e-12 guards a ratio that equals the limit up to rounding.
  if (total <= b1 * (1 + 1e-12)) {
    means.push(meanDiameter_mm);
  } else {
    const d1 = blankDiameter_mm / b1;
    const redraws = Math.ceil(Math.log(d1 / meanDiameter_mm) / Math.log(br) - 1e-12);
    const step = Math.pow(d1 / meanDiameter_mm, 1 / redraws);
    means.push(d1);
    for (let i = 1; i < redraws; i++) means.push(d1 / Math.pow(step, i));
    means.push(meanDiameter_mm);
  }
  return means.map((dm, i) => ({
    stage: i + 1,
    punchDiameter_mm: dm - thickness_mm,
    meanDiameter_mm: dm,
    ratio: (i === 0 ? blankDiameter_mm : means[i - 1]) / dm,
    // the last draw is followed by the final hydrogen anneal, not a process anneal
    annealAfter: limits.processAnnealBetweenDraws && i < means.length - 1,
  }));
}

export function drawnCup(input: DrawnCupInput): DrawnCupResult {
  const { insideDiameter_mm: di, insideHeight_mm: hi, thickness_mm: t } = input;
  const ri = input.cornerRadius_mm ?? 0;
  const trim = input.trim_mm ?? 0;
  requirePositive(di, "dimensions_mm.diameter");
  requirePositive(hi, "dimensions_mm.length");
  requirePositive(t, "thickness_mm");
  requireNonNegative(ri, "cornerRadius_mm");
  requireNonNegative(trim, "trim_mm");
  if (ri > di / 2) throw new FabricationInputError("cornerRadius_mm", "Corner radius must be at most half the inside diameter.");
  if (ri > hi) throw new FabricationInputError("cornerRadius_mm", "Corner radius must be at most the cup's inside height.");
  if (t >= di) throw new FabricationInputError("thickness_mm", "Sheet thickness must be less than the inside diameter.");

  const d = di + t;
  const h = hi + trim + t / 2;
  const r = ri > 0 ? ri + t / 2 : 0;
  const D = cupBlankDiameter(d, h, r);
  const limits = input.limits ?? DEFAULT_DRAW_LIMITS;
  const drawStages = planDrawStages(D, d, t, limits);
  const warnings: Warning[] = [];
  if (ri === 0) {
    warnings.push({ code: "CORNER_RADIUS_SHARP", message: "No corner radius given: blank sized for a sharp corner (slightly large); a drawn cup needs a punch radius of several thicknesses." });
  }
  if (drawStages.length > MAX_REASONABLE_DRAW_STAGES) {
    warnings.push({
      code: "DRAW_STAGES_EXCESSIVE",
      message: `${drawStages.length} draw stages needed (D/d = ${(D / d).toFixed(2)}), beyond the forming limits the shop works to (${MAX_REASONABLE_DRAW_STAGES} draws): a rolled and seam-welded can with welded end caps suits this depth.`,
    });
  }
  return {
    blankDiameter_mm: D,
    area_mm2: (Math.PI * D * D) / 4,
    mean: { d_mm: d, h_mm: h, r_mm: r },
    drawRatio: D / d,
    drawStages,
    processAnneals: drawStages.filter((s) => s.annealAfter).length,
    warnings,
  };
}
