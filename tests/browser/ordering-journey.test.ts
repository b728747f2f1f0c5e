// The customer's journey in Chromium, as a new user would take it: save a design on the design
// check, compare it with a saved one, quote it, download the quote PDF, order it with a drawing,
// pay on the payment stand-in's page and see the order paid with its payment and invoice; the
// second organisation's customer gets "not found" for it; the planner refunds part of it.
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { Order } from "../../server/models";
import { inbox } from "../support/app";
import { DEMO_PASSWORD, expectAccessible, useBrowser } from "../support/browser";
import { waitFor } from "../support/ordering";

const h = useBrowser();
beforeAll(async () => {
  // this app receives the stand-in's events, as a deployment registers its endpoint; the return
  // from the payment page comes back to this server
  await h.app.locals.deps.stripe.webhookEndpoints.create({ url: `${h.baseUrl}/api/webhooks/stripe`, enabled_events: ["*"] });
  h.app.locals.deps.config.appUrl = h.baseUrl;
});

async function signIn(page: Page, email: string) {
  await h.context.clearCookies();
  await page.goto(`${h.baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill(email);
  await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: /^sign in$/i }).click();
  await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
}

const A_DRAWING = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");

describe("a customer orders and pays; another organisation cannot see it; the planner refunds part", () => {
  it("save, compare, quote, PDF, order with a drawing, pay, paid; 404 for the stranger; part refund", { timeout: 240_000 }, async () => {
    const { page, consoleErrors, offMachine } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signIn(page, "customer@demo.test");
    const name = `Journey can ${Date.now().toString(36)}`;

    // --- the design check is the configurator: save the design under a name with the attenuation needed
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: /^design check$/i }).click();
    await page.getByTestId("attenuation-db").filter({ hasText: /dB/ }).waitFor();
    const save = page.getByTestId("save-panel");
    await save.getByLabel(/design name/i).fill("");
    await save.getByRole("button", { name: /^save design$/i }).click();
    await expect.poll(() => save.getByText(/give the design a name/i).isVisible()).toBe(true); // the shared schema's message, beside the box
    await save.getByLabel(/design name/i).fill(name);
    await save.getByLabel(/attenuation needed/i).fill("30");
    await save.getByRole("button", { name: /^save design$/i }).click();
    await save.getByRole("status").filter({ hasText: `Saved as “${name}”` }).waitFor();
    await expect.poll(() => new URL(page.url()).searchParams.get("saved")).toMatch(/^[0-9a-f-]{36}$/);
    await h.shot(page, "journey-design-saved");

    // --- the design list: find it, compare it with a seeded design
    await page.goto(`${h.baseUrl}/designs`);
    await page.getByTestId("designs-table").waitFor();
    await page.getByLabel(/search by name/i).fill(name);
    await page.keyboard.press("Enter");
    await expect.poll(() => page.getByTestId("design-row").count()).toBe(1);
    await page.getByLabel(`Compare “${name}”`).check();
    await page.getByRole("button", { name: /^clear$/i }).click();
    await page.getByLabel("Compare “Photomultiplier can, two layers”").check();
    await expect.poll(() => page.getByLabel(`Compare “${name}”`).isChecked()).toBe(true); // the choice survives a new search
    await page.getByRole("button", { name: /compare 2 side by side/i }).click();
    await page.getByTestId("comparison-table").waitFor();
    await expect.poll(() => page.getByTestId("comparison-row").count()).toBe(2);
    await page.getByTestId("attenuation-chart").locator(".recharts-line").nth(1).waitFor();
    await h.shot(page, "journey-compare");

    // --- open the saved design again and quote 3 of it
    await page.getByRole("link", { name }).first().click();
    await page.getByTestId("attenuation-db").filter({ hasText: /dB/ }).waitFor();
    await expect.poll(() => save.getByText(`Opened from your saved design “${name}”`).isVisible()).toBe(true);
    await save.getByLabel(/^quantity/i).fill("3");
    await save.getByRole("button", { name: /get a quote/i }).click();
    await page.waitForURL(/\/quotes\/[0-9a-f-]{36}$/);
    await page.getByTestId("quote-total").waitFor();
    await expect.poll(() => page.getByTestId("quote-status").textContent()).toBe("Open");
    const pdfHref = await page.getByRole("link", { name: /download the quote/i }).getAttribute("href");
    const pdf = await page.request.get(`${h.baseUrl}${pdfHref}`);
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()["content-type"]).toMatch(/application\/pdf/);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe("%PDF-");
    // a customer's price: the amounts, never the shop's margin or rates
    expect(await page.getByTestId("price-table").textContent()).not.toMatch(/margin|\bRate\b/i);
    await h.shot(page, "journey-quote");

    // --- order it with a purchase order, an address, a date and a drawing
    await page.getByRole("link", { name: /order this quote/i }).click();
    await page.getByLabel(/purchase order number/i).fill("PO-JOURNEY-1");
    await page.getByLabel(/delivery address/i).fill("Fernhollow Instruments (demo)\n1 Test Lane\nSpringfield");
    await page.getByLabel(/requested delivery date/i).fill("2099-01-15");
    await page.getByLabel(/^drawings/i).setInputFiles({ name: "can-drawing.pdf", mimeType: "application/pdf", buffer: A_DRAWING });
    await page.getByText("can-drawing.pdf").waitFor();
    await h.shot(page, "journey-order-form");
    await page.getByRole("button", { name: /place the order/i }).click();
    await page.waitForURL(/\/orders\/[0-9a-f-]{36}$/);
    const orderId = page.url().split("/").pop()!;
    await expect.poll(() => page.getByTestId("order-status").textContent()).toBe("Awaiting payment");
    await page.getByTestId("drawings").getByRole("link", { name: "can-drawing.pdf" }).waitFor();
    await page.getByTestId("timeline").getByText("Drawing attached").waitFor();

    // --- pay on the stand-in's page, at a phone's size; only the signed event marks it paid
    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByRole("button", { name: /^pay /i }).click();
    await page.waitForURL(/\/checkout\//);
    await page.getByRole("button", { name: /^pay /i }).click();
    await page.waitForURL(new RegExp(`/orders/${orderId}\\?checkout=returned`));
    await expect.poll(() => page.getByTestId("order-status").first().textContent(), { timeout: 20_000 }).toBe("Paid");
    await page.getByRole("status").filter({ hasText: /payment is confirmed/i }).waitFor();
    await expect.poll(() => page.getByTestId("payment-row").count()).toBe(1);
    await page.getByRole("link", { name: /invoice .* \(pdf\)/i }).waitFor();
    await h.shot(page, "journey-order-paid-phone");
    await page.setViewportSize({ width: 1366, height: 900 });
    expect((await Order.findByPk(orderId))!.status).toBe("paid");
    const orderNumber = (await page.getByRole("heading", { level: 1 }).textContent())!.replace(/^Order /, "");
    // the mails: order received, then payment received with the invoice attached
    const mails = await waitFor(async () => {
      const m = await inbox(h.app, "customer@demo.test");
      return m.some((x) => x.subject.startsWith(`Payment received for order ${orderNumber}`)) ? m : null;
    }, 20_000, "the payment mail");
    expect(mails.some((m) => m.subject === `Order ${orderNumber} received`)).toBe(true);
    const paid = mails.find((m) => m.subject.startsWith(`Payment received for order ${orderNumber}`))!;
    expect(paid.attachments.map((a) => a.contentType)).toContain("application/pdf");

    // --- the organisation's order list shows it, paid
    await page.goto(`${h.baseUrl}/orders?status=paid&q=${encodeURIComponent(orderNumber)}`);
    await page.getByTestId("orders-table").getByRole("link", { name: orderNumber }).waitFor();
    expect(await page.getByTestId("orders-table").textContent()).toContain("PO-JOURNEY-1");

    // --- the second organisation's customer sees none of it
    await signIn(page, "customer2@demo.test");
    await page.goto(`${h.baseUrl}/orders/${orderId}`);
    await page.getByRole("heading", { level: 1, name: /nothing at this address/i }).waitFor();
    expect((await page.request.get(`${h.baseUrl}/api/orders/${orderId}`)).status()).toBe(404);
    await page.goto(`${h.baseUrl}/orders?q=PO-JOURNEY-1`);
    await page.getByTestId("orders-empty").waitFor();
    await h.shot(page, "journey-stranger-orders");

    // --- the planner refunds part of it, after confirming
    await signIn(page, "admin@demo.test");
    await page.goto(`${h.baseUrl}/orders?q=PO-JOURNEY-1`);
    await page.getByTestId("orders-table").getByRole("link").first().click();
    await page.waitForURL(new RegExp(`/orders/${orderId}$`));
    const refund = page.getByTestId("refund-form");
    await refund.getByLabel(/^amount/i).fill("10");
    await refund.getByLabel(/^reason/i).fill("One can returned with a dent");
    await refund.getByRole("button", { name: /^refund…$/i }).click();
    await refund.getByRole("group", { name: /confirm the refund/i }).waitFor();
    await expectAccessible(page);
    await refund.getByRole("button", { name: /^refund €10\.00$/i }).click();
    await refund.getByRole("status").filter({ hasText: /refunded €10\.00/i }).waitFor();
    await expect.poll(() => page.getByTestId("payment-row").count()).toBe(2);
    await page.getByTestId("timeline").getByText("Refund issued").waitFor();
    await h.shot(page, "journey-planner-refund");
    expect((await Order.findByPk(orderId))!.status).toBe("paid"); // a part refund leaves it paid

    expect(consoleErrors.filter((e) => !/status of 404/.test(e))).toEqual([]);
    expect(offMachine).toEqual([]);
    await page.close();
  });
});
