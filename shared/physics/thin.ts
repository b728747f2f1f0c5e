// Quick thin-shell forms: the second method beside the exact solution, and the only method for
// closed cans in an axial field, open ends, boxes and collars (no exact closed form there).

import { Complex, c } from "./complex";
import { MU0 } from "./exact";

/** Thin-wall DC sphere, t ≪ R, μ ≫ 1: S ≈ 1 + 2μt/(3R). [derived] */
export const thinSphereDC = (mu: number, t: number, R: number): number => 1 + (2 * mu * t) / (3 * R);

/** Thin-wall DC cylinder, transverse, t ≪ R, μ ≫ 1: S ≈ 1 + μt/D. [derived] */
export const thinCylinderDC = (mu: number, t: number, D: number): number => 1 + (mu * t) / D;

function propagation(mu: number, resistivity: number, f: number): Complex {
  // k = (1+j)/δ; k = 0 at DC
  if (!(f > 0) || !Number.isFinite(resistivity)) return c(0);
  const inv = Math.sqrt((2 * Math.PI * f * MU0 * mu) / (2 * resistivity));
  return c(inv, inv);
}

function kaden(geom: "cylinder" | "sphere", mu: number, resistivity: number, t: number, R: number, f: number): Complex {
  const k = propagation(mu, resistivity, f);
  const m = geom === "cylinder" ? 1 / 2 : 1 / 3;
  const n = geom === "cylinder" ? 1 : 2;
  if (k.re === 0) return c(1 + (m * n * mu * t) / R); // the k → 0 limit: ½·(μ/kR)·kt resp. ⅓·(2μ/kR)·kt
  const K = k.mul(R / mu);
  const kt = k.mul(t);
  // cosh(kt) + m(K + n/K)·sinh(kt); overflows past Re(kt) ~ 700, beyond any wall this is used for
  return kt.cosh().add(K.add(K.inverse().mul(n)).mul(m).mul(kt.sinh()));
}

/**
 * Kaden 1959, long cylinder, transverse: S = cosh(kt) + ½(K + 1/K)·sinh(kt), K = kR/μr, R the
 * mean radius. Keeps a spurious static term t/D for μr = 1 (see nonMagneticThinShell).
 */
export const kadenCylinder = (mu: number, resistivity: number, t: number, R: number, f: number): Complex =>
  kaden("cylinder", mu, resistivity, t, R, f);

/** Kaden 1959, sphere: S = cosh(kt) + ⅓(K + 2/K)·sinh(kt), K = kR/μr, R the mean radius. */
export const kadenSphere = (mu: number, resistivity: number, t: number, R: number, f: number): Complex =>
  kaden("sphere", mu, resistivity, t, R, f);

/** Low-frequency forms, t ≪ δ: cylinder 1 + μt/D + jωμ0σRt/2; sphere 1 + 2μt/(3R) + jωμ0σRt/3. [derived] */
export function lowFrequencyThinShell(geom: "cylinder" | "sphere", mu: number, resistivity: number, t: number, R: number, f: number): Complex {
  const eddy = (2 * Math.PI * f * MU0 * R * t) / resistivity / (geom === "cylinder" ? 2 : 3);
  const mag = geom === "cylinder" ? (mu * t) / (2 * R) : (2 * mu * t) / (3 * R);
  return c(1 + mag, eddy);
}

/** Non-magnetic thin shell (μr = 1): S ≈ 1 + jωμ0σRt/2 (cylinder) or /3 (sphere). [derived] */
export function nonMagneticThinShell(geom: "cylinder" | "sphere", resistivity: number, t: number, R: number, f: number): Complex {
  return c(1, (2 * Math.PI * f * MU0 * R * t) / resistivity / (geom === "cylinder" ? 2 : 3));
}

/**
 * Two shells: S ≈ 1 + s1 + s2 + s1·s2·[1 − ratio], s = S − 1, ratio = (b2/a1)^k
 * (k = 2 cylinder, 3 sphere; b2 outer radius of the inner shell, a1 inner radius of the outer one).
 * For other shapes `ratio` is the enclosed-volume ratio of the two, which is what (b2/a1)^k is.
 */
export function twoShell(S1: Complex, S2: Complex, ratio: number): Complex {
  const s1 = S1.sub(1), s2 = S2.sub(1);
  return c(1).add(s1).add(s2).add(s1.mul(s2).mul(1 - ratio));
}

/** Fold the two-shell rule from the inside out over any number of layers; ratios[i] between layer i and i+1. */
export function nestedShells(layerS: Complex[], ratios: number[]): Complex {
  let acc = layerS[0] ?? c(1);
  for (let i = 1; i < layerS.length; i++) acc = twoShell(acc, layerS[i], ratios[i - 1]);
  return acc;
}

/**
 * Axial demagnetizing factor of a prolate (p > 1) or oblate (p < 1) spheroid, p = L/D.
 * Osborn, Phys. Rev. 67:351, 1945. Near p = 1 the closed forms cancel, so a series in
 * e = p − 1 is used there: N ≈ 1/3 − 4e/15 + 8e²/35 (checked against the closed forms). [derived]
 */
export function demagnetizingFactor(p: number): number {
  if (!(p > 0)) throw new RangeError("aspect ratio must be > 0");
  const e = p - 1;
  if (Math.abs(e) < 1e-3) return 1 / 3 - (4 * e) / 15 + (8 * e * e) / 35;
  if (p > 1) {
    const r = Math.sqrt(p * p - 1);
    return ((p / r) * Math.log(p + r) - 1) / (p * p - 1);
  }
  const r = Math.sqrt(1 - p * p);
  return (1 - (p * Math.acos(p)) / r) / (1 - p * p);
}

/** Closed can in an axial field, DC, Mager 1970: S_A ≈ 1 + 4N·μt/D, N = N(L/D). */
export const axialClosedCanDC = (mu: number, t: number, D: number, L: number): number =>
  1 + 4 * demagnetizingFactor(L / D) * ((mu * t) / D);

/**
 * Field decay constants in a tube: exp(−j·z/a). A high-μ wall at low frequency holds the
 * magnetic potential constant on it, so j is a zero of J_m: 3.832 (J1) with the field across
 * the tube, 2.405 (J0) along it, the weak case. A good conductor at AC keeps the normal flux
 * out, so j is a zero of J_m': 1.841 (J1') across, the weak case, and 3.832 (J0' = −J1) along. [derived]
 */
export const LEAKAGE_ROOT = { transverse: 3.832, axial: 2.405 } as const;
export const CONDUCTOR_ROOT = { transverse: 1.841, axial: 3.832 } as const;
export type FieldOrientation = keyof typeof LEAKAGE_ROOT;

/**
 * Which of the two a wall is: Kaden's K = k·R/μr sets the eddy-current term (K) against the
 * flux-shunting one (1/K) in S = cosh(kt) + ½(K + 1/K)·sinh(kt); |k| = √2/δ. 0 at DC. [derived]
 */
export function wallRegime(radius_mm: number, skinDepth_mm: number, mu_r: number): number {
  if (!(skinDepth_mm > 0) || !Number.isFinite(skinDepth_mm)) return 0;
  return (Math.SQRT2 * radius_mm) / (skinDepth_mm * mu_r);
}

/** The magnetic wall's share: 1 where flux shunting rules (K ≪ 1), 0 where eddy currents do (K ≫ 1). */
export const magneticShare = (K: number): number => 1 / (1 + K);

/**
 * The decay constant for a wall of regime K, moving from the high-μ root to the conductor's
 * one as K passes 1 (an interpolation between the two limits: [practice]). `weak`: the smaller
 * of the two orientations, for a hole or collar whose direction to the field is not known.
 */
export function decayRoot(orientation: FieldOrientation | "weak", K: number): number {
  const w = magneticShare(K);
  const across = w * LEAKAGE_ROOT.transverse + (1 - w) * CONDUCTOR_ROOT.transverse;
  const along = w * LEAKAGE_ROOT.axial + (1 - w) * CONDUCTOR_ROOT.axial;
  return orientation === "weak" ? Math.min(across, along) : orientation === "axial" ? along : across;
}

const rootOf = (r: FieldOrientation | number) => (typeof r === "number" ? r : LEAKAGE_ROOT[r]);

/**
 * Open-ended can: leakage through the ends limits the field at the middle.
 * 1/|S_eff| = 1/|S_closed| + exp(−j·(L/2)/a), a the inner radius; magnitudes are added (the two
 * paths taken in phase, the worst case) so a better wall never reads worse. The phase of S_closed
 * is kept. An estimate. [derived]
 */
export function openEndCombination(Sclosed: Complex, length: number, radius: number, root: FieldOrientation | number): Complex {
  const leak = Math.exp((-rootOf(root) * (length / 2)) / radius);
  return Sclosed.div(1 + leak * Sclosed.abs());
}

/** Trade rule for a box, with `a` the governing inside dimension: S ≈ 1 + 0.8·μt/a. [practice] */
export const boxRuleDC = (mu: number, t: number, a: number): number => 1 + (0.8 * mu * t) / a;

/** Radius of the sphere through the corners of a box. */
export const circumscribedRadius = (w: number, d: number, h: number): number => Math.hypot(w, d, h) / 2;

/**
 * Attenuation of a collar (chimney) of length L round a hole of diameter d:
 * 20·log10(exp(j·L/a)) = 8.686·j·L/a dB, a = d/2; `root` is j, or the field's orientation to the
 * collar's axis for a high-μ collar. [derived]
 */
export function collarAttenuation_db(length_mm: number, diameter_mm: number, root: FieldOrientation | number): number {
  return (20 / Math.LN10) * ((rootOf(root) * length_mm) / (diameter_mm / 2));
}

/** Collar length needed to reach `attenuation_db` through a hole. */
export function collarLengthFor_mm(attenuation_db: number, diameter_mm: number, root: FieldOrientation | number): number {
  return (attenuation_db * (diameter_mm / 2) * Math.LN10) / (20 * rootOf(root));
}
