// The payment stand-in's hosted page in Chromium: a customer declines, then pays; only the signed
// event marks the order paid. The order pages come later; this checks the stand-in's page itself.
import { beforeAll, describe, expect, it } from "vitest";
import { User } from "../../server/models";
import { expectAccessible, useBrowser } from "../support/browser";
import { buildOrder, waitFor } from "../support/ordering";
import { checkoutStarter } from "../../server/services/checkoutStarter";
import { Order, Quote } from "../../server/models";

const h = useBrowser();
beforeAll(async () => {
  // this app receives the stand-in's events, as a deployment registers its endpoint
  await h.app.locals.deps.stripe.webhookEndpoints.create({ url: `${h.baseUrl}/api/webhooks/stripe`, enabled_events: ["*"] });
});

describe("paying on the stand-in's checkout page", () => {
  it("shows the amount, declines with a message, pays and returns to the order; the order is paid by the signed event", async () => {
    const customer = (await User.findOne({ where: { email: "customer@demo.test" } }))!;
    const order = await buildOrder(h.app, customer, { quantity: 2 });
    const { stripe, sequelize } = h.app.locals.deps;
    const session = await sequelize.transaction(async (transaction) => {
      const locked = (await Order.findByPk(order.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
      return checkoutStarter({ actor: customer, order: locked, quote: (await Quote.findByPk(order.quoteId, { transaction }))!, stripe, appUrl: h.baseUrl, ip: null, transaction });
    });
    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize({ width: 390, height: 844 }); // a phone: people pay from them
    await page.goto(session.url);
    const euros = (order.totalCents / 100).toLocaleString("en-GB", { minimumFractionDigits: 2 });
    await expect.poll(() => page.getByRole("button", { name: `Pay €${euros}` }).isVisible()).toBe(true);
    await expectAccessible(page);
    await h.shot(page, "checkout-stand-in");

    await page.getByRole("button", { name: "Decline the card" }).click();
    await expect.poll(() => page.getByRole("alert").textContent()).toMatch(/declined/);
    await expectAccessible(page);
    await h.shot(page, "checkout-stand-in-declined");
    expect((await Order.findByPk(order.id))!.status).toBe("awaiting_payment");

    // keyboard: the pay button is reachable and works with Enter
    await page.getByRole("button", { name: `Pay €${euros}` }).focus();
    await Promise.all([page.waitForURL(new RegExp(`/orders/${order.id}\\?checkout=returned`)), page.keyboard.press("Enter")]);
    await waitFor(async () => (await Order.findByPk(order.id))!.status === "paid", 15_000, "the order to be paid");
    expect(consoleErrors.filter((e) => !/404|Not Found/.test(e))).toEqual([]);
  });
});
