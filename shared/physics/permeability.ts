// Which μ a layer works at: the annealed DC μ(B) curve read at the wall's operating induction,
// times the as-formed factor when the part has not had its final anneal. [practice]

import type { MaterialProperties, MuPoint } from "./materials";

export type MaterialState = "annealed" | "as-formed";
export type MuSource = "material-curve" | "explicit";

/** Above the curve's last point (at saturation) μ falls steeply toward 1. */
const COLLAPSE_EXPONENT = 8;

/** μ(B) by log-log interpolation of the table; clamped below its first point. */
export function muFromCurve(curve: MuPoint[], B_T: number, saturation_T: number | null): number {
  if (curve.length === 0) return 1;
  const B = Math.max(B_T, 0);
  const first = curve[0], last = curve[curve.length - 1];
  if (B <= first.B_T) return first.mu_r;
  if (B >= last.B_T) {
    if (saturation_T == null) return last.mu_r; // non-magnetic or no saturation known: clamp
    return 1 + (last.mu_r - 1) * (last.B_T / B) ** COLLAPSE_EXPONENT;
  }
  let i = 1;
  while (curve[i].B_T < B) i++;
  const p = curve[i - 1], q = curve[i];
  const x = (Math.log(B) - Math.log(p.B_T)) / (Math.log(q.B_T) - Math.log(p.B_T));
  return Math.exp(Math.log(p.mu_r) + x * (Math.log(q.mu_r) - Math.log(p.mu_r)));
}

export interface PermeabilityChoice {
  mu_r: number;
  muSource: MuSource;
}

/** μ for a library material in the given state at the wall's peak flux density. */
export function permeabilityFor(material: MaterialProperties, state: MaterialState, wallFlux_T: number): PermeabilityChoice {
  let mu = muFromCurve(material.muCurve, wallFlux_T, material.saturation_T);
  if (state === "as-formed") mu *= material.asFormedFactor;
  return { mu_r: Math.max(1, mu), muSource: "material-curve" };
}
