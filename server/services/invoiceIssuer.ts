import type { Transaction } from "sequelize";
import { Invoice, type Order, type Payment } from "../models";

/** The invoice of a paid order, numbered from the invoice sequence in the payment's transaction. */
export async function invoiceIssuer(props: { order: Order; payment: Payment; transaction: Transaction; now?: Date }): Promise<Invoice> {
  const { order, payment, transaction } = props;
  return Invoice.create(
    { orderId: order.id, paymentId: payment.id, amountCents: payment.amountCents, currency: payment.currency, issuedAt: props.now ?? new Date() },
    { transaction },
  );
}
