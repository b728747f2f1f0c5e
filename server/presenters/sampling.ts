import { SAMPLING_STANDARD, type SamplingPlan } from "../../shared/quality/sampling-plan";
import type { SamplingPlanJson } from "../../shared/schemas/sampling";

const inspectionWords = { normal: "normal inspection", tightened: "tightened inspection", reduced: "reduced inspection" } as const;

/** The contract's five fields first, then how the plan was found. */
export function presentSamplingPlan(plan: SamplingPlan): SamplingPlanJson {
  return {
    codeLetter: plan.codeLetter,
    sampleSize: plan.sampleSize,
    accept: plan.accept,
    reject: plan.reject,
    standard: `${SAMPLING_STANDARD}, ${inspectionWords[plan.inspection]}`,
    lotSize: plan.lotSize,
    aql: plan.aql,
    inspection: plan.inspection,
    planCodeLetter: plan.planCodeLetter,
    tableSampleSize: plan.tableSampleSize,
    everyPart: plan.everyPart,
    note: plan.note,
  };
}
