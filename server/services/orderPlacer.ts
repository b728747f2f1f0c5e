import type { Transaction } from "sequelize";
import { documentNumber } from "../../shared/schemas/documents";
import type { OrderCreateInput } from "../../shared/schemas/order";
import { AppError, ConflictError } from "../errors";
import type { Mailer } from "../jobs/mailer";
import { Order, ShopSettings, recordEvent, type Quote } from "../models";
import type { Actor } from "../policies/utils";
import { orderReceivedMail } from "./mail-texts";

/** Today as YYYY-MM-DD (UTC), for comparing requested dates. */
export const isoDay = (d: Date) => d.toISOString().slice(0, 10);

export function checkRequestedDate(date: string | null | undefined, now: Date): void {
  if (date && date < isoDay(now)) {
    throw new AppError(400, "VALIDATION_FAILED", "The requested date is in the past.", { requestedDate: "must be today or later" });
  }
}

/**
 * Places an order from an unexpired quote (locked by the caller): money, quantity and the required
 * attenuation are the quote's; the number comes from the order sequence; the "order received"
 * mail is queued in the same transaction.
 */
export async function orderPlacer(props: {
  actor: Actor & { email: string; name: string };
  quote: Quote;
  input: Omit<OrderCreateInput, "quoteId">;
  mailer: Mailer;
  appUrl: string;
  ip: string | null;
  transaction: Transaction;
  now?: Date;
}): Promise<Order> {
  const { actor, quote, input, transaction } = props;
  const now = props.now ?? new Date();
  if (quote.isExpired(now)) {
    throw new AppError(400, "QUOTE_EXPIRED", `Quote ${documentNumber("quote", quote.number)} expired on ${quote.expiresAt.toISOString().slice(0, 10)}; ask for a new quote at today's rates.`, {
      quoteId: "this quote has expired",
    });
  }
  if (await Order.findOne({ where: { quoteId: quote.id }, transaction })) {
    throw ConflictError("QUOTE_ALREADY_ORDERED", `Quote ${documentNumber("quote", quote.number)} has already been ordered.`);
  }
  checkRequestedDate(input.requestedDate, now);
  const { defaultAql } = await ShopSettings.current(transaction);
  const order = await Order.create(
    {
      organizationId: quote.organizationId,
      createdById: actor.id,
      quoteId: quote.id,
      status: "awaiting_payment",
      purchaseOrder: input.purchaseOrder || null,
      deliveryAddress: input.deliveryAddress || null,
      requestedDate: input.requestedDate ?? null,
      notes: input.notes || null,
      quantity: quote.quantity,
      unitPriceCents: quote.unitPriceCents,
      totalCents: quote.totalCents,
      currency: quote.currency,
      requiredAttenuationDb: quote.configuration.requiredAttenuation_db,
      aql: defaultAql,
      createdAt: now,
      updatedAt: now,
    },
    { transaction },
  );
  await recordEvent(
    {
      actor,
      organizationId: order.organizationId,
      action: "order.placed",
      subject: { type: "order", id: order.id },
      data: { number: order.number, quoteId: quote.id, quoteNumber: quote.number, total_cents: order.totalCents, currency: order.currency },
      ip: props.ip,
      at: now,
    },
    transaction,
  );
  await props.mailer.enqueue(
    orderReceivedMail({
      to: actor.email, name: actor.name, orderNumber: documentNumber("order", order.number), quoteNumber: documentNumber("quote", quote.number),
      total_cents: order.totalCents, currency: order.currency, purchaseOrder: order.purchaseOrder, link: `${props.appUrl}/orders/${order.id}`,
    }),
    transaction,
  );
  return order;
}
