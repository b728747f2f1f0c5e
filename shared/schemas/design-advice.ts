/**
 * POST /api/design-advice: the requirement (attenuation at a field, the space inside) and the
 * constraints a search keeps to, and the answer the server sends and the client reads. Lengths
 * mm, fields µT, money integer cents with the list's currency.
 */
import { z } from "zod";
import { INPUT_LIMITS, REPORT_LIMIT_DB } from "../physics/limits";
import { fieldSchema } from "./prediction";
import { MAX_ESTIMATE_QUANTITY } from "./price-estimate";

/** Layers a search may nest (the issue's 1–4); every further layer multiplies the designs tried. */
export const MAX_ADVICE_LAYERS = 4;
export const DEFAULT_ADVICE_LAYERS = 3;
/** The most designs one search may try; a larger search is refused with the count it would take. */
export const MAX_SEARCH_DESIGNS = 50_000;

const { min: DIM_MIN, max: DIM_MAX } = INPUT_LIMITS.dimension_mm;

const mm = (what: string) =>
  z
    .number({ error: `Enter ${what} in millimetres as a number.` })
    .min(DIM_MIN, { error: `${what[0].toUpperCase()}${what.slice(1)} is too small: at least ${DIM_MIN} mm.` })
    .max(DIM_MAX, { error: `${what[0].toUpperCase()}${what.slice(1)} is too large: at most ${DIM_MAX} mm.` });

const unique = <T>(xs: readonly T[]) => new Set(xs).size === xs.length;

const constraintsCommon = {
  maxLayers: z
    .number({ error: "The most layers must be a whole number." })
    .int({ error: "The most layers must be a whole number." })
    .min(1, { error: "The most layers is too small: at least 1." })
    .max(MAX_ADVICE_LAYERS, { error: `The most layers is too large: at most ${MAX_ADVICE_LAYERS}.` })
    .default(DEFAULT_ADVICE_LAYERS),
  /** library ids; absent: every magnetic alloy the shop prices and stocks */
  materials: z
    .array(z.string({ error: "A material must be a library id." }).trim().min(1, { error: "Choose a material." }).max(64), { error: "Materials must be a list of library ids." })
    .min(1, { error: "Allow at least one material, or leave the list out for every alloy the shop stocks." })
    .max(10, { error: "At most 10 materials." })
    .refine(unique, { error: "Each material once." })
    .optional(),
  /** sheet thicknesses to try, each one the shop stocks; absent: the gauges the shop offers in the advisor (its design-search settings) */
  gauges_mm: z
    .array(z.number({ error: "A gauge must be a number of millimetres." }).positive({ error: "A gauge must be greater than zero." }).max(INPUT_LIMITS.thickness_mm.max), {
      error: "Gauges must be a list of millimetres.",
    })
    .min(1, { error: "Allow at least one gauge, or leave the list out for every gauge the shop stocks." })
    .max(20, { error: "At most 20 gauges." })
    .refine(unique, { error: "Each gauge once." })
    .optional(),
  maxMass_kg: z
    .number({ error: "The largest mass must be a number of kilograms." })
    .positive({ error: "The largest mass must be greater than zero." })
    .max(100_000, { error: "The largest mass is too large: at most 100 000 kg." })
    .optional(),
};

const outside = (what: string) => mm(`the largest outside ${what}`).optional();

const cylinderConstraints = z.object({
  ...constraintsCommon,
  methods: z
    .array(z.enum(["drawn", "rolled"], { error: "A can is made drawn or rolled." }), { error: "Methods must be a list." })
    .min(1, { error: "Allow at least one method, or leave the list out for both." })
    .refine(unique, { error: "Each method once." })
    .optional(),
  maxOutside_mm: z
    .strictObject({ diameter: outside("diameter"), length: outside("length") }, { error: "A can's largest outside size is {diameter, length} in millimetres." })
    .optional(),
});

const boxConstraints = z.object({
  ...constraintsCommon,
  methods: z
    .array(z.literal("bent", { error: "A box is made bent." }), { error: "Methods must be a list." })
    .min(1, { error: "Allow at least one method, or leave the list out." })
    .refine(unique, { error: "Each method once." })
    .optional(),
  maxOutside_mm: z
    .strictObject({ width: outside("width"), depth: outside("depth"), height: outside("height") }, { error: "A box's largest outside size is {width, depth, height} in millimetres." })
    .optional(),
});

const common = {
  requiredAttenuation_db: z
    .number({ error: "The required attenuation must be a number of dB." })
    .positive({ error: "The required attenuation must be more than 0 dB." })
    .max(REPORT_LIMIT_DB, { error: `The required attenuation is too large: at most ${REPORT_LIMIT_DB} dB.` }),
  field: fieldSchema,
  quantity: z
    .number({ error: "The quantity must be a whole number." })
    .int({ error: "The quantity must be a whole number." })
    .min(1, { error: "The quantity must be at least 1." })
    .max(MAX_ESTIMATE_QUANTITY, { error: `The quantity must be at most ${MAX_ESTIMATE_QUANTITY}.` }),
};

const cylinder = z.object({
  shape: z.literal("cylinder"),
  dimensions_mm: z.object({ diameter: mm("the inside diameter"), length: mm("the inside length") }),
  constraints: cylinderConstraints.default({ maxLayers: DEFAULT_ADVICE_LAYERS }),
  ...common,
});
const box = z.object({
  shape: z.literal("box"),
  dimensions_mm: z.object({ width: mm("the inside width"), depth: mm("the inside depth"), height: mm("the inside height") }),
  constraints: boxConstraints.default({ maxLayers: DEFAULT_ADVICE_LAYERS }),
  ...common,
});

export const designAdviceRequestSchema = z
  .discriminatedUnion("shape", [cylinder, box], {
    error: (iss) =>
      (iss as { code?: string }).code === "invalid_type" ? "Send the requirement as a JSON object." : "Shape must be cylinder or box: the shop makes cans and boxes, not spheres.",
  })
  .superRefine((body, ctx) => {
    // a largest outside size must leave room for at least a wall round the inside
    const inside = body.dimensions_mm as Record<string, number>;
    const most = (body.constraints.maxOutside_mm ?? {}) as Record<string, number | undefined>;
    for (const [key, limit] of Object.entries(most)) {
      if (limit !== undefined && limit <= inside[key])
        ctx.addIssue({
          code: "custom",
          path: ["constraints", "maxOutside_mm", key],
          message: `The largest outside ${key} (${limit} mm) must be larger than the inside ${key} (${inside[key]} mm): the walls take room.`,
        });
    }
  });

export type DesignAdviceRequest = z.infer<typeof designAdviceRequestSchema>;
export type DesignAdviceRequestInput = z.input<typeof designAdviceRequestSchema>;

// --- the answer ---

/** One layer of a design as the configuration gives it (innermost first). */
export interface AdvisedLayer {
  material: string;
  thickness_mm: number;
  /** clear space to the next layer outward; absent on the outermost */
  gap_mm?: number;
}

/**
 * A design as a quote takes it: the prediction body, the method and blank fields, and the
 * requirement. Posted unchanged to /api/predictions it gives the candidate's attenuation_db; to
 * /api/price-estimates (with the quantity) its unitPrice_cents; to /api/quotes it is quoted.
 */
export type AdvisedConfiguration = {
  dimensions_mm: Record<string, number>;
  layers: AdvisedLayer[];
  field: { frequency_hz: number; amplitude_uT: number; orientation: "transverse" | "axial" };
  state: "annealed";
  requiredAttenuation_db: number;
} & (
  | { shape: "cylinder"; ends: "closed"; method: "drawn"; cornerRadius_mm: number; trim_mm: number }
  | { shape: "cylinder"; ends: "closed"; method: "rolled"; seamOverlap_mm: number }
  | { shape: "box"; method: "bent"; lid: true }
);

/** What the saturation check says of each layer, innermost first. */
export interface AdvisedLayerCheck {
  material: string;
  thickness_mm: number;
  /** peak flux density in the wall at the asked frequency, tesla */
  wallFluxDensity_T: number;
  /** saturation / peak wall flux; null for a non-magnetic layer */
  saturationMargin: number | null;
}

export interface DesignCandidateJson {
  configuration: AdvisedConfiguration;
  /** the as-built figure, as POST /api/predictions gives it */
  attenuation_db: number;
  band: { low_db: number; high_db: number };
  /** the seamless shell of the same layers */
  ideal_db: number;
  unitPrice_cents: number;
  currency: string;
  /** the blanks' mass: every layer (a box with its lid) */
  mass_kg: number;
  /** the outside of the outermost layer (a box: across its lid's skirt) */
  outside_mm: Record<string, number>;
  layers: AdvisedLayerCheck[];
  /** the smallest layer margin (null when no layer can saturate) */
  saturationMargin: number | null;
  /** every layer keeps the shop's margin */
  keepsMargin: boolean;
  /** on the Pareto front of price, mass and attenuation */
  front: boolean;
  /** the design in a line, e.g. "2 layers, drawn: 0.5 mm ni80 + 1 mm ni50, 10 mm apart" */
  summary: string;
}

/** What the closest design lacks, each part present only when it falls short there. */
export interface Shortfall {
  /** dB short at the low end of its band */
  db?: number;
  /** layers (0 = innermost) over the shop's saturation margin */
  saturatedLayers?: number[];
  /** mm beyond each largest outside size */
  oversize_mm?: Record<string, number>;
  /** kg beyond the largest mass */
  overMass_kg?: number;
}

export interface ClosestDesignJson extends Omit<DesignCandidateJson, "front"> {
  /** in words: dB short, saturates, too big */
  lacks: string;
  shortfall: Shortfall;
}

/** How the search went: the space, what the bounds ruled out, what was worked out in full. */
export interface AdviceSearchJson {
  /** designs in the space (every one either worked out or ruled out by a bound) */
  designs: number;
  /** ruled out without a prediction, by exact size or mass, or by a bound that cannot drop a winner */
  ruledOut: { tooBig: number; tooHeavy: number; cannotReach: number; dominated: number; notMade: number };
  /** predictions run */
  predicted: number;
  /** designs priced in full (nesting included) */
  priced: number;
  /** designs meeting the requirement that were not listed: dearer than the listed ones and off the front */
  notListed: number;
  elapsed_ms: number;
}

export interface DesignAdviceJson {
  /** designs the search evaluated: the whole space, each worked out or ruled out by a bound */
  evaluated: number;
  /** every design on the front, the cheapest others and the recommendation, cheapest first */
  candidates: DesignCandidateJson[];
  /** index into candidates, or null when no design meets the requirement and keeps the margin */
  recommended: number | null;
  /** why that one (or why none) */
  reason: string;
  /** when nothing meets the requirement, or nothing that does keeps the margin: what comes nearest */
  closest?: ClosestDesignJson;
  search: AdviceSearchJson;
  /** the shop's rule: every layer's saturation / peak wall flux at least this */
  minSaturationMargin: number;
  gapSteps_mm: number[];
  /** the gauges tried (the ones asked for, else the shop's advisor gauges), of those stocked */
  gauges_mm: number[];
  currency: string;
  /** the shop-rates version the prices come from */
  priceListVersion: number;
  /** predictions are engineering estimates */
  estimate: true;
}
