// Pure rules of the scan station: what a scanned text is, and where a job stands once the scans
// still waiting in this device's queue are counted (so an operator can keep working offline).
import type { JobJson } from "../../../shared/schemas/jobs";
import { isJobCode, normalizeCode, parseStepBarcode } from "../../../shared/shop-floor/codes";
import type { ScanAction, StepKey, StepStatus } from "../../../shared/shop-floor/routing";

export type ScannedText = { kind: "job"; code: string } | { kind: "step"; code: string; step: StepKey } | { kind: "unreadable"; text: string };

/** A traveler's job barcode (J-1042), a step's barcode (J-1042-FORM), or neither. */
export function readScannedText(raw: string): ScannedText {
  const text = normalizeCode(raw);
  const step = parseStepBarcode(text);
  if (step) return { kind: "step", ...step };
  if (isJobCode(text)) return { kind: "job", code: text };
  return { kind: "unreadable", text: raw.trim() };
}

export interface PendingScan {
  code: string;
  step: string;
  action: ScanAction;
}

export interface Projection {
  keys: StepKey[];
  statuses: StepStatus[];
  next: { step: StepKey; action: ScanAction } | null;
  /** queued scans of this job that move it on */
  pending: number;
}

/**
 * The job as the server last showed it, moved on by this device's queued scans that follow its
 * sequence (a queued scan out of turn changes nothing: the server will refuse it with its reason).
 */
export function projectJob(job: Pick<JobJson, "code" | "steps">, queue: readonly PendingScan[]): Projection {
  const statuses = job.steps.map((s) => s.status);
  let pending = 0;
  const nextOf = (): Projection["next"] => {
    const i = statuses.findIndex((s) => s !== "completed");
    if (i < 0) return null;
    return { step: job.steps[i].key, action: statuses[i] === "started" ? "complete" : "start" };
  };
  for (const scan of queue) {
    if (normalizeCode(scan.code) !== job.code) continue;
    const next = nextOf();
    const step = parseStepBarcode(scan.step)?.step ?? scan.step.toLowerCase();
    if (!next || next.step !== step || next.action !== scan.action) continue;
    const i = job.steps.findIndex((s) => s.key === step);
    statuses[i] = scan.action === "start" ? "started" : "completed";
    pending += 1;
  }
  return { keys: job.steps.map((s) => s.key), statuses, next: nextOf(), pending };
}

/**
 * What a step barcode scanned at the station asks for: the job's next move when it is that step;
 * a completion for a step already done (the server answers "already recorded"); otherwise a start
 * (the server then says why it cannot, in the operator's words).
 */
export function actionForStep(projection: Projection | null, step: StepKey): ScanAction {
  if (projection?.next?.step === step) return projection.next.action;
  return projection?.statuses[projection.keys.indexOf(step)] === "completed" ? "complete" : "start";
}

/** Whether this scan would be a new event for the job as the device knows it (only then is step data asked for). */
export const movesJobOn = (projection: Projection, step: StepKey, action: ScanAction) => projection.next?.step === step && projection.next.action === action;

const PRESS =
  "Press and shear work: keep guards, light curtains and two-hand controls in service, wear cut-resistant gloves for sheared edges, and follow the site's procedures and local machine-safety rules.";
const WELD = "Welding: eye and skin protection, fume extraction, and a hot-work permit where the site requires one.";

/** The cautions an operator sees at a step, where the work can hurt someone or spoil the part. */
export function stepCautions(step: StepKey, hydrogen: string, afterAnneal: string): string[] {
  if (step === "blank" || step === "form") return [PRESS];
  if (step === "weld") return [WELD];
  if (step === "anneal") return [hydrogen];
  if (step === "verify" || step === "pack") return [afterAnneal];
  return [];
}
