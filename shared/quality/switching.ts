// The switching rules between normal, tightened and reduced inspection, as a pure function of the
// history of lots inspected under one AQL (the caller groups the history, e.g. per alloy and route).
// ISO 2859-1:1999 clause 9 (the same rules as ANSI/ASQ Z1.4 §8 except normal → reduced, where the
// 1999 edition's switching score replaces Z1.4's limit numbers):
//   - start on normal inspection;
//   - normal → tightened when 2 of 5 or fewer consecutive lots are not accepted on original inspection;
//   - tightened → normal when 5 consecutive lots are accepted on original inspection;
//   - normal → reduced when the switching score reaches 30, production is at a steady rate and the
//     responsible authority approves reduced inspection. The score starts at 0 with normal inspection;
//     per lot, when the plan's Ac is 2 or more, +3 if the lot would also have been accepted at the AQL
//     one step tighter (same sample, the next lower AQL column), else back to 0; when Ac is 0 or 1,
//     +2 if the lot is accepted, else back to 0;
//   - reduced → normal when a lot is not accepted, when a reduced plan's count falls between Ac and Re
//     (lot accepted, Table II-C), when production becomes irregular or delayed, or when the
//     authority asks for normal inspection;
//   - discontinue when 5 lots in all are not accepted during one spell of tightened inspection;
//     resume (on tightened) only after the supplier's corrective action is recorded.
// Resubmitted lots do not count: only original inspection does.

import { judgeLot, samplingPlan, type LotDecision, type SamplingPlan } from "./sampling-plan";
import { aqlColumn, aqlLabel, AQL_COLUMNS, tableCell, type Inspection } from "./sampling-tables";

export type SwitchingState = Inspection | "discontinued";

export type SwitchingEntry =
  | {
      kind: "lot";
      /** shown in the reasons, e.g. the lot number */
      label: string;
      lotSize: number;
      /** nonconforming parts (or nonconformities) found in the sample */
      nonconforming: number;
      /** a lot submitted again after rejection: does not count for switching */
      resubmitted?: boolean;
      /** production was at a steady rate when this lot was made (default true) */
      productionSteady?: boolean;
    }
  /** production irregular or delayed, or the authority asks for normal inspection: leaves reduced */
  | { kind: "normal-required"; label: string }
  /** the supplier's corrective action after discontinuation: inspection resumes on tightened */
  | { kind: "corrective-action"; label: string };

export interface SwitchingStep {
  label: string;
  /** the state this entry was inspected under */
  state: SwitchingState;
  plan: SamplingPlan | null;
  decision: LotDecision | null;
  switchingScore: number;
  /** the state after this entry */
  next: SwitchingState;
  /** what happened, in words */
  note: string;
}

export interface SwitchingResult {
  /** the state the next lot is inspected under */
  state: SwitchingState;
  /** why, in words */
  reason: string;
  switchingScore: number;
  steps: SwitchingStep[];
}

export interface SwitchingOptions {
  /** the responsible authority has approved reduced inspection for this product */
  reducedApproved?: boolean;
}

export const SWITCHING_SCORE_LIMIT = 30;
export const TIGHTENED_DISCONTINUE_AFTER = 5;

const stateWords: Record<SwitchingState, string> = { normal: "normal", tightened: "tightened", reduced: "reduced", discontinued: "discontinued" };

/** Would the count also be accepted at the AQL one step tighter (same letter, next lower column)? */
function acceptedOneStepTighter(plan: SamplingPlan, nonconforming: number): boolean {
  const column = aqlColumn(plan.aql);
  if (column <= 0) return false;
  const cell = tableCell("normal", plan.planCodeLetter, column - 1);
  // a plan with Ac ≥ 2 always has a plan beside it in the next lower column
  return cell.kind === "plan" && nonconforming <= cell.accept;
}

export function switchingState(aql: number, history: readonly SwitchingEntry[], options: SwitchingOptions = {}): SwitchingResult {
  if (aqlColumn(aql) < 0) throw new RangeError(`AQL ${aql} is not one of ${AQL_COLUMNS.join(", ")}`);
  let state = "normal" as SwitchingState;
  let reason = "Inspection starts on normal.";
  let score = 0;
  /** original-inspection outcomes since normal inspection began (true = accepted) */
  let normalRun: boolean[] = [];
  let tightenedAcceptedInARow = 0;
  let tightenedRejected = 0;
  const steps: SwitchingStep[] = [];

  const enter = (next: SwitchingState, why: string) => {
    state = next;
    reason = why;
    if (next === "normal") {
      score = 0;
      normalRun = [];
    }
    if (next === "tightened") {
      tightenedAcceptedInARow = 0;
      tightenedRejected = 0;
    }
  };

  for (const entry of history) {
    const before = state;
    if (entry.kind === "normal-required") {
      const note = before === "reduced" ? `${entry.label}: normal inspection required again (production irregular or the authority's decision).` : `${entry.label}: noted; inspection was already ${stateWords[before]}.`;
      if (before === "reduced") enter("normal", note);
      steps.push({ label: entry.label, state: before, plan: null, decision: null, switchingScore: score, next: state, note });
      continue;
    }
    if (entry.kind === "corrective-action") {
      const note = before === "discontinued" ? `${entry.label}: the supplier's corrective action is recorded; inspection resumes on tightened.` : `${entry.label}: corrective action noted; inspection was not discontinued.`;
      if (before === "discontinued") enter("tightened", note);
      steps.push({ label: entry.label, state: before, plan: null, decision: null, switchingScore: score, next: state, note });
      continue;
    }
    if (before === "discontinued") {
      steps.push({ label: entry.label, state: before, plan: null, decision: null, switchingScore: score, next: state, note: `${entry.label}: not inspected under the scheme: acceptance is discontinued until corrective action.` });
      continue;
    }

    const plan = samplingPlan(entry.lotSize, aql, before);
    const decision = judgeLot(plan, entry.nonconforming);
    const accepted = decision !== "rejected";
    const counted = `${entry.label}: ${entry.nonconforming} nonconforming in ${plan.sampleSize} (Ac ${plan.accept}, Re ${plan.reject}), ${accepted ? "accepted" : "not accepted"}`;
    let note = `${counted}.`;

    if (entry.resubmitted) {
      note = `${counted}; a resubmitted lot, so it does not count for switching.`;
    } else if (before === "normal") {
      normalRun = [...normalRun, accepted].slice(-5);
      const rejectedInRun = normalRun.filter((a) => !a).length;
      if (plan.accept >= 2) score = acceptedOneStepTighter(plan, entry.nonconforming) ? score + 3 : 0;
      else score = accepted ? score + 2 : 0;
      if (rejectedInRun >= 2) {
        note = `${counted}; ${rejectedInRun} of the last ${normalRun.length} lots not accepted, so inspection goes to tightened.`;
        enter("tightened", note);
      } else if (score >= SWITCHING_SCORE_LIMIT) {
        const steady = entry.productionSteady !== false;
        if (steady && options.reducedApproved) {
          note = `${counted}; switching score ${score} reached ${SWITCHING_SCORE_LIMIT} with production steady and reduced inspection approved, so inspection goes to reduced.`;
          enter("reduced", note);
        } else {
          const missing = [!steady && "production is not steady", !options.reducedApproved && "reduced inspection is not approved"].filter(Boolean).join(" and ");
          note = `${counted}; switching score ${score} has reached ${SWITCHING_SCORE_LIMIT}, but ${missing}, so inspection stays normal.`;
          reason = note;
        }
      } else {
        note = `${counted}; switching score ${score}.`;
        reason = `Normal inspection: switching score ${score} of ${SWITCHING_SCORE_LIMIT}; ${rejectedInRun} of the last ${normalRun.length} lots not accepted.`;
      }
    } else if (before === "tightened") {
      if (accepted) tightenedAcceptedInARow++;
      else {
        tightenedAcceptedInARow = 0;
        tightenedRejected++;
      }
      if (tightenedRejected >= TIGHTENED_DISCONTINUE_AFTER) {
        note = `${counted}; ${tightenedRejected} lots not accepted on tightened inspection, so acceptance is discontinued until the supplier's corrective action.`;
        enter("discontinued", note);
      } else if (tightenedAcceptedInARow >= 5) {
        note = `${counted}; 5 lots in a row accepted on tightened inspection, so inspection returns to normal.`;
        enter("normal", note);
      } else {
        note = `${counted}; ${tightenedAcceptedInARow} in a row accepted on tightened (5 return it to normal), ${tightenedRejected} not accepted (5 discontinue).`;
        reason = `Tightened inspection: ${tightenedAcceptedInARow} of 5 consecutive lots accepted; ${tightenedRejected} of ${TIGHTENED_DISCONTINUE_AFTER} lots not accepted since tightened began.`;
      }
    } else if (before === "reduced") {
      if (decision === "rejected") {
        note = `${counted}; a lot not accepted on reduced inspection returns inspection to normal.`;
        enter("normal", note);
      } else if (decision === "accepted-back-to-normal") {
        note = `${counted}; the count lies between Ac and Re, so the lot is accepted and inspection returns to normal.`;
        enter("normal", note);
      } else if (entry.productionSteady === false) {
        note = `${counted}; production was not steady, so inspection returns to normal.`;
        enter("normal", note);
      } else {
        reason = `Reduced inspection: the lots since the switch were accepted on the reduced plan at AQL ${aqlLabel(aql)}.`;
      }
    }
    steps.push({ label: entry.label, state: before, plan, decision, switchingScore: score, next: state, note });
  }
  return { state, reason, switchingScore: state === "normal" ? score : 0, steps };
}

/** The plan the next lot gets, or null while acceptance is discontinued. */
export function nextPlan(lotSize: number, aql: number, result: Pick<SwitchingResult, "state">): SamplingPlan | null {
  return result.state === "discontinued" ? null : samplingPlan(lotSize, aql, result.state);
}
