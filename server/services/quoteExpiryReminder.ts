import { Op, type Transaction } from "sequelize";
import { documentNumber } from "../../shared/schemas/documents";
import type { Mailer } from "../jobs/mailer";
import { Order, Quote, User } from "../models";
import { quoteExpiringMail } from "./mail-texts";

export const REMINDER_DAYS = 3;

/**
 * Quotes that expire within three days and were not ordered get one reminder each: the stamp and
 * the queued mail go in the same transaction, so a quote is reminded once however often this runs.
 */
export async function quoteExpiryReminder(props: { mailer: Mailer; appUrl: string; transaction: Transaction; now?: Date; limit?: number }): Promise<number> {
  const { transaction } = props;
  const now = props.now ?? new Date();
  const soon = new Date(now.getTime() + REMINDER_DAYS * 86_400_000);
  const quotes = await Quote.findAll({
    where: { expiresAt: { [Op.gt]: now, [Op.lte]: soon }, expiryReminderSentAt: null },
    attributes: ["id", "number", "organizationId", "createdById", "expiresAt", "totalCents", "currency", "expiryReminderSentAt"],
    order: [["expiresAt", "ASC"]],
    limit: props.limit ?? 500,
    lock: transaction.LOCK.UPDATE,
    skipLocked: true,
    transaction,
  });
  if (!quotes.length) return 0;
  const ordered = new Set((await Order.findAll({ where: { quoteId: quotes.map((q) => q.id) }, attributes: ["quoteId"], transaction })).map((o) => o.quoteId));
  let sent = 0;
  for (const quote of quotes) {
    quote.expiryReminderSentAt = now;
    await quote.save({ transaction, fields: ["expiryReminderSentAt"] });
    if (ordered.has(quote.id) || !quote.createdById) continue;
    const buyer = await User.findByPk(quote.createdById, { transaction });
    if (!buyer || buyer.disabledAt) continue;
    await props.mailer.enqueue(
      quoteExpiringMail({ to: buyer.email, name: buyer.name, quoteNumber: documentNumber("quote", quote.number), expiresAt: quote.expiresAt, total_cents: quote.totalCents, currency: quote.currency, link: `${props.appUrl}/quotes/${quote.id}` }),
      transaction,
    );
    sent++;
  }
  return sent;
}
