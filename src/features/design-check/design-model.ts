// The design-check form as the person types it (strings, their own units) and its translation
// into the API's body (millimetres, microtesla), checked with the same schema the server uses.

import { predictionIssueFields, predictionRequestSchema, type PredictionRequest } from "../../../shared/schemas/prediction";
import { fieldUnitLabels, toMicrotesla, toMillimetres, type FieldUnit, type LengthUnit } from "../../../shared/units";

export const designLengthUnits = ["mm", "in", "mil"] as const satisfies readonly LengthUnit[];
export const designFieldUnits = ["uT", "mT", "G", "mG", "A/m", "Oe"] as const satisfies readonly FieldUnit[];
export type DesignLengthUnit = (typeof designLengthUnits)[number];
export type DesignFieldUnit = (typeof designFieldUnits)[number];
export const lengthUnitNames: Record<DesignLengthUnit, string> = { mm: "mm", in: "inches", mil: "mil (0.001 in)" };
export const fieldUnitNames: Record<DesignFieldUnit, string> = Object.fromEntries(designFieldUnits.map((u) => [u, fieldUnitLabels[u]])) as Record<DesignFieldUnit, string>;

export type Shape = "cylinder" | "box" | "sphere";

export interface LayerDraft {
  /** stable React key; not sent */
  key: number;
  kind: "library" | "custom";
  material: string;
  mu_r: string;
  /** µΩ·m, as alloy data sheets give it */
  resistivity: string;
  saturation: string;
  thickness: string;
  /** clear space to the next layer outward; unused on the outermost layer */
  gap: string;
}

export interface HoleDraft {
  /** stable React key; not sent */
  key: number;
  diameter: string;
  /** empty or 0: a plain hole without a collar */
  collar: string;
}

export interface DesignDraft {
  shape: Shape;
  unit: DesignLengthUnit;
  diameter: string;
  length: string;
  width: string;
  depth: string;
  height: string;
  ends: "closed" | "open";
  layers: LayerDraft[];
  state: "annealed" | "as-formed";
  amplitude: string;
  fieldUnit: DesignFieldUnit;
  frequency: string;
  orientation: "transverse" | "axial";
  /** how a can is made (a box is bent, a sphere of drawn halves): the construction the as-built figure assumes */
  method: "drawn" | "rolled";
  /** cable holes, each with its collar (chimney); absent or empty: none */
  holes?: HoleDraft[];
  /** the exact millimetres behind figures produced by a unit switch (see the form's inUnit) */
  exact?: Record<string, { text: string; mm: number }>;
}

let nextKey = 1;
export const newLayerKey = () => nextKey++;

export function newLayer(overrides: Partial<LayerDraft> = {}): LayerDraft {
  return { key: newLayerKey(), kind: "library", material: "ni80", mu_r: "20000", resistivity: "0.58", saturation: "0.75", thickness: "1", gap: "10", ...overrides };
}

/** The page takes this many holes; the API takes more (MAX_HOLES), a drawing of them would not. */
export const MAX_PAGE_HOLES = 8;

/** A 10 mm hole with a 20 mm collar (two diameters), in the unit the page is using. */
export function newHole(unit: DesignLengthUnit, overrides: Partial<HoleDraft> = {}): HoleDraft {
  const sizes: Record<DesignLengthUnit, [string, string]> = { mm: ["10", "20"], in: ["0.4", "0.8"], mil: ["400", "800"] };
  const [diameter, collar] = sizes[unit];
  return { key: newLayerKey(), diameter, collar, ...overrides };
}

/** A 50 mm × 120 mm closed can, one 1 mm ni80 layer, 100 µT at 60 Hz across the axis: a result at once. */
export const defaultDesign = (): DesignDraft => ({
  shape: "cylinder",
  unit: "mm",
  diameter: "50",
  length: "120",
  width: "80",
  depth: "60",
  height: "40",
  ends: "closed",
  layers: [newLayer()],
  state: "annealed",
  amplitude: "100",
  fieldUnit: "uT",
  frequency: "60",
  orientation: "transverse",
  method: "drawn",
});

// An empty box is sent as null and a typo as NaN, so the schema's own message says what is wrong.
const parse = (s: string): number => (s.trim() === "" ? (null as unknown as number) : Number(s.trim().replace(",", ".")));
const length = (s: string, unit: DesignLengthUnit) => {
  const v = parse(s);
  return typeof v === "number" && Number.isFinite(v) ? toMillimetres(v, unit) : v;
};

/** The API body for the draft (not yet checked). */
export function toRequestBody(d: DesignDraft): Record<string, unknown> {
  const L = (s: string) => length(s, d.unit);
  const dimensions_mm =
    d.shape === "box" ? { width: L(d.width), depth: L(d.depth), height: L(d.height) } : d.shape === "sphere" ? { diameter: L(d.diameter) } : { diameter: L(d.diameter), length: L(d.length) };
  const layers = d.layers.map((l, i) => {
    const outermost = i === d.layers.length - 1;
    const gap = outermost || l.gap.trim() === "" ? {} : { gap_mm: L(l.gap) };
    if (l.kind === "library") return { material: l.material, thickness_mm: L(l.thickness), ...gap };
    const rho = parse(l.resistivity);
    return {
      mu_r: parse(l.mu_r),
      resistivity_ohm_m: typeof rho === "number" && Number.isFinite(rho) ? rho * 1e-6 : rho,
      ...(l.saturation.trim() === "" ? {} : { saturation_T: parse(l.saturation) }),
      thickness_mm: L(l.thickness),
      ...gap,
    };
  });
  const amplitude = parse(d.amplitude);
  // an empty collar box is a plain hole (0 mm), as the hint says
  const holes = (d.holes ?? []).map((h) => ({ diameter_mm: L(h.diameter), collarLength_mm: h.collar.trim() === "" ? 0 : L(h.collar) }));
  return {
    shape: d.shape,
    dimensions_mm,
    ...(d.shape === "cylinder" ? { ends: d.ends } : {}),
    layers,
    field: {
      frequency_hz: parse(d.frequency),
      amplitude_uT: typeof amplitude === "number" && Number.isFinite(amplitude) ? toMicrotesla(amplitude, d.fieldUnit) : amplitude,
      orientation: d.shape === "cylinder" ? d.orientation : "transverse",
    },
    state: d.state,
    ...(d.shape === "cylinder" ? { method: d.method } : d.shape === "box" ? { method: "bent" } : {}),
    ...(holes.length ? { holes } : {}),
  };
}

export type DraftErrors = Record<string, string>;

/** The API's field path → the form's field name ("layers.1.thickness_mm" → "layers.1.thickness"). */
export function draftField(path: string): string | null {
  const layer = /^layers\.(\d+)\.(\w+)/.exec(path);
  if (layer) {
    const names: Record<string, string> = { material: "material", mu_r: "mu_r", resistivity_ohm_m: "resistivity", saturation_T: "saturation", thickness_mm: "thickness", gap_mm: "gap" };
    return `layers.${layer[1]}.${names[layer[2]] ?? "thickness"}`;
  }
  const hole = /^holes\.(\d+)(?:\.(\w+))?/.exec(path);
  if (hole) return `holes.${hole[1]}.${hole[2] === "collarLength_mm" ? "collar" : "diameter"}`;
  const top: Record<string, string> = {
    "dimensions_mm.diameter": "diameter", "dimensions_mm.length": "length", "dimensions_mm.width": "width", "dimensions_mm.depth": "depth",
    "dimensions_mm.height": "height", "field.frequency_hz": "frequency", "field.amplitude_uT": "amplitude", "field.orientation": "orientation",
    state: "state", ends: "ends", shape: "shape", layers: "layers", holes: "holes", method: "method",
  };
  return top[path] ?? null;
}

/** API field messages → the form's fields, and whatever has no field of its own. */
export function draftErrors(fields: Record<string, string>): { errors: DraftErrors; other: string[] } {
  const errors: DraftErrors = {};
  const other: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    const name = draftField(path);
    if (name) errors[name] ??= message;
    else other.push(message);
  }
  return { errors, other };
}

/** The draft checked with the server's schema: the request to send, or the messages for the fields. */
export function checkDraft(d: DesignDraft): { request: PredictionRequest; errors: null } | { request: null; errors: Record<string, string> } {
  const parsed = predictionRequestSchema.safeParse(toRequestBody(d));
  if (parsed.success) return { request: parsed.data, errors: null };
  return { request: null, errors: predictionIssueFields(parsed.error) };
}

/** A short description of a design for the variant list and the chart legend. */
export function describeDesign(r: PredictionRequest, materialName: (id: string) => string = (id) => id): string {
  const d = r.dimensions_mm as Record<string, number>;
  const size = r.shape === "box" ? `box ${fmt(d.width)} × ${fmt(d.depth)} × ${fmt(d.height)} mm` : r.shape === "sphere" ? `sphere Ø ${fmt(d.diameter)} mm` : `can Ø ${fmt(d.diameter)} × ${fmt(d.length)} mm`;
  const layers = r.layers.map((l) => `${fmt(l.thickness_mm)} mm ${l.material ? materialName(l.material) : `μr ${l.mu_r}`}`).join(" + ");
  const holes = r.holes?.length ? `, ${r.holes.length} cable hole${r.holes.length === 1 ? "" : "s"}` : "";
  return `${size}, ${layers}${holes}`;
}

export const fmt = (x: number, digits = 3) => String(+x.toPrecision(digits));
