// Exact shielding factor of N concentric shells (spheres, or long cylinders with the field across
// the axis) in a uniform applied field, DC to AC, with any air gaps between the shells.
//
// Method: in every region the field is B = curl(A) with A = f(r)·sin(angle) (A_z for the cylinder,
// A_φ for the sphere). In a conducting wall f obeys the modified (spherical) Bessel equation in
// k·r, k = (1+j)/δ; in air and in a static wall f = C·r + D·r^-n (n = 1 cylinder, 2 sphere).
// B_normal continuous ⇔ f continuous; H_tangential continuous ⇔ h continuous, with
// h = f'/μr (cylinder) or h = (r·f)'/(r·μr) (sphere). The state (f, h) is carried from the
// uniform inner field (C = 1) outward through a 2×2 transfer per region; S = C_outside / C_inside.
// Wall bases are scaled (e^-kr·I, e^kr·K): the growth e^(Re k·t) goes into a running logarithm
// so walls hundreds of skin depths thick, and many of them, give finite results.

import { c, type Complex } from "./complex";
import { scaledBessel01, type Bessel01 } from "./bessel";

export const MU0 = 4e-7 * Math.PI;

export interface Shell {
  innerRadius_m: number;
  thickness_m: number;
  mu_r: number;
  /** Infinity (or 0 frequency) gives the static, non-conducting wall */
  resistivity_ohm_m: number;
}

/**
 * The flux density a wall carries, as a multiple of the applied field's peak flux density.
 * `peak`: the largest |B| anywhere in the wall (the tangential component at the wall's faces,
 * or the normal one where it is larger), the figure saturation is judged on; at AC the eddy
 * currents crowd the flux toward the outer face, so it is well above the mean.
 * `mean`: the flux the wall carries at its strongest section divided by the thickness.
 */
export interface WallField {
  peak: number;
  mean: number;
}

export interface ExactResult {
  /** complex H_outside / H_inside (time convention e^{jωt}) */
  S: Complex;
  /** |S| */
  shieldingFactor: number;
  /** 20·log10|S|, computed from logarithms so it stays finite where |S| would overflow */
  attenuation_db: number;
  /** per shell, innermost first, when asked for */
  walls?: WallField[];
}

/** Skin depth δ = √(2ρ/(ω μ0 μr)) in metres; Infinity at DC or for an insulator. */
export function skinDepth_m(resistivity_ohm_m: number, mu_r: number, frequency_hz: number): number {
  if (!(frequency_hz > 0) || !Number.isFinite(resistivity_ohm_m)) return Infinity;
  return Math.sqrt((2 * resistivity_ohm_m) / (2 * Math.PI * frequency_hz * MU0 * mu_r));
}

/** Static spherical shell, Jackson §5.12: S = [(2μ+1)(μ+2) − 2(a/b)³(μ−1)²]/(9μ). */
export function staticSphericalShell(mu: number, a: number, b: number): number {
  return ((2 * mu + 1) * (mu + 2) - 2 * (a / b) ** 3 * (mu - 1) ** 2) / (9 * mu);
}

/** Static long cylindrical shell, transverse field: S = [(μ+1)² − (a/b)²(μ−1)²]/(4μ). */
export function staticCylindricalShell(mu: number, a: number, b: number): number {
  return ((mu + 1) ** 2 - (a / b) ** 2 * (mu - 1) ** 2) / (4 * mu);
}

type Geometry = "cylinder" | "sphere";

// The solver runs in every prediction and 200 times per sweep, so its arithmetic is on plain
// {re, im} records (no argument parsing per operation); complex.js carries the result out.
interface Z { re: number; im: number }
const z = (re: number, im = 0): Z => ({ re, im });
const add = (a: Z, b: Z): Z => ({ re: a.re + b.re, im: a.im + b.im });
const sub = (a: Z, b: Z): Z => ({ re: a.re - b.re, im: a.im - b.im });
const mul = (a: Z, b: Z): Z => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
const scl = (a: Z, s: number): Z => ({ re: a.re * s, im: a.im * s });
const div = (a: Z, b: Z): Z => {
  // Smith's algorithm: no overflow in the intermediate |b|²
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re, d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im, d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
};
const inv = (a: Z): Z => div(z(1), a);
const exp = (a: Z): Z => {
  const e = Math.exp(a.re);
  return { re: e * Math.cos(a.im), im: e * Math.sin(a.im) };
};
const abs = (a: Z): number => {
  const x = Math.abs(a.re), y = Math.abs(a.im);
  if (x < y) return y * Math.sqrt(1 + (x / y) * (x / y));
  return x === 0 ? 0 : x * Math.sqrt(1 + (y / x) * (y / x));
};

interface Basis { u1: Z; h1: Z; u2: Z; h2: Z }

function staticBasis(geom: Geometry, r: number, mu: number): Basis {
  if (geom === "cylinder") return { u1: z(r), h1: z(1 / mu), u2: z(1 / r), h2: z(-1 / (mu * r * r)) };
  return { u1: z(r), h1: z((2 * r) / mu), u2: z(1 / (r * r)), h2: z(-1 / (mu * r * r)) };
}

/** Wall basis scaled by e^-kr (growing solution) and e^kr (decaying one). */
function acBasis(geom: Geometry, k: Z, r: number, mu: number, bessel: Bessel01): Basis {
  const x = scl(k, r);
  const ix = inv(x);
  if (geom === "cylinder") {
    const b = bessel(x.re, x.im);
    const i0 = z(b.i0r, b.i0i), i1 = z(b.i1r, b.i1i), k0 = z(b.k0r, b.k0i), k1 = z(b.k1r, b.k1i);
    const di1 = sub(i0, mul(i1, ix)); // I1' = I0 − I1/x
    const dk1 = sub(scl(k0, -1), mul(k1, ix)); // K1' = −K0 − K1/x
    return { u1: i1, h1: scl(mul(k, di1), 1 / mu), u2: k1, h2: scl(mul(k, dk1), 1 / mu) };
  }
  // Modified spherical Bessel: i1 = (x cosh x − sinh x)/x², k1 ∝ e^-x (1/x + 1/x²);
  // h uses (x·u)' : for i1 it is sinh x − i1, for k1 it is −(e^-x + k1).
  const ix2 = mul(ix, ix);
  let si1: Z, ssh: Z;
  if (abs(x) >= 0.5) {
    const E = exp(scl(x, -2));
    ssh = scl(sub(z(1), E), 0.5);
    si1 = mul(sub(scl(mul(x, add(z(1), E)), 0.5), ssh), ix2);
  } else {
    // i1(x) = x Σ (x²/2)^k / (k!·(2k+3)!!), then scaled; avoids the cancellation in the closed form.
    const q = scl(mul(x, x), 0.5);
    let term = z(1 / 3), sum = z(1 / 3);
    for (let kk = 1; kk < 12; kk++) {
      term = scl(mul(term, q), 1 / (kk * (2 * kk + 3)));
      sum = add(sum, term);
    }
    const em = exp(scl(x, -1));
    si1 = mul(mul(x, sum), em);
    // sinh(x) for small x directly
    const sh = { re: Math.sinh(x.re) * Math.cos(x.im), im: Math.cosh(x.re) * Math.sin(x.im) };
    ssh = mul(sh, em);
  }
  const sk1 = add(ix, ix2);
  return { u1: si1, h1: scl(sub(ssh, si1), 1 / mu), u2: sk1, h2: scl(add(z(1), sk1), -1 / mu) };
}

/** A wall's field at its two faces, before it is set against the applied field (log units). */
interface FaceRecord { lnPeak: number; lnFlux: number }

/** The potential's state (f, h) at a radius, scaled by e^log. */
interface State { f: Z; h: Z; log: number }

/**
 * Carries the state across a region whose basis is B at its start and Bb at its end: solve
 * (f, h) = c1·(u1, h1) + c2·(u2, h2) at the start, multiply c2 by `decay`, rebuild at the end.
 * Written out on real and imaginary parts: it runs several times in every solve.
 */
function step(st: State, B: Basis, Bb: Basis, decay: Z | null): void {
  const { u1, h1, u2, h2 } = B;
  const fr = st.f.re, fi = st.f.im, hr = st.h.re, hi = st.h.im;
  // det = u1·h2 − u2·h1
  const dr = u1.re * h2.re - u1.im * h2.im - (u2.re * h1.re - u2.im * h1.im);
  const di = u1.re * h2.im + u1.im * h2.re - (u2.re * h1.im + u2.im * h1.re);
  // numerators: h2·f − u2·h and u1·h − h1·f
  const n1r = h2.re * fr - h2.im * fi - (u2.re * hr - u2.im * hi);
  const n1i = h2.re * fi + h2.im * fr - (u2.re * hi + u2.im * hr);
  let n2r = u1.re * hr - u1.im * hi - (h1.re * fr - h1.im * fi);
  let n2i = u1.re * hi + u1.im * hr - (h1.re * fi + h1.im * fr);
  if (decay) {
    const tr = n2r * decay.re - n2i * decay.im;
    n2i = n2r * decay.im + n2i * decay.re;
    n2r = tr;
  }
  const c1 = div({ re: n1r, im: n1i }, { re: dr, im: di });
  const c2 = div({ re: n2r, im: n2i }, { re: dr, im: di });
  const Fr = c1.re * Bb.u1.re - c1.im * Bb.u1.im + c2.re * Bb.u2.re - c2.im * Bb.u2.im;
  const Fi = c1.re * Bb.u1.im + c1.im * Bb.u1.re + c2.re * Bb.u2.im + c2.im * Bb.u2.re;
  const Hr = c1.re * Bb.h1.re - c1.im * Bb.h1.im + c2.re * Bb.h2.re - c2.im * Bb.h2.im;
  const Hi = c1.re * Bb.h1.im + c1.im * Bb.h1.re + c2.re * Bb.h2.im + c2.im * Bb.h2.re;
  const m = Math.max(Math.hypot(Fr, Fi), Math.hypot(Hr, Hi));
  const k = m > 0 && Number.isFinite(m) ? 1 / m : 1;
  if (k !== 1) st.log += Math.log(m);
  st.f = { re: Fr * k, im: Fi * k };
  st.h = { re: Hr * k, im: Hi * k };
}

/**
 * |B| at a face just inside a wall of permeability mu: tangential from h, normal from f
 * (cylinder B_φ = μ·h, B_r = f/r; sphere B_θ = μ·h/r, B_r = 2f/r), in the units where the
 * uniform inside field is 1 (cylinder) or 2 (sphere), on the state's scale.
 */
function faceB(geom: Geometry, st: State, r: number, mu: number): number {
  return geom === "cylinder" ? Math.max(mu * abs(st.h), abs(st.f) / r) : Math.max((mu * abs(st.h)) / r, (2 * abs(st.f)) / r);
}

function solve(geom: Geometry, shells: Shell[], frequency_hz: number, withWalls = false, bessel: Bessel01 = scaledBessel01): ExactResult {
  if (shells.length === 0) return { S: c(1), shieldingFactor: 1, attenuation_db: 0, ...(withWalls ? { walls: [] } : {}) };
  for (let i = 0; i < shells.length; i++) {
    const s = shells[i];
    if (!(s.innerRadius_m > 0 && s.thickness_m > 0 && s.mu_r >= 1 && s.resistivity_ohm_m > 0))
      throw new RangeError(`shell ${i}: radius and thickness must be > 0, μr >= 1, resistivity > 0`);
    if (i > 0 && s.innerRadius_m < shells[i - 1].innerRadius_m + shells[i - 1].thickness_m * (1 - 1e-12))
      throw new RangeError(`shell ${i} overlaps the shell inside it`);
  }
  const omega = 2 * Math.PI * frequency_hz;
  const a1 = shells[0].innerRadius_m;
  // uniform inner field, C_inside = 1
  const st: State = { f: z(a1), h: z(geom === "cylinder" ? 1 : 2 * a1), log: 0 };
  const faces: FaceRecord[] = [];

  for (let i = 0; i < shells.length; i++) {
    const s = shells[i];
    const a = s.innerRadius_m, b = a + s.thickness_m;
    if (i > 0) {
      // air gap from the previous shell's outer radius to this one's inner radius
      const prevOuter = shells[i - 1].innerRadius_m + shells[i - 1].thickness_m;
      if (a > prevOuter) step(st, staticBasis(geom, prevOuter, 1), staticBasis(geom, a, 1), null);
    }
    // the state at the inner face (continuous f and h: the same just inside the wall)
    const fa = st.f, lnA = st.log, peakA = withWalls ? faceB(geom, st, a, s.mu_r) : 0;
    const delta = skinDepth_m(s.resistivity_ohm_m, s.mu_r, frequency_hz);
    // |k·r| < 1e-7: the eddy-current correction is O((kr)²) below double precision, so the
    // static basis is exact to rounding (and avoids k underflowing at absurdly low frequencies)
    if (omega > 0 && b / delta > 1e-7) {
      const k = z(1 / delta, 1 / delta);
      const t = s.thickness_m;
      // c2 carries e^{-2kt}; the common e^{kt} becomes log growth plus a phase
      step(st, acBasis(geom, k, a, s.mu_r, bessel), acBasis(geom, k, b, s.mu_r, bessel), exp(scl(k, -2 * t)));
      st.log += k.re * t;
      const rot = z(Math.cos(k.im * t), Math.sin(k.im * t));
      st.f = mul(st.f, rot);
      st.h = mul(st.h, rot);
    } else {
      step(st, staticBasis(geom, a, s.mu_r), staticBasis(geom, b, s.mu_r), null);
    }
    if (withWalls) {
      // flux through the wall's strongest section: ∫B_tangential dr = f(a) − f(b) (cylinder),
      // [(r·f)(a) − (r·f)(b)]/r_mid (sphere), both faces brought to the outer face's scale
      const back = Math.exp(lnA - st.log);
      const flux = geom === "cylinder"
        ? abs(sub(st.f, scl(fa, back)))
        : abs(sub(scl(st.f, b), scl(fa, a * back))) / ((a + b) / 2);
      faces.push({
        lnPeak: Math.max(Math.log(peakA) + lnA, Math.log(faceB(geom, st, b, s.mu_r)) + st.log),
        lnFlux: Math.log(flux / s.thickness_m) + st.log,
      });
    }
  }
  const last = shells[shells.length - 1];
  const B = staticBasis(geom, last.innerRadius_m + last.thickness_m, 1);
  const C = div(sub(mul(B.h2, st.f), mul(B.u2, st.h)), sub(mul(B.u1, B.h2), mul(B.u2, B.h1)));
  const mC = abs(C);
  const lnAbs = Math.log(mC) + st.log;
  // phase of C, magnitude from the logarithm (pegged at e^709 rather than overflowing)
  const mag = Math.exp(Math.min(lnAbs, 709));
  const result: ExactResult = {
    S: c((C.re / mC) * mag, (C.im / mC) * mag),
    shieldingFactor: Math.min(Math.exp(lnAbs), Number.MAX_VALUE),
    attenuation_db: (20 * lnAbs) / Math.LN10,
  };
  if (withWalls) {
    // the applied field in the same units: |C_outside| (cylinder), 2·|C_outside| (sphere)
    const lnApplied = lnAbs + (geom === "sphere" ? Math.LN2 : 0);
    result.walls = faces.map((w) => ({ peak: Math.exp(w.lnPeak - lnApplied), mean: Math.exp(w.lnFlux - lnApplied) }));
  }
  return result;
}

/** Exact multilayer sphere, uniform field; shells innermost first. `withWalls`: each wall's field too. */
export function sphericalShieldingFactor(shells: Shell[], frequency_hz: number, withWalls = false): ExactResult {
  return solve("sphere", shells, frequency_hz, withWalls);
}

/**
 * Exact multilayer long cylinder, field across the axis; shells innermost first. `withWalls`:
 * each wall's field too. `bessel`: a search's memo of scaledBessel01 (the same values).
 */
export function cylindricalShieldingFactor(shells: Shell[], frequency_hz: number, withWalls = false, bessel: Bessel01 = scaledBessel01): ExactResult {
  return solve("cylinder", shells, frequency_hz, withWalls, bessel);
}
