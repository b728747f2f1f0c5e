import { describe, expect, it } from "vitest";
import { DEMO, seedDemo } from "../../server/db/seed";
import { Design, Invoice, Order, Organization, Payment, Quote } from "../../server/models";
import { buildTestApp } from "../support/app";

const app = buildTestApp();

describe("the demo scenario's ordering data", () => {
  it("saved designs, quotes (one expired), orders in every state for the first customer, a few for the second; a second run adds nothing", async () => {
    const { sequelize } = app.locals.deps;
    await seedDemo(sequelize, { password: "fluxwright-demo" });
    const [first, second] = await Promise.all(DEMO.customers.map((name) => Organization.findOne({ where: { name } })));
    const count = async () => ({
      designs: await Design.count({ where: { organizationId: [first!.id, second!.id] } }),
      quotes: await Quote.count({ where: { organizationId: [first!.id, second!.id] } }),
      orders: await Order.count({ where: { organizationId: [first!.id, second!.id] } }),
    });
    const before = await count();
    await seedDemo(sequelize, { password: "fluxwright-demo" });
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
    expect(theirs.map((o) => o.status).sort()).toEqual(["awaiting_payment", "paid"]);
  });
});
