/**
 * Price list, stock sheets and forming limits as zod schemas, so the planner's edits are
 * validated before they reach a quote. Money is integer cents in the list's ISO 4217 currency.
 */
import { z } from "zod";
import "./messages"; // the one error map: every field named in plain words
import { DEFAULT_CONSTRUCTION_SETTINGS, type ConstructionSettings } from "../physics/build-model";
import { NEAR_SATURATION_FRACTION } from "../physics/saturation";

const cents = z.number().int().nonnegative();
const percent = z.number().min(0).max(100);

export const stockSheetSchema = z.object({
  materialId: z.string().min(1),
  thickness_mm: z.number().positive(),
  width_mm: z.number().positive(),
  length_mm: z.number().positive(),
});
export type StockSheet = z.infer<typeof stockSheetSchema>;

/** Limiting draw ratios (mean blank diameter / mean cup diameter) per material [practice]. */
export const formingLimitsSchema = z.object({
  materialId: z.string().min(1),
  firstDrawRatio: z.number().min(1.05).max(2.5),
  redrawRatio: z.number().min(1.02).max(2),
  processAnnealBetweenDraws: z.boolean(),
});
export type FormingLimits = z.infer<typeof formingLimitsSchema>;

export const materialPriceSchema = z.object({
  materialId: z.string().min(1),
  pricePerKg_cents: cents,
  /** what the scrap dealer pays back per kg of offcut */
  scrapCreditPerKg_cents: cents,
});
export type MaterialPrice = z.infer<typeof materialPriceSchema>;

export const quantityBreakSchema = z.object({
  minQuantity: z.number().int().positive(),
  discountPercent: percent,
});
export type QuantityBreak = z.infer<typeof quantityBreakSchema>;

const dbSetting = (what: string, min: number, max: number) =>
  z
    .number({ error: `${what} must be a number of dB.` })
    .min(min, { error: `${what} is too small: at least ${min} dB.` })
    .max(max, { error: `${what} is too large: at most ${max} dB.` });

const ceilingSchema = z.object({
  firstLayer_db: dbSetting("The ceiling for one layer", 20, 160),
  perExtraLayer_db: dbSetting("What each further layer adds", 0, 60),
});

/**
 * What the as-built prediction assumes of the shop's construction: the ceiling each
 * construction levels off at (1/S = 1/S_ideal + 1/S_ceiling) and the lid fit. Optional in the
 * document, so that versions saved before it existed still parse; read it through
 * constructionSettingsOf, which gives the defaults from practice.
 */
export const constructionSettingsSchema = z.object({
  ceilings: z.object({ "closed-can": ceilingSchema, "open-tube": ceilingSchema, box: ceilingSchema, sphere: ceilingSchema }),
  lidClearance_mm: z
    .number({ error: "The lid clearance must be a number of millimetres." })
    .min(0.01, { error: "The lid clearance is too small: at least 0.01 mm." })
    .max(5, { error: "The lid clearance is too large: at most 5 mm." }),
  lidOverlapFraction: z
    .number({ error: "The lid overlap must be a fraction of the length." })
    .min(0.05, { error: "The lid overlap is too small: at least 0.05 of the length." })
    .max(1, { error: "The lid overlap is too large: at most the whole length." }),
  lidOverlapMin_mm: z
    .number({ error: "The shortest lid overlap must be a number of millimetres." })
    .min(1, { error: "The shortest lid overlap is too small: at least 1 mm." })
    .max(500, { error: "The shortest lid overlap is too large: at most 500 mm." }),
}) satisfies z.ZodType<ConstructionSettings>;

/**
 * What the design advisor searches with: the gaps between nested layers the shop builds to (its
 * spacers and tooling steps), the gauges it offers unless a customer names others (of those it
 * stocks), and the saturation margin a recommended design keeps on every layer. Optional in
 * the document like the construction settings; read it through designSearchSettingsOf, which
 * gives the defaults.
 */
export const designSearchSettingsSchema = z.object({
  gapSteps_mm: z
    .array(
      z
        .number({ error: "A gap step must be a number of millimetres." })
        .min(0.5, { error: "A gap step is too small: at least 0.5 mm." })
        .max(500, { error: "A gap step is too large: at most 500 mm." }),
      { error: "The gap steps must be a list of millimetres." },
    )
    .min(1, { error: "Give at least one gap step." })
    .max(8, { error: "At most 8 gap steps: each one multiplies the designs a search tries." })
    .refine((steps) => new Set(steps).size === steps.length, { error: "Each gap step once." }),
  gauges_mm: z
    .array(
      z
        .number({ error: "A gauge must be a number of millimetres." })
        .positive({ error: "A gauge must be greater than zero." })
        .max(100, { error: "A gauge is too large: at most 100 mm." }),
      { error: "The gauges must be a list of millimetres." },
    )
    .min(1, { error: "Give at least one gauge." })
    .max(12, { error: "At most 12 gauges: each one multiplies the designs a search tries." })
    .refine((gauges) => new Set(gauges).size === gauges.length, { error: "Each gauge once." }),
  minSaturationMargin: z
    .number({ error: "The saturation margin must be a number." })
    .min(1, { error: "The saturation margin is too small: at least 1 (the wall at saturation)." })
    .max(20, { error: "The saturation margin is too large: at most 20." }),
});
export type DesignSearchSettings = z.infer<typeof designSearchSettingsSchema>;

/**
 * Defaults: gaps of 5 to 20 mm in 5 mm steps, the spacer sizes a small shop keeps [practice];
 * the four common sheet gauges from 0.5 to 2 mm; a recommended design keeps each wall at or
 * below a third of its saturation induction, the trade's rule (see saturation.ts) [practice].
 */
export const DEFAULT_DESIGN_SEARCH_SETTINGS: DesignSearchSettings = {
  gapSteps_mm: [5, 10, 15, 20],
  gauges_mm: [0.5, 1, 1.5, 2],
  minSaturationMargin: 1 / NEAR_SATURATION_FRACTION,
};

export const priceListSchema = z.object({
  currency: z.string().regex(/^[A-Z]{3}$/, { error: "Currency must be a three-letter ISO 4217 code, e.g. EUR." }),
  materials: z.array(materialPriceSchema).min(1),
  /** credit offcuts at the material's scrap price */
  scrapCredit: z.boolean(),
  blankingPerPart_cents: cents,
  formingPerDrawStage_cents: cents,
  formingPerBend_cents: cents,
  processAnnealPerAnneal_cents: cents,
  weldingPerMetre_cents: cents,
  cleaningPerPart_cents: cents,
  hydrogenAnnealPerLoad_cents: cents,
  partsPerFurnaceLoad: z.number().int().positive(),
  verificationPerSampledPart_cents: cents,
  packingPerPart_cents: cents,
  setupPerJob_cents: cents,
  marginPercent: percent,
  quantityBreaks: z.array(quantityBreakSchema),
  /** material utilisation assumed when no stock sheet fits a part's alloy and gauge */
  fallbackUtilisation: z.number().gt(0).max(1),
  stockSheets: z.array(stockSheetSchema),
  formingLimits: z.array(formingLimitsSchema),
  construction: constructionSettingsSchema.optional(),
  designSearch: designSearchSettingsSchema.optional(),
  /**
   * Quoted with every quote: working days from payment to dispatch, and how many days a quote
   * holds its price. Optional with defaults, so versions saved before they existed still parse.
   */
  leadTimeWorkingDays: z.number().int().min(1).max(260).default(20),
  quoteValidityDays: z.number().int().min(1).max(365).default(30),
});
export type PriceList = z.infer<typeof priceListSchema>;

/** The construction settings of a price list version, the defaults from practice when it has none. */
export function constructionSettingsOf(priceList: Pick<PriceList, "construction">): ConstructionSettings {
  return priceList.construction ?? DEFAULT_CONSTRUCTION_SETTINGS;
}

/** The design advisor's settings of a price list version, the defaults when it has none. */
export function designSearchSettingsOf(priceList: Pick<PriceList, "designSearch">): DesignSearchSettings {
  return priceList.designSearch ?? DEFAULT_DESIGN_SEARCH_SETTINGS;
}
