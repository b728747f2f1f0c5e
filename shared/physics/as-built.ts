// What a built shield of this construction reaches: the seamless core with each layer weakened
// by its lid joint and its welds, then the construction ceiling (1/S = 1/S_walls + 1/S_ceiling).
// Everything is carried as ln|S| so that cores of thousands of dB stay finite. The terms and
// their derivations are in build-model.ts; this file only combines them.

import { c, type Complex } from "./complex";
import {
  ceiling_db,
  lidJointAcross,
  lidJointAlong,
  lidOverlap_mm,
  oneSidedPathFactor,
  weldPath_mm,
  type BuildMethod,
  type BuildModel,
  type Construction,
} from "./build-model";
import { REPORT_LIMIT_DB } from "./limits";
import { dbOfLn, regimeOf, type Core, type GeometryLayer, type ShapeCtx } from "./shapes";
import { CONDUCTOR_ROOT, decayRoot, magneticShare, nestedShells } from "./thin";

export interface Scenario {
  /** the lid clearance is the shop's figure times this */
  clearanceFactor: number;
  /** added to the ceiling, dB */
  ceilingShift_db: number;
}
export const NOMINAL: Scenario = { clearanceFactor: 1, ceilingShift_db: 0 };

export type LossCause = "lid-joints" | "welds" | "ceiling";

export interface AsBuiltWalls {
  /** ln|S| of the built walls (no holes) */
  ln: number;
  /** ln|S| of the seamless core (open ends included): the ideal */
  lnIdeal: number;
  ceiling_db: number;
  /** what each cause alone takes from the ideal, dB */
  losses: Record<LossCause, number>;
  lid: { overlap_mm: number; clearance_mm: number } | null;
}

/** ln(1 + e^x) without overflow. */
function softplus(x: number): number {
  return x > 30 ? x : Math.log1p(Math.exp(x));
}

/** ln of 1/Σ(1/S_k) from the ln|S_k| (a leak of 0 is ln = +∞). */
export function lnCombine(lns: number[]): number {
  let m = -Infinity;
  for (const x of lns) if (-x > m) m = -x;
  if (m === -Infinity) return Infinity;
  let sum = 0;
  for (const x of lns) if (x !== Infinity) sum += Math.exp(-x - m);
  return -(m + Math.log(sum));
}

/** lnCombine of two terms, without the list (a fit combines millions of pairs); the same arithmetic. */
export function lnCombine2(a: number, b: number): number {
  const m = Math.max(-a, -b);
  if (m === -Infinity) return Infinity;
  return -(m + Math.log((a !== Infinity ? Math.exp(-a - m) : 0) + (b !== Infinity ? Math.exp(-b - m) : 0)));
}

interface TermProps {
  ctx: ShapeCtx;
  layers: GeometryLayer[];
  mus: number[];
  model: BuildModel;
  method: BuildMethod;
  construction: Construction;
  /** a ceiling fitted to measured lots for this alloy, method and construction */
  fittedCeiling_db?: number;
}

/** ln of each layer's weakening by its welds: a factor on its flux shunting, by the magnetic share. */
function weldLn(p: TermProps, l: GeometryLayer, share: number, axial: boolean): number {
  const dS = weldPath_mm(p.model.weld, l.t);
  let d = 1;
  if (p.method === "rolled") {
    // the longitudinal seam lies in one half path across the axis; along the axis the welded
    // bottom's circumferential weld is in series with the length
    d = axial ? 1 + dS / l.L : oneSidedPathFactor(dS, (Math.PI * (2 * l.a + l.t)) / 2);
  } else if (p.method === "bent") {
    // a field across a box runs round it through two corner welds in each half path
    d = 1 + (2 * dS) / (l.box[0] + l.box[1]);
  }
  return Math.log(1 + share * (d - 1));
}

/**
 * ln|S_lid| of a layer's lid joint. A non-magnetic conductor's eddy currents cannot cross a
 * slip-on lid: for it the lid end is an open end. Between the two the logarithms are
 * interpolated by the magnetic share, as the decay constants are.
 */
function lidLn(p: TermProps, l: GeometryLayer, mu: number, share: number, axial: boolean, clearance: number): number {
  let magnetic: number, conductor: number;
  if (p.ctx.shape === "box") {
    const [bw, bd, bh] = l.box;
    const Deq = Math.sqrt((4 * bw * bd) / Math.PI);
    magnetic = lidJointAlong(lidOverlap_mm(p.model, bh), bh, Deq, clearance);
    conductor = Math.min(700, (CONDUCTOR_ROOT.transverse * bh) / Deq);
  } else if (axial) {
    magnetic = lidJointAlong(lidOverlap_mm(p.model, l.L), l.L, 2 * l.a + l.t, clearance);
    conductor = Math.min(700, (CONDUCTOR_ROOT.axial * l.L) / 2 / l.a);
  } else {
    magnetic = lidJointAcross(lidOverlap_mm(p.model, l.L), l.L, l.a, clearance, decayRoot("transverse", regimeOf(l, mu, p.ctx.f)));
    conductor = Math.min(700, (CONDUCTOR_ROOT.transverse * l.L) / 2 / l.a);
  }
  return share * Math.log(magnetic) + (1 - share) * conductor;
}

/** ln|S| of the closed walls, each layer weakened by its welds and lid as asked. */
function closedWalls(core: Core, weld: number[], lid: number[], useWelds: boolean, useLids: boolean): number {
  if (core.nest) {
    // along the axis each layer's own factor is weakened, then the layers are nested again
    const per: Complex[] = [];
    for (let i = 0; i < core.nest.per.length; i++) {
      const S = core.nest.per[i];
      const m = S.abs();
      const inv = (useWelds ? Math.exp(weld[i]) : 1) / m + (useLids && lid[i] !== Infinity ? Math.exp(-lid[i]) : 0);
      per.push(m > 0 ? S.div(m * inv) : c(1));
    }
    return Math.log(Math.max(nestedShells(per, core.nest.ratios).abs(), 1e-300));
  }
  // a layer alone is never stronger than the whole (a single layer's own figure is the core's,
  // so that a stronger wall never reads worse for a mismatch of the two estimates)
  // Layer i alone: 1/S_i* = d_weld/S_i + 1/S_lid, so ln S_i* = ln S_i − ln d − softplus(ln S_i − ln d − ln S_lid)
  let ln = core.lnClosed;
  for (let i = 0; i < weld.length; i++) {
    const w = useWelds ? weld[i] : 0;
    ln -= w;
    if (useLids && lid[i] !== Infinity && core.lnSingle[i] !== undefined) ln -= softplus(Math.min(core.lnSingle[i], core.lnClosed) - w - lid[i]);
  }
  return ln;
}

/** The joints' and ceiling's terms of a design, worked out once for the nominal answer and its band. */
export interface JointTerms {
  /** ln of each layer's weakening by its welds */
  weld: number[];
  /** ln|S_lid| of each layer's lid joint at the shop's clearance (Infinity: no lid) */
  lid: number[];
  /** each layer's magnetic share (how much of the lid term scales with the clearance) */
  share: number[];
  ceiling_db: number;
  lid0: { overlap_mm: number; clearance_mm: number } | null;
}

export function jointTerms(p: TermProps): JointTerms {
  const { ctx, layers, mus, model, construction } = p;
  const axial = ctx.shape === "cylinder" && ctx.orientation === "axial";
  const hasLid = construction === "closed-can" || construction === "box";
  const weld: number[] = [], lid: number[] = [], share: number[] = [];
  for (let i = 0; i < layers.length; i++) {
    const w = magneticShare(regimeOf(layers[i], mus[i], ctx.f));
    share.push(w);
    weld.push(weldLn(p, layers[i], w, axial));
    lid.push(hasLid ? lidLn(p, layers[i], mus[i], w, axial, model.lidClearance_mm) : Infinity);
  }
  return {
    weld,
    lid,
    share,
    ceiling_db: ceiling_db(model, construction, layers.length, p.fittedCeiling_db),
    lid0: hasLid ? { overlap_mm: lidOverlap_mm(model, ctx.shape === "box" ? layers[0].box[2] : layers[0].L), clearance_mm: model.lidClearance_mm } : null,
  };
}

/** The built walls (open ends included) before the ceiling, and the seamless core they never exceed. */
export interface WallsBeforeCeiling {
  lnWalls: number;
  lnCore: number;
}

export function wallsBeforeCeiling(core: Core, terms: Pick<JointTerms, "weld" | "lid">): WallsBeforeCeiling {
  const lnOpen = core.openLeak > 0 ? -Math.log(core.openLeak) : Infinity;
  return { lnWalls: lnCombine([closedWalls(core, terms.weld, terms.lid, true, true), lnOpen]), lnCore: lnCombine([core.lnClosed, lnOpen]) };
}

/** 1/S = 1/S_walls + 1/S_ceiling, never above the seamless core: the one place the ceiling is combined. */
export function lnWithCeiling(w: WallsBeforeCeiling, ceiling_db: number): number {
  return Math.min(lnCombine2(w.lnWalls, ceiling_db / dbOfLn(1)), w.lnCore);
}

/** The built walls' ln|S| for a core, the joints' terms and a scenario (the band moves the clearance and the ceiling). */
export function combineWalls(core: Core, terms: JointTerms, scenario: Scenario = NOMINAL): number {
  let lid = terms.lid;
  if (scenario.clearanceFactor !== 1) {
    // the magnetic part of S_lid goes as 1/clearance
    const shift = Math.log(scenario.clearanceFactor);
    lid = terms.lid.map((x, i) => (x === Infinity ? x : x - terms.share[i] * shift));
  }
  return lnWithCeiling(wallsBeforeCeiling(core, { weld: terms.weld, lid }), terms.ceiling_db + scenario.ceilingShift_db);
}

/** What a cause takes from the ideal, dB, at most the ideal as stated (a core beyond the report limit is "far" above anything built). */
function lossFrom(lnIdeal: number, ln: number): number {
  return Math.min(Math.max(0, dbOfLn(lnIdeal - ln)), REPORT_LIMIT_DB);
}

/** The nominal (or a scenario's) built walls with, when asked, what each cause alone costs. */
export function asBuiltFrom(core: Core, terms: JointTerms, scenario: Scenario, withLosses: boolean): AsBuiltWalls {
  const lnOpen = core.openLeak > 0 ? -Math.log(core.openLeak) : Infinity;
  const lnIdeal = lnCombine([core.lnClosed, lnOpen]);
  const ceiling = terms.ceiling_db + scenario.ceilingShift_db;
  const losses: Record<LossCause, number> = { "lid-joints": 0, welds: 0, ceiling: 0 };
  if (withLosses) {
    const lnCeiling = ceiling / dbOfLn(1);
    if (terms.lid0) losses["lid-joints"] = lossFrom(lnIdeal, lnCombine([closedWalls(core, terms.weld, terms.lid, false, true), lnOpen]));
    losses.welds = lossFrom(lnIdeal, lnCombine([closedWalls(core, terms.weld, terms.lid, true, false), lnOpen]));
    losses.ceiling = lossFrom(lnIdeal, lnCombine([core.lnClosed, lnOpen, lnCeiling]));
  }
  return {
    ln: combineWalls(core, terms, scenario),
    lnIdeal,
    ceiling_db: ceiling,
    losses,
    lid: terms.lid0 ? { overlap_mm: terms.lid0.overlap_mm, clearance_mm: terms.lid0.clearance_mm * scenario.clearanceFactor } : null,
  };
}
