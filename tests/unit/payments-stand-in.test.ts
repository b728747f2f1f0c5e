import Stripe from "stripe";
import { describe, expect, it } from "vitest";
import { parseForm } from "../../fake-services/payments/form";
import { signPayload } from "../../fake-services/payments/server";

describe("the payment stand-in's signature", () => {
  it("is the hosted service's scheme: the official SDK verifies it, and refuses it with another secret or body [derived]", () => {
    const payload = JSON.stringify({ id: "evt_1", type: "checkout.session.completed", data: { object: { id: "cs_1" } } });
    const header = signPayload(payload, "whsec_fluxwright_local");
    expect(header).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = Stripe.webhooks.constructEvent(payload, header, "whsec_fluxwright_local");
    expect(event.id).toBe("evt_1");
    expect(() => Stripe.webhooks.constructEvent(payload, header, "whsec_other")).toThrow();
    expect(() => Stripe.webhooks.constructEvent(payload.replace("cs_1", "cs_2"), header, "whsec_fluxwright_local")).toThrow();
    // and the SDK's own test header passes the same check as ours would
    const sdkHeader = Stripe.webhooks.generateTestHeaderString({ payload, secret: "whsec_fluxwright_local", timestamp: 1_700_000_000 });
    expect(signPayload(payload, "whsec_fluxwright_local", 1_700_000_000)).toBe(sdkHeader);
  });
});

describe("the stand-in's form bodies", () => {
  it("reads the SDK's bracketed keys into objects and arrays", () => {
    const body =
      "mode=payment&line_items[0][quantity]=2&line_items[0][price_data][currency]=eur&line_items[0][price_data][unit_amount]=1234" +
      "&line_items[0][price_data][product_data][name]=Order%20O-1&metadata[orderId]=abc&enabled_events[0]=*";
    expect(parseForm(body)).toEqual({
      mode: "payment",
      line_items: [{ quantity: "2", price_data: { currency: "eur", unit_amount: "1234", product_data: { name: "Order O-1" } } }],
      metadata: { orderId: "abc" },
      enabled_events: ["*"],
    });
  });
});
