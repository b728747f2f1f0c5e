// The shielding prediction behind POST /api/predictions: geometry of the nested layers, μ for
// each layer at its operating induction, the shape's formulas, saturation and design warnings,
// and a band below the ideal figure. Every figure is an engineering estimate.

import { Complex, c, capMagnitude } from "./complex";
import {
  cylindricalShieldingFactor,
  sphericalShieldingFactor,
  skinDepth_m,
  staticCylindricalShell,
  type Shell,
} from "./exact";
import { materialLibrary, type MaterialProperties } from "./materials";
import { permeabilityFor, type MaterialState, type MuSource } from "./permeability";
import {
  saturationMargin,
  saturationWarnings,
  wallFluxDensity_T,
  type FluxPath,
  type PredictionWarning,
} from "./saturation";
import {
  circumscribedRadius,
  collarAttenuation_db,
  collarLengthFor_mm,
  demagnetizingFactor,
  nestedShells,
  openEndCombination,
} from "./thin";

export type Shape = "cylinder" | "box" | "sphere";
export type Orientation = "transverse" | "axial";

export interface LayerInput {
  material?: string;
  mu_r?: number;
  resistivity_ohm_m?: number;
  saturation_T?: number | null;
  thickness_mm: number;
  /** clear space to the next layer outward */
  gap_mm?: number;
}

export interface HoleInput {
  diameter_mm: number;
  /** 0 or absent: a plain hole */
  collarLength_mm?: number;
}

export interface PredictionInput {
  shape: Shape;
  /** inside dimensions of the innermost layer */
  dimensions_mm: { diameter?: number; length?: number; width?: number; depth?: number; height?: number };
  ends?: "closed" | "open";
  /** innermost first */
  layers: LayerInput[];
  /** amplitude_uT is the peak applied flux density; frequency 0 = static */
  field: { frequency_hz: number; amplitude_uT: number; orientation?: Orientation };
  state?: MaterialState;
  holes?: HoleInput[];
}

export interface LayerResult {
  index: number;
  material: string | null;
  thickness_mm: number;
  /** cylinder/sphere: inside radius of this layer; box: radius of the sphere through its inside corners */
  innerRadius_mm: number;
  wallFluxDensity_T: number;
  saturation_T: number | null;
  saturationMargin: number | null;
  /** relative permeability used */
  mu_r: number;
  muSource: MuSource;
  /** null at DC or for a non-conductor */
  skinDepth_mm: number | null;
}

/** One cable hole and its collar (chimney), in the order given. */
export interface HoleResult {
  index: number;
  diameter_mm: number;
  collarLength_mm: number;
  /** the collar's own attenuation, field along the collar (the weak case, j = 2.405) */
  collarAttenuation_db: number;
  /** the collar length whose own attenuation reaches the walls' predicted figure (capped, see HOLE_TARGET_MAX_DB) */
  neededCollarLength_mm: number;
}

export interface PredictionResult {
  shieldingFactor: number;
  /** the walls and the holes together (see holeLimit) */
  attenuation_db: number;
  /** the walls alone, before the holes' leakage is counted; equals attenuation_db without holes */
  wallAttenuation_db: number;
  holes: HoleResult[];
  layers: LayerResult[];
  warnings: PredictionWarning[];
  method: string;
  band: { low_db: number; high_db: number; margin_db: number; basis: string };
  estimate: true;
  /** box only: both estimates, the lower is used */
  boxEstimates?: { rule_db: number; circumscribedSphere_db: number };
}

export class PredictionInputError extends Error {
  readonly field: string;
  constructor(field: string, message: string) {
    super(message);
    this.name = "PredictionInputError";
    this.field = field;
  }
}

export type MaterialLookup = MaterialProperties[] | ((id: string) => MaterialProperties | undefined);

// Practical limits [practice]
const NICKEL_IRON_FORMING_LIMIT_MM = 3;
const MAX_MODEL_FREQUENCY_HZ = 100_000;
const THIN_FORM_RADIUS_FRACTION = 1 / 5;
/**
 * The needed collar length aims at the walls' predicted figure, but no higher than this: past
 * about 200 dB the walls no longer decide what a built shield reaches (seams and lids do), the
 * same line the page's chart clips at. 200 dB along a collar is about 4.8 hole diameters.
 */
export const HOLE_TARGET_MAX_DB = 200;
/** A hole is reported as limiting the shield when it costs at least this much of the walls' figure. */
const HOLE_LIMITED_DB = 1;

/** A layer with its geometry and working properties resolved. Lengths in mm. */
interface Layer {
  index: number;
  material: MaterialProperties | null;
  t: number;
  /** cylinder/sphere inside radius; box: circumscribed inside radius */
  a: number;
  /** cylinder inside length */
  L: number;
  /** box inside sides */
  box: [number, number, number];
  mu: number;
  muSource: MuSource;
  rho: number;
  sat: number | null;
  Bwall: number;
}

interface Ctx {
  shape: Shape;
  orientation: Orientation;
  ends: "closed" | "open";
  f: number;
}

const finitePositive = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x) && x > 0;

function lookupFn(materials: MaterialLookup): (id: string) => MaterialProperties | undefined {
  return Array.isArray(materials) ? (id) => materials.find((m) => m.id === id) : materials;
}

function shellsOf(layers: Layer[], radius: (l: Layer) => number): Shell[] {
  return layers.map((l) => ({ innerRadius_m: radius(l) / 1000, thickness_m: l.t / 1000, mu_r: l.mu, resistivity_ohm_m: l.rho }));
}

/** (μ−1)²/μ: the static strength of a wall, without the spurious static term for μ = 1. */
const magneticStrength = (mu: number) => ((mu - 1) * (mu - 1)) / mu;

interface ShapeAnswer {
  S: Complex;
  attenuation_db: number;
  method: string;
  boxEstimates?: { rule_db: number; circumscribedSphere_db: number };
}

const dbOf = (S: Complex) => 20 * Math.log10(Math.max(S.abs(), 1e-300));

/** S of a contiguous run of layers (innermost first) by the shape's method. */
function shapeShielding(ctx: Ctx, layers: Layer[]): ShapeAnswer {
  const { shape, f } = ctx;
  if (shape === "sphere") {
    const r = sphericalShieldingFactor(shellsOf(layers, (l) => l.a), f);
    return { S: r.S, attenuation_db: r.attenuation_db, method: "exact multilayer sphere (spherical Bessel)" };
  }
  if (shape === "box") {
    // (1) exact multilayer sphere through the box's corners: conservative [derived]
    const sphere = sphericalShieldingFactor(shellsOf(layers, (l) => l.a), f);
    // (2) trade rule per layer, a = largest inside side (the conservative reading), plus the
    // eddy-current excess of that layer's circumscribed sphere; layers nested by the two-shell
    // rule with the enclosed-volume ratio as gap factor.
    const per = layers.map((l) => {
      const one = shellsOf([l], (x) => x.a);
      const ac = sphericalShieldingFactor(one, f).S;
      const dc = sphericalShieldingFactor(one, 0).S;
      return capMagnitude(c(1 + (0.8 * magneticStrength(l.mu) * l.t) / Math.max(...l.box)).add(ac.sub(dc)));
    });
    const ratios = layers.slice(1).map((o, i) => {
      const inner = layers[i];
      const vIn = inner.box.reduce((p, s) => p * (s + 2 * inner.t), 1);
      return vIn / o.box.reduce((p, s) => p * s, 1);
    });
    const rule = nestedShells(per, ratios);
    const rule_db = dbOf(rule);
    const useRule = rule_db <= sphere.attenuation_db;
    return {
      S: useRule ? rule : sphere.S,
      attenuation_db: Math.min(rule_db, sphere.attenuation_db),
      method: `box estimate: lower of trade rule 1 + 0.8μt/a and circumscribed sphere (${useRule ? "rule" : "sphere"} used)`,
      boxEstimates: { rule_db, circumscribedSphere_db: sphere.attenuation_db },
    };
  }
  // cylinder
  const inner = layers[0];
  if (ctx.orientation === "transverse") {
    const r = cylindricalShieldingFactor(shellsOf(layers, (l) => l.a), f);
    if (ctx.ends === "closed")
      return { S: r.S, attenuation_db: r.attenuation_db, method: "exact multilayer cylinder (Bessel), transverse" };
    const S = openEndCombination(capMagnitude(r.S), inner.L, inner.a, "transverse");
    return { S, attenuation_db: dbOf(S), method: "exact multilayer cylinder (Bessel), transverse, open-end leakage exp(−3.832·z/a)" };
  }
  // Axial, closed can. Per layer: the static flux-shunting term of the exact transverse shell
  // scaled by 4N (Mager: S_A ≈ 1 + 4N·μt/D), plus that shell's AC excess S_T(f) − S_T(0) unchanged
  // (eddy currents in a long tube shield an axial field about as they do a transverse one);
  // reduces to the DC form at f = 0 and to the eddy form for μ = 1. Layers nested by the two-shell
  // rule with the enclosed-volume ratio (D²L) as gap factor. [derived]
  const per = layers.map((l) => {
    const one = shellsOf([l], (x) => x.a);
    const sT0 = staticCylindricalShell(l.mu, l.a, l.a + l.t);
    const ac = f > 0 ? cylindricalShieldingFactor(one, f).S.sub(sT0) : c(0);
    const N = demagnetizingFactor((l.L + l.t) / (2 * l.a + l.t));
    return capMagnitude(c(1 + 4 * N * (sT0 - 1)).add(ac));
  });
  const ratios = layers.slice(1).map((o, i) => {
    const l = layers[i];
    return ((l.a + l.t) ** 2 * (l.L + 2 * l.t)) / (o.a ** 2 * o.L);
  });
  const closed = nestedShells(per, ratios);
  if (ctx.ends === "closed")
    return { S: closed, attenuation_db: dbOf(closed), method: "closed can, axial: 1 + 4N·μt/D (Osborn N) with eddy-current excess of the exact cylinder" };
  const S = openEndCombination(closed, inner.L, inner.a, "axial");
  return { S, attenuation_db: dbOf(S), method: "open can, axial: 1 + 4N·μt/D with open-end leakage exp(−2.405·z/a)" };
}

function fluxPath(ctx: Ctx): FluxPath {
  if (ctx.shape === "cylinder") return ctx.orientation === "axial" ? "cylinder-axial" : "cylinder-transverse";
  return ctx.shape;
}

function describe(l: Layer): string {
  return `Layer ${l.index + 1} (${l.material ? l.material.id : `μr ${l.mu}`}, ${l.t} mm)`;
}

function requireDim(dims: PredictionInput["dimensions_mm"], key: keyof PredictionInput["dimensions_mm"]): number {
  const v = dims?.[key];
  if (!finitePositive(v)) throw new PredictionInputError(`dimensions_mm.${key}`, `dimensions_mm.${key} must be a positive number of millimetres.`);
  return v;
}

export function predictShield(input: PredictionInput, materials: MaterialLookup = materialLibrary): PredictionResult {
  const lookup = lookupFn(materials);
  const shape = input.shape;
  if (shape !== "cylinder" && shape !== "box" && shape !== "sphere")
    throw new PredictionInputError("shape", "shape must be cylinder, box or sphere.");
  const f = input.field?.frequency_hz;
  if (!(typeof f === "number" && Number.isFinite(f) && f >= 0))
    throw new PredictionInputError("field.frequency_hz", "field.frequency_hz must be 0 or more.");
  const amplitude_uT = input.field.amplitude_uT;
  if (!finitePositive(amplitude_uT)) throw new PredictionInputError("field.amplitude_uT", "field.amplitude_uT must be positive.");
  if (!Array.isArray(input.layers) || input.layers.length === 0)
    throw new PredictionInputError("layers", "Give at least one layer.");
  const state: MaterialState = input.state ?? "annealed";
  const ctx: Ctx = {
    shape,
    orientation: shape === "cylinder" ? (input.field.orientation ?? "transverse") : "transverse",
    ends: input.ends ?? "closed",
    f,
  };

  // Inside geometry of the innermost layer
  let a: number, L = 0, box: [number, number, number] = [0, 0, 0];
  if (shape === "box") {
    box = [requireDim(input.dimensions_mm, "width"), requireDim(input.dimensions_mm, "depth"), requireDim(input.dimensions_mm, "height")];
    a = circumscribedRadius(...box);
  } else {
    a = requireDim(input.dimensions_mm, "diameter") / 2;
    if (shape === "cylinder") L = requireDim(input.dimensions_mm, "length");
  }

  // Geometry and material of each layer, innermost first
  const layers: Layer[] = input.layers.map((li, i) => {
    if (!finitePositive(li.thickness_mm)) throw new PredictionInputError(`layers.${i}.thickness_mm`, "thickness_mm must be positive.");
    const gap = li.gap_mm ?? 0;
    if (!(Number.isFinite(gap) && gap >= 0)) throw new PredictionInputError(`layers.${i}.gap_mm`, "gap_mm must be 0 or more.");
    let material: MaterialProperties | null = null;
    let mu = 1, rho = Infinity, sat: number | null = null;
    let muSource: MuSource = "explicit";
    if (li.material != null) {
      const m = lookup(li.material);
      if (!m) throw new PredictionInputError(`layers.${i}.material`, `Unknown material "${li.material}".`);
      material = m;
      rho = m.resistivity_ohm_m;
      sat = m.saturation_T;
      muSource = "material-curve";
    } else {
      if (!(typeof li.mu_r === "number" && Number.isFinite(li.mu_r) && li.mu_r >= 1))
        throw new PredictionInputError(`layers.${i}.mu_r`, "Give a material id or mu_r (1 or more).");
      if (!finitePositive(li.resistivity_ohm_m))
        throw new PredictionInputError(`layers.${i}.resistivity_ohm_m`, "resistivity_ohm_m must be positive.");
      mu = li.mu_r;
      rho = li.resistivity_ohm_m;
      sat = li.saturation_T ?? null;
    }
    const layer: Layer = { index: i, material, t: li.thickness_mm, a, L, box: [...box], mu, muSource, rho, sat, Bwall: 0 };
    // next layer's inside = this one's outside plus the gap
    const grow = 2 * (li.thickness_mm + gap);
    if (shape === "box") {
      box = [box[0] + grow, box[1] + grow, box[2] + grow];
      a = circumscribedRadius(...box);
    } else {
      a += li.thickness_mm + gap;
      L += grow;
    }
    return layer;
  });

  for (const [i, h] of (input.holes ?? []).entries()) {
    if (!finitePositive(h.diameter_mm)) throw new PredictionInputError(`holes.${i}.diameter_mm`, "The hole diameter must be a positive number of millimetres.");
    const collar = h.collarLength_mm ?? 0;
    if (!(Number.isFinite(collar) && collar >= 0)) throw new PredictionInputError(`holes.${i}.collarLength_mm`, "The collar length must be 0 or more millimetres.");
  }

  // Outermost first: the field a layer sees is the applied field reduced by the layers outside
  // it; B_wall comes from the μ → ∞ estimate, then μ is read from the curve at that induction.
  const B_applied = amplitude_uT * 1e-6;
  const path = fluxPath(ctx);
  for (let i = layers.length - 1; i >= 0; i--) {
    const l = layers[i];
    const outside = layers.slice(i + 1);
    const Souter = outside.length ? Math.max(1, shapeShielding(ctx, outside).S.abs()) : 1;
    const B0 = B_applied / Souter;
    const D = 2 * (l.a + l.t);
    const N = path === "cylinder-axial" ? demagnetizingFactor((l.L + l.t) / (2 * l.a + l.t)) : 1 / 3;
    l.Bwall = wallFluxDensity_T(path, B0, D, l.t, N);
    if (l.material) {
      const choice = permeabilityFor(l.material, state, l.Bwall);
      l.mu = choice.mu_r;
      l.muSource = choice.muSource;
    }
  }

  const walls = shapeShielding(ctx, layers);
  const wallAttenuation_db = Math.max(0, walls.attenuation_db);
  const holes = holeResults(input.holes ?? [], wallAttenuation_db);
  const answer = holes.length ? holeLimit(walls, holes, insideArea_mm2(ctx, layers[0])) : walls;
  const shieldingFactor = Math.max(1, Math.min(answer.S.abs(), Number.MAX_VALUE));
  // A passive shell does not amplify a uniform field; the open-end and box combinations can read
  // below 1 for near-transparent walls, so the figure is floored at 1 (0 dB).
  const attenuation_db = Math.max(0, answer.attenuation_db);

  const warnings: PredictionWarning[] = saturationWarnings(
    layers.map((l) => ({ label: describe(l), wallFlux_T: l.Bwall, saturation_T: l.sat })),
  );
  warnings.push(...designWarnings(ctx, layers, input, wallAttenuation_db));
  warnings.push(...holeWarnings(holes, wallAttenuation_db, attenuation_db));

  const rough = shape === "box" || ctx.ends === "open" || ctx.orientation === "axial";
  const fraction = shape === "box" ? 0.35 : rough ? 0.3 : 0.2;
  const margin_db = Math.max(3, fraction * attenuation_db);
  return {
    shieldingFactor,
    attenuation_db,
    wallAttenuation_db,
    holes,
    layers: layers.map((l) => {
      const d = skinDepth_m(l.rho, l.mu, f);
      return {
        index: l.index,
        material: l.material ? l.material.id : null,
        thickness_mm: l.t,
        innerRadius_mm: l.a,
        wallFluxDensity_T: l.Bwall,
        saturation_T: l.sat,
        saturationMargin: saturationMargin(l.sat, l.Bwall),
        mu_r: l.mu,
        muSource: l.muSource,
        skinDepth_mm: Number.isFinite(d) ? d * 1000 : null,
      };
    }),
    warnings,
    method: answer.method,
    band: {
      low_db: Math.max(0, attenuation_db - margin_db),
      high_db: attenuation_db,
      margin_db,
      basis: `measured shields fall short of ideal formulas (seams, lids, handling): low = predicted − ${Math.round(fraction * 100)} % of the dB figure, at least 3 dB [practice]`,
    },
    estimate: true,
    ...(answer.boxEstimates ? { boxEstimates: answer.boxEstimates } : {}),
  };
}

// ---- Cable holes and their collars -------------------------------------------------------
// A collar (chimney) of length L round a hole of diameter d is a tube below cut-off: the field
// that enters it decays as exp(−j·L/a), a = d/2. The weak case is taken throughout, the field
// along the collar's axis (j = 2.405 for a high-μ wall at low frequency), because where the
// collar points relative to the field is rarely known at the design stage. [derived]

function holeResults(holes: HoleInput[], wall_db: number): HoleResult[] {
  const target_db = Math.min(wall_db, HOLE_TARGET_MAX_DB);
  return holes.map((h, index) => {
    const collarLength_mm = h.collarLength_mm ?? 0;
    return {
      index,
      diameter_mm: h.diameter_mm,
      collarLength_mm,
      collarAttenuation_db: collarAttenuation_db(collarLength_mm, h.diameter_mm, "axial"),
      neededCollarLength_mm: collarLengthFor_mm(target_db, h.diameter_mm, "axial"),
    };
  });
}

/** Inside surface of the innermost layer, the wall the holes are compared with. */
function insideArea_mm2(ctx: Ctx, inner: Layer): number {
  if (ctx.shape === "sphere") return 4 * Math.PI * inner.a ** 2;
  if (ctx.shape === "box") {
    const [w, d, h] = inner.box;
    return 2 * (w * d + w * h + d * h);
  }
  const D = 2 * inner.a;
  return Math.PI * D * inner.L + (ctx.ends === "closed" ? 2 * (Math.PI * D * D) / 4 : 0);
}

/**
 * Holes do limit the reported figure. Each hole is a leak beside the walls, and the leaks add:
 *   1/|S_eff| = 1/|S_walls| + Σ_i (A_hole,i / A_wall)·exp(−j·L_i/a_i)
 * with A_wall the innermost layer's inside surface and j = 2.405. The area ratio stands for the
 * share of the enclosure's surface the hole replaces (a plain hole, L = 0, lets through its share
 * of the outside field; a small hole in a large shield then costs little); the collar's decay
 * multiplies it. Magnitudes are added (in phase, the worst case), the walls' phase is kept, as
 * for the open ends. A collar long enough to reach the walls' figure on its own costs under
 * 0.1 dB, so the needed length below is a length with margin. An estimate: the real leakage
 * depends on where the hole sits in the field. [derived]
 */
function holeLimit(walls: ShapeAnswer, holes: HoleResult[], wallArea_mm2: number): ShapeAnswer {
  const leak = holes.reduce((sum, h) => {
    const share = Math.min(1, (Math.PI * h.diameter_mm ** 2) / 4 / wallArea_mm2);
    return sum + share * Math.exp(-(h.collarAttenuation_db * Math.LN10) / 20);
  }, 0);
  const S = walls.S.div(1 + leak * walls.S.abs());
  return { ...walls, S, attenuation_db: dbOf(S), method: `${walls.method}; cable-hole leakage through collars exp(−2.405·L/a)` };
}

function holeWarnings(holes: HoleResult[], wall_db: number, A: number): PredictionWarning[] {
  const out: PredictionWarning[] = [];
  for (const h of holes) {
    if (h.collarLength_mm >= h.neededCollarLength_mm) continue;
    const size = `Hole ${h.index + 1} (Ø ${fmtMm(h.diameter_mm)} mm)`;
    const have = h.collarLength_mm > 0 ? `its ${fmtMm(h.collarLength_mm)} mm collar gives about ${h.collarAttenuation_db.toFixed(0)} dB` : "it has no collar";
    const target = Math.min(wall_db, HOLE_TARGET_MAX_DB);
    out.push({
      code: "SHORT_COLLAR",
      message: `${size}: ${have}, short of the ${target.toFixed(0)} dB the walls are predicted to give. Make the collar at least ${roundUp_mm(h.neededCollarLength_mm)} mm long (${fmtMm(h.neededCollarLength_mm / h.diameter_mm)} hole diameters), or the hole limits the shield.`,
    });
  }
  if (holes.length && wall_db - A >= HOLE_LIMITED_DB)
    out.push({
      code: "HOLE_LIMITED",
      message: `The cable hole${holes.length === 1 ? "" : "s"} limit${holes.length === 1 ? "s" : ""} the shield: with ${holes.length === 1 ? "it" : "them"} the estimate is ${A.toFixed(1)} dB instead of the walls' ${wall_db.toFixed(1)} dB. Longer collars bring it back.`,
    });
  return out;
}

const fmtMm = (x: number) => String(+x.toPrecision(3));
/** A length to ask for: rounded up (0.1 mm below 100 mm, else whole mm), so asking for it clears the warning. */
export const roundUpLength_mm = (x: number): number => (x < 100 ? +(Math.ceil(x * 10) / 10).toFixed(1) : Math.ceil(x));
const roundUp_mm = (x: number) => String(roundUpLength_mm(x));

function designWarnings(ctx: Ctx, layers: Layer[], input: PredictionInput, A: number): PredictionWarning[] {
  const out: PredictionWarning[] = [];
  for (const l of layers) {
    const nickelIron = l.material ? l.material.id.startsWith("ni") : l.mu >= 5000;
    if (nickelIron && l.t > NICKEL_IRON_FORMING_LIMIT_MM)
      out.push({
        code: "THICK_WALL",
        message: `${describe(l)} is thicker than nickel-iron is practically formed (about ${NICKEL_IRON_FORMING_LIMIT_MM} mm); consider more, thinner layers.`,
      });
  }
  if (ctx.f > MAX_MODEL_FREQUENCY_HZ)
    out.push({ code: "OUTSIDE_MODEL", message: `Above ${MAX_MODEL_FREQUENCY_HZ / 1000} kHz the permeability data and formulas are not reliable; treat the figure as a rough estimate.` });
  const thinForm = ctx.shape === "box" || ctx.orientation === "axial" || ctx.ends === "open";
  if (thinForm) {
    const thick = layers.find((l) => l.t > THIN_FORM_RADIUS_FRACTION * (ctx.shape === "box" ? Math.min(...l.box) / 2 : l.a));
    if (thick)
      out.push({ code: "OUTSIDE_MODEL", message: `${describe(thick)} is thick compared with the enclosure (more than a fifth of its radius); the thin-wall formulas used here lose accuracy.` });
  }
  if (ctx.shape === "cylinder" && ctx.orientation === "axial") {
    const p = input.dimensions_mm.length! / input.dimensions_mm.diameter!;
    if (p < 0.2 || p > 20)
      out.push({ code: "OUTSIDE_MODEL", message: `Length-to-diameter ratio ${p.toPrecision(3)} is outside about 0.2–20, where the axial formula has been compared with measurements.` });
  }
  if (ctx.shape === "box")
    out.push({
      code: "BOX_ESTIMATE",
      message: "Box figures are estimates: there is no exact formula for a box, and seams and lid joints usually dominate what a real box achieves.",
    });
  if (ctx.shape === "cylinder" && ctx.ends === "open")
    out.push({
      code: "OPEN_END_ESTIMATE",
      message: "Open ends leak: the figure is an estimate for the middle of the can and falls off toward the ends.",
    });
  if (layers.every((l) => l.mu < 1.5) && A < 20)
    out.push({
      code: "NON_MAGNETIC_LOW_FREQUENCY",
      message: "Only non-magnetic conductors: at this frequency they shield little, because their eddy currents are weak unless the wall is thick compared with the skin depth. Add a high-permeability layer.",
    });
  return out;
}

/** Attenuation at each frequency, other inputs unchanged. */
export function sweepAttenuation(
  input: PredictionInput,
  materials: MaterialLookup,
  frequencies_hz: number[],
): { frequency_hz: number; attenuation_db: number }[] {
  return frequencies_hz.map((frequency_hz) => ({
    frequency_hz,
    attenuation_db: predictShield({ ...input, field: { ...input.field, frequency_hz } }, materials).attenuation_db,
  }));
}

/** n frequencies spaced evenly on a log scale from `from` to `to`, both included. */
export function logFrequencies(from: number, to: number, n: number): number[] {
  if (n < 2) return [from];
  const l0 = Math.log10(from), l1 = Math.log10(to);
  return Array.from({ length: n }, (_, i) => 10 ** (l0 + ((l1 - l0) * i) / (n - 1)));
}
