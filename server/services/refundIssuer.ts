import type Stripe from "stripe";
import type { Transaction } from "sequelize";
import { documentNumber, formatMoney } from "../../shared/schemas/documents";
import { AppError, ConflictError } from "../errors";
import type { Mailer } from "../jobs/mailer";
import { Payment, User, paymentTotals, recordEvent, type Order } from "../models";
import { paymentService } from "../payments/stripe";
import { orderStatusAllows } from "../policies/order";
import type { Actor } from "../policies/utils";
import { refundIssuedMail } from "./mail-texts";

/** The same amount with the same reason this soon after a refund is the same click arriving twice. */
const REPEAT_WINDOW_MS = 60_000;

/**
 * The planner pays back all or part of what an order received, with a reason. The order's row is
 * locked by the caller; the refund is made at the payment service with an idempotency key (a
 * double click or a retry makes one refund) and recorded as its own payment row. A full refund
 * marks the order refunded.
 */
export async function refundIssuer(props: {
  actor: Actor;
  order: Order;
  input: { amount_cents?: number; reason: string };
  stripe: Stripe;
  mailer: Mailer;
  appUrl: string;
  ip: string | null;
  transaction: Transaction;
}): Promise<Payment> {
  const { actor, order, input, transaction } = props;
  if (!orderStatusAllows.refund(order) && order.status !== "refunded") throw ConflictError("NOT_REFUNDABLE", "Only a paid order can be refunded.");
  const rows = await Payment.findAll({ where: { orderId: order.id }, order: [["createdAt", "ASC"]], transaction });
  const { paid, refunded } = paymentTotals(rows);
  const refunds = rows.filter((p) => p.kind === "refund");
  // a double click: the second request waits for the first one's lock, then finds its refund here
  const last = refunds[refunds.length - 1];
  const repeat = last && last.reason === input.reason && Date.now() - last.createdAt.getTime() < REPEAT_WINDOW_MS;
  if (repeat && (input.amount_cents === undefined ? refunded === paid : last.amountCents === input.amount_cents)) return last;
  const refundable = paid - refunded;
  if (refundable <= 0) throw ConflictError("NOT_REFUNDABLE", "Everything this order received has been refunded.");
  const amount = input.amount_cents ?? refundable;
  if (amount > refundable) {
    throw new AppError(400, "VALIDATION_FAILED", "The refund is more than the order has left to refund.", { amount_cents: `at most ${refundable} (${formatMoney(refundable, order.currency)})` });
  }
  const payment = rows.find((p) => p.kind === "payment" && p.providerReference);
  if (!payment) throw ConflictError("NOT_REFUNDABLE", "This order's payment has no reference at the payment service to refund against.");
  const count = refunds.length;
  const refund = await paymentService(() =>
    props.stripe.refunds.create(
      { payment_intent: payment.providerReference!, amount, reason: "requested_by_customer", metadata: { orderId: order.id, reason: input.reason.slice(0, 450) } },
      { idempotencyKey: `refund-${order.id}-${count + 1}` },
    ),
  );
  const row = await Payment.create(
    { orderId: order.id, kind: "refund", status: "refunded", amountCents: amount, currency: order.currency, providerReference: refund.id, checkoutSessionId: null, reason: input.reason, createdById: actor.id },
    { transaction },
  );
  if (refunded + amount === paid) {
    order.status = "refunded";
    await order.save({ transaction });
  }
  await recordEvent(
    { actor, organizationId: order.organizationId, action: "payment.refunded", subject: { type: "order", id: order.id }, data: { paymentId: row.id, refundId: refund.id, amount_cents: amount, currency: order.currency, reason: input.reason, full: refunded + amount === paid }, ip: props.ip },
    transaction,
  );
  const buyer = order.createdById ? await User.findByPk(order.createdById, { transaction }) : null;
  if (buyer) {
    await props.mailer.enqueue(
      refundIssuedMail({ to: buyer.email, name: buyer.name, orderNumber: documentNumber("order", order.number), link: `${props.appUrl}/orders/${order.id}`, amount_cents: amount, currency: order.currency, reason: input.reason }),
      transaction,
    );
  }
  return row;
}
