// The design advisor's requirement form as a pure mapping: the draft the form keeps (canonical
// units: mm, µT, Hz, kg; null for an empty box, NaN for unreadable text) → the body of
// POST /api/design-advice, checked with the server's own schema; the API's field paths → the
// form's fields; and the requirement ↔ the address bar, so reload repeats a search and a link
// shares it.
//
//   shape=cylinder&d=50&l=120&att=60&f=60&B=100&dir=transverse&qty=10&layers=3
//   &mat=ni80&method=drawn&od=80&kg=2&lu=mm&fu=uT&fq=Hz

import { designAdviceRequestSchema, DEFAULT_ADVICE_LAYERS, MAX_ADVICE_LAYERS, type DesignAdviceRequest } from "../../../shared/schemas/design-advice";
import { issueFields } from "../../../shared/schemas/messages";
import type { FieldUnit, FrequencyUnit, LengthUnit } from "../../../shared/units";

export type Kept = number | null;
export type AdviceShape = "cylinder" | "box";
export type CanMethod = "drawn" | "rolled";
export const canMethods: readonly CanMethod[] = ["drawn", "rolled"];

export const adviceLengthUnits = ["mm", "in"] as const satisfies readonly LengthUnit[];
export const adviceFieldUnits = ["uT", "mT", "G", "mG", "A/m", "Oe"] as const satisfies readonly FieldUnit[];
export const adviceFrequencyUnits = ["Hz", "kHz"] as const satisfies readonly FrequencyUnit[];
export interface AdviceUnits {
  length: (typeof adviceLengthUnits)[number];
  field: (typeof adviceFieldUnits)[number];
  frequency: (typeof adviceFrequencyUnits)[number];
}

export type DimensionKey = "diameter" | "length" | "width" | "depth" | "height";
export const dimensionsOf: Record<AdviceShape, readonly DimensionKey[]> = { cylinder: ["diameter", "length"], box: ["width", "depth", "height"] };

export interface RequirementDraft {
  shape: AdviceShape;
  /** inside size, mm */
  inside: Record<DimensionKey, Kept>;
  requiredAttenuation_db: Kept;
  frequency_hz: Kept;
  amplitude_uT: Kept;
  /** a can's field across or along its axis; a box is figured across */
  orientation: "transverse" | "axial";
  quantity: Kept;
  maxLayers: number;
  /** library ids; empty: every alloy the shop stocks */
  materials: string[];
  /** a can's methods; empty: both */
  methods: CanMethod[];
  /** largest outside size, mm; null: no limit */
  outside: Record<DimensionKey, Kept>;
  maxMass_kg: Kept;
  units: AdviceUnits;
}

const noSize = (): Record<DimensionKey, Kept> => ({ diameter: null, length: null, width: null, depth: null, height: null });

/** A can of 50 mm × 120 mm inside, 60 dB at 60 Hz in 100 µT across it, ten off: a typical first question. */
export function defaultRequirement(): RequirementDraft {
  return {
    shape: "cylinder",
    inside: { diameter: 50, length: 120, width: 60, depth: 60, height: 60 },
    requiredAttenuation_db: 60,
    frequency_hz: 60,
    amplitude_uT: 100,
    orientation: "transverse",
    quantity: 10,
    maxLayers: DEFAULT_ADVICE_LAYERS,
    materials: [],
    methods: [],
    outside: noSize(),
    maxMass_kg: null,
    units: { length: "mm", field: "uT", frequency: "Hz" },
  };
}

/** The body as typed (the schema says what is wrong with it); empty optional limits are left out. */
export function toRequestBody(d: RequirementDraft): unknown {
  const keys = dimensionsOf[d.shape];
  const value = (x: Kept) => (x === null ? undefined : x);
  const outside = Object.fromEntries(keys.filter((k) => d.outside[k] !== null).map((k) => [k, d.outside[k]]));
  return {
    shape: d.shape,
    dimensions_mm: Object.fromEntries(keys.map((k) => [k, value(d.inside[k])])),
    requiredAttenuation_db: value(d.requiredAttenuation_db),
    field: { frequency_hz: value(d.frequency_hz), amplitude_uT: value(d.amplitude_uT), orientation: d.shape === "cylinder" ? d.orientation : "transverse" },
    quantity: value(d.quantity),
    constraints: {
      maxLayers: d.maxLayers,
      ...(d.materials.length ? { materials: d.materials } : {}),
      ...(d.shape === "cylinder" && d.methods.length ? { methods: d.methods } : {}),
      ...(Object.keys(outside).length ? { maxOutside_mm: outside } : {}),
      ...(d.maxMass_kg !== null ? { maxMass_kg: d.maxMass_kg } : {}),
    },
  };
}

export type RequirementErrors = Record<string, string>;

/** The API's field path → the form's field name ("constraints.maxOutside_mm.length" → "outside.length"). */
export function requirementField(path: string): string {
  const rules: Array<[RegExp, (m: RegExpExecArray) => string]> = [
    [/^dimensions_mm\.(\w+)/, (m) => `inside.${m[1]}`],
    [/^dimensions_mm$/, () => "inside"],
    [/^requiredAttenuation_db/, () => "requiredAttenuation_db"],
    [/^field\.frequency_hz/, () => "frequency_hz"],
    [/^field\.amplitude_uT/, () => "amplitude_uT"],
    [/^field\.orientation/, () => "orientation"],
    [/^quantity/, () => "quantity"],
    [/^constraints\.maxLayers/, () => "maxLayers"],
    [/^constraints\.materials/, () => "materials"],
    [/^constraints\.methods/, () => "methods"],
    [/^constraints\.maxOutside_mm\.(\w+)/, (m) => `outside.${m[1]}`],
    [/^constraints\.maxMass_kg/, () => "maxMass_kg"],
    [/^shape/, () => "shape"],
  ];
  for (const [re, name] of rules) {
    const m = re.exec(path);
    if (m) return name(m);
  }
  // the rest (a search too large, gauges the shop does not stock) is about the limits as a whole
  return "constraints";
}

/** API field messages → the form's fields (the first message for each). */
export function requirementErrors(fields: Record<string, string>): RequirementErrors {
  const errors: RequirementErrors = {};
  for (const [path, message] of Object.entries(fields)) errors[requirementField(path)] ??= message;
  return errors;
}

/** The draft checked with the server's schema: the request to send, or the messages for the fields. */
export function checkRequirement(d: RequirementDraft): { request: DesignAdviceRequest; errors: null } | { request: null; errors: RequirementErrors } {
  const parsed = designAdviceRequestSchema.safeParse(toRequestBody(d));
  if (parsed.success) return { request: parsed.data, errors: null };
  return { request: null, errors: requirementErrors(issueFields(parsed.error)) };
}

// --- the address bar ---

/** Twelve significant figures: exact for anything typed, free of float noise from a unit conversion. */
const num = (x: Kept): string => (x === null ? "" : Number.isNaN(x) ? "x" : String(+x.toPrecision(12)));
const read = (s: string | null, fallback: Kept): Kept => {
  if (s === null) return fallback;
  if (s === "") return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : NaN;
};
const oneOf = <T extends string>(s: string | null, allowed: readonly T[], fallback: T): T => (s !== null && (allowed as readonly string[]).includes(s) ? (s as T) : fallback);
const SIZE_PARAMS: Record<DimensionKey, string> = { diameter: "d", length: "l", width: "w", depth: "dp", height: "h" };

/** The requirement as search parameters, in a fixed order (equal requirements give equal strings). */
export function requirementToParams(d: RequirementDraft): URLSearchParams {
  const p = new URLSearchParams();
  p.set("shape", d.shape);
  for (const k of dimensionsOf[d.shape]) p.set(SIZE_PARAMS[k], num(d.inside[k]));
  p.set("att", num(d.requiredAttenuation_db));
  p.set("f", num(d.frequency_hz));
  p.set("B", num(d.amplitude_uT));
  if (d.shape === "cylinder") p.set("dir", d.orientation);
  p.set("qty", num(d.quantity));
  p.set("layers", String(d.maxLayers));
  [...d.materials].sort().forEach((m) => p.append("mat", m));
  if (d.shape === "cylinder") canMethods.filter((m) => d.methods.includes(m)).forEach((m) => p.append("method", m));
  for (const k of dimensionsOf[d.shape]) if (d.outside[k] !== null) p.set(`o${SIZE_PARAMS[k]}`, num(d.outside[k]));
  if (d.maxMass_kg !== null) p.set("kg", num(d.maxMass_kg));
  p.set("lu", d.units.length);
  p.set("fu", d.units.field);
  p.set("fq", d.units.frequency);
  return p;
}

/** A requirement from search parameters, or null when none was asked (a bare link); unreadable values come through as NaN for the form to name. */
export function requirementFromParams(p: URLSearchParams): RequirementDraft | null {
  if (!p.has("shape")) return null;
  const base = defaultRequirement();
  const shape = oneOf(p.get("shape"), ["cylinder", "box"] as const, base.shape);
  const inside = { ...base.inside }, outside = noSize();
  for (const k of Object.keys(SIZE_PARAMS) as DimensionKey[]) {
    inside[k] = read(p.get(SIZE_PARAMS[k]), base.inside[k]);
    outside[k] = read(p.get(`o${SIZE_PARAMS[k]}`), null);
  }
  const layers = Number(p.get("layers"));
  return {
    shape,
    inside,
    requiredAttenuation_db: read(p.get("att"), base.requiredAttenuation_db),
    frequency_hz: read(p.get("f"), base.frequency_hz),
    amplitude_uT: read(p.get("B"), base.amplitude_uT),
    orientation: oneOf(p.get("dir"), ["transverse", "axial"] as const, base.orientation),
    quantity: read(p.get("qty"), base.quantity),
    maxLayers: Number.isInteger(layers) && layers >= 1 && layers <= MAX_ADVICE_LAYERS ? layers : base.maxLayers,
    materials: [...new Set(p.getAll("mat").map((m) => m.slice(0, 64)).filter(Boolean))].slice(0, 10).sort(),
    methods: canMethods.filter((m) => p.getAll("method").includes(m)),
    outside,
    maxMass_kg: read(p.get("kg"), null),
    units: {
      length: oneOf(p.get("lu"), adviceLengthUnits, base.units.length),
      field: oneOf(p.get("fu"), adviceFieldUnits, base.units.field),
      frequency: oneOf(p.get("fq"), adviceFrequencyUnits, base.units.frequency),
    },
  };
}

/** The asked requirement ↔ the address bar; null (nothing asked yet) is a bare address. */
export const readAsked = (p: URLSearchParams): RequirementDraft | null => requirementFromParams(p);
export const writeAsked = (d: RequirementDraft | null): URLSearchParams => (d ? requirementToParams(d) : new URLSearchParams());
