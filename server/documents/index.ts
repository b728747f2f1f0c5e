import type { Sequelize } from "sequelize";
import { documentNumber } from "../../shared/schemas/documents";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import type { MailAttachmentRef, RenderedAttachment } from "../jobs/mailer";
import { Certificate, Invoice, Job, Order, Organization, Payment, Quote, ShopSettings, User } from "../models";
import { partDescription } from "../presenters/jobs";
import { loadJobView } from "../services/jobViews";
import { loadLotView, lotHeats, lotJobs } from "../services/lotViews";
import { renderLotLabels } from "./lot-label-pdf";
import { renderTravelers, type TravelerData } from "./traveler-pdf";
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

/** The travelers of these jobs, in the order given. */
export async function travelerDocument(sequelize: Sequelize, jobIds: string[], paperSize: PaperSize): Promise<{ filename: string; content: Buffer }> {
  const [views, patterns, shop, catalog] = await Promise.all([
    Promise.all(jobIds.map((id) => loadJobView(sequelize, { id }))),
    Job.findAll({ where: { id: jobIds }, attributes: ["id", "flatPattern"] }),
    ShopSettings.current(),
    materialCatalog(),
  ]);
  const jobs: TravelerData[] = views.map((v) => {
    if (!v) throw new Error("a job of the traveler is missing");
    return {
      code: v.code,
      orderNumber: documentNumber("order", v.order_number),
      customer: v.organization_name,
      lotNumber: v.lot_number,
      description: partDescription(v),
      materialName: catalog.byId.get(v.material_id)?.name ?? v.material_id,
      thickness_mm: v.thickness_mm,
      quantity: v.quantity,
      blank: v.blank,
      flatPattern: patterns.find((p) => p.id === v.id)!.flatPattern,
      weldLength_mm: v.weld_length_mm,
      dueDate: v.due_date,
      heatNumber: v.heat_number,
      weldedTo: v.assembly_code,
      components: v.components.map((c) => c.code),
      routing: v.routing,
    };
  });
  const content = await renderTravelers({ jobs, paperSize, shop: shopDetails(shop), printedAt: new Date() });
  return { filename: jobs.length === 1 ? `traveler-${jobs[0].code}.pdf` : `travelers-${jobs[0]?.code}.pdf`, content };
}

/** A sheet of labels for one lot. */
export async function lotLabelDocument(sequelize: Sequelize, lotId: string, paperSize: PaperSize): Promise<{ filename: string; content: Buffer }> {
  const [lot, jobs, heats, shop, catalog] = await Promise.all([loadLotView(sequelize, lotId), lotJobs(sequelize, lotId), lotHeats(sequelize, lotId), ShopSettings.current(), materialCatalog()]);
  if (!lot) throw new Error(`no lot ${lotId}`);
  const content = await renderLotLabels({
    lot: {
      number: lot.number,
      orderNumber: documentNumber("order", lot.order_number),
      customer: lot.organization_name,
      materialName: catalog.byId.get(lot.material_id)?.name ?? lot.material_id,
      pieces: lot.pieces,
      mass_kg: lot.mass_kg,
      dueDate: lot.due_date,
      heats: heats.map((h) => h.heat_number),
      furnaceRun: lot.furnace_run_number,
      jobs: jobs.map((j) => j.code),
    },
    paperSize,
    shop: shopDetails(shop),
    printedAt: new Date(),
  });
  return { filename: `lot-label-${lot.number}.pdf`, content };
}

/** The mail worker's attachments: rendered when the mail goes out. */
export async function renderMailAttachment(ref: MailAttachmentRef): Promise<RenderedAttachment> {
  if (ref.document === "invoice") {
    const invoice = await Invoice.findByPk(ref.id);
    if (!invoice) throw new Error(`no invoice ${ref.id}`);
    const { filename, content } = await invoiceDocument(invoice);
    return { filename, content, contentType: "application/pdf" };
  }
  if (ref.document === "certificate") {
    const certificate = await Certificate.findByPk(ref.id);
    if (!certificate) throw new Error(`no certificate ${ref.id}`);
    return { ...certificateFile(certificate), contentType: "application/pdf" };
  }
  throw new Error(`unknown document ${String(ref.document)}`);
}

/** An issued certificate's file: the bytes rendered at issue, never again. */
export function certificateFile(certificate: Pick<Certificate, "number" | "revision" | "pdf">): { filename: string; content: Buffer } {
  return { filename: `certificate-${certificate.number}-rev${certificate.revision}.pdf`, content: certificate.pdf };
}
