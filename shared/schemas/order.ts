/** Orders, their drawings, payments and refunds: request bodies and the answers about orders. */
import { z } from "zod";
import { listQuerySchema, type PersonRef } from "./list";

export const orderStatuses = ["awaiting_payment", "paid", "released", "shipped", "cancelled", "refunded"] as const;
export type OrderStatus = (typeof orderStatuses)[number];
export const orderStatusLabels: Record<OrderStatus, string> = {
  awaiting_payment: "Awaiting payment",
  paid: "Paid",
  released: "In production",
  shipped: "Shipped",
  cancelled: "Cancelled",
  refunded: "Refunded",
};

const purchaseOrder = z
  .string({ error: "The purchase order number must be text." })
  .trim()
  .max(60, { error: "Keep the purchase order number under 60 characters." });
const deliveryAddress = z
  .string({ error: "The delivery address must be text." })
  .trim()
  .max(1000, { error: "Keep the delivery address under 1000 characters." });
const notes = z.string({ error: "Notes must be text." }).trim().max(4000, { error: "Keep the notes under 4000 characters." });
/** A calendar day, YYYY-MM-DD; the server checks it is not in the past. */
const requestedDate = z.iso.date({ error: "Give the requested date as YYYY-MM-DD." });

const orderDetails = {
  purchaseOrder: purchaseOrder.optional(),
  deliveryAddress: deliveryAddress.optional(),
  requestedDate: requestedDate.optional(),
  notes: notes.optional(),
};

export const orderCreateSchema = z.object({
  quoteId: z.uuid({ error: "Choose the quote to order (its id)." }),
  ...orderDetails,
});
export type OrderCreateInput = z.input<typeof orderCreateSchema>;

export const orderUpdateSchema = z
  .object({
    purchaseOrder: purchaseOrder.nullable().optional(),
    deliveryAddress: deliveryAddress.nullable().optional(),
    requestedDate: requestedDate.nullable().optional(),
    notes: notes.nullable().optional(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), { error: "Send at least one field to change.", path: ["purchaseOrder"] });
export type OrderUpdateInput = z.input<typeof orderUpdateSchema>;

export const orderListQuerySchema = listQuerySchema(["createdAt", "number", "total", "status", "requestedDate"] as const, "createdAt").extend({
  status: z.enum(orderStatuses, { error: `status must be one of ${orderStatuses.join(", ")}` }).optional(),
});
export type OrderListQuery = z.input<typeof orderListQuerySchema>;

export const refundCreateSchema = z.object({
  /** omitted: everything not yet refunded */
  amount_cents: z
    .number({ error: "Give the amount to refund in cents." })
    .int({ error: "Give the amount to refund in whole cents." })
    .positive({ error: "The amount to refund must be more than 0." })
    .optional(),
  reason: z
    .string({ error: "Give the reason for the refund." })
    .trim()
    .min(3, { error: "Give the reason for the refund." })
    .max(500, { error: "Keep the reason under 500 characters." }),
});
export type RefundCreateInput = z.input<typeof refundCreateSchema>;

// --- drawings ---

export const MAX_DRAWING_BYTES = 20 * 1024 * 1024;
export const MAX_DRAWINGS_PER_ORDER = 10;
/** What a drawing may be, decided by its content; the name's extension must agree. */
export const drawingKinds = {
  pdf: { label: "PDF", mime: "application/pdf", extensions: ["pdf"] },
  dxf: { label: "DXF drawing", mime: "application/dxf", extensions: ["dxf"] },
  step: { label: "STEP model", mime: "model/step", extensions: ["step", "stp"] },
  png: { label: "PNG image", mime: "image/png", extensions: ["png"] },
  jpg: { label: "JPEG image", mime: "image/jpeg", extensions: ["jpg", "jpeg"] },
  tif: { label: "TIFF image", mime: "image/tiff", extensions: ["tif", "tiff"] },
  webp: { label: "WebP image", mime: "image/webp", extensions: ["webp"] },
} as const;
export type DrawingKind = keyof typeof drawingKinds;
export const DRAWING_ACCEPT = Object.values(drawingKinds).flatMap((k) => k.extensions.map((e) => `.${e}`)).join(",");

// --- answers ---

export interface PaymentJson {
  id: string;
  /** "payment": money received; "refund": money paid back (its own entry, status "refunded") */
  kind: "payment" | "refund";
  amount_cents: number;
  currency: string;
  status: "succeeded" | "refunded";
  reason: string | null;
  reference: string | null;
  createdAt: string;
}

export interface OrderFileJson {
  id: string;
  filename: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  uploadedAt: string;
  uploadedBy: PersonRef | null;
  url: string;
}

export interface TimelineEntry {
  at: string;
  action: string;
  label: string;
  actor: PersonRef | null;
  detail: string | null;
}

/** A payment event the planner must look at: money that did not match the order, or came late. */
export interface PaymentIssueJson {
  eventId: string;
  at: string;
  kind: "amount_mismatch" | "order_not_payable";
  expected: { amount_cents: number; currency: string };
  received: { amount_cents: number | null; currency: string | null };
}

export interface LotRef {
  id: string;
  number: string;
  /** finished pieces in the lot */
  pieces: number;
  materialId: string;
  jobs: Array<{ id: string; code: string }>;
}

// --- shipping ---

const shippingText = (what: string, max: number) =>
  z
    .string({ error: `Give the ${what}.` })
    .trim()
    .min(1, { error: `Give the ${what}.` })
    .max(max, { error: `Keep the ${what} under ${max} characters.` });

export const shipmentCreateSchema = z.object({
  carrier: shippingText("carrier", 100),
  trackingNumber: shippingText("tracking number", 100),
  /** the lots in the parcel (default: every packed lot not yet shipped) */
  lotIds: z.array(z.uuid({ error: "each entry must be a lot's id" }), { error: "lotIds must be a list of lot ids" }).min(1, { error: "Choose at least one lot." }).max(200).optional(),
});
export type ShipmentCreateInput = z.input<typeof shipmentCreateSchema>;

export interface ShipmentJson {
  id: string;
  carrier: string;
  trackingNumber: string;
  shippedAt: string;
  parts: Array<{ lotId: string; lotNumber: string; pieces: number }>;
  createdBy: PersonRef | null;
}

export interface OrderSummaryJson {
  id: string;
  number: string;
  status: OrderStatus;
  organization: { id: string; name: string };
  quote: { id: string; number: string };
  purchaseOrder: string | null;
  summary: string;
  quantity: number;
  total_cents: number;
  currency: string;
  requestedDate: string | null;
  createdAt: string;
  paidAt: string | null;
}

export interface OrderJson extends OrderSummaryJson {
  createdBy: PersonRef | null;
  deliveryAddress: string | null;
  notes: string | null;
  unitPrice_cents: number;
  requiredAttenuation_db: number;
  /** the AQL its lots are sampled at (ISO 2859-1 / Z1.4 column) */
  aql: number;
  leadTime_workingDays: number;
  paid_cents: number;
  refunded_cents: number;
  payments: PaymentJson[];
  lots: LotRef[];
  shipments: ShipmentJson[];
  files: OrderFileJson[];
  timeline: TimelineEntry[];
  invoice: { number: string; issuedAt: string; url: string } | null;
  /** staff only: payment events that need the planner */
  paymentIssues?: PaymentIssueJson[];
  abilities: { update: boolean; pay: boolean; cancel: boolean; upload: boolean; refund: boolean; release: boolean; ship: boolean };
}

export interface CheckoutJson {
  checkoutUrl: string;
  sessionId: string;
}

/** The order's timeline reads the event trail; these are the actions it shows, in people's words. */
export const orderEventLabels: Record<string, string> = {
  "order.placed": "Order placed",
  "order.updated": "Order details changed",
  "order.checkout-started": "Checkout opened",
  "payment.declined": "Card payment declined",
  "order.paid": "Payment received",
  "payment.refunded": "Refund issued",
  "drawing.uploaded": "Drawing attached",
  "drawing.removed": "Drawing removed",
  "order.cancelled": "Order cancelled",
  "order.released": "Released to production",
  "order.shipped": "Shipped",
  "order.part-shipped": "Part of the order shipped",
  "payment.mismatch": "Payment did not match the order",
  "payment.unexpected": "Payment for an order that was not awaiting one",
};
/** Shown to the shop's staff only: they need the planner, not the customer. */
export const staffOnlyOrderEvents = new Set(["payment.mismatch", "payment.unexpected"]);
