// The flat-blank page's state, its address-bar form and its request body: pure functions, so
// reload keeps the part, a link (the design check's "flat pattern" links among them) opens it,
// and back and forward step through it. Lengths are kept in millimetres whatever unit the page
// shows (`unit`), so switching to inches and back leaves the part exactly as it was.

import { suggestKFactor } from "../../../shared/fabrication/bend";
import { DEFAULT_CORNER_RADIUS_MM, DEFAULT_PART, DEFAULT_SEAM_OVERLAP_MM, DEFAULT_TRIM_MM, defaultBendRadius_mm } from "../../../shared/construction-defaults";
import type { BlankRequest } from "../../../shared/schemas/blank";
import { MAX_ESTIMATE_QUANTITY } from "../../../shared/schemas/price-estimate";
import type { LengthUnit } from "../../../shared/units";

export type PartKind = "box-bent" | "cylinder-drawn" | "cylinder-rolled";
export const partKinds: readonly PartKind[] = ["box-bent", "cylinder-drawn", "cylinder-rolled"];
export const blankLengthUnits = ["mm", "in"] as const satisfies readonly LengthUnit[];
export type BlankLengthUnit = (typeof blankLengthUnits)[number];

/** null: an empty box; NaN: not a number. */
export type Kept = number | null;

export interface BlankForm {
  kind: PartKind;
  width_mm: Kept;
  depth_mm: Kept;
  height_mm: Kept;
  diameter_mm: Kept;
  length_mm: Kept;
  thickness_mm: Kept;
  bendRadius_mm: Kept;
  /** empty: the typical K for the radius and thickness */
  kFactor: Kept;
  cornerRadius_mm: Kept;
  trim_mm: Kept;
  seamOverlap_mm: Kept;
  /** "" for none (no mass) */
  material: string;
  /** pieces for the price (signed in) */
  quantity: Kept;
  unit: BlankLengthUnit;
}

/**
 * The page's first part: the design check's default design's innermost layer (a 50 × 120 mm
 * drawn can, 1 mm ni80) with the shop's construction defaults, so both pages agree at first sight;
 * the box and rolled-can boxes hold the same defaults for when the kind is switched.
 */
export const initialBlankForm: BlankForm = {
  kind: DEFAULT_PART.method === "drawn" ? "cylinder-drawn" : "cylinder-rolled",
  width_mm: 80,
  depth_mm: 60,
  height_mm: 40,
  diameter_mm: DEFAULT_PART.diameter_mm,
  length_mm: DEFAULT_PART.length_mm,
  thickness_mm: DEFAULT_PART.thickness_mm,
  bendRadius_mm: defaultBendRadius_mm(DEFAULT_PART.thickness_mm),
  kFactor: null,
  cornerRadius_mm: DEFAULT_CORNER_RADIUS_MM,
  trim_mm: DEFAULT_TRIM_MM,
  seamOverlap_mm: DEFAULT_SEAM_OVERLAP_MM,
  material: DEFAULT_PART.material,
  quantity: 10,
  unit: "mm",
};

/** Address-bar keys (lengths in mm); the design check's links use the same ones (paths.flatBlank.href). */
const LENGTH_KEYS = { width: "width_mm", depth: "depth_mm", height: "height_mm", diameter: "diameter_mm", length: "length_mm", thickness: "thickness_mm", bendRadius: "bendRadius_mm", cornerRadius: "cornerRadius_mm", trim: "trim_mm", seamOverlap: "seamOverlap_mm" } as const;

const num = (x: Kept): string => (x === null ? "" : Number.isNaN(x) ? "x" : String(+x.toPrecision(12)));
const read = (s: string | null, fallback: Kept): Kept => {
  if (s === null) return fallback;
  if (s.trim() === "") return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : NaN;
};

/** The form in the address bar, every key in a fixed order (equal forms, equal strings). */
export function blankToParams(f: BlankForm): URLSearchParams {
  const p = new URLSearchParams();
  p.set("kind", f.kind);
  for (const [key, field] of Object.entries(LENGTH_KEYS)) p.set(key, num(f[field]));
  p.set("kFactor", num(f.kFactor));
  p.set("material", f.material === "" ? "none" : f.material);
  p.set("q", num(f.quantity));
  p.set("lu", f.unit);
  return p;
}

/**
 * The form a link fills in: known keys only, an unknown kind ignored, material "none" for no
 * material, missing keys from the page's first part. Numbers are checked by the server as if typed.
 */
export function blankFromParams(p: URLSearchParams, base: BlankForm = initialBlankForm): BlankForm {
  const f: BlankForm = { ...base };
  const kind = p.get("kind");
  if (kind !== null && (partKinds as readonly string[]).includes(kind)) f.kind = kind as PartKind;
  for (const [key, field] of Object.entries(LENGTH_KEYS)) f[field] = read(p.get(key), base[field]);
  f.kFactor = read(p.get("kFactor"), base.kFactor);
  const material = p.get("material");
  if (material !== null) f.material = material === "none" ? "" : material.slice(0, 64);
  f.quantity = read(p.get("q"), base.quantity);
  const unit = p.get("lu");
  if (unit !== null && (blankLengthUnits as readonly string[]).includes(unit)) f.unit = unit as BlankLengthUnit;
  return f;
}

/** The typical K-factor for the radius and thickness typed, or null while either is missing. */
export function suggestedK(form: BlankForm): number | null {
  const r = form.bendRadius_mm, t = form.thickness_mm;
  return r !== null && t !== null && r >= 0 && t > 0 ? +suggestKFactor(r, t).toFixed(3) : null;
}

// An empty box is sent as null, so the server's own message says what is missing.
const sent = (x: Kept) => (x === null ? (null as unknown as number) : x);
const opt = (x: Kept) => (x === null ? undefined : x);

export function toBlankRequest(form: BlankForm): BlankRequest {
  const material = form.material ? { material: form.material } : {};
  if (form.kind === "box-bent") {
    return {
      shape: "box", method: "bent",
      dimensions_mm: { width: sent(form.width_mm), depth: sent(form.depth_mm), height: sent(form.height_mm) },
      thickness_mm: sent(form.thickness_mm), bendRadius_mm: sent(form.bendRadius_mm),
      kFactor: form.kFactor ?? suggestedK(form) ?? sent(null), ...material,
    };
  }
  const dimensions_mm = { diameter: sent(form.diameter_mm), length: sent(form.length_mm) };
  if (form.kind === "cylinder-drawn") {
    return { shape: "cylinder", method: "drawn", dimensions_mm, thickness_mm: sent(form.thickness_mm), cornerRadius_mm: opt(form.cornerRadius_mm), trim_mm: opt(form.trim_mm), ...material };
  }
  return { shape: "cylinder", method: "rolled", dimensions_mm, thickness_mm: sent(form.thickness_mm), seamOverlap_mm: opt(form.seamOverlap_mm), ...material };
}

/** The quantity for the price, or a sentence saying what would be right. */
export function quantityProblem(q: Kept): string | null {
  if (q === null) return "Enter the quantity.";
  if (!Number.isInteger(q) || q < 1 || q > MAX_ESTIMATE_QUANTITY) return `Quantity must be a whole number of pieces from 1 to ${MAX_ESTIMATE_QUANTITY.toLocaleString("en-GB")}.`;
  return null;
}
