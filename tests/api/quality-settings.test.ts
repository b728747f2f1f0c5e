import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Order, ShopSettings } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, signIn } from "../support/app";
import { buildOrder, ensureReferenceData } from "../support/ordering";

const app = buildTestApp();
let originalAql: number;
beforeAll(async () => {
  await ensureReferenceData();
  originalAql = (await ShopSettings.current()).defaultAql;
});
afterAll(async () => {
  await ShopSettings.update({ defaultAql: originalAql }, { where: { id: 1 } });
});

async function staff(role: "admin" | "qa" | "operator") {
  const shop = await buildOrganization({ kind: "shop" });
  return signIn(app, await buildUser({ role, organizationId: shop.id }));
}

describe("the shop's default AQL: GET/PUT /api/shop-settings/quality", () => {
  it("401; 403 for a customer or operator (read) and for QA (change); 400 naming defaultAql; the planner sets it and new orders take it", async () => {
    expect((await request(app).get("/api/shop-settings/quality")).status).toBe(401);
    expect((await request(app).put("/api/shop-settings/quality").send({ defaultAql: 1 })).status).toBe(401);
    const customer = await signIn(app, await buildUser({ role: "customer" }));
    expect((await customer.agent.get("/api/shop-settings/quality")).status).toBe(403);
    const operator = await staff("operator");
    expect((await operator.agent.get("/api/shop-settings/quality")).status).toBe(403);
    const qa = await staff("qa");
    const read = await qa.agent.get("/api/shop-settings/quality");
    expect(read.status).toBe(200);
    expect(read.body.aqlColumns).toHaveLength(26);
    expect((await qa.agent.put("/api/shop-settings/quality").set("X-CSRF-Token", qa.csrf).send({ defaultAql: 0.65 })).status).toBe(403);

    const planner = await staff("admin");
    expect((await planner.agent.put("/api/shop-settings/quality").send({ defaultAql: 0.65 })).status).toBe(403); // no CSRF token
    for (const bad of [{}, { defaultAql: 2 }, { defaultAql: "1.0" }, { defaultAql: -1 }]) {
      const res = await planner.agent.put("/api/shop-settings/quality").set("X-CSRF-Token", planner.csrf).send(bad);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(["defaultAql"]);
    }
    const saved = await planner.agent.put("/api/shop-settings/quality").set("X-CSRF-Token", planner.csrf).send({ defaultAql: 0.65 });
    expect(saved.status).toBe(200);
    expect(saved.body.defaultAql).toBe(0.65);

    const buyer = await buildUser({ role: "customer" });
    const order = await buildOrder(app, buyer);
    expect(order.aql).toBe(0.65);
    const shown = await (await signIn(app, buyer)).agent.get(`/api/orders/${order.id}`);
    expect(shown.body.aql).toBe(0.65);
  });
});

describe("an order's AQL: PUT /api/orders/:id/aql", () => {
  it("401; 404 for another organisation; 403 for the ordering customer and QA; 400 naming aql; 200 for the planner; 409 once cancelled", async () => {
    const buyer = await buildUser({ role: "customer" });
    const order = await buildOrder(app, buyer);
    const url = `/api/orders/${order.id}/aql`;
    expect((await request(app).put(url).send({ aql: 1.5 })).status).toBe(401);
    const stranger = await signIn(app, await buildUser({ role: "customer" }));
    expect((await stranger.agent.put(url).set("X-CSRF-Token", stranger.csrf).send({ aql: 1.5 })).status).toBe(404);
    const own = await signIn(app, buyer);
    expect((await own.agent.put(url).set("X-CSRF-Token", own.csrf).send({ aql: 1.5 })).status).toBe(403);
    const qa = await staff("qa");
    expect((await qa.agent.put(url).set("X-CSRF-Token", qa.csrf).send({ aql: 1.5 })).status).toBe(403);
    const planner = await staff("admin");
    const bad = await planner.agent.put(url).set("X-CSRF-Token", planner.csrf).send({ aql: 3 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.aql).toMatch(/columns/);
    expect((await planner.agent.put(`/api/orders/00000000-0000-4000-8000-000000000000/aql`).set("X-CSRF-Token", planner.csrf).send({ aql: 1.5 })).status).toBe(404);
    const res = await planner.agent.put(url).set("X-CSRF-Token", planner.csrf).send({ aql: 1.5 });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ orderId: order.id, aql: 1.5 });
    expect((await Order.findByPk(order.id))!.aql).toBe(1.5);
    await Order.update({ status: "cancelled" }, { where: { id: order.id } });
    expect((await planner.agent.put(url).set("X-CSRF-Token", planner.csrf).send({ aql: 2.5 })).status).toBe(409);
  });
});
