import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Event, Job, Lot, Order } from "../../server/models";
import { buildTestApp, buildUser, inbox } from "../support/app";
import { buildOrder, buildPaidOrder, ensureReferenceData } from "../support/ordering";
import { buildReleasedOrder, customer, designs, staff } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);

describe("POST /api/orders/:id/release", { timeout: 30_000 }, () => {
  it("401, 403 without CSRF, for the customer and for an operator; 404 for a bad id; nothing is written", async () => {
    const buyer = await customer(app);
    const order = await buildPaidOrder(app, buyer.user);
    const url = `/api/orders/${order.id}/release`;
    expect((await request(app).post(url)).status).toBe(401);
    const admin = await staff(app, "admin");
    expect((await admin.agent.post(url)).status).toBe(403);
    expect((await buyer.agent.post(url).set("X-CSRF-Token", buyer.csrf)).status).toBe(403);
    const operator = await staff(app, "operator");
    expect((await operator.agent.post(url).set("X-CSRF-Token", operator.csrf)).status).toBe(403);
    expect((await (await customer(app)).agent.get(`/api/orders/${order.id}`)).status).toBe(404);
    expect((await admin.agent.post(`/api/orders/nope/release`).set("X-CSRF-Token", admin.csrf)).status).toBe(404);
    expect(await Lot.count({ where: { orderId: order.id } })).toBe(0);
    expect((await Order.findByPk(order.id))!.status).toBe("paid");
  });

  it("an order awaiting payment cannot be released (409)", async () => {
    const order = await buildOrder(app, await buildUser());
    const admin = await staff(app, "admin");
    const res = await admin.agent.post(`/api/orders/${order.id}/release`).set("X-CSRF-Token", admin.csrf);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("ORDER_NOT_RELEASABLE");
  });

  it("200 the order with its lots and jobs: one job per part for the quantity, the drawn routing, the 'released' mail; twice is a 409", async () => {
    const buyer = await customer(app);
    const order = await buildPaidOrder(app, buyer.user, { quantity: 3 });
    const admin = await staff(app, "admin");
    const res = await admin.agent.post(`/api/orders/${order.id}/release`).set("X-CSRF-Token", admin.csrf);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe("released");
    expect(res.body.lots).toHaveLength(1);
    const [lot] = res.body.lots;
    expect(lot.number).toMatch(/^L\d{2}-\d+$/);
    expect(lot.jobs).toHaveLength(2); // two drawn layers
    for (const j of lot.jobs) expect(j.code).toMatch(/^J-\d+$/);
    expect(lot.pieces).toBe(6);
    expect(res.body.abilities).toMatchObject({ release: false, ship: true });
    expect(res.body.timeline.at(-1)).toMatchObject({ action: "order.released", label: "Released to production", detail: `lot ${lot.number}` });

    const jobs = await Job.findAll({ where: { orderId: order.id }, order: [["seq", "ASC"]] });
    expect(jobs.map((j) => j.quantity)).toEqual([3, 3]);
    expect(jobs.map((j) => j.layer)).toEqual([0, 1]);
    expect(jobs[0].routing.map((s) => s.key)).toEqual(["material", "blank", "form", "clean", "anneal", "verify", "pack"]);
    expect(jobs[0].routing[2].drawStages).toBeGreaterThanOrEqual(1);
    expect(jobs[0].dueDate).toMatch(/^\d{4}-\d{2}-\d{2}$/);

    // the customer sees the lots and codes on the order
    const seen = await buyer.agent.get(`/api/orders/${order.id}`);
    expect(seen.body.lots).toEqual(res.body.lots);
    const mail = (await inbox(app, buyer.user.email)).find((m) => m.subject === `Order ${res.body.number} is in production`);
    expect(mail?.text).toContain(lot.number);

    const again = await admin.agent.post(`/api/orders/${order.id}/release`).set("X-CSRF-Token", admin.csrf);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("ORDER_ALREADY_RELEASED");
    expect(await Lot.count({ where: { orderId: order.id } })).toBe(1);
    expect(await Event.count({ where: { action: "order.released", subjectId: order.id } })).toBe(1);
  });

  it("rolled parts add the weld and end caps are welded onto their wall; a box of two alloys makes a lot per alloy with body, lid and collars", async () => {
    const rolled = await buildReleasedOrder(app, { configuration: designs.rolled(), quantity: 2 });
    const [wall, cap] = rolled.jobs;
    expect(wall.role).toBe("wall");
    expect(wall.routing.map((s) => s.key)).toEqual(["material", "blank", "form", "weld", "clean", "anneal", "verify", "pack"]);
    expect(cap.role).toBe("end-cap");
    expect(cap.quantity).toBe(4);
    expect(cap.assemblyJobId).toBe(wall.id);
    expect(cap.routing.map((s) => s.key)).toEqual(["material", "blank", "form"]);
    expect(rolled.lots[0].pieces).toBe(2);

    const box = await buildReleasedOrder(app, { configuration: designs.bentTwoAlloys(), quantity: 1 });
    expect(box.lots.map((l) => l.materialId)).toEqual(["ni80", "ni50"]);
    const roles = box.jobs.map((j) => `${j.layer}:${j.role}`);
    expect(roles).toEqual(expect.arrayContaining(["0:body", "0:lid", "0:collar", "1:body", "1:lid", "1:collar"]));
    const collar = box.jobs.find((j) => j.role === "collar" && j.layer === 0)!;
    expect(collar.assemblyJobId).toBe(box.jobs.find((j) => j.role === "body" && j.layer === 0)!.id);
    expect(collar.routing.map((s) => s.key)).toEqual(["material", "blank", "form", "weld"]);
    expect(box.jobs.find((j) => j.role === "lid")!.flatPattern.bendLines).toHaveLength(4);
  });

  it("due dates come from the requested date", async () => {
    const { jobs, lots } = await buildReleasedOrder(app, { requestedDate: "2031-03-14" });
    expect(new Set(jobs.map((j) => j.dueDate))).toEqual(new Set(["2031-03-14"]));
    expect(lots[0].dueDate).toBe("2031-03-14");
  });
});
