// Helpers for the quality tests: a released order's lot arranged as annealed (through a real
// furnace run record) with its jobs at verify, and instruments of the register.
import { randomUUID } from "node:crypto";
import type { FluxwrightApp } from "../../server/app";
import { Instrument, Job, type Lot, type User } from "../../server/models";
import { utcDay } from "../../shared/quality/instruments";
import { arrangeReadyForFurnace, buildReleasedOrder, goodRun, staff } from "./shop-floor";

const DAY = 86_400_000;

/** An instrument of the register, calibrated and due in 100 days unless told otherwise. */
export async function buildInstrument(overrides: Partial<{ name: string; kind: Instrument["kind"]; calibrationDue: string; status: "in-service" | "in-calibration"; turns: number; area_mm2: number; radius_mm: number }> = {}) {
  return Instrument.create({
    name: overrides.name ?? `Probe ${randomUUID().slice(0, 6)}`,
    kind: overrides.kind ?? "fluxgate-probe",
    serialNumber: `SN-${randomUUID().slice(0, 6)}`,
    make: null, range: null, notes: null,
    turns: overrides.turns ?? null, area_mm2: overrides.area_mm2 ?? null, radius_mm: overrides.radius_mm ?? null,
    status: overrides.status ?? "in-service",
    calibrationDue: overrides.calibrationDue ?? utcDay(new Date(Date.now() + 100 * DAY)),
    lastCalibratedOn: utcDay(new Date(Date.now() - 200 * DAY)),
    createdById: null,
  });
}

/**
 * A released order whose first lot has been through a furnace run inside the window, every job
 * past its anneal and standing at verify (components finished): the state QA measures.
 */
export async function buildLotAtVerify(app: FluxwrightApp, opts: { quantity?: number; buyer?: User } = {}): Promise<{ lot: Lot; jobs: Job[]; order: Awaited<ReturnType<typeof buildReleasedOrder>>["order"]; buyer: User }> {
  const built = await buildReleasedOrder(app, { quantity: opts.quantity ?? 20, buyer: opts.buyer });
  const lot = built.lots[0];
  await arrangeReadyForFurnace(lot.id);
  const operator = await staff(app, "operator");
  const run = await operator.agent.post("/api/furnace-runs").set("X-CSRF-Token", operator.csrf).send({ lotIds: [lot.id], furnaceId: undefined, ...goodRun });
  if (run.status !== 201) throw new Error(`furnace run: ${run.status} ${JSON.stringify(run.body)}`);
  await Job.sequelize!.query(
    `update jobs set step_index = anneal_index + 1, current_step = routing -> (anneal_index + 1) ->> 'key', step_started_at = null, furnace_run_id = $2 where lot_id = $1 and anneal_index is not null`,
    { bind: [lot.id, run.body.id] },
  );
  await lot.reload();
  const jobs = await Job.findAll({ where: { lotId: lot.id }, order: [["seq", "ASC"]] });
  return { lot, jobs, order: built.order, buyer: built.buyer };
}
