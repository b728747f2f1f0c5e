import { randomUUID } from "node:crypto";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Job, Lot, Scan } from "../../server/models";
import { buildTestApp } from "../support/app";
import { ensureReferenceData } from "../support/ordering";
import { buildLotAtVerify } from "../support/quality";
import { buildHeat, buildReleasedOrder, completeData, customer, designs, scanThrough, staff, type Agent } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);

const scan = (who: Agent, body: Record<string, unknown>, headers: Record<string, string> = {}) =>
  who.agent.post("/api/scans").set("X-CSRF-Token", who.csrf).set(headers).send({ station: "press 2", ...body });

describe("POST /api/scans: who and what", { timeout: 30_000 }, () => {
  it("401, 403 for a customer and without CSRF, 400 naming the fields, 404 for an unknown code", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const body = { code: jobs[0].code, step: "material", action: "start", station: "stores" };
    expect((await request(app).post("/api/scans").send(body)).status).toBe(401);
    const buyer = await customer(app);
    const refused = await scan(buyer, body);
    expect(refused.status).toBe(403);
    const operator = await staff(app, "operator");
    expect((await operator.agent.post("/api/scans").send(body)).status).toBe(403);
    let res = await scan(operator, { code: "", step: "paint", action: "finish", station: "" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["action", "code", "station", "step"]);
    res = await scan(operator, { ...body, code: "J-99999999" });
    expect(res.status).toBe(404);
    expect(res.body.error).toMatchObject({ code: "UNKNOWN_CODE", message: expect.stringContaining("No job has the code J-99999999") });
    expect(await Scan.count({ where: { jobId: jobs[0].id } })).toBe(0);
  });

  it("qa and the planner may scan too; the event records operator, station and time", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const qa = await staff(app, "qa");
    const res = await scan(qa, { code: jobs[0].code.toLowerCase(), step: "material", action: "start", station: "stores tablet" });
    expect(res.status).toBe(201);
    expect(res.body.repeat).toBe(false);
    expect(res.body.event).toMatchObject({ code: jobs[0].code, step: "material", action: "start", station: "stores tablet", operator: { id: qa.user.id, name: "qa person" } });
    expect(Date.now() - Date.parse(res.body.event.scannedAt)).toBeLessThan(60_000);
    expect(res.body.job.steps[0]).toMatchObject({ key: "material", status: "started", started: { station: "stores tablet", by: { id: qa.user.id } } });
    const admin = await staff(app, "admin");
    expect((await scan(admin, { code: jobs[1].code, step: "material", action: "start" })).status).toBe(201);
  });
});

describe("POST /api/scans: the sequence", { timeout: 30_000 }, () => {
  it("refuses a step the job does not have, a step barcode of another job, a complete before its start and a step ahead of its turn (409, in words)", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const [a, b] = jobs;
    const op = await staff(app, "operator");
    let res = await scan(op, { code: a.code, step: "weld", action: "start" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("STEP_NOT_IN_ROUTING");
    expect(res.body.error.message).toMatch(/has no weld step\. Its route is Material issue → Blank → Form/);
    res = await scan(op, { code: a.code, step: `${b.code}-MATERIAL`, action: "start" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("STEP_OF_ANOTHER_JOB");
    expect(res.body.error.message).toContain(`belongs to job ${b.code}`);
    res = await scan(op, { code: a.code, step: "material", action: "complete" });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: "NOT_STARTED", message: expect.stringContaining("scan start first") });
    res = await scan(op, { code: a.code, step: "blank", action: "start" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("OUT_OF_SEQUENCE");
    expect(res.body.error.message).toMatch(/material issue is not finished on job J-\d+\. Next on job J-\d+: start material issue\./);
    expect(await Scan.count({ where: { jobId: a.id } })).toBe(0);
    // the step's own barcode from the traveler works like its key
    res = await scan(op, { code: a.code, step: `${a.code}-MATERIAL`, action: "start" });
    expect(res.status).toBe(201);
  });

  it("a repeat is 200 with the event first recorded, by key or by content; a key reused for another scan is 409", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const op = await staff(app, "operator");
    const key = `tablet-7:${randomUUID()}`;
    const body = { code: jobs[0].code, step: "material", action: "start", idempotencyKey: key };
    const first = await scan(op, body);
    expect(first.status).toBe(201);
    const replay = await scan(op, body);
    expect(replay.status).toBe(200);
    expect(replay.body.repeat).toBe(true);
    expect(replay.body.event).toEqual(first.body.event);
    // the key in the header is the same key
    const header = await scan(op, { code: jobs[0].code, step: "material", action: "start" }, { "Idempotency-Key": key });
    expect(header.status).toBe(200);
    expect(header.body.event.id).toBe(first.body.event.id);
    // another station scanning what is already recorded: no second event
    const other = await scan(op, { code: jobs[0].code, step: "material", action: "start", station: "other tablet" });
    expect(other.status).toBe(200);
    expect(other.body.event.id).toBe(first.body.event.id);
    const reused = await scan(op, { code: jobs[1].code, step: "material", action: "start", idempotencyKey: key });
    expect(reused.status).toBe(409);
    expect(reused.body.error.code).toBe("IDEMPOTENCY_KEY_REUSED");
    const mismatch = await scan(op, { ...body, idempotencyKey: "tablet-7:0002-bbbb" }, { "Idempotency-Key": "tablet-7:0003-cccc" });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.fields).toHaveProperty("idempotencyKey");
    expect(await Scan.count({ where: { jobId: jobs[0].id } })).toBe(1);
    expect(await Scan.count({ where: { jobId: jobs[1].id } })).toBe(0);
  });

  it("20 identical scans at once make one event: one 201, nineteen 200 (with and without an idempotency key)", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const op = await staff(app, "operator");
    for (const [job, key] of [[jobs[0], undefined], [jobs[1], `burst-${randomUUID()}`]] as const) {
      const answers = await Promise.all(Array.from({ length: 20 }, () => scan(op, { code: job.code, step: "material", action: "start", ...(key ? { idempotencyKey: key } : {}) })));
      const statuses = answers.map((r) => r.status).sort();
      expect(statuses).toEqual([...Array(19).fill(200), 201]);
      expect(new Set(answers.map((r) => r.body.event.id)).size).toBe(1);
      expect(await Scan.count({ where: { jobId: job.id } })).toBe(1);
    }
    // the same at a step that needs no step data (its move is taken in the reading statement)
    const heat = await buildHeat();
    await scanThrough(op, jobs[0], "material", heat.heatNumber);
    const key = `burst-${randomUUID()}`;
    for (const extra of [{}, { idempotencyKey: key }]) {
      const answers = await Promise.all(Array.from({ length: 20 }, () => scan(op, { code: jobs[0].code, step: "blank", action: "start", ...extra })));
      expect(answers.map((r) => r.status).sort()).toEqual(extra.idempotencyKey ? Array(20).fill(200) : [...Array(19).fill(200), 201]);
      expect(new Set(answers.map((r) => r.body.event.id)).size).toBe(1);
    }
    expect(await Scan.count({ where: { jobId: jobs[0].id, step: "blank" } })).toBe(1);
  });

  it("starts and completions of the same step racing from several stations leave one of each, and the job where its events say", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const heat = await buildHeat();
    const op = await staff(app, "operator");
    const body = (action: string) => ({ code: jobs[0].code, step: "material", action, ...(action === "complete" ? { heatNumber: heat.heatNumber } : {}) });
    const answers = await Promise.all(Array.from({ length: 16 }, (_, i) => scan(op, body(i % 2 ? "complete" : "start"))));
    for (const r of answers) expect([200, 201, 409]).toContain(r.status);
    expect(answers.filter((r) => r.status === 201).length).toBeLessThanOrEqual(2);
    const rows = await Scan.findAll({ where: { jobId: jobs[0].id } });
    expect(rows.map((r) => r.action).sort()).toEqual(answers.some((r) => r.status === 201 && r.body.event.action === "complete") ? ["complete", "start"] : ["start"]);
    const job = (await Job.findByPk(jobs[0].id))!;
    expect(job.stepIndex).toBe(rows.length === 2 ? 1 : 0);
    expect(job.stepStartedAt !== null).toBe(rows.length === 1);
  });

  it("an offline scan keeps the time it was made; one older than two weeks is refused naming scannedAt", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const op = await staff(app, "operator");
    const when = new Date(Date.now() - 3_600_000).toISOString();
    const res = await scan(op, { code: jobs[0].code, step: "material", action: "start", scannedAt: when });
    expect(res.status).toBe(201);
    expect(res.body.event.scannedAt).toBe(when);
    expect(Date.parse(res.body.event.recordedAt)).toBeGreaterThan(Date.parse(when));
    const old = await scan(op, { code: jobs[1].code, step: "material", action: "start", scannedAt: new Date(Date.now() - 15 * 86_400_000).toISOString() });
    expect(old.status).toBe(400);
    expect(old.body.error.fields).toHaveProperty("scannedAt");
  });
});

describe("POST /api/scans: step data", { timeout: 30_000 }, () => {
  it("material issue needs the heat: unknown heat 400, another alloy or gauge 409, the right one links the job", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const job = jobs[0];
    const op = await staff(app, "operator");
    expect((await scan(op, { code: job.code, step: "material", action: "start" })).status).toBe(201);
    let res = await scan(op, { code: job.code, step: "material", action: "complete" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("heatNumber");
    res = await scan(op, { code: job.code, step: "material", action: "complete", heatNumber: "NO-SUCH-HEAT" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.heatNumber).toMatch(/no heat NO-SUCH-HEAT has been received/);
    const wrongAlloy = await buildHeat({ materialId: "ni50" });
    res = await scan(op, { code: job.code, step: "material", action: "complete", heatNumber: wrongAlloy.heatNumber });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: "HEAT_MISMATCH", message: expect.stringContaining("needs ni80 1 mm") });
    const wrongGauge = await buildHeat({ thicknessMm: 1.5 });
    expect((await scan(op, { code: job.code, step: "material", action: "complete", heatNumber: wrongGauge.heatNumber })).status).toBe(409);
    const heat = await buildHeat();
    res = await scan(op, { code: job.code, step: "material", action: "complete", heatNumber: heat.heatNumber });
    expect(res.status).toBe(201);
    expect(res.body.event.data).toMatchObject({ heatNumber: heat.heatNumber, heatId: heat.id });
    expect(res.body.job.heat).toEqual({ id: heat.id, heatNumber: heat.heatNumber });
    expect(res.body.job.next).toEqual({ step: "blank", action: "start" });
    // the same completion again with another heat is not a repeat
    const other = await buildHeat();
    res = await scan(op, { code: job.code, step: "material", action: "complete", heatNumber: other.heatNumber });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("ALREADY_RECORDED");
  });

  it("forming a drawn can records the draws done: missing is 400, fewer than planned 409 and the job stays at form", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const job = jobs[0];
    const op = await staff(app, "operator");
    const heat = await buildHeat();
    await scanThrough(op, job, "blank", heat.heatNumber);
    expect((await scan(op, { code: job.code, step: "form", action: "start" })).status).toBe(201);
    let res = await scan(op, { code: job.code, step: "form", action: "complete" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("drawStagesDone");
    const planned = job.routing.find((s) => s.key === "form")!.drawStages!;
    if (planned > 1) {
      res = await scan(op, { code: job.code, step: "form", action: "complete", drawStagesDone: planned - 1 });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe("DRAWS_MISSING");
    }
    await job.reload();
    expect(job.routing[job.stepIndex].key).toBe("form");
    expect(await Scan.count({ where: { jobId: job.id, step: "form", action: "complete" } })).toBe(0);
    res = await scan(op, { code: job.code, step: "form", action: "complete", drawStagesDone: planned, processAnnealsDone: planned - 1 });
    expect(res.status).toBe(201);
    expect(res.body.event.data).toMatchObject({ drawStagesDone: planned, processAnnealsDone: planned - 1 });
    expect(res.body.job.steps.find((s: { key: string }) => s.key === "form").status).toBe("completed");
    // what the answer says is what was recorded
    const [recorded] = await Scan.findAll({ where: { jobId: job.id, step: "form", action: "complete" } });
    expect(recorded.data).toMatchObject({ drawStagesDone: planned, processAnnealsDone: planned - 1 });
  });

  it("welding waits for the end caps, needs its inspection, and a failed weld is not completed", async () => {
    const { jobs } = await buildReleasedOrder(app, { configuration: designs.rolled() });
    const [wall, caps] = jobs;
    const op = await staff(app, "operator");
    const heat = await buildHeat();
    await scanThrough(op, wall, "form", heat.heatNumber);
    let res = await scan(op, { code: wall.code, step: "weld", action: "start" });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: "COMPONENTS_NOT_READY", message: expect.stringContaining(caps.code) });
    await scanThrough(op, caps, "form", heat.heatNumber);
    expect((await op.agent.get(`/api/jobs/${wall.id}`)).body.components).toEqual([{ id: caps.id, code: caps.code, status: "completed" }]);
    expect((await scan(op, { code: wall.code, step: "weld", action: "start" })).status).toBe(201);
    res = await scan(op, { code: wall.code, step: "weld", action: "complete" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("weldInspection");
    res = await scan(op, { code: wall.code, step: "weld", action: "complete", weldInspection: { result: "fail" } });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("WELD_REJECTED");
    res = await scan(op, { code: wall.code, step: "weld", action: "complete", weldInspection: { result: "pass", method: "dye-penetrant" } });
    expect(res.status).toBe(201);
    expect(res.body.event.data.weldInspection).toEqual({ result: "pass", method: "dye-penetrant" });
  });

  it("the anneal completes only once the lot's furnace run is recorded; a lot on hold stops its jobs", async () => {
    const { jobs, lots } = await buildReleasedOrder(app);
    const op = await staff(app, "operator");
    const heat = await buildHeat();
    await scanThrough(op, jobs[0], "clean", heat.heatNumber);
    expect((await scan(op, { code: jobs[0].code, step: "anneal", action: "start" })).status).toBe(201);
    let res = await scan(op, { code: jobs[0].code, step: "anneal", action: "complete" });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("NO_FURNACE_RUN");
    await scanThrough(op, jobs[1], "material", heat.heatNumber);
    await Lot.update({ holdReason: "Dropped in transit.", heldAt: new Date() }, { where: { id: lots[0].id } });
    res = await scan(op, { code: jobs[1].code, step: "blank", action: "start" });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: "LOT_ON_HOLD", message: expect.stringContaining("Dropped in transit.") });
    expect(await Scan.count({ where: { jobId: jobs[1].id, step: "blank" } })).toBe(0);
    // what is recorded is still answered as a repeat
    expect((await scan(op, { code: jobs[0].code, step: "anneal", action: "start" })).status).toBe(200);
  });
});

describe("GET /api/jobs/:id and the lookup by code", { timeout: 30_000 }, () => {
  it("401; 403 for the ordering customer, 404 for another one and for a bad id; the staff see steps, lot, order and what comes next", async () => {
    const { jobs, order, buyer, lots } = await buildReleasedOrder(app);
    const job = jobs[0];
    expect((await request(app).get(`/api/jobs/${job.id}`)).status).toBe(401);
    const own = await customer(app, buyer.organizationId);
    expect((await own.agent.get(`/api/jobs/${job.id}`)).status).toBe(403);
    expect((await (await customer(app)).agent.get(`/api/jobs/${job.id}`)).status).toBe(404);
    const op = await staff(app, "operator");
    expect((await op.agent.get(`/api/jobs/not-a-job`)).status).toBe(404);
    const res = await op.agent.get(`/api/jobs/${job.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      id: job.id, code: job.code, status: "released", lotId: lots[0].id,
      lot: { number: lots[0].number, onHold: false }, order: { id: order.id }, next: { step: "material", action: "start" },
      part: { layer: 1, role: "cup", method: "drawn", materialId: "ni80", quantity: 2 },
      abilities: { scan: true, editRouting: false, print: true },
    });
    expect(res.body.steps.map((s: { key: string; status: string }) => `${s.key}:${s.status}`)).toEqual(
      ["material", "blank", "form", "clean", "anneal", "verify", "pack"].map((k) => `${k}:pending`),
    );
    expect(res.body.steps[2].barcode).toBe(`${job.code}-FORM`);
    const byCode = await op.agent.get(`/api/jobs/by-code/${job.code.toLowerCase()}`);
    expect(byCode.body).toEqual(res.body);
    expect((await op.agent.get(`/api/jobs/by-code/J-0`)).status).toBe(404);
    expect((await own.agent.get(`/api/jobs/by-code/${job.code}`)).status).toBe(403);
  });

  it("part-way through its routing a job shows its completed steps, where it stands and what comes next", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const op = await staff(app, "operator");
    const heat = await buildHeat();
    await scanThrough(op, jobs[0], "clean", heat.heatNumber);
    const res = await op.agent.get(`/api/jobs/${jobs[0].id}`);
    expect(res.body.status).toBe("in_progress");
    expect(res.body.steps.filter((s: { status: string }) => s.status === "completed")).toHaveLength(4);
    expect(res.body.next).toEqual({ step: "anneal", action: "start" });
    const job = (await Job.findByPk(jobs[0].id))!;
    expect(job.currentStep).toBe("anneal");
    expect(completeData(job, "form").drawStagesDone).toBe(job.routing[2].drawStages);
  });

  it("verify is started by a scan but completed only by quality's decision on the lot (409 for a scan, even by QA)", async () => {
    const { jobs } = await buildLotAtVerify(app, { quantity: 5 });
    const job = jobs.find((j) => j.routing[j.stepIndex]?.key === "verify")!;
    for (const role of ["operator", "qa"] as const) {
      const who = await staff(app, role);
      const scan = (action: "start" | "complete") => who.agent.post("/api/scans").set("X-CSRF-Token", who.csrf).send({ code: job.code, step: "verify", action, station: "test bench" });
      expect([200, 201]).toContain((await scan("start")).status);
      const refused = await scan("complete");
      expect(refused.status).toBe(409);
      expect(refused.body.error.code).toBe("VERIFY_BY_INSPECTION");
      expect(refused.body.error.message).toMatch(/when quality accepts lot/);
    }
    await job.reload();
    expect(job.routing[job.stepIndex].key).toBe("verify");
    expect(await Scan.count({ where: { jobId: job.id, step: "verify", action: "complete" } })).toBe(0);
  });
});
