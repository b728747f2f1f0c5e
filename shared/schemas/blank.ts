/**
 * POST /api/blanks request bodies (field names as in the API contract). Every issue's path names
 * the offending field, e.g. `dimensions_mm.diameter`, `bendRadius_mm`, `kFactor`, `method`.
 * Lengths mm; plain JSON numbers only (strings, NaN and infinities are rejected).
 */
import { z } from "zod";
import type { BlankResult } from "../fabrication";

const positiveMm = z.number({ error: "must be a number of millimetres" }).positive({ error: "must be greater than zero" });
const nonNegativeMm = z.number({ error: "must be a number of millimetres" }).nonnegative({ error: "must not be negative" });
const material = z.string().min(1).max(64).optional();

const cylinderDimensions = z.object({ diameter: positiveMm, length: positiveMm });
const boxDimensions = z.object({ width: positiveMm, depth: positiveMm, height: positiveMm });

type Ctx = z.RefinementCtx;
// cross-field checks only compare values that are themselves valid, so one bad field gives one issue
const ok = (...xs: unknown[]) => xs.every((x) => typeof x === "number" && Number.isFinite(x) && x >= 0);
const okDims = (...xs: unknown[]) => xs.every((x) => typeof x === "number" && Number.isFinite(x) && x > 0);

function checkThickness(ctx: Ctx, t: number, smallest: number) {
  if (ok(t) && okDims(smallest) && t >= smallest) ctx.addIssue({ code: "custom", path: ["thickness_mm"], message: "thickness must be smaller than the part's dimensions" });
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
    if (r !== undefined && ok(r) && okDims(diameter) && r > diameter / 2) ctx.addIssue({ code: "custom", path: ["cornerRadius_mm"], message: "corner radius must not exceed half the diameter" });
    else if (r !== undefined && ok(r) && okDims(length) && r > length) ctx.addIssue({ code: "custom", path: ["cornerRadius_mm"], message: "corner radius must not exceed the cup height" });
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
    kFactor: z.number({ error: "must be a number" }).min(0, { error: "K-factor must lie between 0 and 0.5" }).max(0.5, { error: "K-factor must lie between 0 and 0.5" }),
    lidHeight_mm: positiveMm.optional(),
    lidClearance_mm: nonNegativeMm.optional(),
    material,
  })
  .superRefine((v, ctx) => {
    const { width, depth, height } = v.dimensions_mm;
    const R = v.bendRadius_mm;
    if (ok(R) && okDims(width, depth) && 2 * R >= Math.min(width, depth)) ctx.addIssue({ code: "custom", path: ["bendRadius_mm"], message: "bend radius must be less than half the smaller side" });
    else if (ok(R) && okDims(height) && R >= height) ctx.addIssue({ code: "custom", path: ["bendRadius_mm"], message: "bend radius must be less than the height" });
    if (v.lidHeight_mm !== undefined && ok(R, v.lidHeight_mm) && v.lidHeight_mm <= R) ctx.addIssue({ code: "custom", path: ["lidHeight_mm"], message: "lid height must exceed the bend radius" });
    checkThickness(ctx, v.thickness_mm, Math.min(width, depth, height));
  });

const METHODS_FOR_SHAPE: Record<string, readonly string[]> = { cylinder: ["drawn", "rolled"], box: ["bent"] };

/** First settle shape and method (so a box cannot be "drawn"), then the body for that method. */
const shapeAndMethod = z
  .object({
    shape: z.enum(["cylinder", "box"], { error: 'shape must be "cylinder" or "box"' }),
    method: z.enum(["drawn", "rolled", "bent"], { error: 'method must be "drawn", "rolled" or "bent"' }),
  })
  .loose()
  .superRefine((v, ctx) => {
    const allowed = METHODS_FOR_SHAPE[v.shape];
    if (!allowed.includes(v.method)) ctx.addIssue({ code: "custom", path: ["method"], message: `a ${v.shape} is made ${allowed.join(" or ")}, not ${v.method}` });
  });

export const blankRequestSchema = shapeAndMethod.pipe(z.discriminatedUnion("method", [drawnBlankRequestSchema, rolledBlankRequestSchema, bentBlankRequestSchema]));

export type DrawnBlankRequest = z.infer<typeof drawnBlankRequestSchema>;
export type RolledBlankRequest = z.infer<typeof rolledBlankRequestSchema>;
export type BentBlankRequest = z.infer<typeof bentBlankRequestSchema>;
export type BlankRequest = z.infer<typeof blankRequestSchema>;

/** Issues as the contract's `fields` object: dotted path → message (first issue per path). */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".") || "body";
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}

/** POST /api/blanks: the engine's result, the material it used for the mass, and for a bent box the typical K-factor. */
export type BlankJson = BlankResult & {
  material?: { id: string; name: string; density_kg_m3: number };
  suggestedKFactor?: number;
};
