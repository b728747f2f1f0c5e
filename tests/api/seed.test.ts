import { describe, expect, it } from "vitest";
import { DEMO, seedDemo } from "../../server/db/seed";
import { Op } from "sequelize";
import { Design, FurnaceRun, Invoice, Job, Lot, MaterialHeat, Order, Organization, Payment, Quote, Scan, Shipment } from "../../server/models";
import { floorBoard } from "../../server/services/floorBoard";
import { buildTestApp } from "../support/app";

const app = buildTestApp();

describe("the demo scenario's ordering data", () => {
  it("saved designs, quotes (one expired), orders in every state for the first customer, a few for the second; a second run adds nothing", { timeout: 60_000 }, async () => {
    const { sequelize } = app.locals.deps;
    await seedDemo(sequelize, { password: "fluxwright-demo", store: app.locals.deps.files });
    const [first, second] = await Promise.all(DEMO.customers.map((name) => Organization.findOne({ where: { name } })));
    const count = async () => ({
      designs: await Design.count({ where: { organizationId: [first!.id, second!.id] } }),
      quotes: await Quote.count({ where: { organizationId: [first!.id, second!.id] } }),
      orders: await Order.count({ where: { organizationId: [first!.id, second!.id] } }),
    });
    const before = await count();
    await seedDemo(sequelize, { password: "fluxwright-demo", store: app.locals.deps.files });
    expect(await count()).toEqual(before);

    const orders = await Order.findAll({ where: { organizationId: first!.id } });
    expect(new Set(orders.map((o) => o.status))).toEqual(new Set(["awaiting_payment", "paid", "released", "shipped", "refunded", "cancelled"]));
    const quotes = await Quote.findAll({ where: { organizationId: first!.id } });
    expect(quotes.some((q) => q.isExpired())).toBe(true);
    expect(await Design.count({ where: { organizationId: first!.id } })).toBe(3);
    // paid orders carry their payment and invoice; the refunded one its refund
    for (const o of orders.filter((x) => ["paid", "released", "shipped", "refunded"].includes(x.status))) {
      expect(await Payment.count({ where: { orderId: o.id, kind: "payment" } })).toBe(1);
      expect(await Invoice.count({ where: { orderId: o.id } })).toBe(1);
    }
    const refunded = orders.find((o) => o.status === "refunded")!;
    expect(await Payment.sum("amountCents", { where: { orderId: refunded.id, kind: "refund" } })).toBe(refunded.totalCents);
    const theirs = await Order.findAll({ where: { organizationId: second!.id } });
    expect(theirs.map((o) => o.status).sort()).toEqual(["awaiting_payment", "paid", "released"]);
  });
});

describe("the demo scenario's shop floor", () => {
  it("heats with mill certificates, work at every step, a lot waiting for a furnace load, a run outside its window with its lot on hold, a shipped order's parcel; a second run adds nothing", { timeout: 60_000 }, async () => {
    const { sequelize } = app.locals.deps;
    await seedDemo(sequelize, { password: "fluxwright-demo", store: app.locals.deps.files });
    const counts = async () => ({ heats: await MaterialHeat.count(), lots: await Lot.count(), jobs: await Job.count(), runs: await FurnaceRun.count(), scans: await Scan.count() });
    const before = await counts();
    await seedDemo(sequelize, { password: "fluxwright-demo", store: app.locals.deps.files });
    expect(await counts()).toEqual(before);

    const heats = await MaterialHeat.findAll({ where: { heatNumber: { [Op.like]: "CV-%" } } });
    expect(heats).toHaveLength(4);
    for (const h of heats) expect(h.millCertificateFileId).not.toBeNull();
    const [first] = await Promise.all(DEMO.customers.map((name) => Organization.findOne({ where: { name } })));
    const demoOrders = (await Order.findAll({ where: { organizationId: first!.id } })).map((o) => o.id);
    const demoJobs = await Job.findAll({ where: { orderId: demoOrders } });
    const atStep = new Set(demoJobs.filter((j) => j.currentStep).map((j) => j.currentStep));
    expect([...atStep].sort()).toEqual(["anneal", "blank", "clean", "form", "material", "pack", "verify", "weld"]);
    expect(demoJobs.some((j) => j.completedAt)).toBe(true);
    const held = (await Lot.findAll({ where: { orderId: demoOrders, holdReason: { [Op.ne]: null } } })).filter((l) => !l.holdReason!.startsWith("Rejected under its sampling plan")); // the quality demo's rejected lot is held too
    expect(held).toHaveLength(1);
    expect(held[0].holdReason).toMatch(/outside the .* anneal window: Peak temperature 1192 °C is above/);
    const runs = await FurnaceRun.findAll({ where: { id: held[0].furnaceRunId! } });
    expect(runs[0].withinWindow).toBe(false);
    expect(await FurnaceRun.count({ where: { chartFileId: { [Op.ne]: null } } })).toBeGreaterThanOrEqual(1);
    const shipped = await Order.findOne({ where: { organizationId: first!.id, status: "shipped" } });
    expect(await Shipment.count({ where: { orderId: shipped!.id } })).toBe(1);
    // the board shows the scenario
    const board = await floorBoard(sequelize);
    expect(board.waitingForFurnace.length).toBeGreaterThanOrEqual(1);
    expect(board.late.count).toBeGreaterThanOrEqual(1);
    expect(board.holds.some((h) => h.lotId === held[0].id)).toBe(true);
  });
});

describe("the demo scenario's instruments", () => {
  it("several instruments, one out for calibration and one overdue, each with its calibration record; a second run adds nothing", async () => {
    const { sequelize } = app.locals.deps;
    const { Instrument, InstrumentCalibration } = await import("../../server/models");
    const { instrumentUsableOn, isOverdue, utcDay } = await import("../../shared/quality/instruments");
    await seedDemo(sequelize, { password: "fluxwright-demo" });
    const demoNames = ["Fluxgate probe FX-3", "Gaussmeter probe HP-1", "Search coil SC-200", "Helmholtz set HX-500", "Signal source SG-2", "Fluxgate probe FX-2 (spare)", "Search coil SC-50"];
    const rows = await Instrument.findAll({ where: { name: demoNames } });
    expect(rows).toHaveLength(7);
    const today = utcDay(new Date());
    expect(rows.filter((i) => i.status === "in-calibration").map((i) => i.name)).toEqual(["Fluxgate probe FX-2 (spare)"]);
    expect(rows.filter((i) => i.status === "in-service" && isOverdue(i, today)).map((i) => i.name)).toEqual(["Search coil SC-50"]);
    expect(rows.filter((i) => instrumentUsableOn(i, today))).toHaveLength(5);
    expect(new Set(rows.map((i) => i.kind))).toEqual(new Set(["fluxgate-probe", "gaussmeter-probe", "search-coil", "helmholtz-coil", "signal-source"]));
    expect(await InstrumentCalibration.count({ where: { instrumentId: rows.map((i) => i.id) } })).toBe(7);
    await seedDemo(sequelize, { password: "fluxwright-demo" });
    expect(await Instrument.count({ where: { name: demoNames } })).toBe(7);
  });
});

describe("the demo scenario's quality records", () => {
  it("a lot measured, accepted and certified with a second revision; a lot rejected with its nonconformance; a second run adds nothing", async () => {
    const { sequelize } = app.locals.deps;
    await seedDemo(sequelize, { password: "fluxwright-demo", store: app.locals.deps.files });
    const { Certificate, Nonconformance, Measurement } = await import("../../server/models");
    const count = async () => [await Certificate.count(), await Nonconformance.count({ where: { status: "open" } }), await Measurement.count()];
    // the demo's customers' certificates (other test files issue their own)
    const demoOrgs = (await Organization.findAll({ where: { name: { [Op.like]: "%(demo)%" } }, attributes: ["id"] })).map((o) => o.id);
    const demo = await Certificate.findAll({ where: { organizationId: demoOrgs }, attributes: ["number", "revision", "supersedesId"], order: [["revision", "ASC"]] });
    expect(demo.map((c) => c.revision)).toEqual([1, 2]);
    expect(demo[1].supersedesId).toBeTruthy();
    expect(await Nonconformance.count({ where: { status: "open" } })).toBeGreaterThanOrEqual(1);
    const before = await count();
    await seedDemo(sequelize, { password: "fluxwright-demo", store: app.locals.deps.files });
    expect(await count()).toEqual(before);
  });
});
