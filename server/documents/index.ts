import { documentNumber } from "../../shared/schemas/documents";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import type { MailAttachmentRef, RenderedAttachment } from "../jobs/mailer";
import { Invoice, Order, Organization, Payment, Quote, ShopSettings, User } from "../models";
import { materialCatalog } from "../services/materialCatalog";
import { renderInvoicePdf } from "./invoice-pdf";
import { renderQuotePdf } from "./quote-pdf";

// Loads what a document shows and renders it: the routes and the mail worker ask here.

const shopDetails = (s: ShopSettings) => ({ name: s.name, address: s.address, email: s.email, phone: s.phone, taxId: s.taxId, quoteTerms: s.quoteTerms });

export async function quoteDocument(quote: Quote): Promise<{ filename: string; content: Buffer }> {
  const [org, shop, by, catalog] = await Promise.all([
    Organization.findByPk(quote.organizationId),
    ShopSettings.current(),
    quote.createdById ? User.findByPk(quote.createdById) : null,
    materialCatalog(),
  ]);
  const content = await renderQuotePdf({
    number: quote.number,
    createdAt: quote.createdAt,
    expiresAt: quote.expiresAt,
    quantity: quote.quantity,
    configuration: quote.configuration,
    prediction: quote.prediction,
    price: quote.price,
    leadTimeWorkingDays: quote.leadTimeWorkingDays,
    validityDays: quote.validityDays,
    massKg: quote.massKg,
    organizationName: org?.name ?? "",
    preparedFor: by?.role === "customer" ? by.name : null,
    paperSize: (org?.paperSize ?? "A4") as PaperSize,
    shop: shopDetails(shop),
    materialNames: new Map(catalog.list.map((m) => [m.id, m.name])),
  });
  return { filename: `quote-${documentNumber("quote", quote.number)}.pdf`, content };
}

export async function invoiceDocument(invoice: Invoice): Promise<{ filename: string; content: Buffer }> {
  const order = await Order.findByPk(invoice.orderId, { include: [{ model: Quote, as: "quote" }, { model: Organization, as: "organization" }] });
  if (!order?.quote) throw new Error(`invoice ${invoice.id} has no order`);
  const [shop, payments] = await Promise.all([ShopSettings.current(), Payment.findAll({ where: { orderId: order.id }, order: [["createdAt", "ASC"]] })]);
  const content = await renderInvoicePdf({
    invoiceNumber: invoice.number,
    issuedAt: invoice.issuedAt,
    orderNumber: order.number,
    quoteNumber: order.quote.number,
    purchaseOrder: order.purchaseOrder,
    organizationName: order.organization?.name ?? "",
    deliveryAddress: order.deliveryAddress,
    quantity: order.quantity,
    unitPriceCents: order.unitPriceCents,
    totalCents: order.totalCents,
    currency: order.currency,
    configuration: order.quote.configuration,
    payments: payments.map((p) => ({ kind: p.kind, amountCents: p.amountCents, createdAt: p.createdAt, reference: p.providerReference, reason: p.reason })),
    paperSize: (order.organization?.paperSize ?? "A4") as PaperSize,
    shop: shopDetails(shop),
  });
  return { filename: `invoice-${documentNumber("invoice", invoice.number)}.pdf`, content };
}

/** The mail worker's attachments: rendered when the mail goes out. */
export async function renderMailAttachment(ref: MailAttachmentRef): Promise<RenderedAttachment> {
  if (ref.document === "invoice") {
    const invoice = await Invoice.findByPk(ref.id);
    if (!invoice) throw new Error(`no invoice ${ref.id}`);
    const { filename, content } = await invoiceDocument(invoice);
    return { filename, content, contentType: "application/pdf" };
  }
  throw new Error(`unknown document ${String(ref.document)}`);
}
