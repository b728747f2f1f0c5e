import Stripe from "stripe";
import { describe, expect, it } from "vitest";
import { paymentsUrl } from "../support/ordering";
import { inject } from "vitest";

// The stand-in answers the official SDK the way the hosted service does, for the calls the app makes.
const stripe = () => new Stripe("sk_test_standin", { host: "127.0.0.1", port: inject("paymentsPort"), protocol: "http", maxNetworkRetries: 0, telemetry: false });
const session = (amount = 1234, quantity = 2) => ({
  mode: "payment" as const,
  success_url: "http://127.0.0.1:1/back",
  cancel_url: "http://127.0.0.1:1/cancel",
  line_items: [{ quantity, price_data: { currency: "eur", unit_amount: amount, product_data: { name: "Order O-1: magnetic shield" } } }],
  metadata: { orderId: "o-1" },
  payment_intent_data: { metadata: { orderId: "o-1" } },
});

describe("the payment stand-in", () => {
  it("creates, retrieves and expires checkout sessions; the same idempotency key gives the same session", async () => {
    const s = stripe();
    const key = `k-${Date.now()}`;
    const a = await s.checkout.sessions.create(session(), { idempotencyKey: key });
    const b = await s.checkout.sessions.create(session(), { idempotencyKey: key });
    expect(b.id).toBe(a.id);
    expect(a).toMatchObject({ object: "checkout.session", status: "open", payment_status: "unpaid", amount_total: 2468, currency: "eur", url: `${paymentsUrl()}/checkout/${a.id}` });
    await expect(s.checkout.sessions.create(session(999), { idempotencyKey: key })).rejects.toThrow(/same parameters/);
    expect((await s.checkout.sessions.retrieve(a.id)).status).toBe("open");
    expect((await s.checkout.sessions.expire(a.id)).status).toBe("expired");
    await expect(s.checkout.sessions.expire(a.id)).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(s.checkout.sessions.retrieve("cs_test_missing")).rejects.toThrow(/No such checkout.session/);
    const page = await fetch(`${paymentsUrl()}/checkout/${a.id}`).then((r) => r.text());
    expect(page).toMatch(/This checkout has expired/);
  });

  it("pays once, refunds up to what was paid, and refuses a wrong key", async () => {
    const s = stripe();
    const created = await s.checkout.sessions.create(session(5000, 1));
    const pay = (outcome: string) => fetch(`${paymentsUrl()}/checkout/${created.id}/pay`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ outcome }) });
    expect((await pay("maybe")).status).toBe(400);
    expect((await pay("succeeded")).status).toBe(200);
    expect((await pay("succeeded")).status).toBe(409);
    const paid = await s.checkout.sessions.retrieve(created.id);
    expect(paid).toMatchObject({ status: "complete", payment_status: "paid" });
    const pi = await s.paymentIntents.retrieve(paid.payment_intent as string);
    expect(pi).toMatchObject({ status: "succeeded", amount_received: 5000, metadata: { orderId: "o-1" } });
    const r1 = await s.refunds.create({ payment_intent: pi.id, amount: 1200 });
    expect(r1).toMatchObject({ object: "refund", status: "succeeded", amount: 1200 });
    await expect(s.refunds.create({ payment_intent: pi.id, amount: 3801 })).rejects.toThrow(/greater than unrefunded/);
    expect((await s.refunds.create({ payment_intent: pi.id })).amount).toBe(3800);
    await expect(new Stripe("pk_wrong", { host: "127.0.0.1", port: inject("paymentsPort"), protocol: "http", maxNetworkRetries: 0 }).checkout.sessions.retrieve(created.id)).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
  });

  it("the hosted page's buttons work without script: decline shows why, pay returns to the shop", async () => {
    const s = stripe();
    const created = await s.checkout.sessions.create(session(700, 1));
    const form = (outcome: string) => fetch(`${paymentsUrl()}/checkout/${created.id}/pay`, { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded" }, body: `outcome=${outcome}`, redirect: "manual" });
    const declined = await form("declined");
    expect(declined.status).toBe(200);
    expect(await declined.text()).toMatch(/role="alert">The card was declined/);
    const paid = await form("succeeded");
    expect(paid.status).toBe(303);
    expect(paid.headers.get("location")).toBe("http://127.0.0.1:1/back");
  });
});
