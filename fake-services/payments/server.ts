// A local stand-in for the hosted payment service: it answers the official SDK for the calls the
// application makes (checkout sessions, payment intents, refunds, webhook endpoints), serves the
// hosted checkout page, and delivers signed events to the application's webhook with retries and
// back-off until it gets a 2xx. State lives in memory. It imports nothing of the application.
import { createHash, createHmac, randomBytes } from "node:crypto";
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import { parseForm } from "./form";
import { checkoutPage, escapeHtml, type PageSession } from "./page";

type Json = Record<string, unknown>;

interface Session extends PageSession {
  object: "checkout.session";
  mode: string;
  amount_subtotal: number;
  payment_intent: string | null;
  client_reference_id: string | null;
  metadata: Record<string, string>;
  intentMetadata: Record<string, string>;
  created: number;
  expires_at: number;
  livemode: false;
}

interface Intent {
  id: string;
  object: "payment_intent";
  amount: number;
  amount_received: number;
  currency: string;
  status: "requires_payment_method" | "succeeded";
  metadata: Record<string, string>;
  last_payment_error: { code: string; message: string } | null;
  created: number;
  refunded: number;
}

export interface Delivery {
  eventId: string;
  type: string;
  url: string;
  attempts: number;
  status: "pending" | "delivered" | "failed";
  lastStatus: number | null;
  lastError: string | null;
}

export interface PaymentsStandInOptions {
  port: number;
  host?: string;
  /** where events go besides the endpoints registered through the API (null: none) */
  webhookUrl?: string | null;
  webhookSecret?: string;
  /** first retry after this many ms, doubling up to maxRetryDelayMs */
  retryDelayMs?: number;
  maxRetryDelayMs?: number;
  maxAttempts?: number;
}

export interface PaymentsStandIn {
  port: number;
  url: string;
  sessions: Map<string, Session>;
  deliveries: Delivery[];
  close(): Promise<void>;
}

const now = () => Math.floor(Date.now() / 1000);
const id = (prefix: string) => `${prefix}_${randomBytes(12).toString("hex")}`;
const API_VERSION = "2026-10-28.endive";

class ApiError extends Error {
  constructor(readonly status: number, readonly type: string, message: string, readonly code?: string, readonly param?: string) {
    super(message);
  }
}
const missing = (what: string, value: string) => new ApiError(404, "invalid_request_error", `No such ${what}: '${value}'`, "resource_missing");
const invalid = (message: string, param?: string) => new ApiError(400, "invalid_request_error", message, "parameter_invalid", param);

/** The hosted service's signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of "t.payload">. */
export function signPayload(payload: string, secret: string, timestamp = now()): string {
  const v1 = createHmac("sha256", secret).update(`${timestamp}.${payload}`).digest("hex");
  return `t=${timestamp},v1=${v1}`;
}

async function readBody(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    size += (chunk as Buffer).length;
    if (size > 1_000_000) throw invalid("request body too large");
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks).toString("utf8");
}

const int = (v: unknown, param: string): number => {
  const n = Number(v);
  if (typeof v !== "string" || !/^\d+$/.test(v) || !Number.isSafeInteger(n)) throw invalid(`Invalid integer: ${String(v)}`, param);
  return n;
};
const strings = (v: unknown): Record<string, string> => (v && typeof v === "object" && !Array.isArray(v) ? Object.fromEntries(Object.entries(v as Json).map(([k, x]) => [k, String(x)])) : {});

export async function startPaymentsStandIn(opts: PaymentsStandInOptions): Promise<PaymentsStandIn> {
  const host = opts.host ?? "127.0.0.1";
  const secret = opts.webhookSecret ?? "whsec_fluxwright_local";
  const retryDelay = opts.retryDelayMs ?? 1000;
  const maxDelay = opts.maxRetryDelayMs ?? 60_000;
  const maxAttempts = opts.maxAttempts ?? 60;
  const sessions = new Map<string, Session>();
  const intents = new Map<string, Intent>();
  const refunds = new Map<string, Json>();
  const endpoints = new Map<string, { id: string; url: string; enabled_events: string[] }>();
  const idempotent = new Map<string, { fingerprint: string; status: number; body: Json }>();
  const deliveries: Delivery[] = [];
  const events = new Map<string, Json>();
  const timers = new Set<NodeJS.Timeout>();
  let baseUrl = "";
  let closed = false;

  // --- events and their delivery ---
  function deliver(event: Json, url: string, delivery: Delivery): void {
    if (closed) return;
    const payload = JSON.stringify(event);
    delivery.attempts++;
    fetch(url, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": signPayload(payload, secret), "user-agent": "payments-stand-in" }, body: payload, signal: AbortSignal.timeout(10_000) })
      .then(async (res) => {
        await res.arrayBuffer().catch(() => undefined);
        delivery.lastStatus = res.status;
        if (res.status >= 200 && res.status < 300) delivery.status = "delivered";
        else retry(event, url, delivery, `HTTP ${res.status}`);
      })
      .catch((err: Error) => retry(event, url, delivery, err.message));
  }
  function retry(event: Json, url: string, delivery: Delivery, error: string): void {
    delivery.lastError = error;
    if (delivery.attempts >= maxAttempts || closed) {
      delivery.status = "failed";
      return;
    }
    const wait = Math.min(maxDelay, retryDelay * 2 ** (delivery.attempts - 1));
    const t = setTimeout(() => {
      timers.delete(t);
      deliver(event, url, delivery);
    }, wait);
    timers.add(t);
  }
  function emit(type: string, object: Json): Json {
    const event: Json = { id: id("evt"), object: "event", api_version: API_VERSION, created: now(), livemode: false, pending_webhooks: 1, request: { id: null }, type, data: { object: structuredClone(object) } };
    events.set(event.id as string, event);
    const targets = [...(opts.webhookUrl ? [opts.webhookUrl] : []), ...[...endpoints.values()].filter((e) => e.enabled_events.includes("*") || e.enabled_events.includes(type)).map((e) => e.url)];
    for (const url of targets) {
      const delivery: Delivery = { eventId: event.id as string, type, url, attempts: 0, status: "pending", lastStatus: null, lastError: null };
      deliveries.push(delivery);
      deliver(event, url, delivery);
    }
    return event;
  }

  // --- resources ---
  const publicSession = (s: Session): Json => {
    const { items: _i, intentMetadata: _m, ...rest } = s;
    return { ...rest, url: s.status === "open" ? `${baseUrl}/checkout/${s.id}` : null };
  };
  const publicIntent = (pi: Intent): Json => {
    const { refunded: _r, ...rest } = pi;
    return rest;
  };

  function session(sid: string): Session {
    const s = sessions.get(sid);
    if (!s) throw missing("checkout.session", sid);
    if (s.status === "open" && s.expires_at <= now()) {
      s.status = "expired";
      emit("checkout.session.expired", publicSession(s));
    }
    return s;
  }

  function createSession(p: Json): Session {
    if (p.mode !== "payment") throw invalid("Only mode=payment is supported by this stand-in.", "mode");
    if (typeof p.success_url !== "string") throw invalid("Missing required param: success_url.", "success_url");
    const lines = Array.isArray(p.line_items) ? (p.line_items as Json[]) : [];
    if (!lines.length) throw invalid("Missing required param: line_items.", "line_items");
    let currency = "";
    const items = lines.map((l, i) => {
      const pd = (l.price_data ?? {}) as Json;
      const c = String(pd.currency ?? "").toLowerCase();
      if (!/^[a-z]{3}$/.test(c)) throw invalid("Invalid currency.", `line_items[${i}][price_data][currency]`);
      if (currency && c !== currency) throw invalid("All line items must share one currency.", `line_items[${i}][price_data][currency]`);
      currency = c;
      const product = (pd.product_data ?? {}) as Json;
      return { name: String(product.name ?? "Item"), description: product.description ? String(product.description) : null, quantity: int(l.quantity, `line_items[${i}][quantity]`), unit_amount: int(pd.unit_amount, `line_items[${i}][price_data][unit_amount]`) };
    });
    const amount = items.reduce((s, i) => s + i.quantity * i.unit_amount, 0);
    const s: Session = {
      id: id("cs_test"), object: "checkout.session", mode: "payment", status: "open", payment_status: "unpaid",
      amount_total: amount, amount_subtotal: amount, currency, items, payment_intent: null,
      success_url: p.success_url, cancel_url: typeof p.cancel_url === "string" ? p.cancel_url : null,
      customer_email: typeof p.customer_email === "string" ? p.customer_email : null,
      client_reference_id: typeof p.client_reference_id === "string" ? p.client_reference_id : null,
      metadata: strings(p.metadata), intentMetadata: strings((p.payment_intent_data as Json | undefined)?.metadata),
      created: now(), expires_at: now() + 24 * 3600, livemode: false,
    };
    sessions.set(s.id, s);
    return s;
  }

  /** The customer's choice on the hosted page (or POST /checkout/:id/pay). */
  function pay(sid: string, outcome: string): Session {
    const s = session(sid);
    if (outcome !== "succeeded" && outcome !== "declined") throw invalid('outcome must be "succeeded" or "declined"', "outcome");
    if (s.status !== "open") throw new ApiError(409, "invalid_request_error", `This checkout is ${s.status}.`, "checkout_not_open");
    let pi = s.payment_intent ? intents.get(s.payment_intent) : undefined;
    if (!pi) {
      pi = { id: id("pi"), object: "payment_intent", amount: s.amount_total, amount_received: 0, currency: s.currency, status: "requires_payment_method", metadata: s.intentMetadata, last_payment_error: null, created: now(), refunded: 0 };
      intents.set(pi.id, pi);
      s.payment_intent = pi.id;
    }
    if (outcome === "declined") {
      pi.last_payment_error = { code: "card_declined", message: "Your card was declined." };
      emit("payment_intent.payment_failed", publicIntent(pi));
      return s;
    }
    pi.status = "succeeded";
    pi.amount_received = pi.amount;
    pi.last_payment_error = null;
    s.status = "complete";
    s.payment_status = "paid";
    emit("checkout.session.completed", publicSession(s));
    emit("payment_intent.succeeded", publicIntent(pi));
    return s;
  }

  function createRefund(p: Json): Json {
    const piId = String(p.payment_intent ?? "");
    const pi = intents.get(piId);
    if (!pi) throw missing("payment_intent", piId);
    if (pi.status !== "succeeded") throw invalid("This PaymentIntent has no successful charge to refund.", "payment_intent");
    const amount = p.amount === undefined ? pi.amount_received - pi.refunded : int(p.amount, "amount");
    if (amount <= 0 || amount > pi.amount_received - pi.refunded) {
      throw new ApiError(400, "invalid_request_error", `Refund amount (${amount}) is greater than unrefunded amount on charge (${pi.amount_received - pi.refunded})`, "amount_too_large", "amount");
    }
    pi.refunded += amount;
    const refund: Json = { id: id("re"), object: "refund", amount, currency: pi.currency, payment_intent: pi.id, status: "succeeded", reason: p.reason ?? null, metadata: strings(p.metadata), created: now() };
    refunds.set(refund.id as string, refund);
    emit("refund.created", refund);
    return refund;
  }

  // --- the API ---
  function api(method: string, path: string, params: Json): { status: number; body: Json } {
    let m: RegExpExecArray | null;
    if (method === "POST" && path === "/v1/checkout/sessions") return { status: 200, body: publicSession(createSession(params)) };
    if ((m = /^\/v1\/checkout\/sessions\/([\w-]+)$/.exec(path)) && method === "GET") return { status: 200, body: publicSession(session(m[1])) };
    if ((m = /^\/v1\/checkout\/sessions\/([\w-]+)\/expire$/.exec(path)) && method === "POST") {
      const s = session(m[1]);
      if (s.status !== "open") throw invalid(`Only open sessions can be expired; this one is ${s.status}.`);
      s.status = "expired";
      emit("checkout.session.expired", publicSession(s));
      return { status: 200, body: publicSession(s) };
    }
    if ((m = /^\/v1\/payment_intents\/([\w-]+)$/.exec(path)) && method === "GET") {
      const pi = intents.get(m[1]);
      if (!pi) throw missing("payment_intent", m[1]);
      return { status: 200, body: publicIntent(pi) };
    }
    if (method === "POST" && path === "/v1/refunds") return { status: 200, body: createRefund(params) };
    if ((m = /^\/v1\/refunds\/([\w-]+)$/.exec(path)) && method === "GET") {
      const r = refunds.get(m[1]);
      if (!r) throw missing("refund", m[1]);
      return { status: 200, body: r };
    }
    if (method === "POST" && path === "/v1/webhook_endpoints") {
      if (typeof params.url !== "string" || !/^https?:\/\//.test(params.url)) throw invalid("Missing required param: url.", "url");
      const enabled = Array.isArray(params.enabled_events) ? params.enabled_events.map(String) : ["*"];
      const e = { id: id("we"), url: params.url, enabled_events: enabled };
      endpoints.set(e.id, e);
      return { status: 200, body: { ...e, object: "webhook_endpoint", status: "enabled", secret, livemode: false, created: now() } };
    }
    if (method === "GET" && path === "/v1/webhook_endpoints") return { status: 200, body: { object: "list", data: [...endpoints.values()].map((e) => ({ ...e, object: "webhook_endpoint" })), has_more: false } };
    if ((m = /^\/v1\/webhook_endpoints\/([\w-]+)$/.exec(path)) && method === "DELETE") {
      if (!endpoints.delete(m[1])) throw missing("webhook_endpoint", m[1]);
      return { status: 200, body: { id: m[1], object: "webhook_endpoint", deleted: true } };
    }
    throw new ApiError(404, "invalid_request_error", `Unrecognized request URL (${method}: ${path}).`);
  }

  const send = (res: ServerResponse, status: number, body: Json, headers: Record<string, string> = {}): void => {
    res.writeHead(status, { "content-type": "application/json", "request-id": id("req"), ...headers }).end(JSON.stringify(body));
  };
  const html = (res: ServerResponse, status: number, page: string): void => void res.writeHead(status, { "content-type": "text/html; charset=utf-8", "content-security-policy": "default-src 'none'; style-src 'unsafe-inline'; form-action 'self' http: https:" }).end(page);

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? "/", "http://localhost");
    const method = req.method ?? "GET";
    const raw = method === "GET" || method === "DELETE" ? "" : await readBody(req);

    // the hosted checkout page and its buttons
    let m: RegExpExecArray | null;
    if ((m = /^\/checkout\/([\w-]+)$/.exec(url.pathname)) && method === "GET") {
      const s = sessions.get(m[1]);
      if (!s) return html(res, 404, `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>No such checkout</title></head><body><main><h1>No such checkout</h1><p>${escapeHtml(m[1])} is unknown to the payment stand-in (it forgets everything when it restarts).</p></main></body></html>`);
      return html(res, 200, checkoutPage(session(s.id)));
    }
    if ((m = /^\/checkout\/([\w-]+)\/pay$/.exec(url.pathname)) && method === "POST") {
      const asJson = (req.headers["content-type"] ?? "").includes("application/json");
      const params = asJson ? (JSON.parse(raw || "{}") as Json) : parseForm(raw);
      const s = pay(m[1], String(params.outcome ?? ""));
      if (asJson) return send(res, 200, { id: s.id, status: s.status, payment_status: s.payment_status, payment_intent: s.payment_intent });
      if (s.status === "complete") return void res.writeHead(303, { location: s.success_url }).end();
      return html(res, 200, checkoutPage(s, { tone: "declined", text: "The card was declined. Nothing was charged. Try again, or go back to the shop." }));
    }
    // the stand-in's own view of what it sent (tests, debugging)
    if (url.pathname === "/_standin/deliveries" && method === "GET") return send(res, 200, { data: deliveries as unknown as Json[] } as Json);
    if ((m = /^\/_standin\/events\/([\w-]+)$/.exec(url.pathname)) && method === "GET") {
      const e = events.get(m[1]);
      return e ? send(res, 200, e) : send(res, 404, { error: { type: "invalid_request_error", message: "no such event" } });
    }
    if (url.pathname === "/favicon.ico") return void res.writeHead(204).end();

    if (!url.pathname.startsWith("/v1/")) return send(res, 404, { error: { type: "invalid_request_error", message: `Unrecognized request URL (${method}: ${url.pathname}).` } });
    const auth = req.headers.authorization ?? "";
    if (!/^Bearer sk_\w+/.test(auth)) return send(res, 401, { error: { type: "invalid_request_error", message: "Invalid API Key provided." } });
    const params = raw ? parseForm(raw) : Object.fromEntries(url.searchParams);
    const key = method === "POST" ? req.headers["idempotency-key"] : undefined;
    const fingerprint = createHash("sha256").update(`${method} ${url.pathname} ${raw}`).digest("hex");
    if (typeof key === "string" && key) {
      const seen = idempotent.get(`${auth} ${key}`);
      if (seen) {
        if (seen.fingerprint !== fingerprint && !key.startsWith("stripe-node-retry-")) {
          return send(res, 400, { error: { type: "idempotency_error", message: "Keys for idempotent requests can only be used with the same parameters they were first used with." } });
        }
        return send(res, seen.status, seen.body, { "idempotent-replayed": "true" });
      }
    }
    try {
      const { status, body } = api(method, url.pathname, params);
      if (typeof key === "string" && key) idempotent.set(`${auth} ${key}`, { fingerprint, status, body });
      send(res, status, body);
    } catch (err) {
      if (err instanceof ApiError) return send(res, err.status, { error: { type: err.type, message: err.message, code: err.code, param: err.param } });
      throw err;
    }
  }

  const server = createServer((req, res) => {
    handle(req, res).catch((err: unknown) => {
      if (err instanceof ApiError) {
        if ((req.headers.accept ?? "").includes("text/html") && req.url?.startsWith("/checkout/")) return html(res, err.status, `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Payment stand-in</title></head><body><main><h1>Not possible</h1><p>${escapeHtml(err.message)}</p></main></body></html>`);
        return send(res, err.status, { error: { type: err.type, message: err.message, code: err.code, param: err.param } });
      }
      send(res, 500, { error: { type: "api_error", message: err instanceof Error ? err.message : String(err) } });
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, host, () => resolve());
  });
  const port = (server.address() as { port: number }).port;
  baseUrl = `http://${host}:${port}`;
  return {
    port,
    url: baseUrl,
    sessions,
    deliveries,
    close: () =>
      new Promise<void>((resolve) => {
        closed = true;
        for (const t of timers) clearTimeout(t);
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
