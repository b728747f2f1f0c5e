import { designSummary } from "../../shared/schemas/design";
import { documentNumber, formatMoney } from "../../shared/schemas/documents";
import {
  orderEventLabels, staffOnlyOrderEvents,
  type LotRef, type OrderFileJson, type OrderJson, type OrderSummaryJson, type PaymentIssueJson, type PaymentJson, type ShipmentJson, type TimelineEntry,
} from "../../shared/schemas/order";
import { paymentTotals, type Event, type Invoice, type Lot, type Order, type OrderFile, type Payment, type Shipment, type User, type WebhookEvent } from "../models";
import { orderPolicy, orderStatusAllows } from "../policies/order";
import { abilities, isStaff, type Actor } from "../policies/utils";

export function presentOrderSummary(order: Order): OrderSummaryJson {
  return {
    id: order.id,
    number: documentNumber("order", order.number),
    status: order.status,
    organization: { id: order.organizationId, name: order.organization?.name ?? "" },
    quote: { id: order.quoteId, number: order.quote ? documentNumber("quote", order.quote.number) : "" },
    purchaseOrder: order.purchaseOrder,
    summary: order.quote ? designSummary(order.quote.configuration) : "",
    quantity: order.quantity,
    total_cents: order.totalCents,
    currency: order.currency,
    requestedDate: order.requestedDate,
    createdAt: order.createdAt.toISOString(),
    paidAt: order.paidAt ? order.paidAt.toISOString() : null,
  };
}

export function presentPayment(p: Payment): PaymentJson {
  return {
    id: p.id,
    kind: p.kind,
    amount_cents: p.amountCents,
    currency: p.currency,
    status: p.status,
    reason: p.reason,
    reference: p.providerReference,
    createdAt: p.createdAt.toISOString(),
  };
}

export function presentOrderFile(orderId: string, f: OrderFile, uploaders: Map<string, User>): OrderFileJson {
  const file = f.file!;
  const by = file.uploadedById ? uploaders.get(file.uploadedById) : undefined;
  return {
    id: file.id,
    filename: file.filename,
    contentType: file.contentType,
    sizeBytes: file.sizeBytes,
    sha256: file.sha256,
    uploadedAt: file.createdAt.toISOString(),
    uploadedBy: by ? { id: by.id, name: by.name } : null,
    url: `/api/orders/${orderId}/files/${file.id}`,
  };
}

function timelineDetail(e: Event): string | null {
  const d = e.data as Record<string, unknown>;
  const money = (cents: unknown, currency: unknown) => (typeof cents === "number" && typeof currency === "string" ? formatMoney(cents, currency) : null);
  switch (e.action) {
    case "order.paid":
      return money(d.amount_cents, d.currency);
    case "payment.refunded":
      return [money(d.amount_cents, d.currency), typeof d.reason === "string" ? d.reason : null].filter(Boolean).join(": ") || null;
    case "drawing.uploaded":
    case "drawing.removed":
      return typeof d.filename === "string" ? d.filename : null;
    case "payment.declined":
      return typeof d.message === "string" ? d.message : null;
    case "payment.mismatch":
      return `expected ${money(d.expected_cents, d.expectedCurrency) ?? "?"}, received ${money(d.received_cents, d.receivedCurrency) ?? `${String(d.received_cents)} ${String(d.receivedCurrency)}`}`;
    case "order.updated":
      return Array.isArray(d.fields) ? `changed: ${d.fields.join(", ")}` : null;
    case "order.released":
      return Array.isArray(d.lots) && d.lots.length ? `lot${d.lots.length === 1 ? "" : "s"} ${d.lots.join(", ")}` : null;
    case "order.shipped":
    case "order.part-shipped":
      return typeof d.carrier === "string" ? `${d.carrier}, tracking ${String(d.trackingNumber)}${Array.isArray(d.lots) ? ` (lot${d.lots.length === 1 ? "" : "s"} ${d.lots.join(", ")})` : ""}` : null;
    default:
      return null;
  }
}

export interface OrderDetailParts {
  payments: Payment[];
  files: OrderFile[];
  events: Event[];
  people: Map<string, User>;
  invoice: Invoice | null;
  /** webhook events that need the planner (staff only) */
  issues: WebhookEvent[];
  /** the lots of a released order, each with its jobs' ids and codes */
  lots: Array<{ lot: Lot; jobs: Array<{ id: string; code: string }> }>;
  shipments: Shipment[];
}

export function presentLotRef(l: { lot: Lot; jobs: Array<{ id: string; code: string }> }): LotRef {
  return { id: l.lot.id, number: l.lot.number, pieces: l.lot.pieces, materialId: l.lot.materialId, jobs: l.jobs };
}

export function presentShipment(s: Shipment, people: Map<string, User>): ShipmentJson {
  const by = s.createdById ? people.get(s.createdById) : undefined;
  return { id: s.id, carrier: s.carrier, trackingNumber: s.trackingNumber, shippedAt: s.shippedAt.toISOString(), parts: s.parts, createdBy: by ? { id: by.id, name: by.name } : null };
}

function presentIssue(w: WebhookEvent, order: Order): PaymentIssueJson {
  const object = ((w.payload.data as { object?: Record<string, unknown> } | undefined)?.object ?? {}) as Record<string, unknown>;
  return {
    eventId: w.id,
    at: w.receivedAt.toISOString(),
    kind: w.outcome === "amount_mismatch" ? "amount_mismatch" : "order_not_payable",
    expected: { amount_cents: order.totalCents, currency: order.currency },
    received: {
      amount_cents: typeof object.amount_total === "number" ? object.amount_total : null,
      currency: typeof object.currency === "string" ? object.currency.toUpperCase() : null,
    },
  };
}

export function presentOrder(order: Order, parts: OrderDetailParts, actor: Actor): OrderJson {
  const staff = isStaff(actor);
  const { paid, refunded } = paymentTotals(parts.payments);
  const can = abilities(actor, orderPolicy, order);
  const person = (id: string | null) => {
    const u = id ? parts.people.get(id) : undefined;
    return u ? { id: u.id, name: u.name } : null;
  };
  const timeline: TimelineEntry[] = parts.events
    .filter((e) => e.action in orderEventLabels && (staff || !staffOnlyOrderEvents.has(e.action)))
    .map((e) => ({ at: e.createdAt.toISOString(), action: e.action, label: orderEventLabels[e.action], actor: person(e.actorId), detail: timelineDetail(e) }));
  const quote = order.quote!;
  const json: OrderJson = {
    ...presentOrderSummary(order),
    createdBy: person(order.createdById),
    deliveryAddress: order.deliveryAddress,
    notes: order.notes,
    unitPrice_cents: order.unitPriceCents,
    requiredAttenuation_db: order.requiredAttenuationDb,
    aql: order.aql,
    leadTime_workingDays: quote.leadTimeWorkingDays,
    paid_cents: paid,
    refunded_cents: refunded,
    payments: parts.payments.map(presentPayment),
    lots: parts.lots.map(presentLotRef),
    shipments: parts.shipments.map((sh) => presentShipment(sh, parts.people)),
    files: parts.files.map((f) => presentOrderFile(order.id, f, parts.people)),
    timeline,
    invoice: parts.invoice
      ? { number: documentNumber("invoice", parts.invoice.number), issuedAt: parts.invoice.issuedAt.toISOString(), url: `/api/orders/${order.id}/invoice.pdf` }
      : null,
    abilities: {
      update: can.update && orderStatusAllows.update(order),
      pay: can.pay && orderStatusAllows.pay(order),
      cancel: can.cancel && orderStatusAllows.cancel(order),
      upload: can.upload && orderStatusAllows.upload(order),
      refund: can.refund && orderStatusAllows.refund(order) && paid - refunded > 0,
      release: can.release && orderStatusAllows.release(order),
      ship: can.ship && orderStatusAllows.ship(order),
    },
  };
  if (staff) json.paymentIssues = parts.issues.map((w) => presentIssue(w, order));
  return json;
}
