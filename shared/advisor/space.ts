// The designs the shop can make for one requirement, and what each one is as a quote takes it.
//
// A design is a forming method, a number of layers, one gap between neighbouring layers (from
// the shop's standard gap steps) and, for each layer, an alloy and a gauge the shop stocks. The
// layers are chosen independently (a high-saturation alloy outside a high-μ one is a classic
// nest); the gap is one step for the whole nest, as the shop's spacers come in sets. The lid is
// not a choice: the prediction of a can or box assumes its slip-on lid, and a box's lid is
// made and priced with it.

import { DEFAULT_CORNER_RADIUS_MM, DEFAULT_LID_CLEARANCE_MM, DEFAULT_SEAM_OVERLAP_MM, DEFAULT_TRIM_MM } from "../construction-defaults";
import type { DrawLimits } from "../fabrication/drawn-cup";
import { partsForDesign, type DesignConfig, type FabricatedPart } from "../fabrication/parts";
import type { PredictionInput } from "../physics/predict";
import type { AdvisedConfiguration, AdvisedLayer } from "../schemas/design-advice";

export type AdviceShape = "cylinder" | "box";
export type AdviceMethod = "drawn" | "rolled" | "bent";

export const METHODS_FOR_SHAPE: Record<AdviceShape, readonly AdviceMethod[]> = { cylinder: ["drawn", "rolled"], box: ["bent"] };
export const DIMENSION_KEYS: Record<AdviceShape, readonly string[]> = { cylinder: ["diameter", "length"], box: ["width", "depth", "height"] };

/** One alloy at one stocked gauge, with what the engines need of it. */
export interface LayerOption {
  material: string;
  thickness_mm: number;
  density_kg_m3: number;
  /** the shop's forming limits for the alloy (the engine's defaults when it has none) */
  limits: DrawLimits;
  pricePerKg_cents: number;
}

/** The requirement and the space to search, everything already checked and resolved against the shop. */
export interface AdviceProblem {
  requiredAttenuation_db: number;
  field: { frequency_hz: number; amplitude_uT: number; orientation: "transverse" | "axial" };
  shape: AdviceShape;
  /** inside of the innermost layer */
  dimensions_mm: Record<string, number>;
  quantity: number;
  maxLayers: number;
  methods: readonly AdviceMethod[];
  /** alloy × gauge choices for a layer */
  options: readonly LayerOption[];
  gapSteps_mm: readonly number[];
  maxOutside_mm?: Record<string, number | undefined>;
  maxMass_kg?: number;
}

/** One design of the space. `order` is its place in the enumeration: the last tie-break, so answers never depend on the search's order. */
export interface Design {
  order: number;
  method: AdviceMethod;
  /** between neighbouring layers; 0 with one layer */
  gap_mm: number;
  /** innermost first */
  layers: LayerOption[];
}

/** Designs in the space: methods × Σ over layer counts of options^n × (gaps when n > 1). */
export function countDesigns(p: Pick<AdviceProblem, "methods" | "options" | "gapSteps_mm" | "maxLayers">): number {
  let perMethod = 0;
  for (let n = 1; n <= p.maxLayers; n++) perMethod += p.options.length ** n * (n > 1 ? p.gapSteps_mm.length : 1);
  return p.methods.length * perMethod;
}

/** Every design of the space, in a fixed order (method, layer count, gap, layers). */
export function* enumerateDesigns(p: AdviceProblem): Generator<Design> {
  let order = 0;
  const k = p.options.length;
  for (const method of p.methods) {
    for (let n = 1; n <= p.maxLayers; n++) {
      const gaps = n > 1 ? p.gapSteps_mm : [0];
      for (const gap_mm of gaps) {
        const pick = new Array<number>(n).fill(0);
        for (;;) {
          yield { order: order++, method, gap_mm, layers: pick.map((i) => p.options[i]) };
          // next choice, innermost layer fastest
          let i = 0;
          while (i < n && ++pick[i] === k) pick[i++] = 0;
          if (i === n || k === 0) break;
        }
      }
    }
  }
}

const gapOf = (d: Design, i: number) => (i < d.layers.length - 1 ? d.gap_mm : undefined);

/** How much every inside dimension of layer i exceeds the innermost one's (the fabrication engine's layerGrowth_mm, for one gap). */
function growth(d: Design, i: number): number {
  let g = 0;
  for (let j = 0; j < i; j++) g += d.layers[j].thickness_mm + d.gap_mm;
  return 2 * g;
}

/**
 * Whether the requests would be accepted as they are: each wall thinner than the radius it is
 * formed on (the prediction's rule; it implies the fabrication's "thinner than the part").
 */
export function formable(p: AdviceProblem, d: Design): boolean {
  const dims = p.dimensions_mm;
  let r = p.shape === "box" ? Math.min(dims.width, dims.depth, dims.height) / 2 : dims.diameter / 2;
  for (const l of d.layers) {
    if (l.thickness_mm >= r) return false;
    r += l.thickness_mm + d.gap_mm;
  }
  return true;
}

/**
 * The outside of the finished nest: the outermost wall, plus on a box the lid's skirt over the
 * body (clearance and a wall on each side) and on a rolled can the end caps' flanges turned
 * down over the wall.
 */
export function outsideSize(p: AdviceProblem, d: Design): Record<string, number> {
  const n = d.layers.length;
  const t = d.layers[n - 1].thickness_mm;
  const grow = growth(d, n - 1) + 2 * t;
  const dims = p.dimensions_mm;
  if (p.shape === "box") {
    const skirt = 2 * (DEFAULT_LID_CLEARANCE_MM + t);
    return { width: dims.width + grow + skirt, depth: dims.depth + grow + skirt, height: dims.height + grow };
  }
  const flange = d.method === "rolled" ? 2 * t : 0;
  return { diameter: dims.diameter + grow + flange, length: dims.length + grow };
}

/** mm beyond each largest outside size the constraints set (empty when it fits). */
export function oversize(p: AdviceProblem, outside: Record<string, number>): Record<string, number> {
  const over: Record<string, number> = {};
  for (const [key, limit] of Object.entries(p.maxOutside_mm ?? {})) {
    if (limit !== undefined && outside[key] > limit) over[key] = outside[key] - limit;
  }
  return over;
}

/** A drawn cup's inside corner radius: the shared default, within what the cup allows (as the design check sends it). */
function cornerRadius(p: AdviceProblem): number {
  return Math.min(DEFAULT_CORNER_RADIUS_MM, p.dimensions_mm.diameter / 2, p.dimensions_mm.length);
}

/** The fabrication engine's design, built as the price estimate builds it from the configuration. */
export function designConfig(p: AdviceProblem, d: Design): DesignConfig {
  const layers = d.layers.map((l, i) => ({ thickness_mm: l.thickness_mm, gap_mm: gapOf(d, i), materialId: l.material, density_kg_m3: l.density_kg_m3, limits: l.limits }));
  const dims = p.dimensions_mm;
  if (p.shape === "box") return { shape: "box", method: "bent", dimensions_mm: { width: dims.width, depth: dims.depth, height: dims.height }, layers, lid: true, holes: [] };
  const dimensions_mm = { diameter: dims.diameter, length: dims.length };
  if (d.method === "rolled") return { shape: "cylinder", method: "rolled", dimensions_mm, layers, seamOverlap_mm: DEFAULT_SEAM_OVERLAP_MM, holes: [] };
  return { shape: "cylinder", method: "drawn", dimensions_mm, layers, cornerRadius_mm: cornerRadius(p), trim_mm: DEFAULT_TRIM_MM, holes: [] };
}

/**
 * partsForDesign for the designs of one search, a layer at a time: a layer's parts depend only
 * on its own alloy and gauge, the method, and the walls and gaps inside it (parts.ts sizes each
 * layer from its inside), so the outer layer of thousands of nests is worked out a few hundred
 * times. Each layer's parts come from partsForDesign itself, so the list is the same.
 */
export interface DesignParts {
  /** every part, as partsForDesign lists them */
  parts: FabricatedPart[];
  /** each layer's own parts, innermost first (the same array for every design with that layer on that inside) */
  byLayer: FabricatedPart[][];
}

export function partsMemo(p: AdviceProblem): (d: Design) => DesignParts {
  // a tree per method and gap, one level per inner layer's thickness; each node keeps the parts
  // of a layer on that inside, by the layer's alloy and gauge
  interface Node {
    inner: Map<number, Node>;
    own: Map<LayerOption, FabricatedPart[]>;
  }
  const node = (): Node => ({ inner: new Map(), own: new Map() });
  const roots = new Map<AdviceMethod, Map<number, Node>>();
  return (d) => {
    let byGap = roots.get(d.method);
    if (!byGap) roots.set(d.method, (byGap = new Map()));
    let at = byGap.get(d.gap_mm);
    if (!at) byGap.set(d.gap_mm, (at = node()));
    const parts: FabricatedPart[] = [];
    const byLayer: FabricatedPart[][] = [];
    for (let i = 0; i < d.layers.length; i++) {
      const l = d.layers[i];
      let own = at.own.get(l);
      if (!own) {
        own = partsForDesign(designConfig(p, { ...d, layers: d.layers.slice(0, i + 1) })).filter((x) => x.layer === i);
        at.own.set(l, own);
      }
      for (const x of own) parts.push(x);
      byLayer.push(own);
      let next = at.inner.get(l.thickness_mm);
      if (!next) at.inner.set(l.thickness_mm, (next = node()));
      at = next;
    }
    return { parts, byLayer };
  };
}

/** The blanks' mass of an assembly. */
export const massOf = (parts: readonly FabricatedPart[]): number => parts.reduce((s, x) => s + (x.mass_kg ?? 0) * x.quantityPerAssembly, 0);

/** The prediction engine's input, as POST /api/predictions reads the configuration. */
export function predictionInput(p: AdviceProblem, d: Design): PredictionInput {
  return {
    shape: p.shape,
    dimensions_mm: p.dimensions_mm,
    ...(p.shape === "cylinder" ? { ends: "closed" as const } : {}),
    layers: advisedLayers(d),
    field: p.field,
    state: "annealed",
    method: d.method,
  };
}

function advisedLayers(d: Design): AdvisedLayer[] {
  return d.layers.map((l, i) => {
    const gap = gapOf(d, i);
    return gap === undefined ? { material: l.material, thickness_mm: l.thickness_mm } : { material: l.material, thickness_mm: l.thickness_mm, gap_mm: gap };
  });
}

/** The design as a quote takes it: the prediction body, the method and blank fields, the requirement. */
export function configurationOf(p: AdviceProblem, d: Design): AdvisedConfiguration {
  const common = {
    dimensions_mm: { ...p.dimensions_mm },
    layers: advisedLayers(d),
    field: { ...p.field },
    state: "annealed" as const,
    requiredAttenuation_db: p.requiredAttenuation_db,
  };
  if (p.shape === "box") return { shape: "box", method: "bent", lid: true, ...common };
  if (d.method === "rolled") return { shape: "cylinder", ends: "closed", method: "rolled", seamOverlap_mm: DEFAULT_SEAM_OVERLAP_MM, ...common };
  return { shape: "cylinder", ends: "closed", method: "drawn", cornerRadius_mm: cornerRadius(p), trim_mm: DEFAULT_TRIM_MM, ...common };
}

const fmt = (x: number) => String(+x.toPrecision(3));
const METHOD_NAMES: Record<AdviceMethod, string> = { drawn: "drawn", rolled: "rolled and welded", bent: "bent" };

/** The design in a line: "2 layers, drawn: 0.5 mm ni80 + 1 mm ni50, 10 mm apart". */
export function summaryOf(d: Design): string {
  const n = d.layers.length;
  const layers = d.layers.map((l) => `${fmt(l.thickness_mm)} mm ${l.material}`).join(" + ");
  return `${n} layer${n === 1 ? "" : "s"}, ${METHOD_NAMES[d.method]}: ${layers}${n > 1 ? `, ${fmt(d.gap_mm)} mm apart` : ""}`;
}
