import { designSummary } from "../../shared/schemas/design";
import { documentNumber, formatMoney } from "../../shared/schemas/documents";
import type { QuoteConfiguration } from "../../shared/schemas/quote";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import { INK, MUTED, createDocument, fmtDate, footers, header, heading, paragraph, table, toBuffer, type ShopDetails } from "./pdf";

export interface InvoiceDocumentData {
  invoiceNumber: number;
  issuedAt: Date;
  orderNumber: number;
  quoteNumber: number;
  purchaseOrder: string | null;
  organizationName: string;
  deliveryAddress: string | null;
  quantity: number;
  unitPriceCents: number;
  totalCents: number;
  currency: string;
  configuration: QuoteConfiguration;
  payments: Array<{ kind: "payment" | "refund"; amountCents: number; createdAt: Date; reference: string | null; reason: string | null }>;
  paperSize: PaperSize;
  shop: ShopDetails;
}

/** Invoice and receipt in one: what was sold, what was paid and when, and any refunds since. */
export async function renderInvoicePdf(d: InvoiceDocumentData): Promise<Buffer> {
  const number = documentNumber("invoice", d.invoiceNumber);
  const money = (c: number) => formatMoney(c, d.currency);
  const doc = createDocument({ paperSize: d.paperSize, title: `Invoice ${number}`, author: d.shop.name, subject: `Invoice ${number} for order ${documentNumber("order", d.orderNumber)}` });
  header(doc, d.shop, `Invoice ${number}`, [
    ["Invoice date", fmtDate(d.issuedAt)],
    ["Order", documentNumber("order", d.orderNumber)],
    ["Quote", documentNumber("quote", d.quoteNumber)],
    ...(d.purchaseOrder ? ([["Your purchase order", d.purchaseOrder]] as Array<[string, string]>) : []),
    ["Customer", d.organizationName],
  ]);
  if (d.deliveryAddress) {
    heading(doc, "Deliver to");
    paragraph(doc, d.deliveryAddress);
  }
  heading(doc, "Invoice");
  table(
    doc,
    [
      { header: "Description", width: 0.55 },
      { header: "Quantity", width: 0.13, align: "right" },
      { header: "Unit price", width: 0.16, align: "right" },
      { header: "Amount", width: 0.16, align: "right" },
    ],
    [
      [`Magnetic shield as quoted in ${documentNumber("quote", d.quoteNumber)}: ${designSummary(d.configuration)}, hydrogen-annealed, attenuation verified by sampling`, String(d.quantity), money(d.unitPriceCents), money(d.totalCents)],
      [`Total (${d.currency})`, "", "", money(d.totalCents)],
    ],
    { boldLast: true },
  );

  heading(doc, "Receipt");
  const paid = d.payments.filter((p) => p.kind === "payment").reduce((s, p) => s + p.amountCents, 0);
  const refunded = d.payments.filter((p) => p.kind === "refund").reduce((s, p) => s + p.amountCents, 0);
  table(
    doc,
    [
      { header: "Date", width: 0.2 },
      { header: "Entry", width: 0.5 },
      { header: "Amount", width: 0.3, align: "right" },
    ],
    [
      ...d.payments.map((p) => [
        fmtDate(p.createdAt),
        p.kind === "payment" ? `Card payment received${p.reference ? ` (${p.reference})` : ""}` : `Refund${p.reason ? `: ${p.reason}` : ""}${p.reference ? ` (${p.reference})` : ""}`,
        p.kind === "payment" ? money(p.amountCents) : `-${money(p.amountCents)}`,
      ]),
      ["", "Balance received", money(paid - refunded)],
    ],
    { boldLast: true },
  );
  doc.moveDown(0.4);
  paragraph(doc, paid >= d.totalCents ? (refunded ? `Paid in full; ${money(refunded)} refunded since.` : "Paid in full. Thank you.") : `Outstanding: ${money(d.totalCents - paid)}.`, { color: INK, font: "bold" });
  paragraph(doc, "Prices are in the currency shown. Keep this document with your purchase records.", { color: MUTED, size: 8.5 });
  footers(doc, `Invoice ${number} · ${d.shop.name}`);
  return toBuffer(doc);
}
