// complex.js wrapped with the few helpers the shielding solutions need.
import Complex from "complex.js";

export { Complex };
export type C = Complex;

export const c = (re: number, im = 0): Complex => new Complex(re, im);
export const ZERO = c(0);
export const ONE = c(1);

/** magnitude in dB: 20·log10|z| */
export const db = (z: Complex): number => 20 * Math.log10(z.abs());

/**
 * Same phase, magnitude limited to `max` (default 1e30, 600 dB). The approximate combinations
 * (two-shell fold, open ends, axial and box forms) multiply layer factors; limiting each keeps
 * six layers inside double range. Figures that high are far beyond anything measurable.
 */
export function capMagnitude(z: Complex, max = 1e30): Complex {
  const m = z.abs();
  return m > max ? z.div(m).mul(max) : z;
}
