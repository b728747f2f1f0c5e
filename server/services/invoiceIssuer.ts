import type { Transaction } from "sequelize";
import { Invoice, nextNumber, type Order, type Payment } from "../models";

/** The invoice of a paid order, numbered from the invoice sequence in the payment's transaction. */
export async function invoiceIssuer(props: { order: Order; payment: Payment; transaction: Transaction; now?: Date }): Promise<Invoice> {
  const { order, payment, transaction } = props;
  const number = await nextNumber("invoice_number_seq", transaction);
  return Invoice.create(
    { number, orderId: order.id, paymentId: payment.id, amountCents: payment.amountCents, currency: payment.currency, issuedAt: props.now ?? new Date() },
    { transaction },
  );
}
