// The shielding prediction behind POST /api/predictions. Two figures: the ideal (the exact
// seamless shell of the given layers) and the headline as-built figure a shield of this
// construction is expected to reach (lid joints, welds, cable holes and the construction
// ceiling; see as-built.ts and build-model.ts), with a band from the same model's spread. μ is
// the alloy's design value at the wall's operating induction; each wall's field comes from the
// exact solution at the asked frequency, and the saturation check from its peak. Every figure
// is an engineering estimate.

import { asBuiltFrom, combineWalls, jointTerms, lnCombine, lnCombine2, lnWithCeiling, NOMINAL, wallsBeforeCeiling, type JointTerms, type LossCause, type Scenario } from "./as-built";
import {
  ceiling_db,
  CONSTRUCTION_WORDS,
  constructionOf,
  DEFAULT_BUILD_MODEL,
  fitFor,
  fitInUse,
  METHOD_WORDS,
  METHODS_FOR,
  type BuildFit,
  type BuildMethod,
  type BuildModel,
  type CalibrationNote,
  type Construction,
} from "./build-model";
import { scaledBessel01, type Bessel01 } from "./bessel";
import { skinDepth_m } from "./exact";
import { holeLeak, holeResults, holeWarnings, type HoleInput, type HoleResult } from "./holes";
import { INPUT_LIMITS, rangeProblem, REPORT_LIMIT_DB, type Range } from "./limits";
import { materialLibrary, type MaterialProperties } from "./materials";
import { lowFieldLimit_T, permeabilityFor, type MaterialState, type MuSource } from "./permeability";
import { saturationMargin, saturationWarnings, type PredictionWarning } from "./saturation";
import { dbOfLn, lnSingleKaden, regimeOf, scaleCore, solveCore, type Core, type GeometryLayer, type Orientation, type Shape, type ShapeCtx } from "./shapes";
import { circumscribedRadius, decayRoot } from "./thin";

export type { Shape, Orientation } from "./shapes";
export type { HoleInput, HoleResult } from "./holes";
export { roundUpLength_mm } from "./holes";

export interface LayerInput {
  material?: string;
  mu_r?: number;
  resistivity_ohm_m?: number;
  saturation_T?: number | null;
  thickness_mm: number;
  /** clear space to the next layer outward */
  gap_mm?: number;
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
  /** the construction the as-built figure assumes; cylinder drawn (default) or rolled, box bent, sphere drawn */
  method?: BuildMethod;
  holes?: HoleInput[];
}

export interface LayerResult {
  index: number;
  material: string | null;
  thickness_mm: number;
  /** cylinder/sphere: inside radius of this layer; box: radius of the sphere through its inside corners */
  innerRadius_mm: number;
  /** peak flux density in the wall, from the exact solution at the asked frequency: what saturation is judged on */
  wallFluxDensity_T: number;
  /** the wall's flux over its thickness: where μ is read on the alloy's table */
  wallFluxMean_T: number;
  saturation_T: number | null;
  saturationMargin: number | null;
  /** relative permeability used */
  mu_r: number;
  muSource: MuSource;
  /** why this μ, in words */
  muReason: string;
  /** null at DC or for a non-conductor */
  skinDepth_mm: number | null;
}

export interface Figure {
  shieldingFactor: number;
  attenuation_db: number;
  /** above REPORT_LIMIT_DB: stated as that limit */
  beyondLimit: boolean;
}

export interface AsBuiltSummary {
  construction: Construction;
  method: BuildMethod;
  layers: number;
  /** the construction ceiling used, dB */
  ceiling_db: number;
  /** the lid joint assumed (innermost layer), or null without a lid */
  lid: { overlap_mm: number; clearance_mm: number } | null;
  /** what each cause alone takes from the ideal, largest first */
  losses: { cause: LossCause | "holes"; db: number }[];
  /** one sentence on the difference from the ideal */
  summary: string;
  /** library defaults and shop settings, or parameters fitted to the shop's measured lots */
  source: "library" | "shop";
}

export interface PredictionResult {
  /** as built: what a shield of this construction is expected to reach */
  shieldingFactor: number;
  attenuation_db: number;
  beyondLimit: boolean;
  /** the built walls alone, before the holes' leakage is counted; equals attenuation_db without holes */
  wallAttenuation_db: number;
  /** the exact seamless shell of the given layers (the check against published solutions uses it) */
  ideal: Figure;
  asBuilt: AsBuiltSummary;
  holes: HoleResult[];
  layers: LayerResult[];
  warnings: PredictionWarning[];
  method: string;
  band: { low_db: number; high_db: number; margin_db: number; basis: string };
  /** the field direction the figure holds for, in words */
  fieldDirection: string;
  estimate: true;
  /** box only: both estimates of the ideal, the lower is used */
  boxEstimates?: { rule_db: number; circumscribedSphere_db: number };
  /** present when the shop's measured lots of this design's class were fitted: whether the fit is used, on how many lots, when */
  calibration?: CalibrationNote;
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
const THIN_FORM_RADIUS_FRACTION = 1 / 5;
/** μ is re-read from the table until it moves less than this between passes */
const MU_SETTLED = 0.02;
const MAX_PASSES = 4;

interface Layer extends GeometryLayer {
  material: MaterialProperties | null;
  sat: number | null;
  /** explicit μ as given, or null for a library material */
  explicitMu: number | null;
  fit?: BuildFit;
}

interface Prepared {
  ctx: ShapeCtx;
  layers: Layer[];
  method: BuildMethod;
  construction: Construction;
  state: MaterialState;
  B0: number;
  holes: HoleInput[];
  model: BuildModel;
  /** the shop's fit of the design's class (outermost alloy, method, construction), when there is one */
  classFit?: BuildFit;
  /** scaledBessel01, or a search's memo of it */
  bessel: Bessel01;
}

interface Settled {
  core: Core;
  mus: number[];
  sources: MuSource[];
  means: number[];
}

function lookupFn(materials: MaterialLookup): (id: string) => MaterialProperties | undefined {
  return Array.isArray(materials) ? (id) => materials.find((m) => m.id === id) : materials;
}

function check(field: string, what: string, value: unknown, range: Range): number {
  const problem = typeof value === "number" ? rangeProblem(what, value, range) : `${what} must be a number.`;
  if (problem) throw new PredictionInputError(field, problem);
  return value as number;
}

function prepare(input: PredictionInput, materials: MaterialLookup, model: BuildModel, bessel: Bessel01 = scaledBessel01): Prepared {
  const lookup = lookupFn(materials);
  const shape = input.shape;
  if (shape !== "cylinder" && shape !== "box" && shape !== "sphere") throw new PredictionInputError("shape", "Shape must be cylinder, box or sphere.");
  const f = check("field.frequency_hz", "The frequency", input.field?.frequency_hz, INPUT_LIMITS.frequency_hz);
  const amplitude_uT = check("field.amplitude_uT", "The field amplitude", input.field.amplitude_uT, INPUT_LIMITS.amplitude_uT);
  if (!Array.isArray(input.layers) || input.layers.length === 0) throw new PredictionInputError("layers", "Give at least one layer.");
  const method = input.method ?? METHODS_FOR[shape][0];
  if (!METHODS_FOR[shape].includes(method))
    throw new PredictionInputError("method", `A ${shape} is made ${METHODS_FOR[shape].map((m) => METHOD_WORDS[m]).join(" or ")} here, not ${method}.`);
  const ends = shape === "cylinder" ? (input.ends ?? "closed") : "closed";
  const ctx: ShapeCtx = { shape, orientation: shape === "cylinder" ? (input.field.orientation ?? "transverse") : "transverse", ends, f };
  const construction = constructionOf(shape, ends);
  // the class's fit, by the outermost layer's alloy (a layer of another alloy keeps the library's μ: the fit was made so)
  const classFit = Array.isArray(input.layers) ? fitFor(model, input.layers[input.layers.length - 1]?.material, method, construction) : undefined;
  const muFit = classFit?.mu_effective !== undefined ? classFit : undefined;

  const d = input.dimensions_mm ?? {};
  let a: number, L = 0, box: [number, number, number] = [0, 0, 0];
  if (shape === "box") {
    box = [
      check("dimensions_mm.width", "The inside width", d.width, INPUT_LIMITS.dimension_mm),
      check("dimensions_mm.depth", "The inside depth", d.depth, INPUT_LIMITS.dimension_mm),
      check("dimensions_mm.height", "The inside height", d.height, INPUT_LIMITS.dimension_mm),
    ];
    a = circumscribedRadius(...box);
  } else {
    a = check("dimensions_mm.diameter", "The inside diameter", d.diameter, INPUT_LIMITS.dimension_mm) / 2;
    if (shape === "cylinder") L = check("dimensions_mm.length", "The inside length", d.length, INPUT_LIMITS.dimension_mm);
  }

  const layers: Layer[] = input.layers.map((li, i) => {
    const t = check(`layers.${i}.thickness_mm`, "The wall thickness", li.thickness_mm, INPUT_LIMITS.thickness_mm);
    const gap = li.gap_mm === undefined ? 0 : check(`layers.${i}.gap_mm`, "The gap", li.gap_mm, INPUT_LIMITS.gap_mm);
    let material: MaterialProperties | null = null;
    let rho: number, sat: number | null, explicitMu: number | null = null;
    if (li.material != null) {
      const m = lookup(li.material);
      if (!m) throw new PredictionInputError(`layers.${i}.material`, `Unknown material "${li.material}".`);
      material = m;
      rho = m.resistivity_ohm_m;
      sat = m.saturation_T;
    } else {
      if (li.mu_r === undefined) throw new PredictionInputError(`layers.${i}.mu_r`, "Give a material id or mu_r (1 or more).");
      explicitMu = check(`layers.${i}.mu_r`, "The relative permeability", li.mu_r, INPUT_LIMITS.mu_r);
      rho = check(`layers.${i}.resistivity_ohm_m`, "The resistivity", li.resistivity_ohm_m, INPUT_LIMITS.resistivity_ohm_m);
      sat = li.saturation_T == null ? null : check(`layers.${i}.saturation_T`, "The saturation", li.saturation_T, INPUT_LIMITS.saturation_T);
    }
    const fit = muFit && material?.id === muFit.material ? muFit : undefined;
    const layer: Layer = { index: i, material, t, a, L, box: [...box], rho, sat, explicitMu, ...(fit?.mu_effective !== undefined ? { fit } : {}) };
    // next layer's inside = this one's outside plus the gap
    const grow = 2 * (t + gap);
    if (shape === "box") {
      box = [box[0] + grow, box[1] + grow, box[2] + grow];
      a = circumscribedRadius(...box);
    } else {
      a += t + gap;
      L += grow;
    }
    return layer;
  });

  const holes = input.holes ?? [];
  holes.forEach((h, i) => {
    check(`holes.${i}.diameter_mm`, "The hole diameter", h.diameter_mm, INPUT_LIMITS.holeDiameter_mm);
    if (h.collarLength_mm !== undefined) check(`holes.${i}.collarLength_mm`, "The collar length", h.collarLength_mm, INPUT_LIMITS.collarLength_mm);
  });

  return { ctx, layers, method, construction, state: input.state ?? "annealed", B0: amplitude_uT * 1e-6, holes, model, ...(classFit ? { classFit } : {}), bessel };
}

/**
 * μ and the walls' field together: start from each alloy's low-field design μ, solve, read μ
 * again at each wall's mean flux, and repeat until μ settles (at low induction it never moves:
 * one solve). Later passes move halfway in log μ so that a wall near saturation cannot swing.
 */
function settle(p: Prepared): Settled {
  const { ctx, layers, B0 } = p;
  let choice = chooseMu(p, layers.map(() => 0), false);
  let mus = choice.map((c) => c.mu_r);
  let core = solveCore(ctx, layers, mus, true, p.bessel);
  for (let pass = 1; pass < MAX_PASSES; pass++) {
    const next = chooseMu(p, core.fields!.map((w) => w.mean * B0), false);
    if (next.every((c, i) => Math.abs(c.mu_r - mus[i]) <= MU_SETTLED * mus[i])) {
      choice = next;
      break;
    }
    choice = next;
    mus = next.map((c, i) => (pass === 1 ? c.mu_r : Math.sqrt(c.mu_r * mus[i])));
    core = solveCore(ctx, layers, mus, true, p.bessel);
  }
  return { core, mus, sources: choice.map((c) => c.muSource), means: core.fields!.map((w) => w.mean * B0) };
}

/**
 * The seamless figure, ln|S|. Where a shop fit sets a layer's μ, the ideal keeps the alloy's
 * design μ when the fit is lower (the fit's μ is an effective one, with the construction's losses
 * in it) and takes the fit's when it is higher: the library's μ are guaranteed minimums, and a
 * shield of the shop's own better material is no longer bounded by a shell of the minimum.
 */
function idealLn(p: Prepared, s: Settled): number {
  let core = s.core;
  if (p.layers.some((l) => l.fit)) {
    const design = chooseMu(p, s.means, true).map((c) => c.mu_r);
    const mus = p.layers.map((l, i) => (l.fit ? Math.max(design[i], s.mus[i]) : s.mus[i]));
    if (mus.some((mu, i) => mu !== s.mus[i])) core = solveCore(p.ctx, p.layers, mus, false);
  }
  return lnCombine([core.lnClosed, core.openLeak > 0 ? -Math.log(core.openLeak) : Infinity]);
}

function termsFor(p: Prepared, mus: number[]): JointTerms {
  // the class's fitted ceiling (the outermost layer's alloy meets the field first)
  return jointTerms({ ctx: p.ctx, layers: p.layers, mus, model: p.model, method: p.method, construction: p.construction, fittedCeiling_db: p.classFit?.ceiling_db });
}

/** ln of the holes' 1/leak beside the walls (Infinity without holes). */
function holesLn(p: Prepared, mus: number[]): number {
  if (!p.holes.length) return Infinity;
  return -Math.log(holeLeak(holeResults(p.holes, 0, collarRoot(p, mus)), insideArea_mm2(p)));
}

/** The as-built ln|S| (holes included) with the library layers' μ scaled by k and the scenario's joints and ceiling. */
function bandLn(p: Prepared, s: Settled, terms: JointTerms, lnKadens: number[], k: number, scenario: Scenario, lnHoles: number): number {
  const factors = p.layers.map((l) => (l.material ? k : 1));
  const core = scaleCore(p.ctx, s.core, p.layers, s.mus, factors, lnKadens);
  return lnCombine([combineWalls(core, terms, scenario), lnHoles]);
}

/** Each layer's μ at the given mean wall flux (the library's design value when `design`, without a shop fit). */
function chooseMu(p: Prepared, means: number[], design: boolean): { mu_r: number; muSource: MuSource }[] {
  return p.layers.map((l, i) =>
    l.material ? permeabilityFor(l.material, p.state, means[i], design ? undefined : l.fit?.mu_effective) : { mu_r: l.explicitMu!, muSource: "explicit" as MuSource },
  );
}

/** Inside surface of the innermost layer, the wall the holes are compared with. */
function insideArea_mm2(p: Prepared): number {
  const inner = p.layers[0];
  if (p.ctx.shape === "sphere") return 4 * Math.PI * inner.a ** 2;
  if (p.ctx.shape === "box") {
    const [w, d, h] = inner.box;
    return 2 * (w * d + w * h + d * h);
  }
  const D = 2 * inner.a;
  return Math.PI * D * inner.L + (p.ctx.ends === "closed" ? 2 * (Math.PI * D * D) / 4 : 0);
}

/** The collar's decay constant: a tube of the innermost layer's material, weak direction. */
function collarRoot(p: Prepared, mus: number[]) {
  return (diameter_mm: number) => decayRoot("weak", regimeOf(p.layers[0], mus[0], p.ctx.f, diameter_mm / 2));
}

/** A figure as stated: finite, at least 0 dB, at most REPORT_LIMIT_DB (flagged beyond). */
function figure(ln: number): Figure {
  const db = Math.max(0, dbOfLn(ln));
  const stated = Math.min(db, REPORT_LIMIT_DB);
  return { shieldingFactor: 10 ** (stated / 20), attenuation_db: stated, beyondLimit: db > REPORT_LIMIT_DB };
}

/** The figure's dB alone (as figure(ln).attenuation_db). */
const statedDb = (ln: number): number => Math.min(Math.max(0, dbOfLn(ln)), REPORT_LIMIT_DB);

const fmt = (x: number, digits = 3) => String(+x.toPrecision(digits));
const tesla = (B: number) => (B >= 0.1 ? `${fmt(B)} T` : B >= 1e-4 ? `${fmt(B * 1000)} mT` : `${fmt(B * 1e6)} µT`);

function muReason(l: Layer, source: MuSource, mean_T: number, state: MaterialState, p: Prepared): string {
  if (!l.material) return "as you gave it";
  if (l.material.saturation_T == null && l.material.relativePermeability.maximum <= 1) return "non-magnetic: μr = 1";
  const limit = tesla(lowFieldLimit_T(l.material));
  let why: string;
  if (source === "shop") why = `the shop's effective low-field μ for ${l.material.id}, ${METHOD_WORDS[p.method]}, ${CONSTRUCTION_WORDS[p.construction]}, fitted to measured lots`;
  else if (source === "initial") why = `the alloy's initial permeability (design value): the wall's mean flux, ${tesla(mean_T)}, is in the low-field range (up to ${limit}), where μ stays at its initial value`;
  else why = `read from the alloy's μ(B) table at the wall's mean flux, ${tesla(mean_T)}, above the low-field range (${limit})`;
  return state === "as-formed" ? `${why}; × ${l.material.asFormedFactor} as formed, before the final anneal` : why;
}

function fieldDirection(ctx: ShapeCtx): string {
  if (ctx.shape === "sphere") return "in any direction: a sphere shields every direction alike";
  if (ctx.shape === "box") return "in any direction, taken at its weakest: the trade rule with the largest inside side, and the lid joint and corner welds counted as if the field crossed them";
  return ctx.orientation === "axial" ? "along the can's axis" : "across the can's axis";
}

const CAUSE_WORDS: Record<LossCause | "holes", string> = { ceiling: "the construction ceiling", "lid-joints": "the lid joint", welds: "the welds", holes: "the cable holes" };

function summary(asBuilt_db: number, ideal: Figure, losses: AsBuiltSummary["losses"], a: { ceiling_db: number; construction: Construction; method: BuildMethod; layers: number; lid: AsBuiltSummary["lid"] }): string {
  const idealText = ideal.beyondLimit ? `more than ${REPORT_LIMIT_DB} dB` : `${ideal.attenuation_db.toFixed(1)} dB`;
  const diff = ideal.attenuation_db - asBuilt_db;
  if (diff < 0.1) return `The built ${CONSTRUCTION_WORDS[a.construction]} should reach about the seamless shell's ${idealText}: the walls decide, not the construction.`;
  const top = losses[0];
  let cause = CAUSE_WORDS[top.cause];
  if (top.cause === "ceiling") cause += ` of a ${METHOD_WORDS[a.method]} ${CONSTRUCTION_WORDS[a.construction]} (${a.ceiling_db.toFixed(0)} dB for ${a.layers} layer${a.layers === 1 ? "" : "s"}, a shop setting)`;
  if (top.cause === "lid-joints" && a.lid) cause += ` (${fmt(a.lid.overlap_mm)} mm overlap at ${fmt(a.lid.clearance_mm)} mm clearance)`;
  return `Built, it should reach about ${asBuilt_db.toFixed(1)} dB, ${ideal.beyondLimit ? "far" : `${diff.toFixed(1)} dB`} below the seamless shell's ${idealText}, limited mostly by ${cause}.`;
}

/**
 * `detail: false` leaves out what only a reader of one prediction needs: the sentences (the
 * as-built summary and each layer's μ reason are empty), the warnings and what each loss takes
 * (`asBuilt.losses` is empty). A search that predicts thousands of designs reads only the
 * figures, which are the same.
 */
export function predictShield(
  input: PredictionInput,
  materials: MaterialLookup = materialLibrary,
  build: BuildModel = DEFAULT_BUILD_MODEL,
  options: { detail?: boolean } = {},
): PredictionResult {
  const detail = options.detail ?? true;
  const p = prepare(input, materials, build);
  const { ctx, layers, B0 } = p;
  const { s, ideal, terms, walls, wallAttenuation_db, holes, lnHoles, built } = worked(p, detail);

  const band = bandOf(p, s, terms, lnHoles, built.attenuation_db, ideal.attenuation_db);

  const losses: AsBuiltSummary["losses"] = !detail ? [] : (Object.entries(walls.losses) as [LossCause, number][])
    .map(([cause, db]): AsBuiltSummary["losses"][number] => ({ cause, db }))
    .concat(holes.length ? [{ cause: "holes" as const, db: Math.max(0, wallAttenuation_db - built.attenuation_db) }] : [])
    .filter((x) => x.db >= 0.05)
    .sort((x, y) => y.db - x.db);
  const asBuilt: AsBuiltSummary = {
    construction: p.construction,
    method: p.method,
    layers: layers.length,
    ceiling_db: walls.ceiling_db,
    lid: walls.lid,
    losses,
    summary: "",
    source: fitInUse(p.classFit) ? "shop" : "library",
  };
  if (detail) asBuilt.summary = summary(built.attenuation_db, ideal, losses.length ? losses : [{ cause: "ceiling", db: 0 }], asBuilt);

  const layerResults: LayerResult[] = layers.map((l, i) => {
    const w = s.core.fields![i];
    const peak = wallPeak_T(s, i, B0);
    const d = skinDepth_m(l.rho, s.mus[i], ctx.f);
    return {
      index: l.index,
      material: l.material ? l.material.id : null,
      thickness_mm: l.t,
      innerRadius_mm: l.a,
      wallFluxDensity_T: peak,
      wallFluxMean_T: Math.min(w.mean * B0, 1e6),
      saturation_T: l.sat,
      saturationMargin: saturationMargin(l.sat, peak),
      mu_r: s.mus[i],
      muSource: s.sources[i],
      muReason: detail ? muReason(l, s.sources[i], s.means[i], p.state, p) : "",
      skinDepth_mm: Number.isFinite(d) ? d * 1000 : null,
    };
  });

  const warnings: PredictionWarning[] = detail ? warningsFor(p, s, input, layerResults, ideal, holes, wallAttenuation_db, built.attenuation_db) : [];

  return {
    shieldingFactor: built.shieldingFactor,
    attenuation_db: built.attenuation_db,
    beyondLimit: built.beyondLimit,
    wallAttenuation_db,
    ideal,
    asBuilt,
    holes,
    layers: layerResults,
    warnings,
    method: s.core.method,
    band,
    fieldDirection: fieldDirection(ctx),
    estimate: true,
    ...(s.core.boxEstimates ? { boxEstimates: s.core.boxEstimates } : {}),
    ...(p.classFit?.calibration ? { calibration: p.classFit.calibration } : {}),
  };
}

/** What the answer's figures are worked out from: the settled core, the ideal, the joints, the walls, the holes and the as-built figure. */
interface Worked {
  s: Settled;
  ideal: Figure;
  terms: JointTerms;
  walls: ReturnType<typeof asBuiltFrom>;
  wallAttenuation_db: number;
  holes: HoleResult[];
  lnHoles: number;
  built: Figure;
}

function worked(p: Prepared, detail: boolean): Worked {
  const s = settle(p);
  const lnIdeal = idealLn(p, s);
  const ideal = figure(lnIdeal);

  const terms = termsFor(p, s.mus);
  const walls = asBuiltFrom(s.core, terms, NOMINAL, detail);
  const lnWalls = Math.min(walls.ln, lnIdeal);
  const wallAttenuation_db = figure(lnWalls).attenuation_db;
  const holes = holeResults(p.holes, wallAttenuation_db, collarRoot(p, s.mus));
  const area = insideArea_mm2(p);
  const lnHoles = holes.length ? -Math.log(holeLeak(holes, area)) : Infinity;
  const lnBuilt = Math.min(lnCombine([lnWalls, lnHoles]), lnIdeal);
  return { s, ideal, terms, walls, wallAttenuation_db, holes, lnHoles, built: figure(lnBuilt) };
}

/** A layer's peak wall flux, T (the answer's wallFluxDensity_T). */
const wallPeak_T = (s: Settled, i: number, B0: number): number => Math.min(s.core.fields![i].peak * B0, 1e6);

/**
 * The figures a search of many designs reads, with the band worked out only when asked for
 * (a design the search sets aside on its figure alone never needs it). Each number is the one
 * predictShield gives for the same input, by the same functions; `bessel` is the search's
 * besselMemo(), which gives scaledBessel01's own values.
 */
export interface ShieldFigures {
  /** predictShield's attenuation_db */
  attenuation_db: number;
  /** predictShield's ideal.attenuation_db */
  ideal_db: number;
  /** predictShield's layers: thickness, peak wall flux and saturation margin */
  layers: { thickness_mm: number; wallFluxDensity_T: number; saturationMargin: number | null }[];
  /** predictShield's band */
  band(): PredictionResult["band"];
}

export function predictFigures(input: PredictionInput, materials: MaterialLookup = materialLibrary, build: BuildModel = DEFAULT_BUILD_MODEL, bessel?: Bessel01): ShieldFigures {
  const p = prepare(input, materials, build, bessel);
  const w = worked(p, false);
  return {
    attenuation_db: w.built.attenuation_db,
    ideal_db: w.ideal.attenuation_db,
    layers: p.layers.map((l, i) => {
      const peak = wallPeak_T(w.s, i, p.B0);
      return { thickness_mm: l.t, wallFluxDensity_T: peak, saturationMargin: saturationMargin(l.sat, peak) };
    }),
    band: () => bandOf(p, w.s, w.terms, w.lnHoles, w.built.attenuation_db, w.ideal.attenuation_db),
  };
}

/**
 * The likely range. With a calibration of the design's class in use: the spread of its
 * cross-validated errors around the figure (measured lots of this class, each predicted by a
 * fit that had not seen it). Otherwise the same model with its parameters across their usual
 * spread. Never above the ideal, and the figure is always inside it.
 */
function bandOf(p: Prepared, s: Settled, terms: JointTerms, lnHoles: number, built_db: number, ideal_db: number): PredictionResult["band"] {
  const fitted = fitInUse(p.classFit) ? p.classFit.band_db : undefined;
  if (fitted) {
    const low = Math.max(0, built_db - fitted.below);
    return { low_db: low, high_db: Math.min(ideal_db, built_db + fitted.above), margin_db: built_db - low, basis: fitted.basis };
  }
  const { ctx, layers } = p;
  const spread = p.model.spread;
  // each layer's own thin-wall strength (across the axis the core already has it)
  const lnKadens = ctx.shape === "cylinder" && ctx.orientation === "transverse" ? s.core.lnSingle : layers.map((l, i) => lnSingleKaden(ctx, l, s.mus[i]));
  const lowLn = bandLn(p, s, terms, lnKadens, spread.muLow, { clearanceFactor: spread.clearanceFactor, ceilingShift_db: -spread.ceiling_db }, lnHoles);
  const highLn = bandLn(p, s, terms, lnKadens, spread.muHigh, { clearanceFactor: 1 / spread.clearanceFactor, ceilingShift_db: spread.ceiling_db }, lnHoles);
  const low = Math.min(built_db, figure(lowLn).attenuation_db);
  const high = Math.min(ideal_db, Math.max(built_db, figure(highLn).attenuation_db));
  return { low_db: low, high_db: high, margin_db: built_db - low, basis: spread.basis };
}

/**
 * The engine's terms of one design that the construction ceiling combines with, so that a fit
 * can try many ceilings without solving the walls again: responseDb(ceilingResponse(x, m, b), c)
 * is predictShield(x, m, b) with the class's one-layer ceiling set to c (the same functions
 * combine them; tests/unit/calibration-fit.test.ts checks the two agree).
 */
export interface CeilingResponse {
  /** ln|S| of the built walls and open ends, before the ceiling */
  lnWalls: number;
  /** ln|S| of the seamless core with the μ used (the walls never exceed it) */
  lnCore: number;
  /** ln|S| of the ideal (the library's design μ) */
  lnIdeal: number;
  /** ln of the holes' 1/leak (Infinity: no holes) */
  lnHoles: number;
  /** what the nest's further layers add to the one-layer ceiling, dB */
  extraLayers_db: number;
}

export function ceilingResponse(input: PredictionInput, materials: MaterialLookup = materialLibrary, build: BuildModel = DEFAULT_BUILD_MODEL): CeilingResponse {
  const p = prepare(input, materials, build);
  const s = settle(p);
  const { lnWalls, lnCore } = wallsBeforeCeiling(s.core, termsFor(p, s.mus));
  return { lnWalls, lnCore, lnIdeal: idealLn(p, s), lnHoles: holesLn(p, s.mus), extraLayers_db: ceiling_db(p.model, p.construction, p.layers.length, 0) };
}

/** The as-built attenuation, dB, of a design's response with its class's one-layer ceiling at `ceiling1_db`. */
export function responseDb(r: CeilingResponse, ceiling1_db: number): number {
  const lnWalls = Math.min(lnWithCeiling(r, ceiling1_db + r.extraLayers_db), r.lnIdeal);
  return statedDb(Math.min(lnCombine2(lnWalls, r.lnHoles), r.lnIdeal));
}

function warningsFor(
  p: Prepared,
  s: Settled,
  input: PredictionInput,
  layerResults: LayerResult[],
  ideal: Figure,
  holes: HoleResult[],
  wallAttenuation_db: number,
  built_db: number,
): PredictionWarning[] {
  const { ctx, layers } = p;
  const warnings: PredictionWarning[] = saturationWarnings(
    layerResults.map((l, i) => ({ label: describe(layers[i]), wallFlux_T: l.wallFluxDensity_T, saturation_T: l.saturation_T })),
    ctx.f > 0,
  );
  warnings.push(...designWarnings(ctx, layers, input, s.mus, ideal.attenuation_db));
  warnings.push(...holeWarnings(holes, wallAttenuation_db, built_db));
  if (ideal.beyondLimit)
    warnings.push({
      code: "BEYOND_REPORT_LIMIT",
      message: `The seamless shell's figure is beyond ${REPORT_LIMIT_DB} dB and is stated as ${REPORT_LIMIT_DB} dB: no measurement reaches there, and a built shield is limited long before by its construction.`,
    });
  return warnings;
}

function describe(l: Layer): string {
  return `Layer ${l.index + 1} (${l.material ? l.material.id : `μr ${l.explicitMu}`}, ${l.t} mm)`;
}

function designWarnings(ctx: ShapeCtx, layers: Layer[], input: PredictionInput, mus: number[], ideal_db: number): PredictionWarning[] {
  const out: PredictionWarning[] = [];
  for (const [i, l] of layers.entries()) {
    const nickelIron = l.material ? l.material.id.startsWith("ni") : mus[i] >= 5000;
    if (nickelIron && l.t > NICKEL_IRON_FORMING_LIMIT_MM)
      out.push({
        code: "THICK_WALL",
        message: `${describe(l)} is thicker than nickel-iron is practically formed (about ${NICKEL_IRON_FORMING_LIMIT_MM} mm); consider more, thinner layers.`,
      });
  }
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
      message: "Box figures are estimates: there is no exact formula for a box, and seams and lid joints usually dominate what a real box achieves. The figure is for the weakest field direction.",
    });
  if (ctx.shape === "cylinder" && ctx.ends === "open")
    out.push({
      code: "OPEN_END_ESTIMATE",
      message: "Open ends leak: the figure is an estimate for the middle of the can and falls off toward the ends.",
    });
  if (mus.every((mu) => mu < 1.5) && ideal_db < 20)
    out.push({
      code: "NON_MAGNETIC_LOW_FREQUENCY",
      message: "Only non-magnetic conductors: at this frequency they shield little, because their eddy currents are weak unless the wall is thick compared with the skin depth. Add a high-permeability layer.",
    });
  return out;
}

export interface SweepPoint {
  frequency_hz: number;
  /** as built */
  attenuation_db: number;
  /** the seamless shell */
  ideal_db: number;
}

/** Both figures at each frequency, other inputs unchanged (no band, no warnings: the chart's curve). */
export function sweepAttenuation(input: PredictionInput, materials: MaterialLookup, frequencies_hz: number[], build: BuildModel = DEFAULT_BUILD_MODEL): SweepPoint[] {
  const base = prepare({ ...input, field: { ...input.field, frequency_hz: 0 } }, materials, build);
  return frequencies_hz.map((frequency_hz) => {
    check("field.frequency_hz", "The frequency", frequency_hz, INPUT_LIMITS.frequency_hz);
    const p: Prepared = { ...base, ctx: { ...base.ctx, f: frequency_hz } };
    const s = settle(p);
    const lnIdeal = idealLn(p, s);
    const lnWalls = Math.min(combineWalls(s.core, termsFor(p, s.mus)), lnIdeal);
    let lnBuilt = lnWalls;
    if (p.holes.length) {
      const holes = holeResults(p.holes, 0, collarRoot(p, s.mus));
      lnBuilt = Math.min(lnCombine([lnWalls, -Math.log(holeLeak(holes, insideArea_mm2(p)))]), lnIdeal);
    }
    return { frequency_hz, attenuation_db: figure(lnBuilt).attenuation_db, ideal_db: figure(lnIdeal).attenuation_db };
  });
}

/** n frequencies spaced evenly on a log scale from `from` to `to`, both included. */
export function logFrequencies(from: number, to: number, n: number): number[] {
  if (n < 2) return [from];
  const l0 = Math.log10(from), l1 = Math.log10(to);
  return Array.from({ length: n }, (_, i) => 10 ** (l0 + ((l1 - l0) * i) / (n - 1)));
}
