/**
 * Body of POST /api/price-estimates, and the fabrication part of a quote's configuration
 * (POST /api/quotes reuses `designConfigurationSchema`). Lengths mm. The object is loose so a
 * quote's configuration may also carry the prediction fields (field, ends, state,
 * requiredAttenuation_db) without this schema knowing them.
 */
import { z } from "zod";
import type { CustomerPriceBuildUp, FabricatedPart, Placement, PriceBuildUp } from "../fabrication";
import "./messages";

export const MAX_ESTIMATE_QUANTITY = 100_000;

// Messages: shared/schemas/messages.ts names each field; the cross-field rules say what would be right.
const positiveMm = z.number().positive().max(100_000);
const nonNegativeMm = z.number().min(0).max(100_000);
const mm = (x: number) => `${+x.toPrecision(6)} mm`;

const layerSchema = z.object({
  material: z.string({ error: "Choose a material." }).trim().min(1, { error: "Choose a material." }).max(64),
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
    shape: z.enum(["cylinder", "box"], { error: "Shape must be cylinder or box." }),
    method: z.enum(["drawn", "rolled", "bent"], { error: "Method must be drawn, rolled or bent." }),
    dimensions_mm: z.object({
      diameter: positiveMm.optional(),
      length: positiveMm.optional(),
      width: positiveMm.optional(),
      depth: positiveMm.optional(),
      height: positiveMm.optional(),
    }),
    /** innermost first */
    layers: z.array(layerSchema, { error: "Layers must be a list." }).min(1, { error: "Give at least one layer." }).max(6, { error: "Give at most 6 layers." }),
    cornerRadius_mm: nonNegativeMm.optional(),
    trim_mm: nonNegativeMm.optional(),
    seamOverlap_mm: nonNegativeMm.optional(),
    capFlange_mm: nonNegativeMm.optional(),
    bendRadius_mm: nonNegativeMm.optional(),
    kFactor: z.number().min(0, { error: "K-factor must be between 0 and 0.5." }).max(0.5, { error: "K-factor must be between 0 and 0.5." }).optional(),
    lid: z.boolean().optional(),
    lidHeight_mm: positiveMm.optional(),
    lidClearance_mm: nonNegativeMm.optional(),
    holes: z.array(holeSchema).max(50).optional(),
  })
  .loose()
  .superRefine((v, ctx) => {
    const allowed = METHODS_FOR_SHAPE[v.shape];
    if (!allowed.includes(v.method)) ctx.addIssue({ code: "custom", path: ["method"], message: `A ${v.shape} is made ${allowed.join(" or ")}, not ${v.method}.` });
    const dims = v.dimensions_mm as Record<string, number | undefined>;
    for (const key of DIMENSIONS_FOR_SHAPE[v.shape]) {
      if (dims[key] === undefined) ctx.addIssue({ code: "custom", path: ["dimensions_mm", key], message: `Enter the inside ${key} of the ${v.shape === "box" ? "box" : "can"} in mm.` });
    }
    const needed = DIMENSIONS_FOR_SHAPE[v.shape].map((k) => dims[k]);
    if (!needed.every(num)) return;
    const smallest = Math.min(...(needed as number[]));
    if (v.shape === "cylinder" && num(v.cornerRadius_mm) && v.cornerRadius_mm > (dims.diameter as number) / 2) {
      ctx.addIssue({ code: "custom", path: ["cornerRadius_mm"], message: `Corner radius must be at most half the inside diameter (${mm((dims.diameter as number) / 2)}).` });
    }
    if (v.shape === "box" && num(v.bendRadius_mm) && 2 * v.bendRadius_mm >= Math.min(dims.width as number, dims.depth as number)) {
      ctx.addIssue({ code: "custom", path: ["bendRadius_mm"], message: `Bend radius must be less than half the smaller side (${mm(Math.min(dims.width as number, dims.depth as number) / 2)}).` });
    }
    v.layers.forEach((l, i) => {
      if (num(l.thickness_mm) && l.thickness_mm >= smallest) ctx.addIssue({ code: "custom", path: ["layers", i, "thickness_mm"], message: `Wall thickness of layer ${i + 1} must be less than the part's smallest inside size (${mm(smallest)}).` });
    });
  });

export const priceEstimateRequestSchema = z.object({
  configuration: designConfigurationSchema,
  quantity: z
    .number({ error: "Quantity must be a whole number of pieces." })
    .int({ error: "Quantity must be a whole number of pieces." })
    .min(1, { error: "Quantity must be at least 1 piece." })
    .max(MAX_ESTIMATE_QUANTITY, { error: `Quantity must be at most ${MAX_ESTIMATE_QUANTITY.toLocaleString("en-GB")} pieces.` }),
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

/**
 * How a price is shown: the shop's staff see every rate, the margin and the material use
 * ("shop"); a customer sees amounts with the margin spread over them and no rate ("customer").
 * The server chooses by the viewer's role and sends nothing more, so hiding is never left to the page.
 */
export type PriceView = ({ view: "shop" } & PriceBuildUp) | ({ view: "customer" } & CustomerPriceBuildUp);

/** POST /api/price-estimates: the estimate as the viewer may see it, and the shop-rates version it was priced with. */
export interface PriceEstimateJson extends Omit<PriceEstimate, "price"> {
  price: PriceView;
  priceListVersion: number;
}
