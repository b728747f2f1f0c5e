/** Saved designs: a customer's named configurations, ready to compare and to quote. */
import { z } from "zod";
import type { PredictionResult } from "../physics/predict";
import { listQuerySchema, type PersonRef } from "./list";
import { quantitySchema, quoteConfigurationSchema, type QuoteConfiguration } from "./quote";

export const designNameSchema = z
  .string({ error: "Give the design a name." })
  .trim()
  .min(1, { error: "Give the design a name." })
  .max(120, { error: "Keep the name under 120 characters." });

export const designCreateSchema = z.object({ name: designNameSchema, configuration: quoteConfigurationSchema });
export type DesignCreateInput = z.input<typeof designCreateSchema>;

export const designUpdateSchema = z
  .object({ name: designNameSchema.optional(), configuration: quoteConfigurationSchema.optional() })
  .refine((v) => v.name !== undefined || v.configuration !== undefined, { error: "Send a new name or a new configuration.", path: ["name"] });
export type DesignUpdateInput = z.input<typeof designUpdateSchema>;

export const designDuplicateSchema = z.object({ name: designNameSchema.optional() });

export const designListQuerySchema = listQuerySchema(["updatedAt", "createdAt", "name"] as const, "updatedAt");
export type DesignListQuery = z.input<typeof designListQuerySchema>;

export const MAX_COMPARED_DESIGNS = 3;
export const designCompareSchema = z.object({
  ids: z
    .array(z.uuid({ error: "each id must be a saved design's id" }), { error: "ids must be a list of design ids" })
    .min(1, { error: "choose at least one design" })
    .max(MAX_COMPARED_DESIGNS, { error: `compare at most ${MAX_COMPARED_DESIGNS} designs` })
    .refine((ids) => new Set(ids).size === ids.length, { error: "choose each design once" }),
  quantity: quantitySchema.default(1),
});
export type DesignCompareInput = z.input<typeof designCompareSchema>;

/** One line to tell designs apart in a list: "cylinder, drawn, 2 layers, 50 × 120 mm". */
export function designSummary(c: Pick<QuoteConfiguration, "shape" | "method" | "layers" | "dimensions_mm">): string {
  const d = c.dimensions_mm as Record<string, number | undefined>;
  const size = c.shape === "box" ? `${d.width} × ${d.depth} × ${d.height} mm` : `⌀${d.diameter} × ${d.length} mm`;
  return `${c.shape}, ${c.method}, ${c.layers.length} layer${c.layers.length === 1 ? "" : "s"}, ${size}`;
}

export interface DesignJson {
  id: string;
  name: string;
  organizationId: string;
  configuration: QuoteConfiguration;
  summary: string;
  createdBy: PersonRef | null;
  createdAt: string;
  updatedAt: string;
  abilities: { update: boolean; delete: boolean; quote: boolean };
}

/** POST /api/designs/compare: each design's figures, side by side. */
export interface DesignComparisonJson {
  items: Array<{
    design: DesignJson;
    prediction: PredictionResult;
    mass_kg: number | null;
    unitPrice_cents: number;
    total_cents: number;
    currency: string;
    quantity: number;
  }>;
  priceListVersion: number;
}
