import { writeFile } from "node:fs/promises";
import path from "node:path";
import { randomBytes } from "node:crypto";
import type { Sequelize, Transaction } from "sequelize";
import type { QuoteConfiguration } from "../../shared/schemas/quote";
import type { ScanInput } from "../../shared/schemas/scans";
import type { StepKey } from "../../shared/shop-floor/routing";
import { renderDemoFurnaceChart, renderDemoMillCertificate } from "../documents/demo-records-pdf";
import type { FileStore } from "../files/store";
import { sha256File } from "../files/store";
import type { Mailer } from "../jobs/mailer";
import { CheckoutSession, Design, Job, Lot, MaterialHeat, Order, Quote, Shipment, StoredFile, recordEvent, type Organization, type User } from "../models";
import { furnaceRunRecorder } from "../services/furnaceRunRecorder";
import { lotPlanner } from "../services/orderReleaser";
import { orderPlacer } from "../services/orderPlacer";
import { paymentEventRecorder } from "../services/paymentEventRecorder";
import { quoteBuilder } from "../services/quoteBuilder";
import { stepScanner } from "../services/stepScanner";

// The demo's shop floor (invented): heats of sheet with their mill certificates, the released and
// shipped orders of the ordering demo with their lots and jobs, and a few more released orders so
// that the board shows work at every step — one lot waiting for a furnace load, one furnace run
// outside its window with its lot on hold, a late order, verify and pack under way.

const DAY = 86_400_000;
const HOUR = 3_600_000;
const silent: Mailer = { enqueue: async () => {}, send: () => {}, idle: async () => {} };
const SUPPLIER = "Corvale Alloys (demo)";
/** the marker: the seed has run when this heat exists */
const FIRST_HEAT = "CV-80-24117";

const HEATS = [
  { heatNumber: FIRST_HEAT, materialId: "ni80", thicknessMm: 1, quantity: 40, alloy: "80 % Ni-Fe-Mo (ASTM A753 Alloy 4)", daysAgo: 40 },
  { heatNumber: "CV-80-24193", materialId: "ni80", thicknessMm: 1.5, quantity: 16, alloy: "80 % Ni-Fe-Mo (ASTM A753 Alloy 4)", daysAgo: 35 },
  { heatNumber: "CV-80-23980", materialId: "ni80", thicknessMm: 0.75, quantity: 24, alloy: "80 % Ni-Fe-Mo (ASTM A753 Alloy 4)", daysAgo: 30 },
  { heatNumber: "CV-50-24044", materialId: "ni50", thicknessMm: 1, quantity: 20, alloy: "48 % Ni-Fe (ASTM A753 Alloy 2)", daysAgo: 38 },
] as const;

const GOOD_RUN = { peakTemperature_c: 1150, soak_min: 180, dewPoint_c: -55, dewPointOut_c: -48, coolingRate_c_per_h: 180, setpoint_c: 1160 };

export async function seedShopFloor(props: {
  sequelize: Sequelize;
  customers: Organization[];
  buyers: User[];
  operator: User;
  planner: User;
  store: FileStore;
  appUrl: string;
  transaction: Transaction;
  now?: Date;
}): Promise<string[]> {
  const { sequelize, transaction, operator, planner, store } = props;
  if (await MaterialHeat.count({ where: { heatNumber: FIRST_HEAT }, transaction })) return [];
  const now = props.now ?? new Date();
  const at = (daysAgo: number) => new Date(now.getTime() - daysAgo * DAY);

  // --- stored paper records ---
  const keep = async (content: Buffer, filename: string, purpose: string, by: User) => {
    const temp = path.join(store.incoming, randomBytes(16).toString("hex"));
    await writeFile(temp, content);
    const sha256 = await sha256File(temp);
    const storageKey = await store.keep(temp);
    return StoredFile.create({ organizationId: by.organizationId, uploadedById: by.id, purpose, filename, contentType: "application/pdf", sizeBytes: content.length, sha256, storageKey }, { transaction });
  };

  // --- heats with their mill certificates ---
  const heatByNumber = new Map<string, MaterialHeat>();
  for (const h of HEATS) {
    const receivedOn = at(h.daysAgo).toISOString().slice(0, 10);
    const cert = await keep(
      await renderDemoMillCertificate({ supplier: SUPPLIER, heatNumber: h.heatNumber, alloy: h.alloy, thickness_mm: h.thicknessMm, quantity: `${h.quantity} sheets 1000 × 2000 mm`, issuedOn: receivedOn }),
      `mill-certificate-${h.heatNumber}.pdf`, "mill-certificate", operator,
    );
    const heat = await MaterialHeat.create(
      { heatNumber: h.heatNumber, materialId: h.materialId, thicknessMm: h.thicknessMm, supplier: SUPPLIER, quantity: h.quantity, unit: "sheets", receivedOn, receivedById: operator.id, millCertificateFileId: cert.id, notes: null, createdAt: at(h.daysAgo) },
      { transaction },
    );
    await recordEvent({ actor: operator, action: "heat.received", subject: { type: "material_heat", id: heat.id }, data: { heatNumber: h.heatNumber, materialId: h.materialId, thickness_mm: h.thicknessMm }, at: at(h.daysAgo) }, transaction);
    heatByNumber.set(h.heatNumber, heat);
  }
  const heatFor = (job: Job) => [...heatByNumber.values()].find((h) => h.materialId === job.materialId && Math.abs(h.thicknessMm - job.thicknessMm) < 1e-6)?.heatNumber;

  // --- walking jobs through their steps with the scan service, at past times ---
  let clock = 0;
  const scan = async (job: Job, step: StepKey, action: "start" | "complete", when: Date) => {
    const input: ScanInput = { code: job.code, step, action, station: step === "anneal" ? "furnace bay" : step === "material" ? "stores" : "floor tablet 1" };
    if (action === "complete") {
      const r = job.routing.find((s) => s.key === step)!;
      if (step === "material") input.heatNumber = heatFor(job);
      if (step === "form" && r.drawStages) input.drawStagesDone = r.drawStages;
      if (step === "weld") input.weldInspection = { result: "pass", method: "visual" };
    }
    // the demo's history: its finished jobs' lots were accepted by quality
    await stepScanner({ actor: operator, input, sequelize, transaction, now: new Date(when.getTime() + clock++ * 60_000), lotDecided: true });
  };
  /** Scans the job up to `step` (and its components first); `until` "start" leaves that step started. */
  const walk = async (job: Job, jobs: Job[], step: StepKey, until: "start" | "complete", from: Date) => {
    for (const c of jobs.filter((j) => j.assemblyJobId === job.id)) await walk(c, jobs, c.routing.at(-1)!.key, "complete", from);
    let t = from.getTime();
    for (const s of job.routing) {
      const target = s.key === step;
      const done = await Job.findByPk(job.id, { transaction });
      const idx = job.routing.indexOf(s);
      if (done!.stepIndex > idx) {
        if (target) return;
        continue;
      }
      if (!(done!.stepIndex === idx && done!.stepStartedAt)) await scan(job, s.key, "start", new Date((t += 2 * HOUR)));
      if (target && until === "start") return;
      await scan(job, s.key, "complete", new Date((t += 3 * HOUR)));
      if (target) return;
    }
  };
  const walkLot = (jobs: Job[], step: StepKey, until: "start" | "complete", from: Date) =>
    jobs.filter((j) => j.finishedPiece).reduce((p, j) => p.then(() => walk(j, jobs, step, until, from)), Promise.resolve());
  const run = async (lots: Lot[], record: typeof GOOD_RUN, daysAgo: number, chart: boolean) => {
    const r = await furnaceRunRecorder({ actor: operator, input: { lotIds: lots.map((l) => l.id), ...record }, sequelize, ip: null, transaction, now: at(daysAgo) });
    if (chart) {
      const file = await keep(
        await renderDemoFurnaceChart({ runNumber: r.number, furnace: r.furnace.name, peak_c: record.peakTemperature_c, soak_min: record.soak_min, coolingRate_c_per_h: record.coolingRate_c_per_h }),
        `chart-${r.number}.pdf`, "furnace-chart", operator,
      );
      r.chartFileId = file.id;
      await r.save({ transaction });
    }
    return r;
  };

  // --- orders: the two the ordering demo marked released and shipped, and new ones for the floor ---
  const release = async (order: Order, daysAgo: number) => {
    const quote = (await Quote.findByPk(order.quoteId, { transaction }))!;
    const { lots, jobs } = await lotPlanner({ order, quote, transaction, now: at(daysAgo) });
    return { lots, jobs: jobs.sort((a, b) => a.seq - b.seq) };
  };
  const [fernhollow, quillbrook] = props.customers;
  const [buyer1, buyer2] = props.buyers;
  const demoOrder = async (org: Organization, buyer: User, designName: string, quantity: number, daysAgo: number, details: { purchaseOrder: string; requestedDate?: string }) => {
    const design = (await Design.findOne({ where: { organizationId: org.id, name: designName }, transaction }))!;
    const quote = await quoteBuilder({ actor: buyer, organizationId: org.id, configuration: design.configuration as QuoteConfiguration, quantity, designId: design.id, ip: null, transaction, now: at(daysAgo + 2) });
    const order = await orderPlacer({ actor: buyer, quote, input: { purchaseOrder: details.purchaseOrder }, mailer: silent, appUrl: props.appUrl, ip: null, transaction, now: at(daysAgo + 1) });
    if (details.requestedDate) order.requestedDate = details.requestedDate;
    await order.save({ transaction });
    const id = `cs_demo_${order.id.replace(/-/g, "").slice(0, 16)}`;
    await CheckoutSession.create({ id, orderId: order.id, amountCents: order.totalCents, currency: order.currency, url: "", status: "open", idempotencyKey: `demo-${id}`, createdById: buyer.id }, { transaction });
    const event = { id: `evt_demo_${id.slice(8)}`, type: "checkout.session.completed", data: { object: { id, amount_total: order.totalCents, currency: order.currency.toLowerCase(), payment_status: "paid", payment_intent: `pi_demo_${id.slice(8)}` } } };
    await paymentEventRecorder({ event, mailer: silent, appUrl: props.appUrl, transaction, now: at(daysAgo + 0.5) });
    await order.reload({ transaction });
    order.status = "released";
    await order.save({ transaction });
    const released = await release(order, daysAgo);
    await recordEvent({ actor: planner, organizationId: org.id, action: "order.released", subject: { type: "order", id: order.id }, data: { lots: released.lots.map((l) => l.number), jobs: released.jobs.length }, at: at(daysAgo) }, transaction);
    return { order, ...released };
  };
  const created: string[] = [`heats ${HEATS.map((h) => h.heatNumber).join(", ")}`];

  // shipped a few days ago: everything annealed inside the window, verified, packed, in one parcel
  const shippedOrder = await Order.findOne({ where: { organizationId: fernhollow.id, status: "shipped" }, transaction });
  if (shippedOrder && !(await Lot.count({ where: { orderId: shippedOrder.id }, transaction }))) {
    const { lots, jobs } = await release(shippedOrder, 27);
    await walkLot(jobs, "clean", "complete", at(26));
    for (const lot of lots) await run([lot], GOOD_RUN, 20, false);
    await walkLot(jobs, "pack", "complete", at(19));
    const shipment = await Shipment.create(
      { orderId: shippedOrder.id, carrier: "Harrow Freight (demo)", trackingNumber: "HF-2210-4471", parts: lots.map((l) => ({ lotId: l.id, lotNumber: l.number, pieces: l.pieces })), shippedAt: at(3), createdById: planner.id },
      { transaction },
    );
    for (const lot of lots) await lot.update({ shipmentId: shipment.id }, { transaction });
    created.push(`shipped order O-${shippedOrder.number}: lots ${lots.map((l) => l.number).join(", ")}`);
  }
  // released twelve days ago: end caps formed, the wall being welded
  const releasedOrder = await Order.findOne({ where: { organizationId: fernhollow.id, status: "released" }, transaction });
  if (releasedOrder && !(await Lot.count({ where: { orderId: releasedOrder.id }, transaction }))) {
    const { lots, jobs } = await release(releasedOrder, 12);
    await walkLot(jobs, "weld", "start", at(11));
    created.push(`released order O-${releasedOrder.number}: lot ${lots[0].number} at weld`);
  }
  // annealed outside the window: the lot is on hold with the run's deviations
  const held = await demoOrder(fernhollow, buyer1, "Photomultiplier can, two layers", 4, 9, { purchaseOrder: "FH-PO-2230" });
  await walkLot(held.jobs, "anneal", "start", at(8));
  const badRun = await run(held.lots, { ...GOOD_RUN, peakTemperature_c: 1192, coolingRate_c_per_h: 340 }, 2, false);
  created.push(`order O-${held.order.number}: furnace run ${badRun.number} outside the window, lot ${held.lots[0].number} on hold`);
  // annealed inside the window a few days ago (chart attached): one can in verification, one being packed
  const finishing = await demoOrder(fernhollow, buyer1, "Photomultiplier can, two layers", 3, 8, { purchaseOrder: "FH-PO-2236" });
  await walkLot(finishing.jobs, "clean", "complete", at(7));
  const goodRun = await run(finishing.lots, GOOD_RUN, 3, true);
  await walk(finishing.jobs[0], finishing.jobs, "verify", "start", at(2));
  await walk(finishing.jobs[1], finishing.jobs, "pack", "start", at(2));
  created.push(`order O-${finishing.order.number}: furnace run ${goodRun.number}, verify and pack under way`);
  // cleaned and waiting for a furnace load
  const waiting = await demoOrder(quillbrook, buyer2, "Beamline pickup shield", 6, 6, { purchaseOrder: "QB-121" });
  await walkLot(waiting.jobs, "clean", "complete", at(5));
  created.push(`order O-${waiting.order.number}: lot ${waiting.lots[0].number} waiting for a furnace load`);
  // late: asked for two days ago, still in forming
  const late = await demoOrder(fernhollow, buyer1, "Sensor box with lid", 2, 5, { purchaseOrder: "FH-PO-2240", requestedDate: at(2).toISOString().slice(0, 10) });
  const [inner, outer] = late.lots.map((l) => late.jobs.filter((j) => j.lotId === l.id));
  await walk(inner[0], inner, "form", "start", at(4));
  await walk(inner[1], inner, "blank", "complete", at(4));
  await walk(outer[0], outer, "material", "complete", at(3));
  await walk(outer[1], outer, "clean", "start", at(4));
  created.push(`order O-${late.order.number}: late, forming`);
  // released yesterday: material issue begun on one can
  const fresh = await demoOrder(fernhollow, buyer1, "Photomultiplier can, two layers", 2, 1, { purchaseOrder: "FH-PO-2244" });
  await walk(fresh.jobs[0], fresh.jobs, "material", "start", at(0.5));
  created.push(`order O-${fresh.order.number}: material issue`);
  return created;
}
