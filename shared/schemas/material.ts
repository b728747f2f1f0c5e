import type { MuPoint } from "../physics/materials";
import { z } from "zod";
import "./messages"; // the one error map: every field named in plain words

// A row of the materials library as the admin edits it (PUT /api/materials/:id, POST /api/materials).
// Every value carries a source tag, so a reader can tell a published figure from shop practice
// or from memory: the tag must contain one of the markers below.

export const SOURCE_MARKERS = ["[pub]", "[practice]", "[memory]", "[derived]"] as const;

/** The values that each need a source tag. */
export const TAGGED_VALUES = ["relativePermeability", "saturation_T", "resistivity_ohm_m", "density_kg_m3", "muCurve", "asFormedFactor"] as const;
export type TaggedValue = (typeof TAGGED_VALUES)[number];

export const tagLabels: Record<TaggedValue, string> = {
  relativePermeability: "Relative permeability",
  saturation_T: "Saturation",
  resistivity_ohm_m: "Resistivity",
  density_kg_m3: "Density",
  muCurve: "μ(B) curve",
  asFormedFactor: "As-formed factor",
};

const sourceTag = z
  .string({ error: "Give the source of this value." })
  .trim()
  .min(1, { error: "Give the source of this value." })
  .max(300, { error: "Keep the source under 300 characters." })
  .refine((s) => SOURCE_MARKERS.some((m) => s.includes(m)), { error: `Mark the source as ${SOURCE_MARKERS.join(", ")}.` });

const muPoint = z.object({
  B_T: z.number({ error: "Flux density must be a number in tesla." }).positive({ error: "Flux density must be greater than 0 T." }).max(10, { error: "Flux density must be at most 10 T." }),
  mu_r: z.number({ error: "μr must be a number." }).min(1, { error: "μr must be at least 1." }).max(10_000_000, { error: "μr must be at most 10 000 000." }),
});

export const materialIdSchema = z
  .string({ error: "Give an id." })
  .trim()
  .regex(/^[a-z0-9][a-z0-9-]{0,39}$/, { error: "Use 1–40 lower-case letters, digits and dashes, e.g. ni80." });

const fields = {
  name: z.string({ error: "Give a name." }).trim().min(1, { error: "Give a name." }).max(200, { error: "Keep the name under 200 characters." }),
  relativePermeability: z.object({
    initial: z.number({ error: "Initial μr must be a number." }).min(1, { error: "Initial μr must be at least 1." }).max(10_000_000),
    maximum: z.number({ error: "Maximum μr must be a number." }).min(1, { error: "Maximum μr must be at least 1." }).max(10_000_000),
  }),
  saturation_T: z.number({ error: "Saturation must be a number in tesla, or empty for a non-magnetic metal." }).positive({ error: "Saturation must be greater than 0 T." }).max(5, { error: "Saturation must be at most 5 T." }).nullable(),
  resistivity_ohm_m: z.number({ error: "Resistivity must be a number in ohm·m." }).positive({ error: "Resistivity must be greater than 0." }).max(1, { error: "Resistivity must be at most 1 Ω·m." }),
  density_kg_m3: z.number({ error: "Density must be a number in kg/m³." }).min(100, { error: "Density must be at least 100 kg/m³." }).max(30_000, { error: "Density must be at most 30 000 kg/m³." }),
  muCurve: z.array(muPoint, { error: "The μ(B) curve must be a list of points." }).min(1, { error: "Give at least one μ(B) point." }).max(40, { error: "At most 40 μ(B) points." }),
  asFormedFactor: z.number({ error: "The as-formed factor must be a number." }).positive({ error: "The as-formed factor must be greater than 0." }).max(1, { error: "The as-formed factor must be at most 1 (forming never raises μ)." }),
  source: z.string({ error: "Give the sources." }).trim().min(1, { error: "Give the sources." }).max(2000, { error: "Keep the sources under 2000 characters." }),
  sourceTags: z.object(Object.fromEntries(TAGGED_VALUES.map((k) => [k, sourceTag])) as Record<TaggedValue, typeof sourceTag>, { error: "Give a source tag for each value." }),
  active: z.boolean({ error: "Active must be true or false." }).default(true),
};

type Body = { relativePermeability: { initial: number; maximum: number }; muCurve: { B_T: number }[] };

function crossChecks(m: Body, ctx: z.RefinementCtx) {
  if (m.relativePermeability.maximum < m.relativePermeability.initial)
    ctx.addIssue({ code: "custom", path: ["relativePermeability", "maximum"], message: "Maximum μr cannot be below the initial μr." });
  // the curve is interpolated on log(B): the points must rise in B
  m.muCurve.forEach((p, i) => {
    if (i > 0 && p.B_T <= m.muCurve[i - 1].B_T)
      ctx.addIssue({ code: "custom", path: ["muCurve", i, "B_T"], message: "Each point's flux density must be higher than the one before." });
  });
}

export const materialUpdateSchema = z.object(fields).superRefine(crossChecks);
export const materialCreateSchema = z.object({ id: materialIdSchema, ...fields }).superRefine(crossChecks);

export type MaterialUpdate = z.output<typeof materialUpdateSchema>;
export type MaterialUpdateInput = z.input<typeof materialUpdateSchema>;
export type MaterialCreate = z.output<typeof materialCreateSchema>;

/** GET /api/materials, one row: the contract's fields, then what the design-check page also needs. */
export interface MaterialJson {
  id: string;
  name: string;
  relativePermeability: { initial: number; maximum: number };
  saturation_T: number | null;
  resistivity_ohm_m: number;
  density_kg_m3: number;
  source: string;
  muCurve: MuPoint[];
  asFormedFactor: number;
  sourceTags: Record<string, string>;
}

/** GET /api/materials/all, one row: the admin's view adds the flag and the dates. */
export interface MaterialRecordJson extends MaterialJson {
  active: boolean;
  createdAt: string;
  updatedAt: string;
}

/** GET /api/materials/:id/history, one recorded change, newest first. */
export interface MaterialChangeJson {
  id: string;
  action: string;
  at: string;
  actor: { id: string; name: string } | null;
  changes: Array<{ path: string; before: unknown; after: unknown }>;
  before: unknown;
  after: unknown;
}
