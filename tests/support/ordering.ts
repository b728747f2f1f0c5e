// Factories and helpers for the ordering tests: quotes, orders and payments made through the same
// services the routes use, a listening app that receives the payment stand-in's events, and
// signed events for the webhook.
import type { AddressInfo } from "node:net";
import type { Server } from "node:http";
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Stripe from "stripe";
import { afterAll, beforeAll, inject } from "vitest";
import type { FluxwrightApp } from "../../server/app";
import { seedShopRates, seedMaterials } from "../../server/db/seed";
import { CheckoutSession, Order, Quote, type User } from "../../server/models";
import { orderPlacer } from "../../server/services/orderPlacer";
import { paymentEventRecorder } from "../../server/services/paymentEventRecorder";
import { quoteBuilder } from "../../server/services/quoteBuilder";
import { quoteConfigurationExample } from "../../shared/schemas/contract-examples";
import type { QuoteConfiguration } from "../../shared/schemas/quote";
import { createHttpServer } from "../../server/http-server";

export const WEBHOOK_SECRET = "whsec_fluxwright_local";
export const paymentsUrl = () => `http://127.0.0.1:${inject("paymentsPort")}`;

/** A fresh, mutable copy of the contract's quote configuration. */
export const configuration = (overrides: Record<string, unknown> = {}): Record<string, unknown> => ({ ...structuredClone(quoteConfigurationExample), ...overrides });

export async function ensureReferenceData(): Promise<void> {
  await seedMaterials();
  await seedShopRates();
}

export async function buildQuote(app: FluxwrightApp, user: User, opts: { quantity?: number; now?: Date; configuration?: Record<string, unknown> } = {}): Promise<Quote> {
  const { quoteCreateSchema } = await import("../../shared/schemas/quote");
  const parsed = quoteCreateSchema.parse({ configuration: opts.configuration ?? configuration(), quantity: opts.quantity ?? 2 });
  return app.locals.deps.sequelize.transaction((transaction) =>
    quoteBuilder({ actor: user, organizationId: user.organizationId, configuration: parsed.configuration as QuoteConfiguration, quantity: parsed.quantity, ip: null, transaction, now: opts.now }),
  );
}

export async function buildOrder(app: FluxwrightApp, user: User, opts: { quantity?: number; purchaseOrder?: string; configuration?: Record<string, unknown> } = {}): Promise<Order> {
  const quote = await buildQuote(app, user, opts);
  const { mailer, config, sequelize } = app.locals.deps;
  return sequelize.transaction((transaction) => orderPlacer({ actor: user, quote, input: { purchaseOrder: opts.purchaseOrder }, mailer, appUrl: config.appUrl, ip: null, transaction }));
}

/** A checkout.session.completed event for a session, as the payment service would send it. */
export function completedEvent(sessionId: string, amount: number, currency = "eur", id = `evt_test_${Math.random().toString(36).slice(2)}`) {
  return { id, object: "event", type: "checkout.session.completed", data: { object: { id: sessionId, object: "checkout.session", amount_total: amount, currency, payment_status: "paid", payment_intent: `pi_test_${id.slice(-10)}` } } };
}

/** Body and header of a signed event, signed the way the hosted service signs (the SDK's own helper). */
export function signed(event: unknown, secret = WEBHOOK_SECRET): { payload: string; header: string } {
  const payload = JSON.stringify(event);
  return { payload, header: Stripe.webhooks.generateTestHeaderString({ payload, secret }) };
}

/** An order paid as the webhook would pay it (without the stand-in): a session row and a signed-event's effect. */
export async function buildPaidOrder(app: FluxwrightApp, user: User, opts: { quantity?: number; configuration?: Record<string, unknown> } = {}): Promise<Order> {
  const order = await buildOrder(app, user, opts);
  const sessionId = `cs_test_${order.id.slice(0, 8)}${Date.now()}`;
  await CheckoutSession.create({ id: sessionId, orderId: order.id, amountCents: order.totalCents, currency: order.currency, url: "http://127.0.0.1/x", idempotencyKey: `test-${sessionId}`, createdById: user.id });
  const { sequelize, mailer, config } = app.locals.deps;
  const event = completedEvent(sessionId, order.totalCents, order.currency.toLowerCase());
  await sequelize.transaction((transaction) => paymentEventRecorder({ event, mailer, appUrl: config.appUrl, transaction }));
  return (await Order.findByPk(order.id))!;
}

/**
 * Listens on a free port and registers the app's webhook with the payment stand-in (as a
 * deployment registers its endpoint), so paying on the stand-in reaches this app.
 */
export function receivePaymentEvents(app: FluxwrightApp): { baseUrl: () => string } {
  let server: Server;
  let endpointId: string | undefined;
  let baseUrl = "";
  beforeAll(async () => {
    server = createHttpServer(app).listen(0, "127.0.0.1");
    await new Promise((r) => server.once("listening", r));
    baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const endpoint = await app.locals.deps.stripe.webhookEndpoints.create({ url: `${baseUrl}/api/webhooks/stripe`, enabled_events: ["*"] });
    endpointId = endpoint.id;
  });
  afterAll(async () => {
    if (endpointId) await app.locals.deps.stripe.webhookEndpoints.del(endpointId).catch(() => {});
    server.closeAllConnections();
    await new Promise((r) => server.close(r));
  });
  return { baseUrl: () => baseUrl };
}

/** The customer's click on the stand-in's page, through its JSON form. */
export async function payOnStandIn(sessionId: string, outcome: "succeeded" | "declined"): Promise<Response> {
  return fetch(`${paymentsUrl()}/checkout/${sessionId}/pay`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ outcome }) });
}

export async function waitFor<T>(probe: () => Promise<T | undefined | null | false>, timeoutMs = 10_000, what = "the condition"): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/**
 * The text of a PDF, read by poppler's pdftotext (an extractor independent of the renderer): laid
 * out as on the page, or "raw" in the order it was written (sentences wrapped in a column stay whole).
 */
export function pdfText(pdf: Buffer, mode: "layout" | "raw" = "layout"): string {
  const dir = mkdtempSync(path.join(tmpdir(), "fw-pdf-"));
  try {
    const file = path.join(dir, "doc.pdf");
    writeFileSync(file, pdf);
    return execFileSync("pdftotext", [`-${mode}`, file, "-"], { encoding: "utf8" });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** The page size in points, as poppler's pdfinfo reads it. */
export function pdfPageSize(pdf: Buffer): { width: number; height: number; pages: number } {
  const dir = mkdtempSync(path.join(tmpdir(), "fw-pdf-"));
  try {
    const file = path.join(dir, "doc.pdf");
    writeFileSync(file, pdf);
    const info = execFileSync("pdfinfo", [file], { encoding: "utf8" });
    const size = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(info)!;
    return { width: Number(size[1]), height: Number(size[2]), pages: Number(/Pages:\s+(\d+)/.exec(info)![1]) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** supertest's binary parser for PDFs and downloads */
export const binary = ((res: NodeJS.ReadableStream, cb: (err: Error | null, body: unknown) => void): void => {
  const chunks: Buffer[] = [];
  res.on("data", (c: Buffer) => chunks.push(c));
  res.on("end", () => cb(null, Buffer.concat(chunks)));
}) as unknown as (res: import("superagent").Response, cb: (err: Error | null, body: unknown) => void) => void;
