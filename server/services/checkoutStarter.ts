import type Stripe from "stripe";
import type { Transaction } from "sequelize";
import { documentNumber } from "../../shared/schemas/documents";
import { ConflictError } from "../errors";
import { CheckoutSession, recordEvent, type Order, type Quote } from "../models";
import { paymentService } from "../payments/stripe";
import { orderStatusAllows } from "../policies/order";
import type { Actor } from "../policies/utils";
import { designSummary } from "../../shared/schemas/design";

/**
 * Opens (or reopens) the hosted checkout for an order awaiting payment. The caller holds the
 * order's row lock, so a double click waits for the first click and then gets the same session;
 * the SDK call carries an idempotency key, so a retry after a lost answer makes no second session.
 * A session that was abandoned stays payable and is reused; an expired one is replaced.
 */
export async function checkoutStarter(props: {
  actor: Actor & { email: string };
  order: Order;
  quote: Quote;
  stripe: Stripe;
  appUrl: string;
  ip: string | null;
  transaction: Transaction;
}): Promise<CheckoutSession> {
  const { actor, order, stripe, transaction } = props;
  if (!orderStatusAllows.pay(order)) {
    throw ConflictError("ORDER_NOT_PAYABLE", order.status === "cancelled" ? "This order was cancelled." : "This order is already paid.");
  }
  const sessions = await CheckoutSession.findAll({ where: { orderId: order.id }, order: [["createdAt", "DESC"]], transaction });
  for (const existing of sessions.filter((s) => s.status === "open")) {
    const remote = await paymentService(() => stripe.checkout.sessions.retrieve(existing.id));
    if (remote.status === "open" && remote.amount_total === order.totalCents && remote.currency?.toUpperCase() === order.currency) return existing;
    if (remote.status === "complete") {
      throw ConflictError("PAYMENT_IN_PROGRESS", "The payment for this order has gone through and is being confirmed; reload the order in a moment.");
    }
    existing.status = "expired";
    await existing.save({ transaction });
  }

  const number = documentNumber("order", order.number);
  const idempotencyKey = `checkout-${order.id}-${sessions.length + 1}`;
  const orderUrl = `${props.appUrl}/orders/${order.id}`;
  const session = await paymentService(() =>
    stripe.checkout.sessions.create(
      {
        mode: "payment",
        client_reference_id: order.id,
        customer_email: actor.email,
        line_items: [
          {
            quantity: order.quantity,
            price_data: {
              currency: order.currency.toLowerCase(),
              unit_amount: order.unitPriceCents,
              product_data: { name: `Order ${number}: magnetic shield`, description: designSummary(props.quote.configuration) },
            },
          },
        ],
        metadata: { orderId: order.id, orderNumber: number },
        payment_intent_data: { metadata: { orderId: order.id, orderNumber: number } },
        // the return only brings the customer back; the signed event marks the payment
        success_url: `${orderUrl}?checkout=returned`,
        cancel_url: `${orderUrl}?checkout=cancelled`,
      },
      { idempotencyKey },
    ),
  );
  const row = await CheckoutSession.create(
    { id: session.id, orderId: order.id, amountCents: session.amount_total ?? order.totalCents, currency: (session.currency ?? order.currency).toUpperCase(), url: session.url ?? "", status: "open", idempotencyKey, createdById: actor.id },
    { transaction },
  );
  await recordEvent(
    { actor, organizationId: order.organizationId, action: "order.checkout-started", subject: { type: "order", id: order.id }, data: { sessionId: session.id }, ip: props.ip },
    transaction,
  );
  return row;
}
