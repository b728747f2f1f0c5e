import { configurationOf, type AdviceProblem, type AdviceResult, type ClosestDesign, type EvaluatedDesign } from "../../shared/advisor";
import type { ClosestDesignJson, DesignAdviceJson, DesignCandidateJson } from "../../shared/schemas/design-advice";

type Figures = Omit<DesignCandidateJson, "front">;

function figures(problem: AdviceProblem, e: EvaluatedDesign & { summary: string }): Figures {
  return {
    configuration: configurationOf(problem, e.design),
    attenuation_db: e.attenuation_db,
    band: e.band,
    ideal_db: e.ideal_db,
    unitPrice_cents: e.unitPrice_cents,
    currency: e.currency,
    mass_kg: e.mass_kg,
    outside_mm: e.outside_mm,
    layers: e.layers,
    saturationMargin: e.saturationMargin,
    keepsMargin: e.keepsMargin,
    summary: e.summary,
  };
}

const presentClosest = (problem: AdviceProblem, c: ClosestDesign): ClosestDesignJson => ({ ...figures(problem, c), lacks: c.lacks, shortfall: c.shortfall });

/** The search's answer as POST /api/design-advice sends it. */
export function presentDesignAdvice(
  problem: AdviceProblem,
  result: AdviceResult,
  shop: { minSaturationMargin: number; currency: string; priceListVersion: number },
): DesignAdviceJson {
  return {
    evaluated: result.evaluated,
    candidates: result.candidates.map((c) => ({ ...figures(problem, c), front: c.front })),
    recommended: result.recommended,
    reason: result.reason,
    ...(result.closest ? { closest: presentClosest(problem, result.closest) } : {}),
    search: result.search,
    minSaturationMargin: shop.minSaturationMargin,
    gapSteps_mm: [...problem.gapSteps_mm],
    gauges_mm: [...new Set(problem.options.map((o) => o.thickness_mm))].sort((a, b) => a - b),
    currency: shop.currency,
    priceListVersion: shop.priceListVersion,
    estimate: true,
  };
}
