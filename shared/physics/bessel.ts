// Modified Bessel functions I0, I1, K0, K1 of complex argument, in scaled form
// (e^-z·I, e^z·K) so that walls hundreds of skin depths thick neither overflow nor underflow.
// Hot path of the cylinder solution: plain re/im arithmetic here, complex.js in the callers.
// Valid for Re z >= 0 (the wall argument k·r has arg π/4).
//   series (DLMF 10.25.2, 10.31.1) for small |z|; Hankel asymptotic (DLMF 10.40.1–2) above.
// Switch points: the K series loses ~0.74·|z| digits to cancellation, the asymptotic series
// bottoms out near e^(-2|z|); at |z| = 10 both are ~1e-10 relative. I's series loses only
// ~0.13·|z| digits, so it runs to |z| = 22.

import Complex from "complex.js";

export interface ScaledBessel {
  /** e^-z·I0(z) */ i0r: number; i0i: number;
  /** e^-z·I1(z) */ i1r: number; i1i: number;
  /** e^z·K0(z) */ k0r: number; k0i: number;
  /** e^z·K1(z) */ k1r: number; k1i: number;
}

const EULER_GAMMA = 0.5772156649015329;
const I_SERIES_MAX = 22;
const K_SERIES_MAX = 10;

/** Scaled I0, I1, K0, K1 at z = zr + j·zi (zr >= 0, z != 0). */
export function scaledBessel01(zr: number, zi: number): ScaledBessel {
  const az = Math.sqrt(zr * zr + zi * zi);
  if (!(az > 0)) throw new RangeError("Bessel argument must be non-zero");
  const out: ScaledBessel = { i0r: 0, i0i: 0, i1r: 0, i1i: 0, k0r: 0, k0i: 0, k1r: 0, k1i: 0 };
  // e^-z and e^z
  const em = Math.exp(-zr), ep = Math.exp(zr);
  const c = Math.cos(zi), s = Math.sin(zi);
  const emr = em * c, emi = -em * s; // e^-z
  const epr = ep * c, epi = ep * s; // e^z

  if (az <= K_SERIES_MAX) {
    // Power series, both families at once.
    const qr = (zr * zr - zi * zi) / 4, qi = (zr * zi) / 2; // z²/4
    let tr = 1, ti = 0; // (z²/4)^k/(k!)²
    let ur = 1, ui = 0; // (z²/4)^k/(k!(k+1)!)
    let I0r = 1, I0i = 0, S1r = 1, S1i = 0; // Σ t, Σ u
    let P0r = -EULER_GAMMA, P0i = 0; // Σ ψ(k+1)·t
    let P1r = 1 - 2 * EULER_GAMMA, P1i = 0; // Σ (ψ(k+1)+ψ(k+2))·u
    let H = 0; // harmonic number H_k
    let maxT = 1;
    for (let k = 1; k < 300; k++) {
      const ntr = (tr * qr - ti * qi) / (k * k), nti = (tr * qi + ti * qr) / (k * k);
      tr = ntr; ti = nti;
      const nur = (ur * qr - ui * qi) / (k * (k + 1)), nui = (ur * qi + ui * qr) / (k * (k + 1));
      ur = nur; ui = nui;
      H += 1 / k;
      const psi1 = -EULER_GAMMA + H; // ψ(k+1)
      const psi2 = psi1 + 1 / (k + 1); // ψ(k+2)
      I0r += tr; I0i += ti;
      S1r += ur; S1i += ui;
      P0r += psi1 * tr; P0i += psi1 * ti;
      P1r += (psi1 + psi2) * ur; P1i += (psi1 + psi2) * ui;
      const mt = tr * tr + ti * ti; // squared magnitudes: no sqrt in the loop
      if (mt > maxT) maxT = mt;
      if (k * k > az * az / 4 && mt * (H + 1) * (H + 1) < 1e-36 * maxT) break;
    }
    // I1 = (z/2)·S1
    const I1r = (zr * S1r - zi * S1i) / 2, I1i = (zr * S1i + zi * S1r) / 2;
    // ln(z/2)
    const lr = Math.log(az / 2), li = Math.atan2(zi, zr);
    // K0 = -ln(z/2)·I0 + P0
    const K0r = -(lr * I0r - li * I0i) + P0r;
    const K0i = -(lr * I0i + li * I0r) + P0i;
    // K1 = 1/z + ln(z/2)·I1 - (z/4)·P1
    const d = zr * zr + zi * zi;
    const K1r = zr / d + (lr * I1r - li * I1i) - (zr * P1r - zi * P1i) / 4;
    const K1i = -zi / d + (lr * I1i + li * I1r) - (zr * P1i + zi * P1r) / 4;
    out.i0r = I0r * emr - I0i * emi; out.i0i = I0r * emi + I0i * emr;
    out.i1r = I1r * emr - I1i * emi; out.i1i = I1r * emi + I1i * emr;
    out.k0r = K0r * epr - K0i * epi; out.k0i = K0r * epi + K0i * epr;
    out.k1r = K1r * epr - K1i * epi; out.k1i = K1r * epi + K1i * epr;
    return out;
  }

  // Asymptotic sums Σ a_k(ν)/z^k (K) and Σ (-1)^k a_k(ν)/z^k (I), ν = 0 and 1, in one loop:
  // the even and odd powers are kept apart, so K's sum is E + O and I's is E − O.
  const d = zr * zr + zi * zi;
  const wr = zr / d, wi = -zi / d; // 1/z
  let t0r = 1, t0i = 0, t1r = 1, t1i = 0; // a_k(0)/z^k, a_k(1)/z^k
  let e0r = 1, e0i = 0, o0r = 0, o0i = 0, e1r = 1, e1i = 0, o1r = 0, o1i = 0;
  let last0 = Infinity, last1 = Infinity, done0 = false, done1 = false;
  for (let k = 1; k < 200 && !(done0 && done1); k++) {
    const odd = (2 * k - 1) * (2 * k - 1);
    if (!done0) {
      const f = -odd / (8 * k);
      const nr = (t0r * wr - t0i * wi) * f, ni = (t0r * wi + t0i * wr) * f;
      const m = nr * nr + ni * ni;
      if (m >= last0) done0 = true; // smallest term reached: the series is asymptotic
      else {
        t0r = nr; t0i = ni; last0 = m;
        if (k & 1) { o0r += nr; o0i += ni; } else { e0r += nr; e0i += ni; }
        if (m < 1e-34) done0 = true;
      }
    }
    if (!done1) {
      const f = (4 - odd) / (8 * k);
      const nr = (t1r * wr - t1i * wi) * f, ni = (t1r * wi + t1i * wr) * f;
      const m = nr * nr + ni * ni;
      if (m >= last1) done1 = true;
      else {
        t1r = nr; t1i = ni; last1 = m;
        if (k & 1) { o1r += nr; o1i += ni; } else { e1r += nr; e1i += ni; }
        if (m < 1e-34) done1 = true;
      }
    }
  }
  // sqrt(z)
  const sq = Math.sqrt(az), half = Math.atan2(zi, zr) / 2;
  const szr = sq * Math.cos(half), szi = sq * Math.sin(half);
  const sd = szr * szr + szi * szi;
  const isr = szr / sd, isi = -szi / sd; // 1/sqrt(z)
  const kc = Math.sqrt(Math.PI / 2), ic = 1 / Math.sqrt(2 * Math.PI);
  const a0r = e0r + o0r, a0i = e0i + o0i, a1r = e1r + o1r, a1i = e1i + o1i;
  out.k0r = kc * (isr * a0r - isi * a0i); out.k0i = kc * (isr * a0i + isi * a0r);
  out.k1r = kc * (isr * a1r - isi * a1i); out.k1i = kc * (isr * a1i + isi * a1r);
  if (az <= I_SERIES_MAX) {
    // I from its series (cheap, accurate here), then scaled.
    const qr = (zr * zr - zi * zi) / 4, qi = (zr * zi) / 2;
    let tr = 1, ti = 0, ur = 1, ui = 0, I0r = 1, I0i = 0, S1r = 1, S1i = 0, maxT = 1;
    for (let k = 1; k < 300; k++) {
      const ntr = (tr * qr - ti * qi) / (k * k), nti = (tr * qi + ti * qr) / (k * k);
      tr = ntr; ti = nti;
      const nur = (ur * qr - ui * qi) / (k * (k + 1)), nui = (ur * qi + ui * qr) / (k * (k + 1));
      ur = nur; ui = nui;
      I0r += tr; I0i += ti; S1r += ur; S1i += ui;
      const mt = tr * tr + ti * ti;
      if (mt > maxT) maxT = mt;
      if (k * k > az * az / 4 && mt < 1e-36 * maxT) break;
    }
    const I1r = (zr * S1r - zi * S1i) / 2, I1i = (zr * S1i + zi * S1r) / 2;
    out.i0r = I0r * emr - I0i * emi; out.i0i = I0r * emi + I0i * emr;
    out.i1r = I1r * emr - I1i * emi; out.i1i = I1r * emi + I1i * emr;
  } else {
    const b0r = e0r - o0r, b0i = e0i - o0i, b1r = e1r - o1r, b1i = e1i - o1i;
    out.i0r = ic * (isr * b0r - isi * b0i); out.i0i = ic * (isr * b0i + isi * b0r);
    out.i1r = ic * (isr * b1r - isi * b1i); out.i1i = ic * (isr * b1i + isi * b1r);
  }
  return out;
}

/** Unscaled I_n(z), n = 0 or 1 (overflows for Re z > ~700; use scaledBessel01 in solvers). */
export function besselI(n: 0 | 1, z: Complex): Complex {
  const b = scaledBessel01(z.re, z.im);
  const v = n === 0 ? new Complex(b.i0r, b.i0i) : new Complex(b.i1r, b.i1i);
  return v.mul(z.exp());
}

/** Unscaled K_n(z), n = 0 or 1. */
export function besselK(n: 0 | 1, z: Complex): Complex {
  const b = scaledBessel01(z.re, z.im);
  const v = n === 0 ? new Complex(b.k0r, b.k0i) : new Complex(b.k1r, b.k1i);
  return v.mul(z.neg().exp());
}

/** scaledBessel01 or a memo of it. */
export type Bessel01 = (zr: number, zi: number) => ScaledBessel;

/**
 * scaledBessel01 remembered by its argument, for one search of many designs: the walls of its
 * designs stand at a few hundred radii, so the same arguments come back thousands of times.
 * The values are scaledBessel01's own. Made per search and dropped with it.
 */
export function besselMemo(): Bessel01 {
  // by the real part, then a short list by the imaginary part (a wall's argument is r/δ·(1 + j):
  // one imaginary part for each real part)
  interface Entry { zi: number; value: ScaledBessel; next: Entry | null }
  const byRe = new Map<number, Entry>();
  return (zr, zi) => {
    const first = byRe.get(zr);
    for (let e: Entry | null = first ?? null; e; e = e.next) if (e.zi === zi) return e.value;
    const value = scaledBessel01(zr, zi);
    byRe.set(zr, { zi, value, next: first ?? null });
    return value;
  };
}
