import { z } from "zod";

// Body of POST /api/predictions (and the prediction part of a quote's configuration).
// Discriminated on `shape` so each shape's dimensions are checked with their own field paths;
// the cross-field check (wall thinner than the radius) names layers.N.thickness_mm.

export const MAX_FREQUENCY_HZ = 100_000;
/** 10 T: far above any field a passive shield is used in; catches unit slips (µT vs T). */
export const MAX_AMPLITUDE_UT = 10_000_000;
export const MAX_LAYERS = 6;
export const MAX_HOLES = 50;

const mm = (what: string) =>
  z.number({ error: `Enter ${what} in millimetres as a number.` }).positive({ error: `${what[0].toUpperCase()}${what.slice(1)} must be greater than 0 mm.` }).max(100_000, { error: `${what[0].toUpperCase()}${what.slice(1)} is too large.` });

const layerSchema = z
  .object({
    material: z.string({ error: "Material must be a library id." }).trim().min(1, { error: "Choose a material." }).max(64).optional(),
    mu_r: z.number({ error: "Relative permeability must be a number." }).min(1, { error: "Relative permeability must be at least 1." }).max(10_000_000).optional(),
    resistivity_ohm_m: z.number({ error: "Resistivity must be a number in ohm·m." }).positive({ error: "Resistivity must be greater than 0." }).max(1).optional(),
    saturation_T: z.number({ error: "Saturation must be a number in tesla." }).positive({ error: "Saturation must be greater than 0 T." }).max(5).nullish(),
    thickness_mm: mm("the wall thickness"),
    gap_mm: z.number({ error: "Gap must be a number of millimetres." }).min(0, { error: "Gap cannot be negative." }).max(10_000).optional(),
  })
  .superRefine((l, ctx) => {
    const explicit = l.mu_r !== undefined || l.resistivity_ohm_m !== undefined;
    if (l.material !== undefined && explicit) {
      ctx.addIssue({ code: "custom", path: ["mu_r"], message: "Give either a material or mu_r and resistivity_ohm_m, not both." });
    } else if (l.material === undefined) {
      if (l.mu_r === undefined) ctx.addIssue({ code: "custom", path: ["mu_r"], message: "Give a material, or mu_r with resistivity_ohm_m." });
      if (l.resistivity_ohm_m === undefined)
        ctx.addIssue({ code: "custom", path: ["resistivity_ohm_m"], message: "Give resistivity_ohm_m with mu_r." });
    }
  });

const holeSchema = z.object({
  diameter_mm: mm("the hole diameter"),
  collarLength_mm: z.number({ error: "Collar length must be a number of millimetres." }).min(0, { error: "Collar length cannot be negative." }).max(10_000).default(0),
});

const fieldSchema = z.object({
  frequency_hz: z
    .number({ error: "Frequency must be a number in hertz." })
    .min(0, { error: "Frequency cannot be negative (0 means a static field)." })
    .max(MAX_FREQUENCY_HZ, { error: `Frequency must be at most ${MAX_FREQUENCY_HZ} Hz.` }),
  amplitude_uT: z
    .number({ error: "Field amplitude must be a number in microtesla." })
    .positive({ error: "Field amplitude must be greater than 0 µT." })
    .max(MAX_AMPLITUDE_UT, { error: `Field amplitude must be at most ${MAX_AMPLITUDE_UT} µT (10 T).` }),
  orientation: z.enum(["transverse", "axial"], { error: "Orientation must be transverse or axial." }).default("transverse"),
});

const common = {
  layers: z
    .array(layerSchema, { error: "Layers must be a list." })
    .min(1, { error: "Give at least one layer." })
    .max(MAX_LAYERS, { error: `At most ${MAX_LAYERS} layers.` }),
  field: fieldSchema,
  state: z.enum(["annealed", "as-formed"], { error: "State must be annealed or as-formed." }).default("annealed"),
  holes: z.array(holeSchema, { error: "Holes must be a list." }).max(MAX_HOLES, { error: `At most ${MAX_HOLES} holes.` }).optional(),
};

const cylinder = z.object({
  shape: z.literal("cylinder"),
  dimensions_mm: z.object({ diameter: mm("the inside diameter"), length: mm("the inside length") }),
  ends: z.enum(["closed", "open"], { error: "Ends must be closed or open." }).default("closed"),
  ...common,
});
const sphere = z.object({
  shape: z.literal("sphere"),
  dimensions_mm: z.object({ diameter: mm("the inside diameter") }),
  ...common,
});
const box = z.object({
  shape: z.literal("box"),
  dimensions_mm: z.object({ width: mm("the inside width"), depth: mm("the inside depth"), height: mm("the inside height") }),
  ...common,
});

export const predictionRequestSchema = z
  .discriminatedUnion("shape", [cylinder, box, sphere], {
    error: (iss) => ((iss as { code?: string }).code === "invalid_type" ? "Send the prediction as a JSON object." : "Shape must be cylinder, box or sphere."),
  })
  .superRefine((body, ctx) => {
    // Each wall must be thinner than the radius it is formed on (box: half the smallest side).
    const d = body.dimensions_mm as Record<string, number>;
    let r = body.shape === "box" ? Math.min(d.width, d.depth, d.height) / 2 : d.diameter / 2;
    if (!(r > 0)) return; // the dimension's own issue already says what is wrong
    // A cable hole must fit in the wall it is cut in: narrower than the smallest inside size.
    (body.holes ?? []).forEach((h, i) => {
      if (h.diameter_mm >= 2 * r)
        ctx.addIssue({
          code: "custom",
          path: ["holes", i, "diameter_mm"],
          message: `The hole (${h.diameter_mm} mm) must be narrower than the shield's smallest inside size (${+(2 * r).toFixed(3)} mm).`,
        });
    });
    body.layers.forEach((l, i) => {
      if (l.thickness_mm >= r)
        ctx.addIssue({
          code: "custom",
          path: ["layers", i, "thickness_mm"],
          message: `The wall (${l.thickness_mm} mm) must be thinner than the radius it is formed on (${+r.toFixed(3)} mm).`,
        });
      r += l.thickness_mm + (l.gap_mm ?? 0);
    });
  });

export type PredictionRequest = z.infer<typeof predictionRequestSchema>;
export type PredictionRequestInput = z.input<typeof predictionRequestSchema>;

/** Zod issues as the API's `fields` map: {"layers.0.thickness_mm": "message"}. */
export function predictionIssueFields(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".") || "body";
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

// POST /api/predictions/sweep: the prediction body plus how many log-spaced frequencies.
export const SWEEP_FROM_HZ = 1;
export const SWEEP_TO_HZ = 10_000;
export const sweepOptionsSchema = z.object({
  points: z
    .number({ error: "Points must be a whole number." })
    .int({ error: "Points must be a whole number." })
    .min(2, { error: "Ask for at least 2 points." })
    .max(400, { error: "Ask for at most 400 points." })
    .default(100),
});
