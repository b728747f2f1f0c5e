import { z } from "zod";

// Body of POST /api/predictions (and the prediction part of a quote's configuration).
// Discriminated on `shape` so each shape's dimensions are checked with their own field paths;
// the cross-field check (wall thinner than the radius) names layers.N.thickness_mm.

import { INPUT_LIMITS, type Range } from "../physics/limits";
import { issueFields } from "./messages";

export const MAX_FREQUENCY_HZ = INPUT_LIMITS.frequency_hz.max;
/** 10 T: far above any field a passive shield is used in; catches unit slips (µT vs T). */
export const MAX_AMPLITUDE_UT = INPUT_LIMITS.amplitude_uT.max;
export const MAX_LAYERS = 6;
export const MAX_HOLES = 50;

const cap = (what: string) => `${what[0].toUpperCase()}${what.slice(1)}`;
const withUnit = (x: number, unit: string) => (unit ? `${x} ${unit}` : String(x));

/** A number inside its physical range; outside it the message says "too small" or "too large". */
function bounded(what: string, range: Range, typeError?: string, minNote = "") {
  return z
    .number({ error: typeError ?? `${cap(what)} must be a number${range.unit ? ` in ${range.unit}` : ""}.` })
    .min(range.min, { error: `${cap(what)} is too small: at least ${withUnit(range.min, range.unit)}${minNote}.` })
    .max(range.max, { error: `${cap(what)} is too large: at most ${withUnit(range.max, range.unit)}.` });
}

const mm = (what: string, range: Range = INPUT_LIMITS.dimension_mm) => bounded(what, range, `Enter ${what} as a number.`);

const layerSchema = z
  .object({
    material: z.string({ error: "Material must be a library id." }).trim().min(1, { error: "Choose a material." }).max(64).optional(),
    mu_r: bounded("the relative permeability", INPUT_LIMITS.mu_r, "Relative permeability must be a number.").optional(),
    resistivity_ohm_m: bounded("the resistivity", INPUT_LIMITS.resistivity_ohm_m, "Resistivity must be a number in ohm·m.").optional(),
    saturation_T: bounded("the saturation", INPUT_LIMITS.saturation_T, "Saturation must be a number in tesla.").nullish(),
    thickness_mm: mm("the wall thickness", INPUT_LIMITS.thickness_mm),
    gap_mm: bounded("the gap", INPUT_LIMITS.gap_mm, "Gap must be a number of millimetres.").optional(),
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
  diameter_mm: mm("the hole diameter", INPUT_LIMITS.holeDiameter_mm),
  collarLength_mm: bounded("the collar length", INPUT_LIMITS.collarLength_mm, "Collar length must be a number of millimetres.").default(0),
});

/** The applied field: frequency, amplitude and direction (the design advisor asks for the same). */
export const fieldSchema = z.object({
  frequency_hz: bounded("the frequency", INPUT_LIMITS.frequency_hz, "Frequency must be a number in hertz.", " (0 is a static field)"),
  amplitude_uT: bounded("the field amplitude", INPUT_LIMITS.amplitude_uT, "Field amplitude must be a number in microtesla."),
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

// The construction the as-built figure assumes; absent: a can drawn, a box bent, a sphere of drawn halves.
const cylinder = z.object({
  shape: z.literal("cylinder"),
  dimensions_mm: z.object({ diameter: mm("the inside diameter"), length: mm("the inside length") }),
  ends: z.enum(["closed", "open"], { error: "Ends must be closed or open." }).default("closed"),
  method: z.enum(["drawn", "rolled"], { error: "A can is made drawn or rolled." }).optional(),
  ...common,
});
const sphere = z.object({
  shape: z.literal("sphere"),
  dimensions_mm: z.object({ diameter: mm("the inside diameter") }),
  method: z.literal("drawn", { error: "A sphere is made of drawn halves: method drawn, or leave it out." }).optional(),
  ...common,
});
const box = z.object({
  shape: z.literal("box"),
  dimensions_mm: z.object({ width: mm("the inside width"), depth: mm("the inside depth"), height: mm("the inside height") }),
  method: z.literal("bent", { error: "A box is made bent: method bent, or leave it out." }).optional(),
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
export const predictionIssueFields = issueFields;

// POST /api/predictions/sweep: the prediction body plus how many log-spaced frequencies, and
// the range (the page lets the person change it; it always includes the asked frequency).
export const SWEEP_FROM_HZ = 1;
export const SWEEP_TO_HZ = 10_000;
const sweepHz = (what: string) =>
  z
    .number({ error: `${cap(what)} must be a number in hertz.` })
    .min(0.01, { error: `${cap(what)} is too small: at least 0.01 Hz (a log scale cannot start at DC).` })
    .max(MAX_FREQUENCY_HZ, { error: `${cap(what)} is too large: at most ${MAX_FREQUENCY_HZ} Hz.` });
export const sweepOptionsSchema = z
  .object({
    points: z
      .number({ error: "Points must be a whole number." })
      .int({ error: "Points must be a whole number." })
      .min(2, { error: "Ask for at least 2 points." })
      .max(400, { error: "Ask for at most 400 points." })
      .default(100),
    from_hz: sweepHz("the lowest frequency").default(SWEEP_FROM_HZ),
    to_hz: sweepHz("the highest frequency").default(SWEEP_TO_HZ),
  })
  .refine((o) => o.to_hz >= o.from_hz * 1.5, { path: ["to_hz"], message: "The highest frequency must be at least 1.5 times the lowest." });
export type SweepOptions = z.infer<typeof sweepOptionsSchema>;
