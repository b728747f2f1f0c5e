/**
 * Quotes: what a customer asks to be priced (POST /api/quotes) and the answers about quotes.
 * A quote's configuration is the prediction body plus the forming method, the blank fields and
 * the attenuation the customer needs; both engines' schemas check it, so a field wrong for either
 * is named, and a configuration that passes can be predicted, blanked and priced.
 */
import { z } from "zod";
import type { PredictionResult } from "../physics/predict";
import type { PersonRef } from "./list";
import { listQuerySchema } from "./list";
import { designConfigurationSchema, MAX_ESTIMATE_QUANTITY, type DesignConfiguration } from "./price-estimate";
import { predictionRequestSchema, type PredictionRequest } from "./prediction";

export const requiredAttenuationSchema = z
  .number({ error: "Enter the attenuation you need, in dB." })
  .min(0, { error: "The attenuation needed cannot be negative." })
  .max(300, { error: "The attenuation needed must be at most 300 dB." });

export const quantitySchema = z
  .number({ error: "quantity must be a whole number" })
  .int({ error: "quantity must be a whole number" })
  .min(1, { error: "quantity must be at least 1" })
  .max(MAX_ESTIMATE_QUANTITY, { error: `quantity must be at most ${MAX_ESTIMATE_QUANTITY}` });

/** the named fields of a loose object type, without its index signature */
type Known<T> = { [K in keyof T as string extends K ? never : K]: T[K] };
export type QuoteConfiguration = Known<DesignConfiguration> & PredictionRequest & { requiredAttenuation_db: number };

/**
 * Both engines' schemas over the same object, each keeping only the fields it knows (the
 * fabrication schema is loose on its own; here it strips), so a stored configuration holds nothing
 * a client sent along.
 */
export const quoteConfigurationSchema = z
  .intersection(designConfigurationSchema.strip(), predictionRequestSchema)
  .and(z.object({ requiredAttenuation_db: requiredAttenuationSchema }))
  .transform((v) => v as QuoteConfiguration);

export type QuoteConfigurationInput = z.input<typeof quoteConfigurationSchema>;

export const quoteCreateSchema = z.object({
  configuration: quoteConfigurationSchema,
  quantity: quantitySchema,
  /** the saved design this quote prices, when it came from one */
  designId: z.uuid({ error: "designId must be the id of a saved design" }).optional(),
});
export type QuoteCreateInput = z.input<typeof quoteCreateSchema>;

export const quoteStatuses = ["open", "expired", "ordered"] as const;
export type QuoteStatus = (typeof quoteStatuses)[number];
export const quoteStatusLabels: Record<QuoteStatus, string> = { open: "Open", expired: "Expired", ordered: "Ordered" };

export const quoteListQuerySchema = listQuerySchema(["createdAt", "number", "total", "expiresAt"] as const, "createdAt").extend({
  status: z.enum(quoteStatuses, { error: `status must be one of ${quoteStatuses.join(", ")}` }).optional(),
});
export type QuoteListQuery = z.input<typeof quoteListQuerySchema>;

/** A price line as the customer sees it: the selling amount, never the shop's rate or margin. */
export interface QuotePriceLine {
  key: string;
  label: string;
  quantity: number;
  total_cents: number;
}

/** The planner's view of the same build-up: the rates, the subtotal and the margin. */
export interface QuoteInternalPrice {
  lines: Array<QuotePriceLine & { unit_cents: number }>;
  subtotal_cents: number;
  marginPercent: number;
  margin_cents: number;
  priceListVersion: number;
}

export interface QuotePrice {
  lines: QuotePriceLine[];
  /** the lines' sum: selling prices before the quantity discount */
  linesTotal_cents: number;
  discountPercent: number;
  discount_cents: number;
  rounding_cents: number;
  unitPrice_cents: number;
  quantity: number;
  total_cents: number;
  currency: string;
  /** staff only */
  internal?: QuoteInternalPrice;
}

/** One blank of the assembly: which layer and part it makes, its flat shape and mass. */
export interface QuoteBlankPart {
  layer: number;
  role: string;
  method: string;
  materialId?: string;
  thickness_mm: number;
  quantityPerAssembly: number;
  blank: { kind: "disc"; diameter_mm: number } | { kind: "rectangle" | "cross"; length_mm: number; width_mm: number };
  area_mm2: number;
  mass_kg?: number;
}

/** The innermost layer's main blank (as POST /api/blanks names it) and every blank of the assembly. */
export type QuoteBlank = QuoteBlankPart["blank"] & { layer: number; role: string; area_mm2: number; mass_kg?: number; parts: QuoteBlankPart[] };

export interface QuoteJson {
  id: string;
  number: string;
  status: QuoteStatus;
  organization: { id: string; name: string };
  createdBy: PersonRef | null;
  designId: string | null;
  requotedFromId: string | null;
  orderId: string | null;
  configuration: QuoteConfiguration;
  quantity: number;
  unitPrice_cents: number;
  total_cents: number;
  currency: string;
  /** whatever the prediction engine answered, frozen when the quote was made */
  prediction: PredictionResult;
  blank: QuoteBlank;
  /** total mass of one assembly */
  mass_kg: number | null;
  price: QuotePrice;
  priceListVersion: number;
  leadTime_workingDays: number;
  validity_days: number;
  expiresAt: string;
  createdAt: string;
  abilities: { order: boolean; requote: boolean; download: boolean };
}

export interface QuoteSummaryJson {
  id: string;
  number: string;
  status: QuoteStatus;
  organization: { id: string; name: string };
  designId: string | null;
  orderId: string | null;
  summary: string;
  quantity: number;
  unitPrice_cents: number;
  total_cents: number;
  currency: string;
  attenuation_db: number;
  requiredAttenuation_db: number;
  expiresAt: string;
  createdAt: string;
}
