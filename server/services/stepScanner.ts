import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { ScanData, ScanInput } from "../../shared/schemas/scans";
import { MAX_OFFLINE_AGE_DAYS } from "../../shared/schemas/scans";
import { normalizeCode, parseStepBarcode } from "../../shared/shop-floor/codes";
import { checkScan, stepLabels, type RoutingStep, type StepKey } from "../../shared/shop-floor/routing";
import { AppError, ConflictError, ValidationError } from "../errors";
import type { Actor } from "../policies/utils";
import type { ScanRow } from "../presenters/jobs";

// The locked job, its lot's hold and furnace run, and the scan already recorded under the
// idempotency key if any: one statement.
const LOCK_JOB = `
select j.id, j.code, j.routing, j.step_index, j.step_started_at, j.material_id, j.thickness_mm, j.heat_id,
  l.number as lot_number, l.hold_reason, l.furnace_run_id as lot_furnace_run_id,
  k.job_id as key_job_id, k.step as key_step, k.action as key_action
from jobs j
join lots l on l.id = j.lot_id
left join scans k on k.idempotency_key = $2
where j.code = $1
for update of j`;

interface LockedJob {
  id: string;
  code: string;
  routing: RoutingStep[];
  step_index: number;
  step_started_at: Date | null;
  material_id: string;
  thickness_mm: number;
  heat_id: string | null;
  lot_number: string;
  hold_reason: string | null;
  lot_furnace_run_id: string | null;
  key_job_id: string | null;
  key_step: string | null;
  key_action: string | null;
}

// The event and the job's move in one statement; the unique (job, step, action) is the last word
// on "once", whatever the lock let through.
const RECORD = `
with s as (
  insert into scans (job_id, step_index, step, action, station, operator_id, idempotency_key, data, scanned_at)
  values ($1, $2, $3, $4, $5, $6, $7, $8, $9)
  on conflict (job_id, step_index, action) do nothing
  returning id, job_id, step, action, station, operator_id, idempotency_key, data, scanned_at, created_at),
u as (
  update jobs set
    step_index = $10, step_started_at = $11, current_step = $12, completed_at = $13,
    heat_id = coalesce($14, heat_id), furnace_run_id = coalesce($15, furnace_run_id), updated_at = now()
  where id = $1 and exists (select 1 from s)
  returning id)
select s.*, null::text as operator_name from s`;

const RECORDED = `
select s.id, s.job_id, s.step, s.action, s.station, s.operator_id, u.name as operator_name, s.idempotency_key, s.data, s.scanned_at, s.created_at
from scans s left join users u on u.id = s.operator_id
where s.job_id = $1 and s.step_index = $2 and s.action = $3`;

export interface ScanOutcome {
  /** nothing new was recorded: the answer is the event already there */
  repeat: boolean;
  scan: ScanRow;
  jobId: string;
  code: string;
}

const sameNumber = (a: number, b: number) => Math.abs(a - b) < 1e-6;

/**
 * Records a step's start or completion from a station. The job's row lock makes scans of one job
 * take turns; the unique (job, step, action) makes each step start once and complete once. What
 * is already recorded answers as a repeat (a second scanner, an offline queue replayed, the same
 * idempotency key again); what is out of sequence is refused in the operator's words. Step data:
 * the heat at material issue (alloy and gauge must match the job), the draws at form, the weld
 * inspection at weld; completing the anneal links the job to its lot's furnace run.
 */
export async function stepScanner(props: { actor: Actor & { name: string }; input: ScanInput; sequelize: Sequelize; transaction: Transaction; now?: Date }): Promise<ScanOutcome> {
  const { actor, input, sequelize, transaction } = props;
  const now = props.now ?? new Date();
  const code = normalizeCode(input.code);
  let step = input.step.trim().toLowerCase() as StepKey;
  const fromBarcode = parseStepBarcode(input.step);
  if (fromBarcode) {
    if (fromBarcode.code !== code) {
      throw ConflictError("STEP_OF_ANOTHER_JOB", `That step barcode belongs to job ${fromBarcode.code}, not ${code}: scan the step on ${code}'s own traveler.`);
    }
    step = fromBarcode.step;
  }
  const key = input.idempotencyKey ?? null;

  const [job] = await sequelize.query<LockedJob>(LOCK_JOB, { bind: [code, key], type: QueryTypes.SELECT, transaction });
  if (!job) throw new AppError(404, "UNKNOWN_CODE", `No job has the code ${code}. Check the traveler, or type the code printed under its barcode.`);
  const what = `job ${job.code}`;

  if (key && job.key_job_id) {
    if (job.key_job_id === job.id && job.key_step === step && job.key_action === input.action) return repeatOf(job, job.routing.findIndex((s) => s.key === step), input, sequelize, transaction);
    throw ConflictError("IDEMPOTENCY_KEY_REUSED", "This scan's idempotency key was already used for a different scan; the device must give each scan its own key.");
  }

  const verdict = checkScan({ routing: job.routing, stepIndex: job.step_index, started: job.step_started_at !== null }, step, input.action, what);
  if (verdict.kind === "refused") throw ConflictError(verdict.code, verdict.message);
  if (verdict.kind === "repeat") return repeatOf(job, verdict.stepIndex, input, sequelize, transaction);
  if (job.hold_reason) throw ConflictError("LOT_ON_HOLD", `Lot ${job.lot_number} is on hold: ${job.hold_reason} Only the planner can release it; leave ${job.code} where it is.`);

  const i = verdict.stepIndex;
  const routingStep = job.routing[i];
  const data: ScanData = {};
  if (input.note) data.note = input.note;
  let heatId: string | null = null;
  let furnaceRunId: string | null = null;

  if (step === "material") {
    if (input.heatNumber) {
      heatId = await heatFor(job, input.heatNumber, sequelize, transaction);
      if (job.heat_id && job.heat_id !== heatId) throw ConflictError("HEAT_ALREADY_LINKED", `${capital(what)} was issued from another heat at the start of material issue; ask the planner to correct it.`);
      data.heatNumber = input.heatNumber.trim();
      data.heatId = heatId;
    } else if (input.action === "complete" && !job.heat_id) {
      throw ValidationError({ heatNumber: "give the heat number of the sheet this job is cut from" }, "Material issue needs the heat number.");
    }
  }
  if (step === "form" && input.action === "complete" && routingStep.drawStages) {
    if (input.drawStagesDone === undefined) throw ValidationError({ drawStagesDone: `give the draws done (${routingStep.drawStages} planned)` }, "Forming a drawn part needs the number of draws done.");
    if (input.drawStagesDone < routingStep.drawStages) {
      throw ConflictError("DRAWS_MISSING", `${capital(what)} needs ${routingStep.drawStages} draws${routingStep.processAnneals ? ` with ${routingStep.processAnneals} process anneal${routingStep.processAnneals === 1 ? "" : "s"} between them` : ""}; ${input.drawStagesDone} recorded. Finish the draws before completing form.`);
    }
    data.drawStagesDone = input.drawStagesDone;
    if (input.processAnnealsDone !== undefined) data.processAnnealsDone = input.processAnnealsDone;
  }
  if (step === "weld" && input.action === "start") {
    const waiting = await sequelize.query<{ code: string }>(`select code from jobs where assembly_job_id = $1 and completed_at is null order by seq`, { bind: [job.id], type: QueryTypes.SELECT, transaction });
    if (waiting.length) {
      throw ConflictError("COMPONENTS_NOT_READY", `The parts welded onto ${job.code} are not ready: finish ${waiting.map((w) => w.code).join(", ")} first.`);
    }
  }
  if (step === "weld" && input.action === "complete") {
    if (!input.weldInspection) throw ValidationError({ weldInspection: 'record the weld inspection: result "pass" or "fail"' }, "Completing the weld needs its inspection.");
    if (input.weldInspection.result === "fail") {
      throw ConflictError("WELD_REJECTED", `A weld that failed inspection cannot be completed: repair it, inspect it again, then complete the weld on ${job.code}.`);
    }
    data.weldInspection = input.weldInspection;
  }
  if (step === "anneal" && input.action === "complete") {
    if (!job.lot_furnace_run_id) throw ConflictError("NO_FURNACE_RUN", `Lot ${job.lot_number}'s furnace run has not been recorded yet: record the run, then complete the anneal on ${job.code}.`);
    furnaceRunId = job.lot_furnace_run_id;
    data.furnaceRunId = furnaceRunId;
  }

  const scannedAt = stationTime(input.scannedAt, now);
  const complete = input.action === "complete";
  const nextIndex = complete ? i + 1 : i;
  const done = nextIndex >= job.routing.length;
  let rows: ScanRow[];
  try {
    rows = await sequelize.query<ScanRow>(RECORD, {
      bind: [
        job.id, i, step, input.action, input.station, actor.id, key, JSON.stringify(data), scannedAt,
        nextIndex, complete ? null : scannedAt, done ? null : job.routing[nextIndex].key, done ? scannedAt : null, heatId, furnaceRunId,
      ],
      type: QueryTypes.SELECT,
      transaction,
    });
  } catch (err) {
    // a concurrent scan took this idempotency key for something else
    if ((err as { original?: { constraint?: string } }).original?.constraint === "scans_idempotency_key") {
      throw ConflictError("IDEMPOTENCY_KEY_REUSED", "This scan's idempotency key was already used for a different scan; the device must give each scan its own key.");
    }
    throw err;
  }
  if (!rows.length) return repeatOf(job, i, input, sequelize, transaction);
  return { repeat: false, scan: { ...rows[0], operator_name: actor.name }, jobId: job.id, code: job.code };
}

/** The event already recorded for this step and action; a repeat that names other step data is refused. */
async function repeatOf(job: LockedJob, stepIndex: number, input: ScanInput, sequelize: Sequelize, transaction: Transaction): Promise<ScanOutcome> {
  const [scan] = await sequelize.query<ScanRow>(RECORDED, { bind: [job.id, stepIndex, input.action], type: QueryTypes.SELECT, transaction });
  if (!scan) throw new Error(`job ${job.code}: step ${stepIndex} ${input.action} is recorded in its progress but has no scan`);
  const d = scan.data as ScanData;
  const label = stepLabels[job.routing[stepIndex].key].toLowerCase();
  const differs = (given: unknown, recorded: unknown) => given !== undefined && recorded !== undefined && given !== recorded;
  if (differs(input.heatNumber?.trim(), d.heatNumber) || differs(input.drawStagesDone, d.drawStagesDone) || differs(input.weldInspection?.result, d.weldInspection?.result)) {
    throw ConflictError("ALREADY_RECORDED", `The ${label} ${input.action === "start" ? "start" : "completion"} of ${job.code} is already recorded (${new Date(scan.scanned_at).toISOString()}, ${scan.station}) with other details; ask the planner to correct it.`);
  }
  return { repeat: true, scan, jobId: job.id, code: job.code };
}

/** The heat of this job's alloy and gauge with that number, or the reason it is refused. */
async function heatFor(job: LockedJob, heatNumber: string, sequelize: Sequelize, transaction: Transaction): Promise<string> {
  const heats = await sequelize.query<{ id: string; material_id: string; thickness_mm: number }>(
    `select id, material_id, thickness_mm from material_heats where heat_number = $1`,
    { bind: [heatNumber.trim()], type: QueryTypes.SELECT, transaction },
  );
  const match = heats.find((h) => h.material_id === job.material_id && sameNumber(h.thickness_mm, job.thickness_mm));
  if (match) return match.id;
  if (!heats.length) throw ValidationError({ heatNumber: `no heat ${heatNumber.trim()} has been received; receive the delivery first` }, "Unknown heat number.");
  const h = heats[0];
  throw ConflictError("HEAT_MISMATCH", `Heat ${heatNumber.trim()} is ${h.material_id} ${h.thickness_mm} mm; job ${job.code} needs ${job.material_id} ${job.thickness_mm} mm. Use a sheet of the right alloy and gauge.`);
}

/** When the scan happened: the device's own time for a queued offline scan (never in the future), else now. */
function stationTime(given: string | undefined, now: Date): Date {
  if (!given) return now;
  const t = new Date(given);
  if (t.getTime() < now.getTime() - MAX_OFFLINE_AGE_DAYS * 86_400_000) {
    throw ValidationError({ scannedAt: `is more than ${MAX_OFFLINE_AGE_DAYS} days old; record the work with the planner` });
  }
  return t.getTime() > now.getTime() ? now : t;
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
