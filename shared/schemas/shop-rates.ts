/**
 * Bodies of the planner's shop-rate edits. The three parts of one versioned price list
 * (rates, stock sheets, forming limits) are edited separately, each validated by the pieces of
 * priceListSchema; the server merges the part into the current list and validates the whole.
 */
import { z } from "zod";
import type { ConstructionSettings } from "../physics/build-model";
import {
  constructionSettingsSchema, designSearchSettingsSchema, formingLimitsSchema, priceListSchema, stockSheetSchema,
  type DesignSearchSettings, type FormingLimits, type PriceList, type StockSheet,
} from "./pricing";

type Ctx = z.RefinementCtx;
function unique<T>(items: readonly T[], key: (item: T) => string, path: (i: number) => (string | number)[], message: string, ctx: Ctx) {
  const seen = new Set<string>();
  items.forEach((item, i) => {
    const k = key(item);
    if (seen.has(k)) ctx.addIssue({ code: "custom", path: path(i), message });
    seen.add(k);
  });
}

/** Everything of the price list except the stock sheets, forming limits, construction and design-search settings. */
export const priceRatesSchema = priceListSchema
  .omit({ stockSheets: true, formingLimits: true, construction: true, designSearch: true })
  .superRefine((v, ctx) => {
    unique(v.materials, (m) => m.materialId, (i) => ["materials", i, "materialId"], "this material is priced twice", ctx);
    unique(v.quantityBreaks, (b) => String(b.minQuantity), (i) => ["quantityBreaks", i, "minQuantity"], "two breaks start at the same quantity", ctx);
  });

export const stockSheetsUpdateSchema = z
  .object({ stockSheets: z.array(stockSheetSchema).max(500) })
  .superRefine((v, ctx) =>
    unique(v.stockSheets, (s) => `${s.materialId}@${s.thickness_mm}:${s.width_mm}x${s.length_mm}`, (i) => ["stockSheets", i, "length_mm"], "this sheet size is listed twice", ctx),
  );

export const formingLimitsUpdateSchema = z
  .object({ formingLimits: z.array(formingLimitsSchema).max(100) })
  .superRefine((v, ctx) => unique(v.formingLimits, (f) => f.materialId, (i) => ["formingLimits", i, "materialId"], "this material has limits twice", ctx));

/** The construction settings the as-built prediction reads (ceilings per construction, the lid fit). */
export const constructionUpdateSchema = z.object({ construction: constructionSettingsSchema });

/** The design advisor's gap steps and saturation margin. */
export const designSearchUpdateSchema = z.object({ designSearch: designSearchSettingsSchema });

export type PriceRates = z.infer<typeof priceRatesSchema>;
export type PriceRatesInput = z.input<typeof priceRatesSchema>;
export type StockSheetsUpdate = z.infer<typeof stockSheetsUpdateSchema>;
export type FormingLimitsUpdate = z.infer<typeof formingLimitsUpdateSchema>;
export type ConstructionUpdate = z.infer<typeof constructionUpdateSchema>;
export type DesignSearchUpdate = z.infer<typeof designSearchUpdateSchema>;

/** Which part of the list a version changed. */
export const shopRateParts = ["seed", "price-list", "stock-sheets", "forming-limits", "construction", "design-search"] as const;
export type ShopRatePart = (typeof shopRateParts)[number];

/** Who saved a version. */
export interface ShopRatesAuthorJson {
  id: string;
  name: string;
}

/** GET /api/shop-rates/history, one row: a version, what it changed, who and when. */
export interface ShopRatesVersionJson {
  version: number;
  part: ShopRatePart;
  createdAt: string;
  createdBy: ShopRatesAuthorJson | null;
}

/** GET /api/shop-rates and every save's answer: the current list in its parts. */
export interface ShopRatesJson extends ShopRatesVersionJson {
  priceList: Omit<PriceList, "stockSheets" | "formingLimits" | "construction" | "designSearch">;
  stockSheets: StockSheet[];
  formingLimits: FormingLimits[];
  /** what the as-built prediction assumes of the shop's construction (defaults until first saved) */
  construction: ConstructionSettings;
  /** the design advisor's gap steps and saturation margin (defaults until first saved) */
  designSearch: DesignSearchSettings;
}
