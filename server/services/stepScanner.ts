import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { ScanData, ScanInput } from "../../shared/schemas/scans";
import { MAX_OFFLINE_AGE_DAYS } from "../../shared/schemas/scans";
import { normalizeCode, parseStepBarcode } from "../../shared/shop-floor/codes";
import { checkScan, stepLabels, type StepKey } from "../../shared/shop-floor/routing";
import { jsonRows, prepared } from "../db/prepared";
import { AppError, ConflictError, ValidationError } from "../errors";
import type { Actor } from "../policies/utils";
import type { ScanRow } from "../presenters/jobs";
import { jobViewSql, type JobView } from "./jobViews";

// The job as its page shows it (the answer's job, without a second read), the scan already
// recorded under the idempotency key if any, and — when the scan is the job's plain next move ($9)
// with no step data but the draws done at form ($10, checked here against the draws planned) —
// that move itself: the event inserted and the job moved in the same statement, so most scans cost
// one round trip. Whatever else (a repeat, a refusal, a step whose data the code checks) comes back
// as the read alone, and the code below decides.
const SCAN = {
  name: "scan-read-or-move",
  text: `
with v as (${jobViewSql({
    columns: "k.job_id as key_job_id, k.step as key_step, k.action as key_action",
    joins: "left join scans k on k.idempotency_key = $2::varchar",
    where: "j.code = $1::varchar",
  })}),
s as (
  insert into scans (job_id, step_index, step, action, station, operator_id, idempotency_key, data, scanned_at)
  select v.id, v.step_index, $3::varchar, $4::varchar, $5::varchar, $6::uuid, $2::varchar, $7::jsonb, $8::timestamptz
  from v
  where $9::boolean and v.key_job_id is null and v.hold_reason is null and v.completed_at is null
    and v.routing -> v.step_index ->> 'key' = $3 and (v.step_started_at is null) = ($4 = 'start')
    and ($10::int is null or (v.routing -> v.step_index ->> 'drawStages')::int between 1 and $10::int)
  on conflict (job_id, step_index, action) do nothing
  returning id, job_id, step, action, station, operator_id, idempotency_key, data, scanned_at, created_at),
u as (
  update jobs j set
    step_index = j.step_index + (case when $4 = 'complete' then 1 else 0 end),
    step_started_at = case when $4 = 'start' then $8::timestamptz end,
    current_step = case when $4 = 'start' then j.current_step else j.routing -> (j.step_index + 1) ->> 'key' end,
    completed_at = case when $4 = 'complete' and j.step_index + 1 >= jsonb_array_length(j.routing) then $8::timestamptz end,
    updated_at = now()
  from s where j.id = s.job_id
  returning j.id)
${jsonRows("select v.*, s.id as moved_scan_id, s.created_at as moved_created_at from v left join s on true")}`,
  jsonRows: true,
} as const;

/** Completing form with the draws done: the one step datum the scan's statement checks itself (against the draws planned). */
const formWithDraws = (step: StepKey, action: "start" | "complete", input: ScanInput) => step === "form" && action === "complete" && input.drawStagesDone !== undefined;

/** Scans that carry step data the code checks (heat, missing draws, weld inspection, components, furnace run, the lot's decision at verify). */
const needsStepData = (step: StepKey, action: "start" | "complete", input: ScanInput) =>
  step === "form" && action === "complete"
    ? input.drawStagesDone === undefined
    : step === "material" || step === "weld" || (step === "anneal" && action === "complete") || (step === "verify" && action === "complete") || input.drawStagesDone !== undefined;

/** The draws done at form (and the process anneals between them), as a scan records them. */
const drawsData = (input: ScanInput): ScanData => ({
  drawStagesDone: input.drawStagesDone,
  ...(input.processAnnealsDone !== undefined ? { processAnnealsDone: input.processAnnealsDone } : {}),
});

type ReadJob = JobView & { key_job_id: string | null; key_step: string | null; key_action: string | null; moved_scan_id: string | null; moved_created_at: string | null };

// The event and the job's move in one statement (one transaction of its own, or the caller's),
// only from the state the scan was checked against ($16, $17). From each state of a job exactly
// one event is new (start or complete of its current step), so the unique (job, step, action) lets
// one of any number of racing scans insert; the others find the row taken and insert nothing. The
// job's update, which holds its row lock to the end, happens only with the insert. No row back:
// the job moved since it was read (read it again).
const RECORD = { name: "scan-record", text: `
with s as (
  insert into scans (job_id, step_index, step, action, station, operator_id, idempotency_key, data, scanned_at)
  select $1, $2, $3, $4, $5, $6, $7, $8, $9
  where exists (select 1 from jobs where id = $1 and step_index = $16 and (step_started_at is not null) = $17)
  on conflict (job_id, step_index, action) do nothing
  returning id, job_id, step, action, station, operator_id, idempotency_key, data, scanned_at, created_at),
u as (
  update jobs set
    step_index = $10, step_started_at = $11, current_step = $12, completed_at = $13,
    heat_id = coalesce($14, heat_id), furnace_run_id = coalesce($15, furnace_run_id), updated_at = now()
  where id = $1 and exists (select 1 from s)
  returning id)
select s.*, null::text as operator_name from s` };

const RECORDED = { name: "scan-recorded", text: `
select s.id, s.job_id, s.step, s.action, s.station, s.operator_id, u.name as operator_name, s.idempotency_key, s.data, s.scanned_at, s.created_at
from scans s left join users u on u.id = s.operator_id
where s.job_id = $1 and s.step_index = $2 and s.action = $3` };

export interface ScanOutcome {
  /** nothing new was recorded: the answer is the event already there */
  repeat: boolean;
  scan: ScanRow;
  /** the job as it stands after the scan */
  job: JobView;
  code: string;
}

interface ScanProps {
  actor: Actor & { name: string };
  input: ScanInput;
  sequelize: Sequelize;
  transaction?: Transaction;
  now?: Date;
  /** quality's decision on the lot (accepted under its plan, or by concession): only it completes verify */
  lotDecided?: boolean;
}

const sameNumber = (a: number, b: number) => Math.abs(a - b) < 1e-6;
const ATTEMPTS = 5;

/**
 * Records a step's start or completion from a station. Each step starts once and completes once:
 * the unique (job, step, action) decides, and the job moves in the same statement, under its row
 * lock, only from the state the scan was checked against (a scan that lost a race reads the job
 * again and is then a repeat or refused). What is already recorded answers as a repeat (a second
 * scanner, an offline queue replayed, the same idempotency key again); what is out of sequence is
 * refused in the operator's words. Step data: the heat at material issue (alloy and gauge must
 * match the job), the draws at form, the weld inspection at weld; completing the anneal links the
 * job to its lot's furnace run. Runs in the caller's transaction when given one (the demo seed).
 */
export async function stepScanner(props: ScanProps): Promise<ScanOutcome> {
  for (let attempt = 1; ; attempt++) {
    const outcome = await attemptScan(props);
    if (outcome) return outcome;
    if (attempt === ATTEMPTS) throw ConflictError("JOB_BUSY", "This job is being scanned at another station right now; scan again.");
  }
}

async function attemptScan(props: ScanProps): Promise<ScanOutcome | null> {
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
  const scannedAt = stationTime(input.scannedAt, now);
  const plainData: ScanData = input.note ? { note: input.note } : {};
  const draws = formWithDraws(step, input.action, input);
  // what the statement records when it moves the job: the note, and the draws at form
  const movedData: ScanData = draws ? { ...plainData, ...drawsData(input) } : plainData;

  let job: ReadJob | undefined;
  try {
    [job] = await prepared<ReadJob>(sequelize, SCAN, [
      code, key, step, input.action, input.station, actor.id, JSON.stringify(movedData), scannedAt, !needsStepData(step, input.action, input), draws ? input.drawStagesDone : null,
    ], transaction);
  } catch (err) {
    if (isKeyTaken(err)) throw keyReused();
    throw err;
  }
  if (!job) throw new AppError(404, "UNKNOWN_CODE", `No job has the code ${code}. Check the traveler, or type the code printed under its barcode.`);
  const what = `job ${job.code}`;
  if (job.moved_scan_id) {
    const i = job.step_index;
    const scan: ScanRow = {
      id: job.moved_scan_id, job_id: job.id, step, action: input.action, station: input.station, operator_id: actor.id, operator_name: actor.name,
      idempotency_key: key, data: movedData as Record<string, unknown>, scanned_at: scannedAt, created_at: job.moved_created_at!,
    };
    return { repeat: false, scan, job: moved(job, i, input, actor, scannedAt, null, null), code: job.code };
  }

  if (key && job.key_job_id) {
    if (job.key_job_id === job.id && job.key_step === step && job.key_action === input.action) return repeatOf(job, job.routing.findIndex((s) => s.key === step), input, sequelize, transaction);
    throw keyReused();
  }

  const started = job.step_started_at !== null;
  const verdict = checkScan({ routing: job.routing, stepIndex: job.step_index, started }, step, input.action, what);
  if (verdict.kind === "refused") throw ConflictError(verdict.code, verdict.message);
  if (verdict.kind === "repeat") return repeatOf(job, verdict.stepIndex, input, sequelize, transaction);
  if (step === "verify" && input.action === "complete" && !props.lotDecided) {
    throw ConflictError("VERIFY_BY_INSPECTION", `Verify on ${job.code} completes by itself when quality accepts lot ${job.lot_number} from its measured sample; it is not completed by a scan.`);
  }
  if (job.hold_reason) throw ConflictError("LOT_ON_HOLD", `Lot ${job.lot_number} is on hold: ${job.hold_reason} Only the planner can release it; leave ${job.code} where it is.`);

  const i = verdict.stepIndex;
  const routingStep = job.routing[i];
  const data: ScanData = { ...plainData };
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
    Object.assign(data, drawsData(input));
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

  const complete = input.action === "complete";
  const nextIndex = complete ? i + 1 : i;
  const done = nextIndex >= job.routing.length;
  let rows: ScanRow[];
  try {
    rows = await prepared<ScanRow>(sequelize, RECORD, [
      job.id, i, step, input.action, input.station, actor.id, key, JSON.stringify(data), scannedAt,
      nextIndex, complete ? null : scannedAt, done ? null : job.routing[nextIndex].key, done ? scannedAt : null, heatId, furnaceRunId,
      job.step_index, started,
    ], transaction);
  } catch (err) {
    if (isKeyTaken(err)) throw keyReused();
    throw err;
  }
  if (!rows.length) return null;
  const scan = { ...rows[0], operator_name: actor.name };
  return { repeat: false, scan, job: moved(job, i, input, actor, scannedAt, heatId ? { id: heatId, number: data.heatNumber ?? "" } : null, furnaceRunId), code: job.code };
}

/** The job as it stands after the move just recorded (what a second read would show). */
function moved(job: ReadJob, i: number, input: ScanInput, actor: Actor & { name: string }, at: Date, heat: { id: string; number: string } | null, furnaceRunId: string | null): JobView {
  const complete = input.action === "complete";
  const next = complete ? i + 1 : i;
  const { key_job_id: _k, key_step: _s, key_action: _a, moved_scan_id: _m, moved_created_at: _c, ...view } = job;
  return {
    ...view,
    step_index: next,
    step_started_at: complete ? null : at.toISOString(),
    completed_at: next >= job.routing.length ? at.toISOString() : null,
    ...(heat ? { heat_id: heat.id, heat_number: heat.number } : {}),
    ...(furnaceRunId ? { furnace_run_id: furnaceRunId, furnace_run_number: job.lot_furnace_run_number } : {}),
    scans: [...job.scans, { stepIndex: i, action: input.action, at: at.toISOString(), station: input.station, operatorId: actor.id, operatorName: actor.name }],
  };
}

/** A concurrent scan took this idempotency key for something else. */
const isKeyTaken = (err: unknown) => {
  const e = err as { constraint?: string; original?: { constraint?: string } };
  return (e.constraint ?? e.original?.constraint) === "scans_idempotency_key";
};
const keyReused = () => ConflictError("IDEMPOTENCY_KEY_REUSED", "This scan's idempotency key was already used for a different scan; the device must give each scan its own key.");

/** The event already recorded for this step and action; a repeat that names other step data is refused. */
async function repeatOf(job: ReadJob, stepIndex: number, input: ScanInput, sequelize: Sequelize, transaction?: Transaction): Promise<ScanOutcome> {
  const [scan] = await prepared<ScanRow>(sequelize, RECORDED, [job.id, stepIndex, input.action], transaction);
  if (!scan) throw new Error(`job ${job.code}: step ${stepIndex} ${input.action} is recorded in its progress but has no scan`);
  const d = scan.data as ScanData;
  const label = stepLabels[job.routing[stepIndex].key].toLowerCase();
  const differs = (given: unknown, recorded: unknown) => given !== undefined && recorded !== undefined && given !== recorded;
  if (differs(input.heatNumber?.trim(), d.heatNumber) || differs(input.drawStagesDone, d.drawStagesDone) || differs(input.weldInspection?.result, d.weldInspection?.result)) {
    throw ConflictError("ALREADY_RECORDED", `The ${label} ${input.action === "start" ? "start" : "completion"} of ${job.code} is already recorded (${new Date(scan.scanned_at).toISOString()}, ${scan.station}) with other details; ask the planner to correct it.`);
  }
  return { repeat: true, scan, job, code: job.code };
}

/** The heat of this job's alloy and gauge with that number, or the reason it is refused. */
async function heatFor(job: ReadJob, heatNumber: string, sequelize: Sequelize, transaction?: Transaction): Promise<string> {
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
