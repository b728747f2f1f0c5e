import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Event, FurnaceRun, Job, Lot } from "../../server/models";
import { buildTestApp } from "../support/app";
import { binary, ensureReferenceData } from "../support/ordering";
import { arrangeReadyForFurnace, buildHeat, buildReleasedOrder, customer, designs, goodRun, scanThrough, staff, type Agent } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);

const record = (who: Agent, body: Record<string, unknown>) => who.agent.post("/api/furnace-runs").set("X-CSRF-Token", who.csrf).send(body);
const PDF = Buffer.from("%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n");

async function readyLot(opts: Parameters<typeof buildReleasedOrder>[1] = {}) {
  const released = await buildReleasedOrder(app, opts);
  for (const lot of released.lots) await arrangeReadyForFurnace(lot.id);
  return released;
}

describe("GET /api/furnaces", { timeout: 30_000 }, () => {
  it("401, 403 for a customer; the staff see the furnaces, the anneal windows seeded from practice and the hydrogen caution", async () => {
    expect((await request(app).get("/api/furnaces")).status).toBe(401);
    expect((await (await customer(app)).agent.get("/api/furnaces")).status).toBe(403);
    const res = await (await staff(app, "operator")).agent.get("/api/furnaces");
    expect(res.status).toBe(200);
    expect(res.body.furnaces[0]).toMatchObject({ id: expect.any(String), maxLoad_kg: expect.any(Number) });
    // domain.md section 5 [practice]: 80 % Ni-Fe-Mo 1100–1180 °C, 2–4 h, dew point −40 °C or drier, 100–300 °C/h
    expect(res.body.annealWindows.find((w: { materialId: string }) => w.materialId === "ni80")).toMatchObject({
      peak_c: { min: 1100, max: 1180 }, soak_min: { min: 120, max: 240 }, dewPointMax_c: -40, coolingRate_c_per_h: { min: 100, max: 300 },
    });
    expect(res.body.caution).toMatch(/NFPA 86/);
    expect(res.body.caution).toMatch(/EN 746-3/);
  });
});

describe("POST /api/furnace-runs", { timeout: 30_000 }, () => {
  it("401, 403 for a customer and for quality, 400 naming the fields and an unknown lot", async () => {
    const { lots } = await readyLot();
    const body = { lotIds: [lots[0].id], ...goodRun };
    expect((await request(app).post("/api/furnace-runs").send(body)).status).toBe(401);
    expect((await record(await customer(app), body)).status).toBe(403);
    expect((await record(await staff(app, "qa"), body)).status).toBe(403);
    const op = await staff(app, "operator");
    let res = await record(op, { lotIds: [], peakTemperature_c: "hot", dewPoint_c: -50, coolingRate_c_per_h: 200 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["lotIds", "peakTemperature_c", "soak_min"]);
    res = await record(op, { ...body, lotIds: [lots[0].id, "9b6f3c5e-0000-4000-8000-000000000000"] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ "lotIds.1": "no such lot" });
    res = await record(op, { ...body, furnaceId: "NOPE-9" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("furnaceId");
    expect(await FurnaceRun.count({ where: { materialId: "ni80", number: "none" } })).toBe(0);
    expect((await Lot.findByPk(lots[0].id))!.furnaceRunId).toBeNull();
  });

  it("refuses a lot not ready for the anneal (409 naming the job and its step), mixed alloys and a load over the furnace's capacity (400)", async () => {
    const notReady = await buildReleasedOrder(app);
    const op = await staff(app, "operator");
    let res = await record(op, { lotIds: [notReady.lots[0].id], ...goodRun });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: "LOT_NOT_READY", message: expect.stringMatching(/job J-\d+ is at material/) });

    const box = await readyLot({ configuration: designs.bentTwoAlloys() });
    res = await record(op, { lotIds: box.lots.map((l) => l.id), ...goodRun });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.lotIds).toMatch(/one alloy/);

    const heavy = await readyLot();
    await Lot.update({ massKg: 400 }, { where: { id: heavy.lots[0].id } });
    res = await record(op, { lotIds: [heavy.lots[0].id], ...goodRun });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.lotIds).toMatch(/the load is 400\.0 kg; .* takes at most 250 kg/);
    expect(await Lot.count({ where: { id: [notReady.lots[0].id, heavy.lots[0].id, ...box.lots.map((l) => l.id)], furnaceRunId: null } })).toBe(4);
  });

  it("201 within the window: the lots are in the run, no hold; completing the anneal links each job to the run; a lot is loaded once", async () => {
    const { lots, jobs } = await buildReleasedOrder(app);
    const op = await staff(app, "operator");
    const heat = await buildHeat();
    for (const j of jobs) await scanThrough(op, j, "clean", heat.heatNumber);
    const ready = await op.agent.get(`/api/lots/${lots[0].id}`);
    expect(ready.body).toMatchObject({ status: "ready_for_anneal", readyForAnneal: true, heats: [{ heatNumber: heat.heatNumber, millCertificate: false }] });
    const res = await record(op, { lotIds: [lots[0].id], ...goodRun, setpoint_c: 1160, notes: "Bell 1, lower rack" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      number: expect.stringMatching(/^FR-\d+$/), withinWindow: true, deviations: [], material: { id: "ni80" }, pieces: 4,
      lots: [{ id: lots[0].id, number: lots[0].number, onHold: false }], operator: { id: op.user.id }, setpoint_c: 1160, dewPointOut_c: -45,
      window: { materialId: "ni80" }, chart: null,
    });
    const lot = await op.agent.get(`/api/lots/${lots[0].id}`);
    expect(lot.body).toMatchObject({ status: "annealed", hold: null, furnaceRun: { id: res.body.id, withinWindow: true } });
    for (const j of jobs) {
      await op.agent.post("/api/scans").set("X-CSRF-Token", op.csrf).send({ code: j.code, step: "anneal", action: "start", station: "furnace" });
      const done = await op.agent.post("/api/scans").set("X-CSRF-Token", op.csrf).send({ code: j.code, step: "anneal", action: "complete", station: "furnace" });
      expect(done.status).toBe(201);
      expect(done.body.job.furnaceRun).toEqual({ id: res.body.id, number: res.body.number });
    }
    expect((await Job.findByPk(jobs[0].id))!.furnaceRunId).toBe(res.body.id);
    const again = await record(op, { lotIds: [lots[0].id], ...goodRun });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("LOT_ALREADY_ANNEALED");
    expect(await Event.count({ where: { action: "furnace-run.recorded", subjectId: res.body.id } })).toBe(1);
  });

  it("a record outside the window puts the lots on hold with the reason; only the planner releases it, with a reason, and may send the lot to be annealed again", async () => {
    const { lots, jobs } = await readyLot();
    const op = await staff(app, "operator");
    const res = await record(op, { lotIds: [lots[0].id], ...goodRun, peakTemperature_c: 1195, dewPoint_c: -30 });
    expect(res.status).toBe(201);
    expect(res.body.withinWindow).toBe(false);
    expect(res.body.deviations).toEqual(["Peak temperature 1195 °C is above the window's 1180 °C", "Dew point in -30 °C is wetter than the window's -40 °C"]);
    expect(res.body.lots[0].onHold).toBe(true);
    let lot = await op.agent.get(`/api/lots/${lots[0].id}`);
    expect(lot.body.status).toBe("on_hold");
    expect(lot.body.hold.reason).toMatch(/^Furnace run FR-\d+ was outside the .* anneal window: Peak temperature 1195 °C is above/);
    expect(lot.body.abilities).toMatchObject({ releaseHold: false });
    const scan = await op.agent.post("/api/scans").set("X-CSRF-Token", op.csrf).send({ code: jobs[0].code, step: "anneal", action: "start", station: "furnace" });
    expect(scan.status).toBe(409);
    expect(scan.body.error.code).toBe("LOT_ON_HOLD");
    const board = await op.agent.get("/api/floor");
    expect(board.body.holds.find((h: { lotId: string }) => h.lotId === lots[0].id)).toMatchObject({ reason: lot.body.hold.reason, furnaceRunId: res.body.id });

    const url = `/api/lots/${lots[0].id}/hold-release`;
    expect((await request(app).post(url).send({ reason: "ok" })).status).toBe(401);
    expect((await op.agent.post(url).set("X-CSRF-Token", op.csrf).send({ reason: "Looks fine to me" })).status).toBe(403);
    expect((await (await staff(app, "qa")).agent.post(url).send({ reason: "x" })).status).toBe(403);
    expect((await (await customer(app)).agent.get(`/api/lots/${lots[0].id}`)).status).toBe(404);
    const planner = await staff(app, "admin");
    lot = await planner.agent.get(`/api/lots/${lots[0].id}`);
    expect(lot.body.abilities).toMatchObject({ releaseHold: true });
    let released = await planner.agent.post(url).set("X-CSRF-Token", planner.csrf).send({});
    expect(released.status).toBe(400);
    expect(released.body.error.fields).toHaveProperty("reason");
    released = await planner.agent.post(url).set("X-CSRF-Token", planner.csrf).send({ reason: "Anneal again in a run inside the window", reanneal: true });
    expect(released.status).toBe(200);
    expect(released.body).toMatchObject({ status: "ready_for_anneal", hold: null, furnaceRun: null });
    expect((await planner.agent.post(url).set("X-CSRF-Token", planner.csrf).send({ reason: "again" })).status).toBe(409);
    const events = await Event.findAll({ where: { subjectId: lots[0].id, action: ["lot.held", "lot.hold-released"] }, order: [["id", "ASC"]] });
    expect(events.map((e) => e.action)).toEqual(["lot.held", "lot.hold-released"]);
    expect(events[1].data).toMatchObject({ reason: "Anneal again in a run inside the window", reanneal: true });
    // the out-of-window run keeps its load on record
    expect((await op.agent.get(`/api/furnace-runs/${res.body.id}`)).body.lots.map((l: { id: string }) => l.id)).toEqual([lots[0].id]);
    const second = await record(op, { lotIds: [lots[0].id], ...goodRun });
    expect(second.status).toBe(201);
    expect(second.body.withinWindow).toBe(true);
  });

  it("the planner or quality may hold a lot by hand; an operator may not", async () => {
    const { lots } = await buildReleasedOrder(app);
    const url = `/api/lots/${lots[0].id}/hold`;
    const op = await staff(app, "operator");
    expect((await op.agent.post(url).set("X-CSRF-Token", op.csrf).send({ reason: "Dented" })).status).toBe(403);
    const qa = await staff(app, "qa");
    expect((await qa.agent.post(url).set("X-CSRF-Token", qa.csrf).send({ reason: "" })).status).toBe(400);
    const res = await qa.agent.post(url).set("X-CSRF-Token", qa.csrf).send({ reason: "Dented corner on two cans" });
    expect(res.status).toBe(200);
    expect(res.body.hold).toMatchObject({ reason: "Dented corner on two cans", by: { id: qa.user.id } });
    expect((await qa.agent.post(url).set("X-CSRF-Token", qa.csrf).send({ reason: "again" })).status).toBe(409);
  });

  it("the chart: a PDF or an image is kept and downloaded as sent; another type is refused naming the file", async () => {
    const { lots } = await readyLot();
    const op = await staff(app, "operator");
    const run = (await record(op, { lotIds: [lots[0].id], ...goodRun })).body;
    const url = `/api/furnace-runs/${run.id}/chart`;
    expect((await request(app).post(url).attach("file", PDF, "chart.pdf")).status).toBe(401);
    expect((await (await staff(app, "qa")).agent.post(url).attach("file", PDF, "chart.pdf")).status).toBe(403);
    let res = await op.agent.post(url).set("X-CSRF-Token", op.csrf).attach("file", Buffer.from("0\r\nSECTION\r\n2\r\nENTITIES\r\n0\r\nENDSEC\r\n0\r\nEOF\r\n"), "chart.dxf");
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/DXF drawing, not a PDF or an image/);
    res = await op.agent.post(url).set("X-CSRF-Token", op.csrf).attach("file", Buffer.from("MZ\x90\x00\x03\x00\x00\x00\x04\x00\x00\x00\xff\xff"), "chart.pdf");
    expect(res.status).toBe(400);
    res = await op.agent.post(url).set("X-CSRF-Token", op.csrf).attach("file", PDF, "run chart.pdf");
    expect(res.status).toBe(201);
    expect(res.body.chart).toMatchObject({ filename: "run chart.pdf", contentType: "application/pdf", url });
    const download = await op.agent.get(url).buffer(true).parse(binary);
    expect(download.status).toBe(200);
    expect(Buffer.compare(download.body as Buffer, PDF)).toBe(0);
    expect(download.headers["content-disposition"]).toMatch(/^attachment/);
    expect((await op.agent.get(`/api/furnace-runs/${lots[0].id}/chart`)).status).toBe(404);
  });

  it("GET /api/furnace-runs lists runs with their lots, filtered by the window verdict", async () => {
    const a = await readyLot();
    const b = await readyLot();
    const op = await staff(app, "operator");
    const good = (await record(op, { lotIds: [a.lots[0].id], ...goodRun })).body;
    const bad = (await record(op, { lotIds: [b.lots[0].id], ...goodRun, coolingRate_c_per_h: 450 })).body;
    expect((await request(app).get("/api/furnace-runs")).status).toBe(401);
    expect((await (await customer(app)).agent.get("/api/furnace-runs")).status).toBe(403);
    let res = await op.agent.get("/api/furnace-runs?withinWindow=false&pageSize=100");
    expect(res.body.items.map((r: { id: string }) => r.id)).toContain(bad.id);
    expect(res.body.items.map((r: { id: string }) => r.id)).not.toContain(good.id);
    res = await op.agent.get(`/api/furnace-runs?q=${a.lots[0].number}`);
    expect(res.body.items).toEqual([expect.objectContaining({ id: good.id, lotNumbers: [a.lots[0].number], withinWindow: true })]);
    expect((await op.agent.get("/api/furnace-runs?withinWindow=maybe")).status).toBe(400);
  });
});
