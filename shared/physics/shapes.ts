// The seamless core of each shape: the shielding of the given layers with the given μ, the
// field each wall carries, and what the as-built model needs to weaken each layer on its own.
// Cylinders across the field and spheres are exact (complex Bessel); a closed can along its axis,
// a box and open ends are the thin-wall estimates of domain.md, with the exact solutions' AC gain.

import { scaledBessel01, type Bessel01 } from "./bessel";
import { Complex, c, capMagnitude } from "./complex";
import {
  cylindricalShieldingFactor,
  skinDepth_m,
  sphericalShieldingFactor,
  staticCylindricalShell,
  type Shell,
  type WallField,
} from "./exact";
import { wallFluxDensity_T } from "./saturation";
import { decayRoot, demagnetizingFactor, nestedShells, wallRegime } from "./thin";

export type Shape = "cylinder" | "box" | "sphere";
export type Orientation = "transverse" | "axial";

/** A layer's geometry and conductor, lengths in mm. */
export interface GeometryLayer {
  index: number;
  t: number;
  /** cylinder/sphere inside radius; box: circumscribed inside radius */
  a: number;
  /** cylinder inside length */
  L: number;
  /** box inside sides */
  box: [number, number, number];
  /** Ω·m; Infinity for an insulator */
  rho: number;
}

export interface ShapeCtx {
  shape: Shape;
  orientation: Orientation;
  ends: "closed" | "open";
  f: number;
}

export interface Core {
  /** ln|S| of the closed walls (finite where |S| would overflow) */
  lnClosed: number;
  /** open ends: the leak 1/|S| added at the middle (exp(−j·(L/2)/a)); 0 when closed */
  openLeak: number;
  method: string;
  boxEstimates?: { rule_db: number; circumscribedSphere_db: number };
  /** per layer, as multiples of the applied field (peak and mean over the wall) */
  fields?: WallField[];
  /** per layer, ln|S| of the layer alone: what a joint in that layer is set against */
  lnSingle: number[];
  /** axial: each layer's factor and the gap ratios, re-nested once the joints weaken them */
  nest?: { per: Complex[]; ratios: number[] };
}

const LN10_20 = 20 / Math.LN10;
export const dbOfLn = (ln: number): number => ln * LN10_20;
const lnAbs = (S: Complex): number => Math.log(Math.max(S.abs(), 1e-300));

function shells(layers: GeometryLayer[], mus: number[], radius: (l: GeometryLayer) => number): Shell[] {
  return layers.map((l, i) => ({ innerRadius_m: radius(l) / 1000, thickness_m: l.t / 1000, mu_r: mus[i], resistivity_ohm_m: l.rho }));
}

/** (μ−1)²/μ: the static strength of a wall, without the spurious static term for μ = 1. */
const magneticStrength = (mu: number) => ((mu - 1) * (mu - 1)) / mu;

/** The regime of a layer's wall at radius r (mm): see wallRegime. */
export function regimeOf(l: GeometryLayer, mu: number, f: number, radius_mm = l.a): number {
  const d = skinDepth_m(l.rho, mu, f);
  return Number.isFinite(d) ? wallRegime(radius_mm, d * 1000, mu) : 0;
}

/**
 * |S| of one thin wall by Kaden's forms, in logarithms: cylinder S = cosh(kt) + ½(K + 1/K)·sinh(kt),
 * sphere S = cosh(kt) + ⅓(K + 2/K)·sinh(kt), K = kR/μ; 1 + μt/(2R) and 1 + 2μt/(3R) at DC (with
 * (μ−1)²/μ for μ, so a non-magnetic wall does nothing at DC). Used where a few per cent do not
 * matter: how strong a layer is on its own, and how the figure moves with μ. [pub: Kaden 1959]
 */
export function lnKaden(geom: "cylinder" | "sphere", mu: number, rho: number, t_mm: number, R_mm: number, f: number): number {
  const m = geom === "cylinder" ? 0.5 : 1 / 3, n = geom === "cylinder" ? 1 : 2;
  const d = skinDepth_m(rho, mu, f);
  if (!Number.isFinite(d) || t_mm / 1000 / d < 1e-6) return Math.log(1 + (m * n * magneticStrength(mu) * t_mm) / R_mm);
  const kt = t_mm / 1000 / d; // Re(kt) = Im(kt)
  const kR = R_mm / 1000 / d;
  // m(K + n/K) with K = kR(1+j)/μ
  const Kr = kR / mu, Ki = kR / mu;
  const m2 = Kr * Kr + Ki * Ki;
  const sr = m * (Kr + (n * Kr) / m2), si = m * (Ki - (n * Ki) / m2);
  if (kt > 20) {
    // cosh ≈ sinh ≈ e^{kt}/2·e^{j·kt}: |S| ≈ e^{kt}/2·|1 + m(K + n/K)|
    return kt - Math.LN2 + Math.log(Math.hypot(1 + sr, si));
  }
  const chr = Math.cosh(kt) * Math.cos(kt), chi = Math.sinh(kt) * Math.sin(kt);
  const shr = Math.sinh(kt) * Math.cos(kt), shi = Math.cosh(kt) * Math.sin(kt);
  return Math.log(Math.hypot(chr + sr * shr - si * shi, chi + sr * shi + si * shr));
}

/** A layer's own strength by Kaden's form (cylinder across the field, or sphere; a box as its corner sphere). */
export function lnSingleKaden(ctx: ShapeCtx, l: GeometryLayer, mu: number): number {
  return lnKaden(ctx.shape === "cylinder" ? "cylinder" : "sphere", mu, l.rho, l.t, l.a + l.t / 2, ctx.f);
}

/**
 * The core with μ scaled by k per layer (1 where a layer's μ stays), without solving again: each
 * layer's share of the figure moves as its own thin-wall (Kaden) factor does, the gaps' factors
 * not at all. What the band needs; the band is a spread estimate, so this is close enough. [derived]
 */
export function scaleCore(ctx: ShapeCtx, core: Core, layers: GeometryLayer[], mus: number[], k: number[], lnKadens: number[]): Core {
  let lnClosed = core.lnClosed;
  const lnSingle = core.lnSingle.slice();
  const per = core.nest ? core.nest.per.slice() : null;
  for (let i = 0; i < layers.length; i++) {
    if (k[i] === 1) continue;
    const shift = lnSingleKaden(ctx, layers[i], Math.max(1, mus[i] * k[i])) - lnKadens[i];
    if (per) per[i] = per[i].mul(Math.exp(shift));
    else lnClosed += shift;
    if (lnSingle[i] !== undefined) lnSingle[i] += shift;
  }
  if (per) lnClosed = lnAbs(nestedShells(per, core.nest!.ratios));
  return { ...core, lnClosed, lnSingle, ...(per ? { nest: { per, ratios: core.nest!.ratios } } : {}) };
}

/** The seamless core for the given μ per layer; `withFields` also gives each wall's field; `bessel`: a search's memo of scaledBessel01. */
export function solveCore(ctx: ShapeCtx, layers: GeometryLayer[], mus: number[], withFields: boolean, bessel: Bessel01 = scaledBessel01): Core {
  const { shape, f } = ctx;
  if (shape === "sphere") {
    const r = sphericalShieldingFactor(shells(layers, mus, (l) => l.a), f, withFields);
    return { lnClosed: r.attenuation_db / LN10_20, openLeak: 0, method: "exact multilayer sphere (spherical Bessel)", fields: r.walls, lnSingle: [] };
  }
  if (shape === "box") return boxCore(ctx, layers, mus, withFields);
  if (ctx.orientation === "axial") return axialCore(ctx, layers, mus, withFields);

  const r = cylindricalShieldingFactor(shells(layers, mus, (l) => l.a), f, withFields, bessel);
  const lnSingle = layers.map((l, i) => lnSingleKaden(ctx, l, mus[i]));
  const core: Core = { lnClosed: r.attenuation_db / LN10_20, openLeak: 0, method: "exact multilayer cylinder (Bessel), transverse field", fields: r.walls, lnSingle };
  if (ctx.ends === "open") {
    const inner = layers[0];
    const root = decayRoot("transverse", regimeOf(inner, mus[0], f));
    core.openLeak = Math.exp((-root * (inner.L / 2)) / inner.a);
    core.method += `, open-end leakage exp(−${root.toFixed(3)}·z/a)`;
  }
  return core;
}

/**
 * Closed can along its axis. Per layer, the DC form S_A = 1 + 4N·(S_T0 − 1) (Mager, with the
 * exact static transverse shell for μt/D and Osborn's N), times that layer's AC gain
 * S_T(f)/S_T0 from the exact cylinder: the eddy currents multiply what the wall does as they do
 * across the axis, so the axial figure stays below the transverse one at every frequency for a
 * long can (N < ¼) and equals it for a non-magnetic tube (S_T0 = 1, where both are the
 * eddy-current figure of the tube). Layers nest by the two-shell rule with the enclosed-volume
 * ratio (D²L) as gap factor. [derived]
 */
function axialCore(ctx: ShapeCtx, layers: GeometryLayer[], mus: number[], withFields: boolean): Core {
  const f = ctx.f;
  const fields: WallField[] = [];
  const per = layers.map((l, i) => {
    const one = shells([l], [mus[i]], (x) => x.a);
    const sT0 = staticCylindricalShell(mus[i], l.a, l.a + l.t);
    const N = demagnetizingFactor((l.L + l.t) / (2 * l.a + l.t));
    let gain: Complex = c(1);
    let crowdPeak = 1, crowdMean = 1;
    if (f > 0) {
      const ac = cylindricalShieldingFactor(one, f, withFields);
      gain = ac.S.div(sT0);
      if (withFields) {
        const dc = cylindricalShieldingFactor(one, 0, true).walls![0];
        crowdPeak = ac.walls![0].peak / dc.peak;
        crowdMean = ac.walls![0].mean / dc.mean;
      }
    }
    // the μ → ∞ estimate of the wall flux along the axis, B0·D/(4N·t), crowded as the exact cylinder crowds it
    const along = wallFluxDensity_T("cylinder-axial", 1, 2 * (l.a + l.t), l.t, N);
    fields.push({ peak: along * crowdPeak, mean: along * crowdMean });
    return capMagnitude(c(1 + 4 * N * (sT0 - 1)).mul(gain));
  });
  const ratios = layers.slice(1).map((o, i) => {
    const l = layers[i];
    return ((l.a + l.t) ** 2 * (l.L + 2 * l.t)) / (o.a ** 2 * o.L);
  });
  if (withFields) {
    // each layer sees the applied field reduced by the layers outside it
    for (let i = 0; i < layers.length - 1; i++) {
      const outside = Math.max(1, nestedShells(per.slice(i + 1), ratios.slice(i + 1)).abs());
      fields[i] = { peak: fields[i].peak / outside, mean: fields[i].mean / outside };
    }
  }
  const closed = nestedShells(per, ratios);
  const core: Core = {
    lnClosed: lnAbs(closed),
    openLeak: 0,
    method: "closed can, axial field: (1 + 4N·(S_T0 − 1))·S_T(f)/S_T0 per layer (Mager, Osborn N, exact cylinder's AC gain)",
    lnSingle: per.map(lnAbs),
    nest: { per, ratios },
    ...(withFields ? { fields } : {}),
  };
  if (ctx.ends === "open") {
    const inner = layers[0];
    const root = decayRoot("axial", regimeOf(inner, mus[0], f));
    core.openLeak = Math.exp((-root * (inner.L / 2)) / inner.a);
    core.method = `${core.method.replace(/^closed can/, "open can")}, open-end leakage exp(−${root.toFixed(3)}·z/a)`;
  }
  return core;
}

/**
 * Box: the lower of (1) the exact multilayer sphere through the box's corners, conservative
 * [derived], and (2) the trade rule 1 + 0.8μt/a per layer with a = the largest inside side (the
 * conservative reading) plus that layer's sphere's eddy-current excess, nested by the two-shell
 * rule with the enclosed-volume ratio. The walls' field comes from the corner sphere.
 */
function boxCore(ctx: ShapeCtx, layers: GeometryLayer[], mus: number[], withFields: boolean): Core {
  const f = ctx.f;
  const sphere = sphericalShieldingFactor(shells(layers, mus, (l) => l.a), f, withFields);
  const per = layers.map((l, i) => {
    const one = shells([l], [mus[i]], (x) => x.a);
    const excess = f > 0 ? sphericalShieldingFactor(one, f).S.sub(sphericalShieldingFactor(one, 0).S) : c(0);
    return capMagnitude(c(1 + (0.8 * magneticStrength(mus[i]) * l.t) / Math.max(...l.box)).add(excess));
  });
  const ratios = layers.slice(1).map((o, i) => {
    const inner = layers[i];
    const vIn = inner.box.reduce((p, s) => p * (s + 2 * inner.t), 1);
    return vIn / o.box.reduce((p, s) => p * s, 1);
  });
  const rule = nestedShells(per, ratios);
  const rule_db = dbOfLn(lnAbs(rule));
  const useRule = rule_db <= sphere.attenuation_db;
  return {
    lnClosed: Math.min(lnAbs(rule), sphere.attenuation_db / LN10_20),
    openLeak: 0,
    method: `box estimate: lower of trade rule 1 + 0.8μt/a and circumscribed sphere (${useRule ? "rule" : "sphere"} used)`,
    boxEstimates: { rule_db, circumscribedSphere_db: sphere.attenuation_db },
    fields: sphere.walls,
    lnSingle: per.map(lnAbs),
  };
}
