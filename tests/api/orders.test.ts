import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Event, Order } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, inbox, signIn } from "../support/app";
import { buildOrder, buildPaidOrder, buildQuote, ensureReferenceData } from "../support/ordering";

const app = buildTestApp();
beforeAll(ensureReferenceData);

async function customer(organizationId?: string) {
  const user = await buildUser({ role: "customer", name: "Olga Orderly", ...(organizationId ? { organizationId } : {}) });
  return { user, ...(await signIn(app, user)) };
}
async function staff(role: "admin" | "operator" = "admin") {
  const shop = await buildOrganization({ kind: "shop" });
  const user = await buildUser({ role, organizationId: shop.id });
  return { user, ...(await signIn(app, user)) };
}
const tomorrow = () => new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);

describe("POST /api/orders", () => {
  it("401, 403 without CSRF and for staff, 400 naming the field, 404 for another organisation's quote", async () => {
    const { user, agent, csrf } = await customer();
    const quote = await buildQuote(app, user);
    expect((await request(app).post("/api/orders").send({ quoteId: quote.id })).status).toBe(401);
    expect((await agent.post("/api/orders").send({ quoteId: quote.id })).status).toBe(403);
    const admin = await staff();
    expect((await admin.agent.post("/api/orders").set("X-CSRF-Token", admin.csrf).send({ quoteId: quote.id })).status).toBe(403);
    let res = await agent.post("/api/orders").set("X-CSRF-Token", csrf).send({ quoteId: "Q-1", requestedDate: "next week", purchaseOrder: "x".repeat(61) });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["purchaseOrder", "quoteId", "requestedDate"]);
    res = await agent.post("/api/orders").set("X-CSRF-Token", csrf).send({ quoteId: quote.id, requestedDate: "2001-01-01" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("requestedDate");
    const stranger = await customer();
    res = await stranger.agent.post("/api/orders").set("X-CSRF-Token", stranger.csrf).send({ quoteId: quote.id });
    expect(res.status).toBe(404);
    expect(await Order.count({ where: { quoteId: quote.id } })).toBe(0);
  });

  it("an expired quote is refused, naming quoteId; nothing is written", async () => {
    const { user, agent, csrf } = await customer();
    const quote = await buildQuote(app, user, { now: new Date(Date.now() - 31 * 86_400_000) });
    const res = await agent.post("/api/orders").set("X-CSRF-Token", csrf).send({ quoteId: quote.id });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("QUOTE_EXPIRED");
    expect(res.body.error.fields).toHaveProperty("quoteId");
    expect(res.body.error.message).toMatch(/new quote/);
    expect(await Order.count({ where: { quoteId: quote.id } })).toBe(0);
  });

  it("201 awaiting payment with the quote's money, the number from the sequence, an event and the 'order received' mail; a quote is ordered once", async () => {
    const { user, agent, csrf } = await customer();
    const quote = await buildQuote(app, user, { quantity: 4 });
    const res = await agent.post("/api/orders").set("X-CSRF-Token", csrf).send({ quoteId: quote.id, purchaseOrder: "PO-2211", deliveryAddress: "Goods in\nBuilding 2", requestedDate: tomorrow(), notes: "Deliver mornings" });
    expect(res.status).toBe(201);
    const o = res.body;
    expect(o).toMatchObject({ status: "awaiting_payment", purchaseOrder: "PO-2211", deliveryAddress: "Goods in\nBuilding 2", requestedDate: tomorrow(), notes: "Deliver mornings" });
    expect(o.number).toMatch(/^O-\d+$/);
    expect(o.quote).toEqual({ id: quote.id, number: `Q-${quote.number}` });
    expect(o.total_cents).toBe(quote.totalCents);
    expect(o.quantity).toBe(4);
    expect(o.requiredAttenuation_db).toBe(40);
    expect(o.payments).toEqual([]);
    expect(o.lots).toEqual([]);
    expect(o.abilities).toMatchObject({ pay: true, cancel: true, upload: true, refund: false });
    expect(o.timeline[0]).toMatchObject({ action: "order.placed", label: "Order placed", actor: { id: user.id, name: "Olga Orderly" } });
    expect(await Event.count({ where: { action: "order.placed", subjectId: o.id } })).toBe(1);
    const mail = (await inbox(app, user.email)).find((m) => m.subject === `Order ${o.number} received`);
    expect(mail?.text).toContain("PO-2211");
    const again = await agent.post("/api/orders").set("X-CSRF-Token", csrf).send({ quoteId: quote.id });
    expect(again.status).toBe(409);
    // the quote now reads as ordered
    expect((await agent.get(`/api/quotes/${quote.id}`)).body).toMatchObject({ status: "ordered", orderId: o.id });
  });
});

describe("GET /api/orders/:id", () => {
  it("401, 404 across organisations and for a bad id, 200 for colleagues of the same organisation and for staff", async () => {
    const { user } = await customer();
    const order = await buildOrder(app, user);
    expect((await request(app).get(`/api/orders/${order.id}`)).status).toBe(401);
    expect((await (await customer()).agent.get(`/api/orders/${order.id}`)).status).toBe(404);
    const colleague = await customer(user.organizationId);
    expect((await colleague.agent.get(`/api/orders/${order.id}`)).status).toBe(200);
    expect((await colleague.agent.get(`/api/orders/12345`)).status).toBe(404);
    const operator = await staff("operator");
    const seen = await operator.agent.get(`/api/orders/${order.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.abilities).toMatchObject({ pay: false, refund: false, upload: false });
  });
});

describe("GET /api/orders", () => {
  it("the customer's own orders, the staff's all of them; search, status filter, sort and pagination on the server", async () => {
    const org = await buildOrganization({ name: `Listwell ${Date.now()}` });
    const { user, agent } = await customer(org.id);
    const a = await buildOrder(app, user, { purchaseOrder: "PO-ALPHA" });
    const b = await buildPaidOrder(app, user);
    const c = await buildOrder(app, user, { purchaseOrder: "PO-GAMMA" });
    const foreign = await buildOrder(app, (await customer()).user);
    expect((await request(app).get("/api/orders")).status).toBe(401);
    let res = await agent.get("/api/orders");
    expect(res.status).toBe(200);
    expect(res.body.items.map((o: { id: string }) => o.id)).toEqual([c.id, b.id, a.id]);
    expect(res.body.total).toBe(3);
    res = await agent.get("/api/orders?status=paid");
    expect(res.body.items.map((o: { id: string }) => o.id)).toEqual([b.id]);
    res = await agent.get("/api/orders?q=alpha");
    expect(res.body.items.map((o: { id: string }) => o.id)).toEqual([a.id]);
    res = await agent.get(`/api/orders?q=O-${c.number}`);
    expect(res.body.items.map((o: { id: string }) => o.id)).toEqual([c.id]);
    res = await agent.get("/api/orders?sort=number&dir=asc&pageSize=2&page=2");
    expect(res.body).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(res.body.items.map((o: { id: string }) => o.id)).toEqual([c.id]);
    expect(res.body.items[0]).toMatchObject({ organization: { id: org.id }, quote: { number: expect.stringMatching(/^Q-/) }, summary: expect.stringContaining("cylinder") });
    res = await agent.get("/api/orders?status=lost&sort=colour");
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["sort", "status"]);
    const admin = await staff();
    res = await admin.agent.get(`/api/orders?q=${encodeURIComponent(org.name)}&pageSize=100`);
    expect(res.body.items.map((o: { id: string }) => o.id).sort()).toEqual([a.id, b.id, c.id].sort());
    res = await admin.agent.get(`/api/orders?q=O-${foreign.number}`);
    expect(res.body.items.map((o: { id: string }) => o.id)).toEqual([foreign.id]);
  });
});

describe("PATCH /api/orders/:id and POST /api/orders/:id/cancel", () => {
  it("401, 404 across organisations, 400 naming the field, 409 once paid; changes go in the timeline", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user);
    expect((await request(app).patch(`/api/orders/${order.id}`).send({ notes: "x" })).status).toBe(401);
    const stranger = await customer();
    expect((await stranger.agent.patch(`/api/orders/${order.id}`).set("X-CSRF-Token", stranger.csrf).send({ notes: "x" })).status).toBe(404);
    const operator = await staff("operator");
    expect((await operator.agent.patch(`/api/orders/${order.id}`).set("X-CSRF-Token", operator.csrf).send({ notes: "x" })).status).toBe(403);
    let res = await agent.patch(`/api/orders/${order.id}`).set("X-CSRF-Token", csrf).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("purchaseOrder");
    res = await agent.patch(`/api/orders/${order.id}`).set("X-CSRF-Token", csrf).send({ deliveryAddress: "Dock 3", purchaseOrder: "PO-9" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ deliveryAddress: "Dock 3", purchaseOrder: "PO-9" });
    expect(res.body.timeline.at(-1)).toMatchObject({ action: "order.updated", detail: "changed: purchaseOrder, deliveryAddress" });
    const paid = await buildPaidOrder(app, user);
    expect((await agent.patch(`/api/orders/${paid.id}`).set("X-CSRF-Token", csrf).send({ notes: "x" })).status).toBe(409);
    expect((await agent.post(`/api/orders/${paid.id}/cancel`).set("X-CSRF-Token", csrf)).status).toBe(409);
  });

  it("cancelling an order awaiting payment: 401, 404 across organisations, 403 for an operator; then it can no longer be paid", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user);
    expect((await request(app).post(`/api/orders/${order.id}/cancel`)).status).toBe(401);
    const stranger = await customer();
    expect((await stranger.agent.post(`/api/orders/${order.id}/cancel`).set("X-CSRF-Token", stranger.csrf)).status).toBe(404);
    const operator = await staff("operator");
    expect((await operator.agent.post(`/api/orders/${order.id}/cancel`).set("X-CSRF-Token", operator.csrf)).status).toBe(403);
    const first = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    expect(first.status).toBe(200);
    const res = await agent.post(`/api/orders/${order.id}/cancel`).set("X-CSRF-Token", csrf);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe("cancelled");
    expect(res.body.abilities.pay).toBe(false);
    expect((await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf)).status).toBe(409);
    const session = await app.locals.deps.stripe.checkout.sessions.retrieve(first.body.sessionId);
    expect(session.status).toBe("expired");
  });
});
