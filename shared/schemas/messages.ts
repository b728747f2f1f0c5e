import { z } from "zod";

// The one error map of every request schema, used alike by the server (parseInput, so the 400's
// `fields` read this way) and by the client's forms (the same schemas through the zod resolver):
// each message names the field in plain words and says what would be right — "Seam overlap must
// be at least 0 mm." — never zod's own "Invalid input: expected number, received NaN".
// A schema's own message (for a rule that needs its own words) still comes first; this map
// speaks for every check that has none. Importing any module of shared/schemas installs it.

/** How a field is named in a sentence, and the unit its numbers are in. */
export interface FieldWords {
  /** lower case unless a proper term ("K-factor", "μr"); capitalised at a sentence's start */
  label: string;
  unit?: string;
  /** money in integer minor units: the message speaks of amounts, not cents */
  money?: boolean;
  /** picked from a list rather than typed: "Choose the material." */
  choose?: boolean;
}

// The request fields' own names, by their last key (context where the same key means two things).
const WORDS: Record<string, FieldWords> = {
  // shapes and blanks
  diameter: { label: "inside diameter", unit: "mm" },
  length: { label: "inside length", unit: "mm" },
  width: { label: "inside width", unit: "mm" },
  depth: { label: "inside depth", unit: "mm" },
  height: { label: "inside height", unit: "mm" },
  thickness_mm: { label: "sheet thickness", unit: "mm" },
  cornerRadius_mm: { label: "corner radius", unit: "mm" },
  trim_mm: { label: "trim allowance", unit: "mm" },
  seamOverlap_mm: { label: "seam overlap", unit: "mm" },
  capFlange_mm: { label: "cap flange", unit: "mm" },
  bendRadius_mm: { label: "bend radius", unit: "mm" },
  kFactor: { label: "K-factor" },
  lid: { label: "lid" },
  lidHeight_mm: { label: "lid height", unit: "mm" },
  lidClearance_mm: { label: "lid clearance", unit: "mm" },
  gap_mm: { label: "gap", unit: "mm" },
  diameter_mm: { label: "hole diameter", unit: "mm" },
  collarLength_mm: { label: "collar length", unit: "mm" },
  material: { label: "material", choose: true },
  shape: { label: "shape", choose: true },
  method: { label: "method", choose: true },
  quantity: { label: "quantity" },
  layers: { label: "layers" },
  holes: { label: "holes" },
  // the shop rates
  currency: { label: "currency" },
  materials: { label: "material prices" },
  materialId: { label: "material", choose: true },
  pricePerKg_cents: { label: "price per kg", money: true },
  scrapCreditPerKg_cents: { label: "scrap credit per kg", money: true },
  scrapCredit: { label: "scrap credit" },
  blankingPerPart_cents: { label: "blanking rate per blank", money: true },
  formingPerDrawStage_cents: { label: "rate per draw stage", money: true },
  formingPerBend_cents: { label: "rate per bend", money: true },
  processAnnealPerAnneal_cents: { label: "rate per process anneal", money: true },
  weldingPerMetre_cents: { label: "welding rate per metre", money: true },
  cleaningPerPart_cents: { label: "cleaning rate per piece", money: true },
  hydrogenAnnealPerLoad_cents: { label: "hydrogen anneal rate per furnace load", money: true },
  partsPerFurnaceLoad: { label: "pieces per furnace load" },
  verificationPerSampledPart_cents: { label: "verification rate per sampled part", money: true },
  packingPerPart_cents: { label: "packing rate per piece", money: true },
  setupPerJob_cents: { label: "setup rate per job", money: true },
  marginPercent: { label: "margin", unit: "%" },
  quantityBreaks: { label: "quantity breaks" },
  minQuantity: { label: "break quantity" },
  discountPercent: { label: "discount", unit: "%" },
  fallbackUtilisation: { label: "utilisation when no sheet fits" },
  stockSheets: { label: "stock sheets" },
  width_mm: { label: "sheet width", unit: "mm" },
  length_mm: { label: "sheet length", unit: "mm" },
  formingLimits: { label: "forming limits" },
  firstDrawRatio: { label: "first draw ratio" },
  redrawRatio: { label: "redraw ratio" },
  processAnnealBetweenDraws: { label: "anneal between draws" },
  // materials
  B_T: { label: "flux density", unit: "T" },
  mu_r: { label: "μr" },
  saturation_T: { label: "saturation", unit: "T" },
  resistivity_ohm_m: { label: "resistivity", unit: "Ω·m" },
  density_kg_m3: { label: "density", unit: "kg/m³" },
  asFormedFactor: { label: "as-formed factor" },
  initial: { label: "initial μr" },
  maximum: { label: "maximum μr" },
  // people
  email: { label: "email address" },
  password: { label: "password" },
  name: { label: "name" },
  organization: { label: "organisation" },
  organizationId: { label: "organisation", choose: true },
  role: { label: "role", choose: true },
  token: { label: "link" },
  active: { label: "active" },
};

// Keys whose meaning depends on where they sit: a thickness in a layer is its wall, in a stock
// sheet its gauge.
const IN_CONTEXT: Record<string, Record<string, FieldWords>> = {
  layers: { thickness_mm: { label: "wall thickness", unit: "mm" } },
  stockSheets: { thickness_mm: { label: "gauge", unit: "mm" } },
  formingLimits: {},
};

const UNIT_SUFFIXES: Array<[RegExp, Omit<FieldWords, "label">]> = [
  [/_mm$/, { unit: "mm" }],
  [/_kg$/, { unit: "kg" }],
  [/_T$/, { unit: "T" }],
  [/_uT$/, { unit: "µT" }],
  [/_hz$/, { unit: "Hz" }],
  [/_db$/, { unit: "dB" }],
  [/_c$/, { unit: "°C" }],
  [/_min$/, { unit: "min" }],
  [/_cents$/, { money: true }],
  [/Percent$/, { unit: "%" }],
];

/** "seamOverlap_mm" → "seam overlap" (the fallback for a key the table does not know). */
function humanise(key: string): FieldWords {
  let stem = key;
  let extra: Omit<FieldWords, "label"> = {};
  for (const [pattern, words] of UNIT_SUFFIXES) {
    if (pattern.test(stem)) {
      stem = stem.replace(pattern, "");
      extra = words;
      break;
    }
  }
  const label = stem.replace(/_/g, " ").replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase().trim() || "this value";
  return { label, ...extra };
}

/** The words for a field path as the API names it ("layers.1.thickness_mm" → wall thickness of layer 2). */
export function fieldWords(path: ReadonlyArray<PropertyKey>): FieldWords {
  const keys = path.filter((k): k is string => typeof k === "string");
  const last = keys[keys.length - 1];
  if (last === undefined) return { label: "this value" };
  const context = keys.slice(0, -1).reverse().find((k) => k in IN_CONTEXT);
  const words = (context && IN_CONTEXT[context][last]) || WORDS[last] || humanise(last);
  // a layer or a hole is named by its place, counted from one as the page counts them
  const i = path.findIndex((k) => k === "layers" || k === "holes");
  const index = i >= 0 ? path[i + 1] : undefined;
  if (typeof index === "number" && path.length > i + 2) return { ...words, label: `${words.label} of ${path[i] === "layers" ? "layer" : "hole"} ${index + 1}` };
  return words;
}

const capital = (s: string) => (s ? s[0].toUpperCase() + s.slice(1) : s);
const withUnit = (x: number | bigint, w: FieldWords) => {
  const n = typeof x === "bigint" ? x.toString() : String(+Number(x).toPrecision(6));
  return w.unit ? (w.unit === "%" ? `${n} %` : `${n} ${w.unit}`) : n;
};
const inUnit = (w: FieldWords) => (w.unit && w.unit !== "%" ? ` in ${w.unit}` : "");
const enter = (w: FieldWords) => `${w.choose ? "Choose" : "Enter"} the ${w.label}`;

type Issue = Parameters<z.core.$ZodErrorMap>[0];

/** One sentence for one issue, naming the field. */
export function describeIssue(issue: Issue): string {
  const w = fieldWords(issue.path ?? []);
  const Label = capital(w.label);
  const i = issue as Issue & Record<string, unknown>;
  switch (issue.code) {
    case "invalid_type": {
      const input = i.input;
      const expected = String(i.expected);
      if (input === undefined || input === null || input === "") {
        return expected === "number" || expected === "int" ? `${enter(w)}${inUnit(w)}.` : expected === "array" ? `Give the ${w.label}.` : `${enter(w)}.`;
      }
      if (expected === "number") return `${Label} must be a number${inUnit(w)}.`;
      if (expected === "int") return w.money ? `${Label} must be in whole cents.` : `${Label} must be a whole number.`;
      if (expected === "boolean") return `${Label} must be yes or no.`;
      if (expected === "array") return `${Label} must be a list.`;
      if (expected === "object") return `${Label} must be a group of values.`;
      return `${Label} must be text.`;
    }
    case "too_small": {
      const min = i.minimum as number | bigint;
      if (i.origin === "string") return Number(min) <= 1 ? `${enter(w)}.` : `${Label} must be at least ${min} characters long.`;
      if (i.origin === "array" || i.origin === "set") return `Give at least ${min} ${Number(min) === 1 ? "entry" : "entries"} for the ${w.label}.`;
      if (w.money && Number(min) === 0) return `${Label} must not be negative.`;
      if (i.inclusive === false) return `${Label} must be more than ${withUnit(min, w)}.`;
      if (!w.unit && Number(min) === 0) return `${Label} must not be negative.`;
      return `${Label} must be at least ${withUnit(min, w)}.`;
    }
    case "too_big": {
      const max = i.maximum as number | bigint;
      if (i.origin === "string") return `${Label} must be at most ${max} characters long.`;
      if (i.origin === "array" || i.origin === "set") return `Give at most ${max} ${Number(max) === 1 ? "entry" : "entries"} for the ${w.label}.`;
      if (i.inclusive === false) return `${Label} must be less than ${withUnit(max, w)}.`;
      return `${Label} must be at most ${withUnit(max, w)}.`;
    }
    case "not_multiple_of":
      return `${Label} must be a multiple of ${String(i.divisor)}.`;
    case "invalid_value": {
      const values = (i.values as unknown[] | undefined)?.map((v) => String(v)) ?? [];
      return values.length === 1 ? `${Label} must be ${values[0]}.` : `${Label} must be one of: ${values.join(", ")}.`;
    }
    case "invalid_format":
      return i.format === "email" ? `Enter a valid ${w.label}.` : `${Label} is not in the expected form.`;
    case "unrecognized_keys":
      return `Leave out ${((i.keys as string[] | undefined) ?? []).join(", ")}: ${((i.keys as string[] | undefined)?.length ?? 0) === 1 ? "it is" : "they are"} not part of this form.`;
    case "invalid_union":
      return `${Label} is not one of the accepted kinds.`;
    default:
      return `${Label} is not valid.`;
  }
}

z.config({ customError: (issue) => describeIssue(issue) });

/** Issues as the API's `fields` map, first message per dotted path ("body" for the whole body). */
export function issueFields(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".") || "body";
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}
