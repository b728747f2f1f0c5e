import { QueryTypes, type Transaction } from "sequelize";
import { Event } from "./Event";

export type DocumentSequence = "quote_number_seq" | "order_number_seq" | "invoice_number_seq" | "lot_number_seq" | "certificate_number_seq" | "job_number_seq";

/** The next number of a document sequence (gap-tolerant, never reused), inside the caller's transaction. */
export async function nextNumber(sequence: DocumentSequence, transaction: Transaction): Promise<number> {
  const [row] = await Event.sequelize!.query<{ n: string }>(`select nextval('${sequence}') as n`, { type: QueryTypes.SELECT, transaction });
  return Number(row.n);
}
