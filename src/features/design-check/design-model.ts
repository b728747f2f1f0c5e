// The design-check form's state and its translation into the API's body, checked with the same
// schema the server uses. The state keeps every quantity in the API's canonical unit (mm, µT, Hz,
// µΩ·m for a custom resistivity): the person's units only decide how the inputs and results show
// them, so a unit switch never changes the design (see UnitInput).

import { MAX_LAYERS } from "../../../shared/schemas/prediction";
import { predictionIssueFields, predictionRequestSchema, type PredictionRequest } from "../../../shared/schemas/prediction";
import { DEFAULT_PART } from "../../../shared/construction-defaults";
import { fieldUnitLabels, fromMillimetres, unitSymbols, type FieldUnit, type FrequencyUnit, type LengthUnit } from "../../../shared/units";

export const designLengthUnits = ["mm", "in", "mil"] as const satisfies readonly LengthUnit[];
export const designFieldUnits = ["uT", "mT", "G", "mG", "A/m", "Oe"] as const satisfies readonly FieldUnit[];
export const designFrequencyUnits = ["Hz", "kHz"] as const satisfies readonly FrequencyUnit[];
export type DesignLengthUnit = (typeof designLengthUnits)[number];
export type DesignFieldUnit = (typeof designFieldUnits)[number];
export type DesignFrequencyUnit = (typeof designFrequencyUnits)[number];
export const lengthUnitNames: Record<DesignLengthUnit, string> = { mm: "mm", in: "inches", mil: "mil (0.001 in)" };
export const fieldUnitNames: Record<DesignFieldUnit, string> = Object.fromEntries(designFieldUnits.map((u) => [u, fieldUnitLabels[u]])) as Record<DesignFieldUnit, string>;

export type Shape = "cylinder" | "box" | "sphere";
/** A kept value: a number in the canonical unit, null when the box is empty, NaN when what was typed is not a number. */
export type Kept = number | null;

export interface LayerDraft {
  /** stable React key; not sent */
  key: number;
  kind: "library" | "custom";
  material: string;
  mu_r: Kept;
  /** µΩ·m, as alloy data sheets give it */
  resistivity_uohm_m: Kept;
  saturation_T: Kept;
  thickness_mm: Kept;
  /** clear space to the next layer outward; unused on the outermost layer */
  gap_mm: Kept;
}

export interface HoleDraft {
  /** stable React key; not sent */
  key: number;
  diameter_mm: Kept;
  /** empty or 0: a plain hole without a collar */
  collar_mm: Kept;
}

/** How the person reads the design; never part of it. */
export interface DesignUnits {
  length: DesignLengthUnit;
  field: DesignFieldUnit;
  frequency: DesignFrequencyUnit;
}

export interface DesignDraft {
  shape: Shape;
  diameter_mm: Kept;
  length_mm: Kept;
  width_mm: Kept;
  depth_mm: Kept;
  height_mm: Kept;
  ends: "closed" | "open";
  /** how a can is made (a box is bent, a sphere of drawn halves): the construction the as-built figure assumes */
  method: "drawn" | "rolled";
  layers: LayerDraft[];
  state: "annealed" | "as-formed";
  amplitude_uT: Kept;
  frequency_hz: Kept;
  orientation: "transverse" | "axial";
  /** cable holes, each with its collar (chimney) */
  holes: HoleDraft[];
  units: DesignUnits;
}

let nextKey = 1;
export const newKey = () => nextKey++;

export function newLayer(overrides: Partial<LayerDraft> = {}): LayerDraft {
  return { key: newKey(), kind: "library", material: DEFAULT_PART.material, mu_r: 20000, resistivity_uohm_m: 0.58, saturation_T: 0.75, thickness_mm: DEFAULT_PART.thickness_mm, gap_mm: 10, ...overrides };
}

/** The page takes this many holes; the API takes more (MAX_HOLES), a drawing of them would not. */
export const MAX_PAGE_HOLES = 8;
export { MAX_LAYERS };

/** A 10 mm hole with a 20 mm collar (two diameters). */
export function newHole(overrides: Partial<HoleDraft> = {}): HoleDraft {
  return { key: newKey(), diameter_mm: 10, collar_mm: 20, ...overrides };
}

/** A 50 mm × 120 mm closed drawn can, one 1 mm ni80 layer, 100 µT at 60 Hz across the axis: a result at once (the flat-blank page opens on the same part). */
export const defaultDesign = (): DesignDraft => ({
  shape: DEFAULT_PART.shape,
  diameter_mm: DEFAULT_PART.diameter_mm,
  length_mm: DEFAULT_PART.length_mm,
  width_mm: 80,
  depth_mm: 60,
  height_mm: 40,
  ends: "closed",
  method: DEFAULT_PART.method,
  layers: [newLayer()],
  state: "annealed",
  amplitude_uT: 100,
  frequency_hz: 60,
  orientation: "transverse",
  holes: [],
  units: { length: "mm", field: "uT", frequency: "Hz" },
});

// An empty box is sent as null, so the schema's own message says what is missing.
const sent = (x: Kept) => (x === null ? (null as unknown as number) : x);

/** The API body for the draft (not yet checked). */
export function toRequestBody(d: DesignDraft): Record<string, unknown> {
  const dimensions_mm =
    d.shape === "box" ? { width: sent(d.width_mm), depth: sent(d.depth_mm), height: sent(d.height_mm) } : d.shape === "sphere" ? { diameter: sent(d.diameter_mm) } : { diameter: sent(d.diameter_mm), length: sent(d.length_mm) };
  const layers = d.layers.map((l, i) => {
    const outermost = i === d.layers.length - 1;
    const gap = outermost || l.gap_mm === null ? {} : { gap_mm: l.gap_mm };
    if (l.kind === "library") return { material: l.material, thickness_mm: sent(l.thickness_mm), ...gap };
    const rho = l.resistivity_uohm_m;
    return {
      mu_r: sent(l.mu_r),
      resistivity_ohm_m: rho === null ? sent(null) : rho * 1e-6,
      ...(l.saturation_T === null ? {} : { saturation_T: l.saturation_T }),
      thickness_mm: sent(l.thickness_mm),
      ...gap,
    };
  });
  // an empty collar box is a plain hole (0 mm), as the hint says
  const holes = d.holes.map((h) => ({ diameter_mm: sent(h.diameter_mm), collarLength_mm: h.collar_mm === null ? 0 : h.collar_mm }));
  return {
    shape: d.shape,
    dimensions_mm,
    ...(d.shape === "cylinder" ? { ends: d.ends } : {}),
    layers,
    field: { frequency_hz: sent(d.frequency_hz), amplitude_uT: sent(d.amplitude_uT), orientation: d.shape === "cylinder" ? d.orientation : "transverse" },
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

export const fmt = (x: number, digits = 3) => String(+x.toPrecision(digits));

/** A length for a sentence or a drawing, in the person's unit: "50 mm", "1.969 in". */
export function lengthText(mm: number, unit: DesignLengthUnit = "mm", digits = 4): string {
  return `${fmt(fromMillimetres(mm, unit), digits)} ${unitSymbols[unit]}`;
}

/** Several lengths with the unit written once: "72 × 142 mm". */
export function sizeText(mms: readonly number[], unit: DesignLengthUnit = "mm", digits = 5): string {
  return `${mms.map((mm) => fmt(fromMillimetres(mm, unit), digits)).join(" × ")} ${unitSymbols[unit]}`;
}

/** A short description of a design for the variant list and the chart legend. */
export function describeDesign(r: PredictionRequest, materialName: (id: string) => string = (id) => id, unit: DesignLengthUnit = "mm"): string {
  const d = r.dimensions_mm as Record<string, number>;
  const L = (x: number) => fmt(fromMillimetres(x, unit), 4);
  const u = unitSymbols[unit];
  const size = r.shape === "box" ? `box ${L(d.width)} × ${L(d.depth)} × ${L(d.height)} ${u}` : r.shape === "sphere" ? `sphere Ø ${L(d.diameter)} ${u}` : `can Ø ${L(d.diameter)} × ${L(d.length)} ${u}`;
  const layers = r.layers.map((l) => `${L(l.thickness_mm)} ${u} ${l.material ? materialName(l.material) : `μr ${l.mu_r}`}`).join(" + ");
  const holes = r.holes?.length ? `, ${r.holes.length} cable hole${r.holes.length === 1 ? "" : "s"}` : "";
  return `${size}, ${layers}${holes}`;
}
