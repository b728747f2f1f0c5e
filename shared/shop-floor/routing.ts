/**
 * Routings: the steps a job goes through, in the trade's order, planned from the part's forming
 * method, and the sequence rules a scan is checked against. Pure: the server records scans with
 * it, the scan station explains what comes next with the same rules.
 */

/** Step keys in routing order (the API contract's list); a routing skips the steps its part does not use. */
export const stepKeys = ["material", "blank", "form", "weld", "clean", "anneal", "verify", "pack"] as const;
export type StepKey = (typeof stepKeys)[number];

export const stepLabels: Record<StepKey, string> = {
  material: "Material issue",
  blank: "Blank",
  form: "Form",
  weld: "Weld",
  clean: "Clean",
  anneal: "Hydrogen anneal",
  verify: "Verify",
  pack: "Pack",
};

/** One step of a job's routing; the form step of a drawn part carries its draw stages and process anneals. */
export interface RoutingStep {
  key: StepKey;
  /** drawn parts: draws on the press, first draw included */
  drawStages?: number;
  /** drawn parts: anneals between heavy draws (inside the form step) */
  processAnneals?: number;
  /** the planner's instruction printed on the traveler */
  note?: string;
}

export type PartRole = "cup" | "wall" | "end-cap" | "body" | "lid" | "collar";
export type FormingMethod = "drawn" | "rolled" | "bent";

/** What the routing of a part depends on. */
export interface RoutedPart {
  role: PartRole;
  method: FormingMethod;
  /** goes through clean, anneal, verify and pack as its own piece (end caps and collars are welded on first) */
  finishedPiece: boolean;
  drawStages: number;
  processAnneals: number;
  /** collars or end caps are welded onto this piece */
  takesComponents: boolean;
  /** a magnetic alloy: hydrogen-annealed after all forming and welding (copper and aluminium are not) */
  annealed: boolean;
}

export const roleLabels: Record<PartRole, string> = {
  cup: "drawn can",
  wall: "rolled wall",
  "end-cap": "end cap",
  body: "box body",
  lid: "box lid",
  collar: "cable-hole collar",
};

/**
 * The routing a part gets at release. Finished pieces: material, blank, form (with the draw stages
 * and process anneals of a drawn part), weld for rolled and bent parts and for any piece that
 * takes collars or end caps, clean (degrease before the furnace), the final hydrogen anneal for a
 * magnetic alloy, verify, pack. End caps and collars stop once they are ready to be welded on:
 * material, blank, form (a collar is rolled and seam-welded).
 */
export function planRouting(part: RoutedPart): RoutingStep[] {
  const steps: RoutingStep[] = [{ key: "material" }, { key: "blank" }];
  const form: RoutingStep = { key: "form" };
  if (part.method === "drawn" && part.drawStages > 0) {
    form.drawStages = part.drawStages;
    form.processAnneals = part.processAnneals;
  }
  steps.push(form);
  if (!part.finishedPiece) {
    if (part.role === "collar") steps.push({ key: "weld" });
    return steps;
  }
  if (part.method !== "drawn" || part.takesComponents) steps.push({ key: "weld" });
  steps.push({ key: "clean" });
  if (part.annealed) steps.push({ key: "anneal" });
  steps.push({ key: "verify" }, { key: "pack" });
  return steps;
}

export const MAX_DRAW_STAGES = 12;

/**
 * Problems with a routing the planner edited, as `{ "steps.N.field": "what is wrong" }` (empty when
 * it is sound): the trade's order, one of each step, material issue first, and for a finished
 * piece of a magnetic alloy the clean and the final anneal after all forming and welding.
 */
export function routingProblems(steps: readonly RoutingStep[], part: Pick<RoutedPart, "method" | "finishedPiece" | "annealed" | "role">): Record<string, string> {
  const problems: Record<string, string> = {};
  const order = (k: StepKey) => stepKeys.indexOf(k);
  const has = (k: StepKey) => steps.some((s) => s.key === k);
  steps.forEach((s, i) => {
    if (i > 0 && order(s.key) <= order(steps[i - 1].key)) {
      problems[`steps.${i}.key`] ??= order(s.key) === order(steps[i - 1].key) ? `${stepLabels[s.key]} is listed twice` : `${stepLabels[s.key]} must come before ${stepLabels[steps[i - 1].key]}`;
    }
    if (s.key !== "form" && (s.drawStages !== undefined || s.processAnneals !== undefined)) problems[`steps.${i}.drawStages`] ??= "draw stages belong to the form step";
    if (s.key === "form" && s.drawStages !== undefined && s.processAnneals !== undefined && s.processAnneals > Math.max(0, s.drawStages - 1)) {
      problems[`steps.${i}.processAnneals`] = "process anneals go between draws: at most one fewer than the draw stages";
    }
  });
  if (steps[0]?.key !== "material") problems["steps.0.key"] ??= "a routing starts with material issue, so the job is linked to its heat";
  if (!has("blank")) problems.steps ??= "a routing needs its blank step";
  if (part.method === "drawn" && !has("form")) problems.steps ??= "a drawn part needs its form step";
  if (part.finishedPiece) {
    if (!has("pack")) problems.steps ??= "a finished piece ends with pack";
    if (part.annealed && !has("anneal")) problems.steps ??= "nickel-iron loses its permeability in forming: a finished piece needs the final hydrogen anneal";
    if (part.annealed && !has("clean")) problems.steps ??= "parts are degreased before the hydrogen furnace: keep the clean step";
    if (part.method !== "drawn" && !has("weld")) problems.steps ??= `a ${part.method} part is welded: keep the weld step`;
  } else {
    for (const k of ["clean", "anneal", "verify", "pack"] as const) {
      if (has(k)) problems.steps ??= `a ${roleLabels[part.role]} is cleaned, annealed, verified and packed with the piece it is welded to`;
    }
  }
  return problems;
}

// --- progress and scans ---

export type StepStatus = "pending" | "started" | "completed";
export type ScanAction = "start" | "complete";

/** Where a job is: the index of its first step not completed (= routing length when done) and whether that step has started. */
export interface JobProgress {
  routing: readonly RoutingStep[];
  stepIndex: number;
  started: boolean;
}

export function stepStatuses(p: JobProgress): StepStatus[] {
  return p.routing.map((_, i) => (i < p.stepIndex ? "completed" : i === p.stepIndex && p.started ? "started" : "pending"));
}

/** The scan that moves the job on, or null when every step is completed. */
export function nextScan(p: JobProgress): { step: StepKey; action: ScanAction } | null {
  const step = p.routing[p.stepIndex];
  if (!step) return null;
  return { step: step.key, action: p.started ? "complete" : "start" };
}

export const routeText = (routing: readonly RoutingStep[]) => routing.map((s) => stepLabels[s.key]).join(" → ");

export type ScanVerdict =
  | { kind: "new"; stepIndex: number }
  /** this step's start or completion is already recorded: answer with the recorded event */
  | { kind: "repeat"; stepIndex: number }
  | { kind: "refused"; code: "STEP_NOT_IN_ROUTING" | "OUT_OF_SEQUENCE" | "NOT_STARTED"; message: string };

/**
 * Checks a scan against the job's progress. Each step is started once and completed once; a scan
 * of what is already recorded is a repeat (a second scanner, a replayed offline queue), not an
 * error. Messages are written for the person at the station.
 */
export function checkScan(p: JobProgress, step: StepKey, action: ScanAction, what = "this job"): ScanVerdict {
  const i = p.routing.findIndex((s) => s.key === step);
  const label = stepLabels[step];
  if (i < 0) {
    return { kind: "refused", code: "STEP_NOT_IN_ROUTING", message: `${capital(what)} has no ${label.toLowerCase()} step. Its route is ${routeText(p.routing)}.` };
  }
  if (i < p.stepIndex || (i === p.stepIndex && action === "start" && p.started)) return { kind: "repeat", stepIndex: i };
  const next = nextScan(p);
  const nextText = next ? `Next on ${what}: ${next.action} ${stepLabels[next.step].toLowerCase()}.` : "";
  if (i > p.stepIndex) {
    const current = p.routing[p.stepIndex];
    return {
      kind: "refused",
      code: "OUT_OF_SEQUENCE",
      message: `${label} cannot ${action === "start" ? "start" : "be completed"} yet: ${stepLabels[current.key].toLowerCase()} is not finished on ${what}. ${nextText}`.trim(),
    };
  }
  // i === stepIndex
  if (action === "complete" && !p.started) {
    return { kind: "refused", code: "NOT_STARTED", message: `${label} has not been started on ${what}: scan start first, then complete when the work is done.` };
  }
  return { kind: "new", stepIndex: i };
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
