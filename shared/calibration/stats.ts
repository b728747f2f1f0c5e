// Small robust statistics used by the fit and the control charts (no dependencies: shared/ is
// isomorphic and these are a few lines each).

/** The median (the mean of the two middle values for an even count); NaN for none. */
export function median(values: ArrayLike<number>): number {
  const n = values.length;
  if (n === 0) return NaN;
  const sorted = Float64Array.from(values).sort();
  const mid = n >> 1;
  return n % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

export const mean = (values: ArrayLike<number>): number => {
  let s = 0;
  for (let i = 0; i < values.length; i++) s += values[i];
  return values.length ? s / values.length : NaN;
};

/** Sample standard deviation (n − 1). */
export function sampleSd(values: ArrayLike<number>): number {
  const n = values.length;
  if (n < 2) return NaN;
  const m = mean(values);
  let s = 0;
  for (let i = 0; i < n; i++) s += (values[i] - m) ** 2;
  return Math.sqrt(s / (n - 1));
}

/**
 * 1.4826 × the median absolute deviation: a standard deviation that a few wild values do not
 * move (1.4826 = 1/Φ⁻¹(3/4), so it equals σ for normal data). [pub: Rousseeuw & Croux, JASA 88:1273, 1993]
 */
export const MAD_TO_SIGMA = 1.4826;
export function robustSigma(values: ArrayLike<number>, center = median(values)): number {
  const dev = Float64Array.from(values, (v) => Math.abs(v - center));
  return MAD_TO_SIGMA * median(dev);
}

/** A median absolute value (the errors' figure: how far off a typical prediction is). */
export function medianAbs(values: ArrayLike<number>): number {
  return median(Float64Array.from(values, Math.abs));
}

/** z such that a normal variable is below it with probability p (Acklam's rational approximation, |error| < 1.2e-9). */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) return p === 0 ? -Infinity : p === 1 ? Infinity : NaN;
  const a = [-3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239];
  const b = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
  const c = [-7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
  const lo = 0.02425;
  if (p < lo) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  }
  if (p > 1 - lo) return -normalQuantile(1 - p);
  const q = p - 0.5;
  const r = q * q;
  return ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) / (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1);
}

/** A small seeded generator (mulberry32): the folds of a class are the same every time its lots are. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A 32-bit hash of a text (FNV-1a), to seed the generator. */
export function hashText(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}
