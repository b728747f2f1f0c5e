// A design ↔ the address bar, both ways, as a pure mapping: reload keeps the design, a link
// shares it, back and forward step through it. Values are written in the canonical units (mm, µT,
// Hz), so a link means the same shield whatever units its reader prefers; the units the sender
// chose travel too (lu, fu, fq), as a courtesy. Anything missing or unreadable falls back to the
// default design's value, so an old or hand-edited link still opens a design.
//
//   shape=cylinder&d=50&l=120&ends=closed&method=drawn&layer=ni80:1:10&layer=~20000,0.58,0.75:1:10
//   &state=annealed&B=100&f=60&dir=transverse&hole=10:20&lu=mm&fu=uT&fq=Hz
//
// A layer is material:thickness:gap, or for a custom metal ~μr,resistivity µΩ·m[,saturation T]
// in place of the material; a hole is diameter:collar.

import {
  defaultDesign, designFieldUnits, designFrequencyUnits, designLengthUnits, MAX_LAYERS, MAX_PAGE_HOLES, newHole, newLayer,
  type DesignDraft, type HoleDraft, type Kept, type LayerDraft,
} from "./design-model";

/** Twelve significant figures: exact for anything typed, free of float noise from a unit conversion. */
const num = (x: Kept): string => (x === null ? "" : Number.isNaN(x) ? "x" : String(+x.toPrecision(12)));
const read = (s: string | undefined | null, fallback: Kept): Kept => {
  if (s === undefined || s === null) return fallback;
  if (s === "") return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : NaN;
};
const oneOf = <T extends string>(s: string | null, allowed: readonly T[], fallback: T): T => (s !== null && (allowed as readonly string[]).includes(s) ? (s as T) : fallback);

function layerParam(l: LayerDraft): string {
  const what = l.kind === "library" ? l.material : `~${[num(l.mu_r), num(l.resistivity_uohm_m), ...(l.saturation_T === null ? [] : [num(l.saturation_T)])].join(",")}`;
  // the outermost layer's gap is kept too: it counts again once a layer is added outside
  return [what, num(l.thickness_mm), num(l.gap_mm)].join(":");
}

function layerFrom(text: string): LayerDraft {
  const [what = "", thickness, gap] = text.split(":");
  const base = newLayer();
  const common = { thickness_mm: read(thickness, base.thickness_mm), gap_mm: gap === undefined ? base.gap_mm : read(gap, null) };
  if (what.startsWith("~")) {
    const [mu, rho, sat] = what.slice(1).split(",");
    return { ...base, ...common, kind: "custom", mu_r: read(mu, base.mu_r), resistivity_uohm_m: read(rho, base.resistivity_uohm_m), saturation_T: sat === undefined ? null : read(sat, null) };
  }
  // the material id is checked by the schema (and the server) like anything typed
  return { ...base, ...common, kind: "library", material: what.slice(0, 64) || base.material };
}

function holeFrom(text: string): HoleDraft {
  const [diameter, collar] = text.split(":");
  const base = newHole();
  return { ...base, diameter_mm: read(diameter, base.diameter_mm), collar_mm: collar === undefined ? 0 : read(collar, null) };
}

/** The design as search parameters, in a fixed order (equal designs give equal strings). */
export function designToParams(d: DesignDraft): URLSearchParams {
  const p = new URLSearchParams();
  p.set("shape", d.shape);
  if (d.shape === "box") {
    p.set("w", num(d.width_mm));
    p.set("dp", num(d.depth_mm));
    p.set("h", num(d.height_mm));
  } else {
    p.set("d", num(d.diameter_mm));
    if (d.shape === "cylinder") {
      p.set("l", num(d.length_mm));
      p.set("ends", d.ends);
      p.set("method", d.method);
    }
  }
  d.layers.forEach((l) => p.append("layer", layerParam(l)));
  p.set("state", d.state);
  p.set("B", num(d.amplitude_uT));
  p.set("f", num(d.frequency_hz));
  if (d.shape === "cylinder") p.set("dir", d.orientation);
  d.holes.forEach((h) => p.append("hole", `${num(h.diameter_mm)}:${num(h.collar_mm)}`));
  p.set("lu", d.units.length);
  p.set("fu", d.units.field);
  p.set("fq", d.units.frequency);
  return p;
}

/** A design from search parameters; what is missing or unreadable comes from the default design. */
export function designFromParams(p: URLSearchParams): DesignDraft {
  const base = defaultDesign();
  const shape = oneOf(p.get("shape"), ["cylinder", "box", "sphere"] as const, base.shape);
  const layers = p.getAll("layer").slice(0, MAX_LAYERS).map(layerFrom);
  return {
    ...base,
    shape,
    diameter_mm: read(p.get("d"), base.diameter_mm),
    length_mm: read(p.get("l"), base.length_mm),
    width_mm: read(p.get("w"), base.width_mm),
    depth_mm: read(p.get("dp"), base.depth_mm),
    height_mm: read(p.get("h"), base.height_mm),
    ends: oneOf(p.get("ends"), ["closed", "open"] as const, base.ends),
    method: oneOf(p.get("method"), ["drawn", "rolled"] as const, base.method),
    layers: layers.length ? layers : base.layers,
    state: oneOf(p.get("state"), ["annealed", "as-formed"] as const, base.state),
    amplitude_uT: read(p.get("B"), base.amplitude_uT),
    frequency_hz: read(p.get("f"), base.frequency_hz),
    orientation: oneOf(p.get("dir"), ["transverse", "axial"] as const, base.orientation),
    holes: p.getAll("hole").slice(0, MAX_PAGE_HOLES).map(holeFrom),
    units: {
      length: oneOf(p.get("lu"), designLengthUnits, base.units.length),
      field: oneOf(p.get("fu"), designFieldUnits, base.units.field),
      frequency: oneOf(p.get("fq"), designFrequencyUnits, base.units.frequency),
    },
  };
}

/** The chart's range (Hz) beside the design: cf, ct; empty boxes stay empty. */
export interface ChartRangeDraft {
  from_hz: Kept;
  to_hz: Kept;
}

export function chartRangeToParams(r: ChartRangeDraft, p: URLSearchParams): URLSearchParams {
  p.set("cf", num(r.from_hz));
  p.set("ct", num(r.to_hz));
  return p;
}

export function chartRangeFromParams(p: URLSearchParams, fallback: ChartRangeDraft): ChartRangeDraft {
  return { from_hz: read(p.get("cf"), fallback.from_hz), to_hz: read(p.get("ct"), fallback.to_hz) };
}

/** Two designs are the same shield (and units) when they write the same parameters; React keys do not count. */
export const sameDesign = (a: DesignDraft, b: DesignDraft) => designToParams(a).toString() === designToParams(b).toString();
