/**
 * Quotes: what a customer asks to be priced (POST /api/quotes) and the answers about quotes.
 * A quote's configuration is the prediction body plus the forming method, the blank fields and
 * the attenuation the customer needs; both engines' schemas check it, so a field wrong for either
 * is named, and a configuration that passes can be predicted, blanked and priced. A layer given by
 * its own μr and resistivity (as the prediction allows) is made in the closest library alloy,
 * named in its `pricedAs`.
 */
import { z } from "zod";
import { materialLibrary } from "../physics/materials";
import type { PredictionResult } from "../physics/predict";
import type { PersonRef } from "./list";
import { listQuerySchema } from "./list";
import { designConfigurationSchema, MAX_ESTIMATE_QUANTITY, type DesignConfiguration, type PriceView } from "./price-estimate";
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
type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/**
 * A layer as the prediction takes it (a library material, or its own μr and resistivity), plus,
 * for a layer given by its properties, the library alloy it is made and priced in.
 */
export type QuoteLayer = PredictionRequest["layers"][number] & { pricedAs?: string };
export type QuoteConfiguration = Omit<Known<DesignConfiguration>, "layers"> &
  DistributiveOmit<PredictionRequest, "layers"> & { layers: QuoteLayer[]; requiredAttenuation_db: number };

/**
 * The library alloy closest to a layer given by its own properties: for a magnetic layer the one
 * whose saturation (else initial μr) is nearest on a log scale, for a conductor the nearest
 * resistivity. The shop makes and prices the layer in it; the prediction keeps the given values.
 */
export function closestLibraryMaterial(l: { mu_r?: unknown; resistivity_ohm_m?: unknown; saturation_T?: unknown }): string {
  const num = (x: unknown) => (typeof x === "number" && Number.isFinite(x) && x > 0 ? x : undefined);
  const mu = num(l.mu_r) ?? 1;
  const magnetic = mu > 1.5;
  const candidates = materialLibrary.filter((m) => m.relativePermeability.maximum > 1.5 === magnetic);
  const gap = (a: number, b: number) => Math.abs(Math.log(a / b));
  const score = (m: (typeof materialLibrary)[number]) => {
    if (!magnetic) return gap(m.resistivity_ohm_m, num(l.resistivity_ohm_m) ?? m.resistivity_ohm_m);
    const sat = num(l.saturation_T);
    return sat && m.saturation_T ? gap(m.saturation_T, sat) : gap(m.relativePermeability.initial, mu);
  };
  return candidates.reduce((best, m) => (score(m) < score(best) ? m : best)).id;
}

const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === "object" && x !== null && !Array.isArray(x);
const explicit = (l: Record<string, unknown>) => l.material === undefined && (l.mu_r !== undefined || l.resistivity_ohm_m !== undefined);

/** The fabrication side sees every layer as a library material (its `pricedAs` for a layer given by its properties). */
function withMakingMaterial(value: unknown): unknown {
  if (!isRecord(value) || !Array.isArray(value.layers)) return value;
  return { ...value, layers: value.layers.map((l) => (isRecord(l) && explicit(l) ? { ...l, material: typeof l.pricedAs === "string" ? l.pricedAs : closestLibraryMaterial(l) } : l)) };
}

/** Back to the prediction's own layer: the making material of a property layer is its `pricedAs`. */
function separateMakingMaterial(v: Record<string, unknown>): QuoteConfiguration {
  const layers = (v.layers as Array<Record<string, unknown>>).map((l) => {
    if (l.mu_r === undefined && l.resistivity_ohm_m === undefined) return l;
    const { material, ...rest } = l;
    return { ...rest, pricedAs: material };
  });
  return { ...v, layers } as unknown as QuoteConfiguration;
}

/** The configuration as the fabrication engine reads it: every layer in a library material. */
export function forFabrication(c: QuoteConfiguration): DesignConfiguration {
  return { ...c, layers: c.layers.map((l) => ({ material: (l.material ?? l.pricedAs)!, thickness_mm: l.thickness_mm, gap_mm: l.gap_mm })) } as DesignConfiguration;
}

/**
 * Both engines' schemas over the same object, each keeping only the fields it knows (the
 * fabrication schema is loose on its own; here it strips), so a stored configuration holds nothing
 * a client sent along.
 */
export const quoteConfigurationSchema = z
  .intersection(z.preprocess(withMakingMaterial, designConfigurationSchema.strip()), predictionRequestSchema)
  .and(z.object({ requiredAttenuation_db: requiredAttenuationSchema }))
  .transform((v) => separateMakingMaterial(v as Record<string, unknown>));

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
  /** the frozen build-up as the viewer may see it (the one price view of estimates and quotes) */
  price: PriceView;
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
