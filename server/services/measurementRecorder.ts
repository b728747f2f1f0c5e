import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { instrumentUnusableReason, utcDay } from "../../shared/quality/instruments";
import { helmholtzCentreField, judgeMeasurement, millivoltsToVolts, searchCoilField, squareMillimetresToSquareMetres, teslaToMicrotesla } from "../../shared/quality/measurement";
import type { LotProgressJson, MeasurementParsed, Orientation } from "../../shared/schemas/quality";
import { AppError, ConflictError, ValidationError, type FieldErrors } from "../errors";
import { Instrument, Lot, LotDisposition, Measurement, Nonconformance, recordEvent } from "../models";
import type { Actor } from "../policies/utils";
import { lotHolder } from "./lotHolds";
import { loadLotInspection, lotProgress, lotSamplingPlan, notAnnealedReason, verdict, type LotInspectionRow } from "./lotInspection";
import { stepScanner } from "./stepScanner";

const insideKinds = new Set(["fluxgate-probe", "gaussmeter-probe", "search-coil"]);

interface Prepared {
  input: MeasurementParsed;
  applied_uT: number;
  inside_uT: number;
  instrument: Instrument;
  derivation: Record<string, unknown>;
}

/** The fields of one reading, from what was entered or from the coil's figures; problems by field. */
function prepare(input: MeasurementParsed, instruments: Map<string, Instrument>, today: string): { ok: true; value: Prepared } | { ok: false; problems: FieldErrors; conflict?: string } {
  const problems: FieldErrors = {};
  const instrument = instruments.get(input.instrumentId);
  if (!instrument) return { ok: false, problems: { instrumentId: "no such instrument in the register" } };
  const unusable = instrumentUnusableReason(instrument, today);
  if (unusable) return { ok: false, problems: { instrumentId: unusable }, conflict: unusable };
  if (!insideKinds.has(instrument.kind)) problems.instrumentId = `${instrument.name} is a ${instrument.kind.replace("-", " ")}: the inside field is read with a probe or a search coil`;
  const derivation: Record<string, unknown> = {};
  let applied = input.appliedField_uT;
  if (input.helmholtz) {
    const set = instruments.get(input.helmholtz.instrumentId);
    const setProblem = !set ? "no such instrument in the register" : set.kind !== "helmholtz-coil" ? `${set.name} is not a Helmholtz coil set` : instrumentUnusableReason(set, today);
    if (setProblem || !set?.turns || !set.radius_mm) {
      problems["helmholtz.instrumentId"] = setProblem ?? `${set!.name} has no turns or radius in the register`;
      if (set && setProblem && set.kind === "helmholtz-coil") return { ok: false, problems, conflict: setProblem };
    } else {
      applied = teslaToMicrotesla(helmholtzCentreField({ turnsPerCoil: set.turns, current_A: input.helmholtz.current_A, radius_m: set.radius_mm / 1000 }));
      Object.assign(derivation, { applied: { helmholtz: set.name, helmholtzId: set.id, turnsPerCoil: set.turns, radius_mm: set.radius_mm, current_A: input.helmholtz.current_A, calibrationDue: set.calibrationDue } });
    }
  }
  let inside = input.insideField_uT;
  if (input.searchCoil) {
    if (instrument.kind !== "search-coil" || !instrument.turns || !instrument.area_mm2) {
      problems["searchCoil.voltage_mV"] = `${instrument.name} is not a search coil with turns and area in the register`;
    } else {
      inside = teslaToMicrotesla(searchCoilField({ frequency_hz: input.frequency_hz, turns: instrument.turns, area_m2: squareMillimetresToSquareMetres(instrument.area_mm2), voltage_V: millivoltsToVolts(input.searchCoil.voltage_mV) }));
      Object.assign(derivation, { inside: { searchCoil: instrument.name, turns: instrument.turns, area_mm2: instrument.area_mm2, voltage_mV: input.searchCoil.voltage_mV } });
    }
  }
  if (Object.keys(problems).length) return { ok: false, problems };
  return { ok: true, value: { input, applied_uT: applied!, inside_uT: inside!, instrument, derivation } };
}

export interface RecordedMeasurements {
  measurements: Measurement[];
  progress: LotProgressJson;
  lot: LotInspectionRow;
}

/**
 * Records readings of sampled parts for a lot, all or none: the lot must have completed its anneal
 * and not be decided or on hold, every instrument must be in calibration, each serial measured
 * once per round, and no more parts than the plan's sample. When the sample is measured (or the
 * failures reach Re) the lot is decided under its plan: accepted lots complete their verify step
 * through the scan service; a rejected lot goes on hold with a nonconformance record.
 * `rowOf` names a reading's CSV row in the refusal (a CSV is refused whole, its bad rows listed).
 */
export async function measurementRecorder(props: {
  actor: Actor & { name: string };
  lotId: string;
  inputs: MeasurementParsed[];
  source: "entry" | "csv";
  rowOf?: (index: number) => number;
  sequelize: Sequelize;
  ip: string | null;
  transaction: Transaction;
  now?: Date;
}): Promise<RecordedMeasurements> {
  const { actor, sequelize, transaction, inputs } = props;
  const now = props.now ?? new Date();
  const today = utcDay(now);
  await Lot.findByPk(props.lotId, { transaction, lock: transaction.LOCK.UPDATE, attributes: ["id"] });
  const lot = (await loadLotInspection(sequelize, props.lotId, transaction))!;
  const notReady = notAnnealedReason(lot);
  if (notReady) throw ConflictError("LOT_NOT_ANNEALED", notReady);
  if (lot.hold_reason) throw ConflictError("LOT_ON_HOLD", `Lot ${lot.number} is on hold: ${lot.hold_reason}`);
  const { plan } = await lotSamplingPlan(sequelize, lot, transaction);
  if (!plan) throw ConflictError("ACCEPTANCE_DISCONTINUED", `Acceptance of this alloy and route is discontinued under the switching rules until corrective action is recorded.`);
  const before = await lotProgress(sequelize, lot, plan, transaction);
  if (before.decision) throw ConflictError("LOT_DECIDED", `Lot ${lot.number} is already ${before.decision} in round ${before.round}; nothing more is measured in this round.`);

  const ids = new Set<string>();
  for (const i of inputs) {
    ids.add(i.instrumentId);
    if (i.helmholtz) ids.add(i.helmholtz.instrumentId);
  }
  const instruments = new Map((await Instrument.findAll({ where: { id: [...ids] }, transaction })).map((i) => [i.id, i]));
  const taken = new Set(
    (await sequelize.query<{ serial: string }>(`select serial from measurements where lot_id = $1 and round = $2`, { bind: [lot.id, lot.inspection_round], type: QueryTypes.SELECT, transaction })).map((r) => r.serial),
  );

  const problems: FieldErrors = {};
  const ready: Prepared[] = [];
  const csv = props.source === "csv";
  const where = (index: number, field: string) => (csv ? `rows.${props.rowOf ? props.rowOf(index) : index + 1}.${field}` : field);
  let conflict: string | undefined;
  inputs.forEach((input, index) => {
    const p = prepare(input, instruments, today);
    if (!p.ok) {
      for (const [k, v] of Object.entries(p.problems)) problems[where(index, k)] = v;
      conflict ??= p.conflict;
      return;
    }
    if (taken.has(input.serial)) problems[where(index, "serial")] = `part ${input.serial} is already measured in this round`;
    taken.add(input.serial);
    ready.push(p.value);
  });
  if (!csv && conflict && Object.keys(problems).length === 1) throw new AppError(409, "INSTRUMENT_NOT_USABLE", conflict);
  if (!csv && Object.keys(problems).some((k) => k === "serial") && Object.keys(problems).length === 1) throw ConflictError("ALREADY_MEASURED", `Part ${inputs[0].serial} of lot ${lot.number} is already measured in this round.`);
  if (Object.keys(problems).length) throw ValidationError(problems, csv ? "Some rows of the file need attention; nothing was stored." : "Some fields need attention.");
  const room = plan.sampleSize - before.measured;
  if (ready.length > room) {
    throw ConflictError("SAMPLE_COMPLETE", room === 0 ? `Lot ${lot.number}'s sample of ${plan.sampleSize} is already measured.` : `Lot ${lot.number}'s plan needs ${room} more part${room === 1 ? "" : "s"}; ${ready.length} readings were sent. Nothing was stored.`);
  }

  const defaults = { frequency_hz: lot.configuration.field?.frequency_hz, orientation: lot.configuration.field?.orientation ?? "transverse" };
  const measurements = await Measurement.bulkCreate(
    ready.map((r) => {
      const judged = judgeMeasurement({ applied_uT: r.applied_uT, inside_uT: r.inside_uT, required_db: lot.required_db });
      return {
        lotId: lot.id,
        round: lot.inspection_round,
        serial: r.input.serial,
        frequencyHz: r.input.frequency_hz,
        appliedFieldUt: r.applied_uT,
        insideFieldUt: r.inside_uT,
        orientation: (r.input.orientation ?? defaults.orientation) as Orientation,
        probePosition: r.input.probePosition ?? "centre",
        instrumentId: r.instrument.id,
        instrumentCalibrationDue: r.instrument.calibrationDue,
        derivation: r.derivation,
        shieldingFactor: judged.shieldingFactor,
        attenuationDb: judged.attenuation_db,
        requiredDb: lot.required_db,
        predictedDb: lot.predicted_db,
        pass: judged.pass,
        source: props.source,
        measuredById: actor.id,
        createdAt: now,
      };
    }),
    { transaction, returning: true },
  );
  await recordEvent(
    { actor, action: "lot.measured", subject: { type: "lot", id: lot.id }, data: { round: lot.inspection_round, source: props.source, serials: measurements.map((m) => m.serial), failures: measurements.filter((m) => !m.pass).map((m) => m.serial) }, ip: props.ip, at: now },
    transaction,
  );

  const progress = await lotProgress(sequelize, lot, plan, transaction);
  const decision = verdict(progress);
  if (decision) {
    await LotDisposition.create({ lotId: lot.id, round: lot.inspection_round, decision, plan, measured: progress.measured, failures: progress.failures, concession: null, decidedById: actor.id }, { transaction });
    await recordEvent({ actor, action: `lot.${decision}`, subject: { type: "lot", id: lot.id }, data: { round: lot.inspection_round, measured: progress.measured, failures: progress.failures, accept: plan.accept, reject: plan.reject }, ip: props.ip, at: now }, transaction);
    if (decision === "accepted") await completeVerify({ actor, lot, sequelize, transaction, now });
    else await openNonconformance({ actor, lot, progress, sequelize, ip: props.ip, transaction, now });
    progress.decision = decision;
  }
  return { measurements, progress, lot };
}

/** The verify step of every job of the lot that stands at it, completed through the scan service. */
export async function completeVerify(props: { actor: Actor & { name: string }; lot: Pick<LotInspectionRow, "id" | "number">; sequelize: Sequelize; transaction: Transaction; now: Date }): Promise<void> {
  const { actor, lot, sequelize, transaction, now } = props;
  const jobs = await sequelize.query<{ code: string; started: boolean }>(
    `select code, step_started_at is not null as started from jobs where lot_id = $1 and completed_at is null and routing -> step_index ->> 'key' = 'verify' order by seq`,
    { bind: [lot.id], type: QueryTypes.SELECT, transaction },
  );
  const station = `quality: lot ${lot.number} sample measured`;
  for (const job of jobs) {
    if (!job.started) await stepScanner({ actor, input: { code: job.code, step: "verify", action: "start", station }, sequelize, transaction, now });
    await stepScanner({ actor, input: { code: job.code, step: "verify", action: "complete", station, note: "accepted under its sampling plan" }, sequelize, transaction, now, lotDecided: true });
  }
}

async function openNonconformance(props: { actor: Actor & { name: string }; lot: LotInspectionRow; progress: LotProgressJson; sequelize: Sequelize; ip: string | null; transaction: Transaction; now: Date }): Promise<void> {
  const { actor, lot, progress, transaction, now } = props;
  const nc = await Nonconformance.create(
    {
      lotId: lot.id,
      round: lot.inspection_round,
      description: `Lot ${lot.number} rejected: ${progress.failures} of ${progress.measured} sampled parts below the required ${lot.required_db} dB (plan Ac ${progress.accept}, Re ${progress.reject}).`,
      openedById: actor.id,
    },
    { transaction },
  );
  await recordEvent({ actor, action: "nonconformance.opened", subject: { type: "nonconformance", id: nc.id }, data: { lot: lot.number, description: nc.description }, ip: props.ip, at: now }, transaction);
  const row = (await Lot.findByPk(lot.id, { transaction }))!;
  await lotHolder({ actor, lot: row, input: { reason: `Rejected under its sampling plan (${nc.number}).` }, ip: props.ip, transaction, now });
}
