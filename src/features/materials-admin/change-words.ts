// A recorded change to a material, in words a planner reads at a glance: "Density: 8 750 →
// 8 740 kg/m³", "μ(B) point 3 added: 0.5 T, μr 20 000", "Source of density: “[pub] …” → “…”".
// The trail stores JSON paths and raw values; this is the one place that words them.

import { tagLabels, type TaggedValue } from "../../../shared/schemas/material";

/** Digits in groups of three with a space, as engineering tables print them: 8 750, 120 000; decimals kept. */
export function grouped(x: number, significant = 6): string {
  if (!Number.isFinite(x)) return String(x);
  const text = String(+x.toPrecision(significant));
  if (/e/i.test(text)) return text;
  const [whole, fraction] = text.replace("-", "").split(".");
  const spaced = whole.length >= 4 ? whole.replace(/\B(?=(\d{3})+(?!\d))/g, " ") : whole;
  return `${x < 0 ? "\u2212" : ""}${spaced}${fraction ? `.${fraction}` : ""}`;
}

interface Quantity {
  label: string;
  show: (v: unknown) => string;
}

const num = (unit: string, scale = 1) => (v: unknown) => (typeof v === "number" ? `${grouped(v * scale)}${unit ? ` ${unit}` : ""}` : v === null || v === undefined ? "none" : String(v));
const text = (v: unknown) => (v === null || v === undefined || v === "" ? "none" : `“${String(v)}”`);

const QUANTITIES: Record<string, Quantity> = {
  name: { label: "Name", show: text },
  "relativePermeability.initial": { label: "Initial μr", show: num("") },
  "relativePermeability.maximum": { label: "Maximum μr", show: num("") },
  saturation_T: { label: "Saturation", show: (v) => (v === null ? "none (non-magnetic)" : num("T")(v)) },
  resistivity_ohm_m: { label: "Resistivity", show: num("µΩ·m", 1e6) },
  density_kg_m3: { label: "Density", show: num("kg/m³") },
  asFormedFactor: { label: "As-formed factor", show: num("") },
  active: { label: "In use", show: (v) => (v ? "yes" : "no") },
  source: { label: "Sources", show: text },
};

const point = (v: unknown) => {
  const p = v as { B_T?: number; mu_r?: number } | null;
  return p && typeof p === "object" ? `${grouped(p.B_T ?? NaN)} T, μr ${grouped(p.mu_r ?? NaN)}` : "none";
};

/** "before → after" with a shared unit written once at the end ("8 750 → 8 740 kg/m³"). */
function arrow(before: string, after: string): string {
  const unitOf = (s: string) => /^[−\d\s.]+?\s([^\d\s−].*)$/.exec(s)?.[1];
  const unit = unitOf(before);
  if (unit && unit === unitOf(after)) return `${before.slice(0, -unit.length - 1)} → ${after}`;
  return `${before} → ${after}`;
}

/** One change of a material's record as a sentence. */
export function describeMaterialChange(c: { path: string; before: unknown; after: unknown }): string {
  const q = QUANTITIES[c.path];
  if (q) return `${q.label}: ${arrow(q.show(c.before), q.show(c.after))}`;
  const tag = /^sourceTags\.(\w+)$/.exec(c.path);
  if (tag) return `Source of ${(tagLabels[tag[1] as TaggedValue] ?? tag[1]).toLowerCase()}: ${text(c.before)} → ${text(c.after)}`;
  const curve = /^muCurve\.(\d+)(?:\.(B_T|mu_r))?$/.exec(c.path);
  if (curve) {
    const n = Number(curve[1]) + 1;
    if (curve[2] === "B_T") return `μ(B) point ${n}: flux density ${arrow(num("T")(c.before), num("T")(c.after))}`;
    if (curve[2] === "mu_r") return `μ(B) point ${n}: μr ${arrow(num("")(c.before), num("")(c.after))}`;
    if (c.before === null || c.before === undefined) return `μ(B) point ${n} added: ${point(c.after)}`;
    if (c.after === null || c.after === undefined) return `μ(B) point ${n} removed (was ${point(c.before)})`;
    return `μ(B) point ${n}: ${point(c.before)} → ${point(c.after)}`;
  }
  return `${c.path}: ${JSON.stringify(c.before)} → ${JSON.stringify(c.after)}`;
}
