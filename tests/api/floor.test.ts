import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Lot } from "../../server/models";
import { buildTestApp } from "../support/app";
import { ensureReferenceData } from "../support/ordering";
import { arrangeReadyForFurnace, buildReleasedOrder, customer, staff } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);

describe("GET /api/floor", { timeout: 30_000 }, () => {
  it("401, 403 for a customer and for quality; the board: work by step, late jobs most overdue first, lots waiting for a furnace load, holds with reasons", async () => {
    expect((await request(app).get("/api/floor")).status).toBe(401);
    expect((await (await customer(app)).agent.get("/api/floor")).status).toBe(403);
    expect((await (await staff(app, "qa")).agent.get("/api/floor")).status).toBe(403);
    const op = await staff(app, "operator");
    const before = (await op.agent.get("/api/floor")).body;

    const late = await buildReleasedOrder(app, { requestedDate: "2020-02-03" });
    const waiting = await buildReleasedOrder(app);
    await arrangeReadyForFurnace(waiting.lots[0].id);
    const held = await buildReleasedOrder(app);
    await Lot.update({ holdReason: "Crate dropped at goods in", heldAt: new Date() }, { where: { id: held.lots[0].id } });
    await op.agent.post("/api/scans").set("X-CSRF-Token", op.csrf).send({ code: late.jobs[0].code, step: "material", action: "start", station: "stores" });

    const res = await (await staff(app, "admin")).agent.get("/api/floor");
    expect(res.status).toBe(200);
    const board = res.body;
    expect(board.wip.map((w: { step: string }) => w.step)).toEqual(["material", "blank", "form", "weld", "clean", "anneal", "verify", "pack"]);
    const at = (b: typeof board, step: string) => b.wip.find((w: { step: string }) => w.step === step);
    expect(at(board, "material").started).toBeGreaterThanOrEqual(at(before, "material").started + 1);
    expect(at(board, "anneal").waiting).toBeGreaterThanOrEqual(at(before, "anneal").waiting + 2);
    expect(board.openJobs).toBe(board.wip.reduce((s: number, w: { waiting: number; started: number }) => s + w.waiting + w.started, 0));
    const lateJob = board.late.jobs.find((j: { id: string }) => j.id === late.jobs[0].id);
    expect(lateJob).toMatchObject({ code: late.jobs[0].code, lotNumber: late.lots[0].number, step: "material", dueDate: "2020-02-03" });
    expect(lateJob.daysLate).toBeGreaterThan(365);
    expect(board.late.count).toBeGreaterThanOrEqual(2);
    const days = board.late.jobs.map((j: { daysLate: number }) => j.daysLate);
    expect(days).toEqual([...days].sort((a: number, b: number) => b - a));
    expect(board.waitingForFurnace.find((l: { id: string }) => l.id === waiting.lots[0].id)).toMatchObject({ number: waiting.lots[0].number, materialId: "ni80", pieces: 4 });
    expect(board.waitingForFurnace.find((l: { id: string }) => l.id === held.lots[0].id)).toBeUndefined();
    expect(board.holds.find((h: { lotId: string }) => h.lotId === held.lots[0].id)).toMatchObject({ reason: "Crate dropped at goods in", lotNumber: held.lots[0].number });
  });
});

describe("GET /api/jobs and GET /api/lots", { timeout: 30_000 }, () => {
  it("401, 403 for a customer, 400 naming a bad filter; filtered by order, lot, step, status and lateness", async () => {
    const { order, jobs, lots } = await buildReleasedOrder(app, { requestedDate: "2021-05-05" });
    expect((await request(app).get("/api/jobs")).status).toBe(401);
    expect((await (await customer(app)).agent.get("/api/jobs")).status).toBe(403);
    expect((await (await customer(app)).agent.get("/api/lots")).status).toBe(403);
    const op = await staff(app, "operator");
    let res = await op.agent.get("/api/jobs?step=paint&status=lost&orderId=7");
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["orderId", "status", "step"]);
    res = await op.agent.get(`/api/jobs?orderId=${order.id}&sort=code&dir=asc`);
    expect(res.body).toMatchObject({ total: 2, page: 1 });
    expect(res.body.items.map((j: { code: string }) => j.code)).toEqual(jobs.map((j) => j.code));
    expect(res.body.items[0]).toMatchObject({ status: "released", step: "material", stepStarted: false, lotNumber: lots[0].number, late: true, description: "Layer 1 drawn can, deep drawn" });
    await op.agent.post("/api/scans").set("X-CSRF-Token", op.csrf).send({ code: jobs[1].code, step: "material", action: "start", station: "stores" });
    res = await op.agent.get(`/api/jobs?orderId=${order.id}&status=in_progress`);
    expect(res.body.items.map((j: { id: string }) => j.id)).toEqual([jobs[1].id]);
    res = await op.agent.get(`/api/jobs?lotId=${lots[0].id}&late=true&step=material&pageSize=1&page=2`);
    expect(res.body).toMatchObject({ total: 2, page: 2, pageSize: 1 });
    res = await op.agent.get(`/api/jobs?q=${jobs[0].code.toLowerCase()}`);
    expect(res.body.items.map((j: { id: string }) => j.id)).toEqual([jobs[0].id]);

    res = await op.agent.get(`/api/lots?orderId=${order.id}`);
    expect(res.body.items).toEqual([expect.objectContaining({ id: lots[0].id, number: lots[0].number, status: "in_work", pieces: 4, late: true, orderNumber: `O-${order.number}` })]);
    await arrangeReadyForFurnace(lots[0].id);
    res = await op.agent.get(`/api/lots?status=ready_for_anneal&q=${lots[0].number}`);
    expect(res.body.items.map((l: { id: string }) => l.id)).toEqual([lots[0].id]);
    expect((await op.agent.get("/api/lots?status=gone")).status).toBe(400);
  });
});
