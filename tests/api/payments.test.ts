import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { createServer } from "node:net";
import { CheckoutSession, Order, Payment, WebhookEvent } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, inbox, signIn } from "../support/app";
import {
  binary, buildOrder, buildPaidOrder, completedEvent, ensureReferenceData, payOnStandIn, paymentsUrl, pdfText, receivePaymentEvents, signed, waitFor,
} from "../support/ordering";

const app = buildTestApp();
receivePaymentEvents(app);
beforeAll(ensureReferenceData);

async function customer() {
  const user = await buildUser({ role: "customer", name: "Piet Payer" });
  return { user, ...(await signIn(app, user)) };
}
async function planner() {
  const shop = await buildOrganization({ kind: "shop" });
  const user = await buildUser({ role: "admin", organizationId: shop.id, name: "Pat Planner" });
  return { user, ...(await signIn(app, user)) };
}
const orderOf = (agent: ReturnType<typeof request.agent>, id: string) => agent.get(`/api/orders/${id}`).then((r) => r.body);

describe("POST /api/orders/:id/checkout", () => {
  it("401, 403 without CSRF and for staff, 404 across organisations and for a bad id", async () => {
    const { user, agent } = await customer();
    const order = await buildOrder(app, user);
    expect((await request(app).post(`/api/orders/${order.id}/checkout`)).status).toBe(401);
    expect((await agent.post(`/api/orders/${order.id}/checkout`)).status).toBe(403);
    const admin = await planner();
    expect((await admin.agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", admin.csrf)).status).toBe(403);
    const stranger = await customer();
    expect((await stranger.agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", stranger.csrf)).status).toBe(404);
    expect((await stranger.agent.post(`/api/orders/nope/checkout`).set("X-CSRF-Token", stranger.csrf)).status).toBe(404);
  });

  it("200 {checkoutUrl, sessionId}: the stand-in's page shows the amount with pay and decline buttons; a double click makes one session", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user, { quantity: 2 });
    const [a, b] = await Promise.all([
      agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf),
      agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf),
    ]);
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    expect(a.body.sessionId).toMatch(/^cs_/);
    expect(b.body.sessionId).toBe(a.body.sessionId);
    expect(a.body.checkoutUrl).toBe(`${paymentsUrl()}/checkout/${a.body.sessionId}`);
    expect(await CheckoutSession.count({ where: { orderId: order.id } })).toBe(1);
    const page = await fetch(a.body.checkoutUrl).then((r) => r.text());
    const euros = (order.totalCents / 100).toLocaleString("en-GB", { minimumFractionDigits: 2 });
    expect(page).toContain(`Pay €${euros}`);
    expect(page).toContain("Decline the card");
    expect(page).toMatch(/Local payment stand-in/);
    // a third click later: the open session is reused
    const c = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    expect(c.body.sessionId).toBe(a.body.sessionId);
  });

  it("the payment service down: a clear 503 'try again', nothing written, the order still payable", async () => {
    const closed = await new Promise<number>((resolve) => {
      const s = createServer().listen(0, "127.0.0.1", () => {
        const { port } = s.address() as { port: number };
        s.close(() => resolve(port));
      });
    });
    const offline = buildTestApp({ PAYMENTS_PORT: String(closed) });
    const user = await buildUser({ role: "customer" });
    const order = await buildOrder(offline, user);
    const { agent, csrf } = await signIn(offline, user);
    const res = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe("PAYMENTS_UNAVAILABLE");
    expect(res.body.error.message).toMatch(/try again/);
    expect(await CheckoutSession.count({ where: { orderId: order.id } })).toBe(0);
    const after = await orderOf(agent, order.id);
    expect(after.status).toBe("awaiting_payment");
    expect(after.abilities.pay).toBe(true);
  });
});

describe("paying on the stand-in", () => {
  it("pay → the signed event marks the order paid, with its payment, invoice and the mail with the invoice attached; the browser's return alone changes nothing", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user, { quantity: 3, purchaseOrder: "PO-4711" });
    const { body } = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    // coming back from the checkout page is no proof of payment
    expect((await agent.get(`/api/orders/${order.id}?checkout=returned`)).body.status).toBe("awaiting_payment");
    expect((await payOnStandIn(body.sessionId, "succeeded")).status).toBe(200);
    const paid = await waitFor(async () => {
      const o = await orderOf(agent, order.id);
      return o.status === "paid" ? o : null;
    }, 10_000, "the order to be paid");
    expect(paid.payments).toEqual([expect.objectContaining({ amount_cents: order.totalCents, currency: "EUR", status: "succeeded", kind: "payment" })]);
    expect(paid.paid_cents).toBe(order.totalCents);
    expect(paid.invoice.number).toMatch(/^INV-\d+$/);
    expect(paid.timeline.map((t: { action: string }) => t.action)).toEqual(expect.arrayContaining(["order.placed", "order.checkout-started", "order.paid"]));
    expect(paid.lots).toEqual([]);
    const mails = await inbox(app, user.email);
    const receipt = mails.find((m) => m.subject.startsWith(`Payment received for order O-${order.number}`));
    expect(receipt).toBeDefined();
    expect(receipt!.attachments).toEqual([expect.objectContaining({ filename: `invoice-${paid.invoice.number}.pdf`, contentType: "application/pdf" })]);
    expect(mails.some((m) => m.subject === `Order O-${order.number} received`)).toBe(true);
    // paid: no second checkout
    const again = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    expect(again.status).toBe(409);
  });

  it("a declined card leaves the order awaiting payment and payable with the same session; paying after that works", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user);
    const { body } = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    expect((await payOnStandIn(body.sessionId, "declined")).status).toBe(200);
    const declined = await waitFor(async () => {
      const o = await orderOf(agent, order.id);
      return o.timeline.some((t: { action: string }) => t.action === "payment.declined") ? o : null;
    }, 10_000, "the decline to arrive");
    expect(declined.status).toBe("awaiting_payment");
    expect(declined.payments).toEqual([]);
    expect(declined.abilities.pay).toBe(true);
    const retry = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    expect(retry.body.sessionId).toBe(body.sessionId);
    await payOnStandIn(body.sessionId, "succeeded");
    await waitFor(async () => (await orderOf(agent, order.id)).status === "paid", 10_000, "the order to be paid");
  });

  it("an abandoned checkout that expired gets a new session next time", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user);
    const first = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    await app.locals.deps.stripe.checkout.sessions.expire(first.body.sessionId);
    const second = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(second.status, JSON.stringify(second.body)).toBe(200);
    expect(second.body.sessionId).not.toBe(first.body.sessionId);
    expect((await orderOf(agent, order.id)).status).toBe("awaiting_payment");
  });
});

describe("POST /api/webhooks/stripe", () => {
  async function sessionFor(orderTotal = 2) {
    const user = await buildUser({ role: "customer" });
    const order = await buildOrder(app, user, { quantity: orderTotal });
    const id = `cs_test_hook_${order.id.slice(0, 8)}`;
    await CheckoutSession.create({ id, orderId: order.id, amountCents: order.totalCents, currency: order.currency, url: "http://127.0.0.1/x", idempotencyKey: `hook-${id}`, createdById: user.id });
    return { user, order, sessionId: id };
  }
  const post = (payload: string, header?: string) => {
    const r = request(app).post("/api/webhooks/stripe").set("content-type", "application/json");
    if (header !== undefined) r.set("Stripe-Signature", header);
    return r.send(payload);
  };

  it("400 on a forged, missing, wrongly keyed or stale signature; nothing recorded", async () => {
    const { order, sessionId } = await sessionFor();
    const event = completedEvent(sessionId, order.totalCents);
    const good = signed(event);
    expect((await post(good.payload)).status).toBe(400);
    expect((await post(good.payload, good.header.replace(/v1=[0-9a-f]{4}/, "v1=0000"))).status).toBe(400);
    expect((await post(good.payload, signed(event, "whsec_someone_else").header)).status).toBe(400);
    const tampered = await post(good.payload.replace(String(order.totalCents), "1"), good.header);
    expect(tampered.status).toBe(400);
    expect(tampered.body.error.code).toBe("SIGNATURE_INVALID");
    const stale = Math.floor(Date.now() / 1000) - 3600;
    const { createHmac } = await import("node:crypto");
    const oldHeader = `t=${stale},v1=${createHmac("sha256", "whsec_fluxwright_local").update(`${stale}.${good.payload}`).digest("hex")}`;
    expect((await post(good.payload, oldHeader)).status).toBe(400);
    expect(await WebhookEvent.count({ where: { id: event.id } })).toBe(0);
    expect((await Order.findByPk(order.id))!.status).toBe("awaiting_payment");
  });

  it("an expiry event arriving while the checkout is reopened (the order's row held) waits for it instead of deadlocking", async () => {
    const { order, sessionId } = await sessionFor();
    const event = { ...completedEvent(sessionId, order.totalCents), type: "checkout.session.expired" };
    const { payload, header } = signed(event);
    const { sequelize } = app.locals.deps;
    let answer!: Promise<request.Response>;
    // what POST /api/orders/:id/checkout does: the order's row, then (after a call out) its session's
    await sequelize.transaction(async (transaction) => {
      await Order.findByPk(order.id, { transaction, lock: transaction.LOCK.UPDATE });
      answer = post(payload, header).then((r) => r); // supertest sends on then()
      await new Promise((r) => setTimeout(r, 300)); // the event is in its own transaction by now, waiting
      await CheckoutSession.update({ status: "expired" }, { where: { id: sessionId }, transaction });
    });
    const res = await answer;
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe("processed");
    expect((await CheckoutSession.findByPk(sessionId))!.status).toBe("expired");
  });

  it("a replayed event (3 times) records one payment", async () => {
    const { order, sessionId } = await sessionFor();
    const { payload, header } = signed(completedEvent(sessionId, order.totalCents));
    const answers = await Promise.all([post(payload, header), post(payload, header), post(payload, header)]);
    expect(answers.map((a) => a.status)).toEqual([200, 200, 200]);
    expect(answers.map((a) => a.body.outcome).sort()).toEqual(["duplicate", "duplicate", "processed"]);
    expect(await Payment.count({ where: { orderId: order.id } })).toBe(1);
    expect((await Order.findByPk(order.id))!.status).toBe("paid");
    // another event id for the same completed session changes nothing either
    const { payload: p2, header: h2 } = signed(completedEvent(sessionId, order.totalCents));
    expect((await post(p2, h2)).body.outcome).toBe("order_not_payable");
    expect(await Payment.count({ where: { orderId: order.id } })).toBe(1);
  });

  it("an amount or currency that does not match leaves the order unpaid and is shown to the planner, not the customer", async () => {
    const { user, order, sessionId } = await sessionFor();
    const short = signed(completedEvent(sessionId, order.totalCents - 100));
    const res = await post(short.payload, short.header);
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe("amount_mismatch");
    const wrongCurrency = signed(completedEvent(sessionId, order.totalCents, "usd"));
    expect((await post(wrongCurrency.payload, wrongCurrency.header)).body.outcome).toBe("amount_mismatch");
    expect((await Order.findByPk(order.id))!.status).toBe("awaiting_payment");
    expect(await Payment.count({ where: { orderId: order.id } })).toBe(0);
    const admin = await planner();
    const staffView = (await admin.agent.get(`/api/orders/${order.id}`)).body;
    expect(staffView.paymentIssues).toHaveLength(2);
    expect(staffView.paymentIssues[0]).toMatchObject({ kind: "amount_mismatch", expected: { amount_cents: order.totalCents, currency: "EUR" }, received: { amount_cents: order.totalCents - 100, currency: "EUR" } });
    expect(staffView.timeline.some((t: { action: string }) => t.action === "payment.mismatch")).toBe(true);
    const own = await signIn(app, user);
    const customerView = (await own.agent.get(`/api/orders/${order.id}`)).body;
    expect(customerView.paymentIssues).toBeUndefined();
    expect(customerView.timeline.some((t: { action: string }) => t.action === "payment.mismatch")).toBe(false);
  });

  it("unknown sessions and other event types are acknowledged and recorded once; a signed body that is not an event is a 400", async () => {
    const unknown = signed(completedEvent("cs_test_nobody", 100));
    expect((await post(unknown.payload, unknown.header)).body.outcome).toBe("unknown_session");
    const other = signed({ id: `evt_other_${Date.now()}`, type: "customer.created", data: { object: { id: "cus_1" } } });
    expect((await post(other.payload, other.header)).body.outcome).toBe("ignored");
    const junk = signed({ hello: "world" });
    expect((await post(junk.payload, junk.header)).status).toBe(400);
    const notJson = "{nope";
    const { header } = signed("x");
    expect((await post(notJson, header)).status).toBe(400);
  });
});

describe("POST /api/orders/:id/refunds", () => {
  async function paidThroughStandIn() {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user, { quantity: 2 });
    const { body } = await agent.post(`/api/orders/${order.id}/checkout`).set("X-CSRF-Token", csrf);
    await payOnStandIn(body.sessionId, "succeeded");
    await waitFor(async () => (await orderOf(agent, order.id)).status === "paid", 10_000, "the order to be paid");
    return { user, agent, order };
  }

  it("401, 403 for the customer and for an operator, 404 for a bad id, 409 for an unpaid order, 400 naming the field", async () => {
    const { user, agent, order } = await paidThroughStandIn();
    expect((await request(app).post(`/api/orders/${order.id}/refunds`).send({ reason: "x" })).status).toBe(401);
    const own = await signIn(app, user);
    expect((await own.agent.post(`/api/orders/${order.id}/refunds`).set("X-CSRF-Token", own.csrf).send({ reason: "please" })).status).toBe(403);
    const operator = await signIn(app, await buildUser({ role: "operator" }));
    expect((await operator.agent.post(`/api/orders/${order.id}/refunds`).set("X-CSRF-Token", operator.csrf).send({ reason: "please" })).status).toBe(403);
    const admin = await planner();
    const refund = (id: string, body: unknown) => admin.agent.post(`/api/orders/${id}/refunds`).set("X-CSRF-Token", admin.csrf).send(body as object);
    expect((await refund("7d0b2a8e-6f7e-4c1c-9f65-1a7f8c7d1e11", { reason: "dented" })).status).toBe(404);
    const unpaid = await buildOrder(app, user);
    expect((await refund(unpaid.id, { reason: "dented" })).status).toBe(409);
    let res = await refund(order.id, { amount_cents: order.totalCents + 1, reason: "dented" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("amount_cents");
    res = await refund(order.id, { amount_cents: 100 });
    expect(res.body.error.fields).toHaveProperty("reason");
    expect((await orderOf(agent, order.id)).refunded_cents).toBe(0);
  });

  it("201 a part refund, then the rest: each its own payments entry with status refunded; a double click refunds once; the receipt lists them", async () => {
    const { agent, order } = await paidThroughStandIn();
    const admin = await planner();
    const refund = (body: unknown) => admin.agent.post(`/api/orders/${order.id}/refunds`).set("X-CSRF-Token", admin.csrf).send(body as object);
    const [a, b] = await Promise.all([refund({ amount_cents: 1500, reason: "one can dented in transit" }), refund({ amount_cents: 1500, reason: "one can dented in transit" })]);
    expect([a.status, b.status]).toEqual([201, 201]);
    let view = await orderOf(agent, order.id);
    expect(view.status).toBe("paid");
    expect(view.refunded_cents).toBe(1500);
    expect(view.payments).toEqual([
      expect.objectContaining({ kind: "payment", status: "succeeded", amount_cents: order.totalCents }),
      expect.objectContaining({ kind: "refund", status: "refunded", amount_cents: 1500, reason: "one can dented in transit", currency: "EUR" }),
    ]);
    const rest = await refund({ reason: "order withdrawn" });
    expect(rest.status).toBe(201);
    view = await orderOf(agent, order.id);
    expect(view.status).toBe("refunded");
    expect(view.refunded_cents).toBe(order.totalCents);
    expect(view.payments.filter((p: { status: string }) => p.status === "refunded").map((p: { amount_cents: number }) => p.amount_cents)).toEqual([1500, order.totalCents - 1500]);
    expect((await refund({ amount_cents: 1, reason: "more" })).status).toBe(409);
    const pdf = await agent.get(`/api/orders/${order.id}/invoice.pdf`).buffer(true).parse(binary);
    const text = pdfText(pdf.body as Buffer);
    expect(text).toContain(view.invoice.number);
    expect(text).toContain("one can dented in transit");
    expect(text).toMatch(/Card payment received/);
  });
});

describe("GET /api/orders/:id/invoice.pdf", () => {
  it("401, 404 across organisations and before payment, 200 a PDF for the owner and staff", async () => {
    const { user, agent } = await customer();
    const unpaid = await buildOrder(app, user);
    expect((await agent.get(`/api/orders/${unpaid.id}/invoice.pdf`)).status).toBe(404);
    const order = await buildPaidOrder(app, user);
    expect((await request(app).get(`/api/orders/${order.id}/invoice.pdf`)).status).toBe(401);
    const stranger = await customer();
    expect((await stranger.agent.get(`/api/orders/${order.id}/invoice.pdf`)).status).toBe(404);
    const res = await agent.get(`/api/orders/${order.id}/invoice.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    const text = pdfText(res.body as Buffer);
    expect(text).toMatch(/Invoice INV-\d+/);
    expect(text).toContain(`O-${order.number}`);
    expect(text).toMatch(/Paid in full/);
    expect(text).not.toMatch(/[Mm]argin/);
    const admin = await planner();
    expect((await admin.agent.get(`/api/orders/${order.id}/invoice.pdf`)).status).toBe(200);
  });
});
