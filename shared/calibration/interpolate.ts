// Monotone piecewise-cubic Hermite interpolation (PCHIP, Fritsch & Carlson, SIAM J. Numer. Anal.
// 17:238, 1980, with the weighted harmonic-mean slopes of Fritsch & Butland) on an evenly spaced
// grid: a design's response across effective μ is worked out by the engine at the grid's points
// and read between them without overshoot.

export interface Pchip {
  x0: number;
  h: number;
  y: Float64Array;
  /** slopes dy/dx at the points */
  d: Float64Array;
  /** every value the same infinity (no holes: the leak term is absent) */
  infinite: boolean;
}

export function pchip(x0: number, h: number, y: ArrayLike<number>): Pchip {
  const n = y.length;
  const ys = Float64Array.from(y);
  const d = new Float64Array(n);
  if (ys.every((v) => v === Infinity)) return { x0, h, y: ys, d, infinite: true };
  if (!ys.every(Number.isFinite)) throw new Error("pchip: the values must be finite");
  const delta = new Float64Array(n - 1);
  for (let i = 0; i < n - 1; i++) delta[i] = (ys[i + 1] - ys[i]) / h;
  if (n === 2) {
    d[0] = d[1] = delta[0];
    return { x0, h, y: ys, d, infinite: false };
  }
  for (let i = 1; i < n - 1; i++) {
    const a = delta[i - 1], b = delta[i];
    d[i] = a * b <= 0 ? 0 : 2 / (1 / a + 1 / b); // even spacing: the weights are equal
  }
  // one-sided three-point ends, kept monotone
  const end = (d0: number, d1: number) => {
    let s = (3 * d0 - d1) / 2;
    if (Math.sign(s) !== Math.sign(d0)) s = 0;
    else if (Math.sign(d0) !== Math.sign(d1) && Math.abs(s) > Math.abs(3 * d0)) s = 3 * d0;
    return s;
  };
  d[0] = end(delta[0], delta[1]);
  d[n - 1] = end(delta[n - 2], delta[n - 3]);
  return { x0, h, y: ys, d, infinite: false };
}

/** The interpolant at x (clamped to the grid). */
export function pchipAt(p: Pchip, x: number): number {
  if (p.infinite) return Infinity;
  const n = p.y.length;
  let t = (x - p.x0) / p.h;
  if (t <= 0) return p.y[0];
  if (t >= n - 1) return p.y[n - 1];
  const i = Math.min(n - 2, Math.floor(t));
  t -= i;
  const t2 = t * t, t3 = t2 * t;
  return (2 * t3 - 3 * t2 + 1) * p.y[i] + (t3 - 2 * t2 + t) * p.h * p.d[i] + (-2 * t3 + 3 * t2) * p.y[i + 1] + (t3 - t2) * p.h * p.d[i + 1];
}
