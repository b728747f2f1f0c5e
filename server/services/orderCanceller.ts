import type Stripe from "stripe";
import type { Transaction } from "sequelize";
import { ConflictError } from "../errors";
import { CheckoutSession, recordEvent, type Order } from "../models";
import { paymentService } from "../payments/stripe";
import { orderStatusAllows } from "../policies/order";
import type { Actor } from "../policies/utils";

/**
 * Cancels an order that awaits payment: its open checkout sessions are expired at the payment
 * service first, so nobody can pay for a cancelled order.
 */
export async function orderCanceller(props: { actor: Actor; order: Order; stripe: Stripe; ip: string | null; transaction: Transaction }): Promise<Order> {
  const { actor, order, transaction } = props;
  if (!orderStatusAllows.cancel(order)) throw ConflictError("ORDER_NOT_CANCELLABLE", "Only an order awaiting payment can be cancelled here; ask the shop about a paid one.");
  const open = await CheckoutSession.findAll({ where: { orderId: order.id, status: "open" }, transaction });
  for (const session of open) {
    const remote = await paymentService(() => props.stripe.checkout.sessions.retrieve(session.id));
    if (remote.status === "complete") throw ConflictError("PAYMENT_IN_PROGRESS", "A payment for this order has just gone through; it cannot be cancelled here.");
    if (remote.status === "open") await paymentService(() => props.stripe.checkout.sessions.expire(session.id));
    session.status = "expired";
    await session.save({ transaction });
  }
  order.status = "cancelled";
  await order.save({ transaction });
  await recordEvent({ actor, organizationId: order.organizationId, action: "order.cancelled", subject: { type: "order", id: order.id }, data: {}, ip: props.ip }, transaction);
  return order;
}
