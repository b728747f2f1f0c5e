/**
 * POST /api/blanks request bodies (field names as in the API contract). Every issue's path names
 * the offending field, e.g. `dimensions_mm.diameter`, `bendRadius_mm`, `kFactor`, `method`.
 * Lengths mm; plain JSON numbers only (strings, NaN and infinities are rejected).
 */
import { z } from "zod";
import type { BlankResult } from "../fabrication";
import { issueFields } from "./messages";

// Messages: shared/schemas/messages.ts names each field ("Seam overlap must be at least 0 mm.");
// the cross-field rules below say in the same way what would be right.
const positiveMm = z.number().positive();
const nonNegativeMm = z.number().min(0);
const material = z.string().min(1).max(64).optional();
const mm = (x: number) => `${+x.toPrecision(6)} mm`;

const cylinderDimensions = z.object({ diameter: positiveMm, length: positiveMm });
const boxDimensions = z.object({ width: positiveMm, depth: positiveMm, height: positiveMm });

type Ctx = z.RefinementCtx;
// cross-field checks only compare values that are themselves valid, so one bad field gives one issue
const ok = (...xs: unknown[]) => xs.every((x) => typeof x === "number" && Number.isFinite(x) && x >= 0);
const okDims = (...xs: unknown[]) => xs.every((x) => typeof x === "number" && Number.isFinite(x) && x > 0);

function checkThickness(ctx: Ctx, t: number, smallest: number) {
  if (ok(t) && okDims(smallest) && t >= smallest) ctx.addIssue({ code: "custom", path: ["thickness_mm"], message: `Sheet thickness must be less than the part's smallest inside size (${mm(smallest)}).` });
}

export const drawnBlankRequestSchema = z
  .object({
    shape: z.literal("cylinder"),
    method: z.literal("drawn"),
    dimensions_mm: cylinderDimensions,
    thickness_mm: positiveMm,
    cornerRadius_mm: nonNegativeMm.optional(),
    trim_mm: nonNegativeMm.optional(),
    material,
  })
  .superRefine((v, ctx) => {
    const { diameter, length } = v.dimensions_mm;
    const r = v.cornerRadius_mm;
    if (r !== undefined && ok(r) && okDims(diameter) && r > diameter / 2) ctx.addIssue({ code: "custom", path: ["cornerRadius_mm"], message: `Corner radius must be at most half the inside diameter (${mm(diameter / 2)}).` });
    else if (r !== undefined && ok(r) && okDims(length) && r > length) ctx.addIssue({ code: "custom", path: ["cornerRadius_mm"], message: `Corner radius must be at most the cup's inside height (${mm(length)}).` });
    checkThickness(ctx, v.thickness_mm, Math.min(diameter, length));
  });

export const rolledBlankRequestSchema = z
  .object({
    shape: z.literal("cylinder"),
    method: z.literal("rolled"),
    dimensions_mm: cylinderDimensions,
    thickness_mm: positiveMm,
    seamOverlap_mm: nonNegativeMm.optional(),
    capFlange_mm: nonNegativeMm.optional(),
    material,
  })
  .superRefine((v, ctx) => checkThickness(ctx, v.thickness_mm, Math.min(v.dimensions_mm.diameter, v.dimensions_mm.length)));

export const bentBlankRequestSchema = z
  .object({
    shape: z.literal("box"),
    method: z.literal("bent"),
    dimensions_mm: boxDimensions,
    thickness_mm: positiveMm,
    bendRadius_mm: nonNegativeMm,
    kFactor: z.number().min(0, { error: "K-factor must be between 0 and 0.5." }).max(0.5, { error: "K-factor must be between 0 and 0.5." }),
    lidHeight_mm: positiveMm.optional(),
    lidClearance_mm: nonNegativeMm.optional(),
    material,
  })
  .superRefine((v, ctx) => {
    const { width, depth, height } = v.dimensions_mm;
    const R = v.bendRadius_mm;
    if (ok(R) && okDims(width, depth) && 2 * R >= Math.min(width, depth)) ctx.addIssue({ code: "custom", path: ["bendRadius_mm"], message: `Bend radius must be less than half the smaller side (${mm(Math.min(width, depth) / 2)}).` });
    else if (ok(R) && okDims(height) && R >= height) ctx.addIssue({ code: "custom", path: ["bendRadius_mm"], message: `Bend radius must be less than the inside height (${mm(height)}).` });
    if (v.lidHeight_mm !== undefined && ok(R, v.lidHeight_mm) && v.lidHeight_mm <= R) ctx.addIssue({ code: "custom", path: ["lidHeight_mm"], message: `Lid height must be more than the bend radius (${mm(R)}).` });
    checkThickness(ctx, v.thickness_mm, Math.min(width, depth, height));
  });

const METHODS_FOR_SHAPE: Record<string, readonly string[]> = { cylinder: ["drawn", "rolled"], box: ["bent"] };

/** First settle shape and method (so a box cannot be "drawn"), then the body for that method. */
const shapeAndMethod = z
  .object({
    shape: z.enum(["cylinder", "box"], { error: "Shape must be cylinder or box." }),
    method: z.enum(["drawn", "rolled", "bent"], { error: "Method must be drawn, rolled or bent." }),
  })
  .loose()
  .superRefine((v, ctx) => {
    const allowed = METHODS_FOR_SHAPE[v.shape];
    if (!allowed.includes(v.method)) ctx.addIssue({ code: "custom", path: ["method"], message: `A ${v.shape} is made ${allowed.join(" or ")}, not ${v.method}.` });
  });

export const blankRequestSchema = shapeAndMethod.pipe(z.discriminatedUnion("method", [drawnBlankRequestSchema, rolledBlankRequestSchema, bentBlankRequestSchema]));

export type DrawnBlankRequest = z.infer<typeof drawnBlankRequestSchema>;
export type RolledBlankRequest = z.infer<typeof rolledBlankRequestSchema>;
export type BentBlankRequest = z.infer<typeof bentBlankRequestSchema>;
export type BlankRequest = z.infer<typeof blankRequestSchema>;

/** Issues as the contract's `fields` object: dotted path → message (first issue per path). */
export const fieldErrors = issueFields;

/** POST /api/blanks: the engine's result, the material it used for the mass, and for a bent box the typical K-factor. */
export type BlankJson = BlankResult & {
  material?: { id: string; name: string; density_kg_m3: number };
  suggestedKFactor?: number;
};
