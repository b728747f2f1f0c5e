import { QueryTypes, type Transaction } from "sequelize";
import { z } from "zod";
import { documentNumber } from "../../shared/schemas/documents";
import { batched } from "../db/batcher";
import { prepared } from "../db/prepared";
import type { Mailer } from "../jobs/mailer";
import { CheckoutSession, Order, Payment, Quote, User, WebhookEvent, recordEvent } from "../models";
import { invoiceIssuer } from "./invoiceIssuer";
import { paymentReceivedMail } from "./mail-texts";

/** What the app reads of a payment-service event; the rest is kept as it came. */
export const paymentEventSchema = z.object({
  id: z.string().min(1).max(255),
  type: z.string().min(1).max(100),
  data: z.object({ object: z.record(z.string(), z.unknown()) }),
});
export type PaymentEvent = z.infer<typeof paymentEventSchema>;

const sessionObject = z.object({
  id: z.string(),
  amount_total: z.number().int().nullable().optional(),
  currency: z.string().nullable().optional(),
  payment_status: z.string().optional(),
  payment_intent: z.union([z.string(), z.object({ id: z.string() })]).nullable().optional(),
});
const intentObject = z.object({
  id: z.string(),
  metadata: z.record(z.string(), z.string()).optional(),
  last_payment_error: z.object({ message: z.string().optional() }).nullable().optional(),
});

const HANDLED = ["checkout.session.completed", "checkout.session.async_payment_succeeded", "checkout.session.expired", "payment_intent.payment_failed"];

interface TriageItem {
  id: string;
  type: string;
  outcome: string;
  payload: string;
  /** record whatever the session (a type the app does not act on) */
  always: boolean;
  sessionId: string;
}

// A named statement: one text whatever the batch's size (the events come as arrays), so PostgreSQL
// plans it once per connection; sent unnamed, parsing and planning it cost more than running it
// (perf: 14 % of the machine against 7.5 % for its execution under the webhook bench).
const TRIAGE = {
  name: "payment-event-triage",
  text: `with input as (
       select * from unnest($1::text[], $2::text[], $3::text[], $4::jsonb[], $5::bool[], $6::text[]) as t(id, type, outcome, payload, always, session_id)),
     existing as (select w.id from webhook_events w where w.id in (select id from input)),
     ins as (
       insert into webhook_events (id, type, outcome, payload)
       select i.id, i.type, i.outcome, i.payload from input i
       where i.id not in (select id from existing)
         and (i.always or not exists (select 1 from checkout_sessions s where s.id = i.session_id))
       on conflict (id) do nothing
       returning id, outcome)
     select i.id, i.id in (select id from existing) as seen, (select outcome from ins where ins.id = i.id limit 1) as recorded from input i`,
} as const;

/**
 * One statement for a batch of events: each is recorded once unless it was seen before, or it
 * names a checkout session the app knows (those need the transaction). Answers, per event,
 * whether it was seen and what was recorded. One batch in flight per process: with a worker per
 * core the workers' batches already overlap, and larger batches cost PostgreSQL less per event
 * (0.44–0.46 of bare Express against 0.37–0.44 with two per process, two workers on two cores).
 */
const triageBatch = batched<TriageItem, { seen: boolean; recorded: string | null }>(async (items) => {
  const rows = await prepared<{ id: string; seen: boolean; recorded: string | null }>(WebhookEvent.sequelize!, TRIAGE, [
    items.map((i) => i.id), items.map((i) => i.type), items.map((i) => i.outcome), items.map((i) => i.payload), items.map((i) => i.always), items.map((i) => i.sessionId),
  ]);
  return rows.map((r) => ({ seen: r.seen, recorded: r.recorded }));
}, { maxInFlight: 1 });

/**
 * The answer for the events that need no transaction: a replay (already recorded), a type the app
 * does not act on, or a checkout session it never opened are recorded once and answered; events
 * arriving together share one statement. Returns null when the event needs paymentEventRecorder.
 */
export async function paymentEventTriage(event: PaymentEvent): Promise<PaymentEventOutcome | null> {
  const handled = HANDLED.includes(event.type);
  const sessionId = event.type.startsWith("checkout.session.") && typeof event.data.object.id === "string" ? event.data.object.id : null;
  if (handled && sessionId === null) {
    const seen = await WebhookEvent.count({ where: { id: event.id } });
    return seen ? "duplicate" : null;
  }
  const row = await triageBatch({ id: event.id, type: event.type, outcome: handled ? "unknown_session" : "ignored", payload: JSON.stringify(event), always: !handled, sessionId: sessionId ?? "" });
  if (row.seen) return "duplicate";
  return (row.recorded as PaymentEventOutcome | null) ?? null;
}

export type PaymentEventOutcome =
  | "duplicate" | "processed" | "ignored" | "not_paid" | "unknown_session" | "unknown_order" | "amount_mismatch" | "order_not_payable";

/**
 * Records a verified payment-service event once and acts on it, in one transaction: the event id
 * is inserted first (a replay, even a concurrent one, finds it and changes nothing), then a paid
 * checkout whose amount and currency match its order marks the order paid, adds the payment and the
 * invoice, and queues the mail. A mismatch leaves the order unpaid and is kept for the planner.
 */
export async function paymentEventRecorder(props: { event: PaymentEvent; mailer: Mailer; appUrl: string; transaction: Transaction; now?: Date }): Promise<PaymentEventOutcome> {
  const { event, transaction } = props;
  const handled = HANDLED;
  const first = await WebhookEvent.sequelize!.query(
    `insert into webhook_events (id, type, outcome, payload) values ($1, $2, $3, $4) on conflict (id) do nothing returning id`,
    { bind: [event.id, event.type, handled.includes(event.type) ? "received" : "ignored", JSON.stringify(event)], type: QueryTypes.SELECT, transaction },
  );
  if (first.length === 0) return "duplicate";
  if (!handled.includes(event.type)) return "ignored";

  const outcome = async (result: PaymentEventOutcome, orderId: string | null = null): Promise<PaymentEventOutcome> => {
    await WebhookEvent.update({ outcome: result, orderId }, { where: { id: event.id }, transaction });
    return result;
  };

  if (event.type === "payment_intent.payment_failed") {
    const intent = intentObject.safeParse(event.data.object);
    const orderId = intent.success ? intent.data.metadata?.orderId : undefined;
    const order = orderId && z.uuid().safeParse(orderId).success ? await Order.findByPk(orderId, { transaction }) : null;
    if (!order) return outcome("unknown_order");
    await recordEvent(
      { actor: null, organizationId: order.organizationId, action: "payment.declined", subject: { type: "order", id: order.id }, data: { eventId: event.id, message: intent.data?.last_payment_error?.message ?? null } },
      transaction,
    );
    return outcome("processed", order.id);
  }

  const parsed = sessionObject.safeParse(event.data.object);
  if (!parsed.success) return outcome("ignored");
  const object = parsed.data;
  const known = await CheckoutSession.findByPk(object.id, { transaction, attributes: ["id", "orderId"] });
  if (!known) return outcome("unknown_session");
  // the order's row first, then its session's: the order the checkout takes them in, so an event
  // arriving while the customer reopens the checkout waits instead of deadlocking with it
  const order = await Order.findByPk(known.orderId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!order) return outcome("unknown_order");
  const session = (await CheckoutSession.findByPk(object.id, { transaction, lock: transaction.LOCK.UPDATE }))!;

  if (event.type === "checkout.session.expired") {
    if (session.status === "open") {
      session.status = "expired";
      await session.save({ transaction });
    }
    return outcome("processed", order.id);
  }

  if (object.payment_status !== "paid") return outcome("not_paid", order.id);
  const received = { received_cents: object.amount_total ?? null, receivedCurrency: object.currency?.toUpperCase() ?? null };
  const expected = { expected_cents: order.totalCents, expectedCurrency: order.currency };
  if (received.received_cents !== order.totalCents || received.receivedCurrency !== order.currency) {
    await recordEvent({ actor: null, organizationId: order.organizationId, action: "payment.mismatch", subject: { type: "order", id: order.id }, data: { eventId: event.id, sessionId: session.id, ...expected, ...received } }, transaction);
    return outcome("amount_mismatch", order.id);
  }
  if (order.status !== "awaiting_payment" || (await Payment.findOne({ where: { checkoutSessionId: session.id, kind: "payment" }, transaction }))) {
    // money for an order that is paid or cancelled: nothing changes here, the planner sorts it out
    await recordEvent({ actor: null, organizationId: order.organizationId, action: "payment.unexpected", subject: { type: "order", id: order.id }, data: { eventId: event.id, sessionId: session.id, status: order.status, ...received } }, transaction);
    return outcome("order_not_payable", order.id);
  }

  const now = props.now ?? new Date();
  const intentId = typeof object.payment_intent === "string" ? object.payment_intent : (object.payment_intent?.id ?? null);
  const payment = await Payment.create(
    { orderId: order.id, kind: "payment", status: "succeeded", amountCents: order.totalCents, currency: order.currency, providerReference: intentId, checkoutSessionId: session.id, reason: null, createdById: null, createdAt: now },
    { transaction },
  );
  session.status = "complete";
  await session.save({ transaction });
  order.status = "paid";
  order.paidAt = now;
  await order.save({ transaction });
  const invoice = await invoiceIssuer({ order, payment, transaction, now });
  await recordEvent(
    { actor: null, organizationId: order.organizationId, action: "order.paid", subject: { type: "order", id: order.id }, data: { eventId: event.id, paymentId: payment.id, amount_cents: payment.amountCents, currency: payment.currency, invoiceNumber: invoice.number }, at: now },
    transaction,
  );
  const buyer = order.createdById ? await User.findByPk(order.createdById, { transaction }) : null;
  const quote = await Quote.findByPk(order.quoteId, { transaction, attributes: ["id", "leadTimeWorkingDays"] });
  if (buyer) {
    await props.mailer.enqueue(
      paymentReceivedMail({
        to: buyer.email, name: buyer.name, orderNumber: documentNumber("order", order.number), link: `${props.appUrl}/orders/${order.id}`,
        amount_cents: payment.amountCents, currency: payment.currency, invoiceNumber: documentNumber("invoice", invoice.number), invoiceId: invoice.id,
        leadTime_workingDays: quote?.leadTimeWorkingDays ?? 0,
      }),
      transaction,
    );
  }
  return outcome("processed", order.id);
}
