// Factories and helpers for the shop-floor tests: released orders made through the same services
// the routes use, heats, signed-in staff, and a scan helper that walks a job through its routing.
import { randomUUID } from "node:crypto";
import type { FluxwrightApp } from "../../server/app";
import type { Mailer } from "../../server/jobs/mailer";
import { CheckoutSession, Job, Lot, MaterialHeat, Order, Quote, type User } from "../../server/models";
import { orderPlacer } from "../../server/services/orderPlacer";
import { orderReleaser } from "../../server/services/orderReleaser";
import { paymentEventRecorder } from "../../server/services/paymentEventRecorder";
import type { Role } from "../../shared/schemas/auth";
import type { StepKey } from "../../shared/shop-floor/routing";
import { buildOrganization, buildUser, signIn } from "./app";
import { buildQuote, completedEvent, configuration } from "./ordering";

export type Agent = Awaited<ReturnType<typeof signIn>>;

/** A signed-in member of the shop's staff. */
export async function staff(app: FluxwrightApp, role: Exclude<Role, "customer"> = "admin"): Promise<Agent & { user: User }> {
  const shop = await buildOrganization({ kind: "shop" });
  const user = await buildUser({ role, organizationId: shop.id, name: `${role} person` });
  return { user, ...(await signIn(app, user)) };
}

/** A signed-in customer (of a new organisation unless one is given). */
export async function customer(app: FluxwrightApp, organizationId?: string): Promise<Agent & { user: User }> {
  const user = await buildUser({ role: "customer", name: "Carla Customer", ...(organizationId ? { organizationId } : {}) });
  return { user, ...(await signIn(app, user)) };
}

/** Configurations the shop makes, one per forming method. */
export const designs = {
  /** the contract's example: two 80 % Ni layers, deep drawn */
  drawn: () => configuration(),
  /** one rolled 80 % Ni layer: wall and two end caps */
  rolled: () => configuration({ method: "rolled", seamOverlap_mm: 0, cornerRadius_mm: undefined, trim_mm: undefined, layers: [{ material: "ni80", thickness_mm: 1 }] }),
  /** a bent box with a lid, 80 % Ni inside, 50 % Ni outside, and a collared cable hole */
  bentTwoAlloys: () =>
    configuration({
      shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, ends: undefined, cornerRadius_mm: undefined, trim_mm: undefined,
      bendRadius_mm: 1.5, kFactor: 0.44, lid: true, holes: [{ diameter_mm: 8, collarLength_mm: 12 }],
      layers: [{ material: "ni80", thickness_mm: 1, gap_mm: 6 }, { material: "ni50", thickness_mm: 1 }],
    }),
};

/** Queues nothing: the factory's orders need no mail, and every mail queued slows every test file's `inbox()`. */
const silent: Mailer = { enqueue: async () => {}, send: () => {}, idle: async () => {} };

/**
 * A paid order released to the floor through the ordering and release services (without their
 * mails: the release and shipment tests read those); returns the order, its lots and jobs.
 */
export async function buildReleasedOrder(app: FluxwrightApp, opts: { buyer?: User; quantity?: number; configuration?: Record<string, unknown>; requestedDate?: string } = {}) {
  const buyer = opts.buyer ?? (await buildUser({ role: "customer" }));
  const { sequelize, config } = app.locals.deps;
  const quote = await buildQuote(app, buyer, { quantity: opts.quantity ?? 2, configuration: opts.configuration });
  const placed = await sequelize.transaction((transaction) => orderPlacer({ actor: buyer, quote, input: {}, mailer: silent, appUrl: config.appUrl, ip: null, transaction }));
  const sessionId = `cs_test_${placed.id.slice(0, 8)}${Date.now()}`;
  await CheckoutSession.create({ id: sessionId, orderId: placed.id, amountCents: placed.totalCents, currency: placed.currency, url: "http://127.0.0.1/x", idempotencyKey: `test-${sessionId}`, createdById: buyer.id });
  await sequelize.transaction((transaction) =>
    paymentEventRecorder({ event: completedEvent(sessionId, placed.totalCents, placed.currency.toLowerCase()), mailer: silent, appUrl: config.appUrl, transaction }),
  );
  const paid = placed;
  if (opts.requestedDate) await Order.update({ requestedDate: opts.requestedDate }, { where: { id: paid.id } });
  const mailer = silent;
  const planner = await buildUser({ role: "admin", organizationId: (await buildOrganization({ kind: "shop" })).id });
  await sequelize.transaction(async (transaction) => {
    const order = (await Order.findByPk(paid.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const quote = (await Quote.findByPk(order.quoteId, { transaction }))!;
    await orderReleaser({ actor: planner, order, quote, mailer, appUrl: config.appUrl, ip: null, transaction });
  });
  const order = (await Order.findByPk(paid.id))!;
  const lots = await Lot.findAll({ where: { orderId: order.id }, order: [["seq", "ASC"]] });
  const jobs = await Job.findAll({ where: { orderId: order.id }, order: [["seq", "ASC"]] });
  return { order, lots, jobs, buyer };
}

/** A received heat of sheet (unique heat number unless given). */
export async function buildHeat(overrides: Partial<{ heatNumber: string; materialId: string; thicknessMm: number }> = {}) {
  return MaterialHeat.create({
    heatNumber: overrides.heatNumber ?? `H${randomUUID().slice(0, 8).toUpperCase()}`,
    materialId: overrides.materialId ?? "ni80",
    thicknessMm: overrides.thicknessMm ?? 1,
    supplier: "Test Mill (test)",
    quantity: 10,
    unit: "sheets",
    receivedById: null,
    notes: null,
  });
}

/** Step data each step needs to complete, for a job of this routing. */
export function completeData(job: Job, step: StepKey, heatNumber?: string): Record<string, unknown> {
  const routingStep = job.routing.find((s) => s.key === step);
  if (step === "material") return { heatNumber };
  if (step === "form" && routingStep?.drawStages) return { drawStagesDone: routingStep.drawStages };
  if (step === "weld") return { weldInspection: { result: "pass" } };
  return {};
}

/** Scans start and complete of every step up to (and including) `until`, through the API. */
export async function scanThrough(agent: Agent, job: Job, until: StepKey, heatNumber: string): Promise<void> {
  for (const s of job.routing) {
    for (const action of ["start", "complete"] as const) {
      const res = await agent.agent
        .post("/api/scans")
        .set("X-CSRF-Token", agent.csrf)
        .send({ code: job.code, step: s.key, action, station: "test bench", ...(action === "complete" ? completeData(job, s.key, heatNumber) : {}) });
      if (res.status !== 201 && res.status !== 200) throw new Error(`scan ${job.code} ${s.key} ${action}: ${res.status} ${JSON.stringify(res.body)}`);
    }
    if (s.key === until) return;
  }
}

/**
 * Arranges a lot as if every job had been scanned through clean (components finished): the state a
 * furnace load needs, without walking each job through the API. The scan tests walk the real path.
 */
export async function arrangeReadyForFurnace(lotId: string): Promise<void> {
  const sequelize = Job.sequelize!;
  await sequelize.query(`update jobs set step_index = anneal_index, current_step = 'anneal', step_started_at = null where lot_id = $1 and anneal_index is not null`, { bind: [lotId] });
  await sequelize.query(
    `update jobs set step_index = jsonb_array_length(routing), current_step = null, step_started_at = null, completed_at = now() where lot_id = $1 and anneal_index is null`,
    { bind: [lotId] },
  );
}

/** A furnace run record inside the 80 % Ni window of the shop settings' defaults. */
export const goodRun = { peakTemperature_c: 1150, soak_min: 180, dewPoint_c: -50, dewPointOut_c: -45, coolingRate_c_per_h: 200 };

/** Arranges every job of a lot as finished (scanned through pack). */
export async function arrangeFinished(lotId: string): Promise<void> {
  await Job.sequelize!.query(
    `update jobs set step_index = jsonb_array_length(routing), current_step = null, step_started_at = null, completed_at = now() where lot_id = $1`,
    { bind: [lotId] },
  );
}
