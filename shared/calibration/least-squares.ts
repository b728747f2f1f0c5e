// Levenberg–Marquardt for the class's one or two parameters (ln μ, ceiling dB), weighted least
// squares on dB. The problem is tiny (two unknowns), so the normal equations are solved directly;
// the damping keeps a step sensible where the model bends (the ceiling's take-over, the μ table).

/** What the solver needs from the model: predictions and their slopes at θ, for the rows asked. */
export interface LeastSquaresModel {
  /** free parameters */
  dims: number;
  /** fills f (per row) and, when given, J (row-major, rows × dims) at θ */
  evaluate(theta: Float64Array, f: Float64Array, J?: Float64Array): void;
  /** keeps θ inside its bounds */
  clamp(theta: Float64Array): void;
}

export interface LeastSquaresResult {
  theta: Float64Array;
  cost: number;
  converged: boolean;
  iterations: number;
}

const MAX_ITERATIONS = 60;
/** in ln μ (a millionth of μ) and dB alike */
const STEP_TOLERANCE = 1e-6;

function cost(y: Float64Array, w: Float64Array, f: Float64Array): number {
  let s = 0;
  for (let i = 0; i < y.length; i++) s += w[i] * (y[i] - f[i]) ** 2;
  return s;
}

/** Solves the small symmetric system A δ = b (dims 1 or 2); false when singular. */
function solve(A: Float64Array, b: Float64Array, dims: number, out: Float64Array): boolean {
  if (dims === 1) {
    if (!(A[0] > 0)) return false;
    out[0] = b[0] / A[0];
    return true;
  }
  const det = A[0] * A[3] - A[1] * A[2];
  if (!(Math.abs(det) > 1e-300)) return false;
  out[0] = (A[3] * b[0] - A[1] * b[1]) / det;
  out[1] = (A[0] * b[1] - A[2] * b[0]) / det;
  return true;
}

/** Minimises Σ w (y − f(θ))² from θ0. */
export function levenbergMarquardt(model: LeastSquaresModel, y: Float64Array, w: Float64Array, theta0: Float64Array): LeastSquaresResult {
  const n = y.length, p = model.dims;
  const theta = Float64Array.from(theta0);
  model.clamp(theta);
  const f = new Float64Array(n), J = new Float64Array(n * p), fTry = new Float64Array(n);
  const H = new Float64Array(p * p), g = new Float64Array(p), A = new Float64Array(p * p), delta = new Float64Array(p), trial = new Float64Array(p);
  let lambda = 1e-3;
  model.evaluate(theta, f, J);
  let current = cost(y, w, f);
  let converged = false;
  let it = 0;
  for (; it < MAX_ITERATIONS && !converged; it++) {
    H.fill(0);
    g.fill(0);
    for (let i = 0; i < n; i++) {
      const r = y[i] - f[i];
      for (let a = 0; a < p; a++) {
        const ja = J[i * p + a];
        g[a] += w[i] * r * ja;
        for (let b = 0; b < p; b++) H[a * p + b] += w[i] * ja * J[i * p + b];
      }
    }
    let accepted = false;
    for (let tries = 0; tries < 12 && !accepted; tries++) {
      for (let k = 0; k < p * p; k++) A[k] = H[k];
      for (let a = 0; a < p; a++) A[a * p + a] += lambda * (H[a * p + a] + 1e-12);
      if (!solve(A, g, p, delta)) {
        lambda *= 10;
        continue;
      }
      for (let a = 0; a < p; a++) trial[a] = theta[a] + delta[a];
      model.clamp(trial);
      model.evaluate(trial, fTry);
      const next = cost(y, w, fTry);
      if (next <= current) {
        let step = 0;
        for (let a = 0; a < p; a++) step = Math.max(step, Math.abs(trial[a] - theta[a]));
        const gain = current - next;
        theta.set(trial);
        current = next;
        lambda = Math.max(lambda / 3, 1e-9);
        accepted = true;
        if (step < STEP_TOLERANCE || gain <= 1e-9 * (current + 1e-12)) converged = true;
      } else lambda *= 4;
    }
    // no step lowers the cost: a minimum (or a kink the slopes cannot see past)
    if (!accepted) converged = true;
    model.evaluate(theta, f, J);
  }
  return { theta, cost: current, converged, iterations: it };
}
