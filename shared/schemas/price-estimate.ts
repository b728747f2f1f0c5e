/**
 * Body of POST /api/price-estimates, and the fabrication part of a quote's configuration
 * (POST /api/quotes reuses `designConfigurationSchema`). Lengths mm. The object is loose so a
 * quote's configuration may also carry the prediction fields (field, ends, state,
 * requiredAttenuation_db) without this schema knowing them.
 */
import { z } from "zod";
import type { FabricatedPart, Placement, PriceBuildUp } from "../fabrication";

export const MAX_ESTIMATE_QUANTITY = 100_000;

const positiveMm = z.number({ error: "must be a number of millimetres" }).positive({ error: "must be greater than zero" }).max(100_000, { error: "is too large" });
const nonNegativeMm = z.number({ error: "must be a number of millimetres" }).nonnegative({ error: "must not be negative" }).max(100_000, { error: "is too large" });

const layerSchema = z.object({
  material: z.string({ error: "choose a material" }).trim().min(1, { error: "choose a material" }).max(64),
  thickness_mm: positiveMm,
  gap_mm: nonNegativeMm.optional(),
});

const holeSchema = z.object({
  diameter_mm: positiveMm,
  /** 0: a plain hole without a collar */
  collarLength_mm: nonNegativeMm.default(0),
});

const METHODS_FOR_SHAPE: Record<string, readonly string[]> = { cylinder: ["drawn", "rolled"], box: ["bent"] };
const DIMENSIONS_FOR_SHAPE: Record<string, readonly string[]> = { cylinder: ["diameter", "length"], box: ["width", "depth", "height"] };
const num = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);

export const designConfigurationSchema = z
  .object({
    shape: z.enum(["cylinder", "box"], { error: 'shape must be "cylinder" or "box"' }),
    method: z.enum(["drawn", "rolled", "bent"], { error: 'method must be "drawn", "rolled" or "bent"' }),
    dimensions_mm: z.object({
      diameter: positiveMm.optional(),
      length: positiveMm.optional(),
      width: positiveMm.optional(),
      depth: positiveMm.optional(),
      height: positiveMm.optional(),
    }),
    /** innermost first */
    layers: z.array(layerSchema, { error: "layers must be a list" }).min(1, { error: "give at least one layer" }).max(6, { error: "at most 6 layers" }),
    cornerRadius_mm: nonNegativeMm.optional(),
    trim_mm: nonNegativeMm.optional(),
    seamOverlap_mm: nonNegativeMm.optional(),
    capFlange_mm: nonNegativeMm.optional(),
    bendRadius_mm: nonNegativeMm.optional(),
    kFactor: z.number({ error: "must be a number" }).min(0, { error: "K-factor must lie between 0 and 0.5" }).max(0.5, { error: "K-factor must lie between 0 and 0.5" }).optional(),
    lid: z.boolean().optional(),
    lidHeight_mm: positiveMm.optional(),
    lidClearance_mm: nonNegativeMm.optional(),
    holes: z.array(holeSchema).max(50).optional(),
  })
  .loose()
  .superRefine((v, ctx) => {
    const allowed = METHODS_FOR_SHAPE[v.shape];
    if (!allowed.includes(v.method)) ctx.addIssue({ code: "custom", path: ["method"], message: `a ${v.shape} is made ${allowed.join(" or ")}, not ${v.method}` });
    const dims = v.dimensions_mm as Record<string, number | undefined>;
    for (const key of DIMENSIONS_FOR_SHAPE[v.shape]) {
      if (dims[key] === undefined) ctx.addIssue({ code: "custom", path: ["dimensions_mm", key], message: `a ${v.shape} needs its inside ${key}` });
    }
    const needed = DIMENSIONS_FOR_SHAPE[v.shape].map((k) => dims[k]);
    if (!needed.every(num)) return;
    const smallest = Math.min(...(needed as number[]));
    if (v.shape === "cylinder" && num(v.cornerRadius_mm) && v.cornerRadius_mm > (dims.diameter as number) / 2) {
      ctx.addIssue({ code: "custom", path: ["cornerRadius_mm"], message: "corner radius must not exceed half the diameter" });
    }
    if (v.shape === "box" && num(v.bendRadius_mm) && 2 * v.bendRadius_mm >= Math.min(dims.width as number, dims.depth as number)) {
      ctx.addIssue({ code: "custom", path: ["bendRadius_mm"], message: "bend radius must be less than half the smaller side" });
    }
    v.layers.forEach((l, i) => {
      if (num(l.thickness_mm) && l.thickness_mm >= smallest) ctx.addIssue({ code: "custom", path: ["layers", i, "thickness_mm"], message: "thickness must be smaller than the part's dimensions" });
    });
  });

export const priceEstimateRequestSchema = z.object({
  configuration: designConfigurationSchema,
  quantity: z
    .number({ error: "quantity must be a whole number" })
    .int({ error: "quantity must be a whole number" })
    .min(1, { error: "quantity must be at least 1" })
    .max(MAX_ESTIMATE_QUANTITY, { error: `quantity must be at most ${MAX_ESTIMATE_QUANTITY}` }),
});

export type DesignConfiguration = z.infer<typeof designConfigurationSchema>;
export type DesignConfigurationInput = z.input<typeof designConfigurationSchema>;
export type PriceEstimateRequest = z.infer<typeof priceEstimateRequestSchema>;

/** One alloy and gauge of a design nested on its stock sheet. */
export interface NestingGroup {
  materialId: string;
  thickness_mm: number;
  sheet: { width_mm: number; length_mm: number } | null;
  /** copies of the assembly's blanks in the nested sample */
  assembliesNested: number;
  partsPerSheet: number;
  /** sheets for the whole quantity; scaled from the sample when the quantity is larger */
  sheets: number;
  sheetsEstimated: boolean;
  utilisation: number;
  scrapFraction: number;
  algorithm: string | null;
  /** the first sheet's blanks, lower-left corners in mm, x across the sheet width */
  placements: Array<Pick<Placement, "x" | "y" | "w" | "h" | "kind" | "rotated"> & { label: string }>;
}

/** The price of a design at a quantity, as priceEstimator works it out. */
export interface PriceEstimate {
  parts: Array<Omit<FabricatedPart, "density_kg_m3" | "finishedPiece">>;
  nesting: NestingGroup[];
  price: PriceBuildUp;
  currency: string;
}

/** POST /api/price-estimates: the estimate and the shop-rates version it was priced with. */
export interface PriceEstimateJson extends PriceEstimate {
  priceListVersion: number;
}
