// Which μ a layer works at. The library's figures are design values (the standard's guaranteed
// minimum or a conservative typical figure). At low induction (the Rayleigh range) μ stays at
// its initial value, flat; the annealed μ(B) table rises from there toward its maximum and
// collapses near saturation. The table's first point ends the low-field range: below it the
// initial value is used whatever the flux, so a worse geometry (more wall flux) is never
// rewarded with a higher μ. The as-formed state multiplies by the material's factor. [practice]

import type { MaterialProperties, MuPoint } from "./materials";

export type MaterialState = "annealed" | "as-formed";
/**
 * initial: the design initial permeability, the wall's flux being in the low-field range;
 * material-curve: read from the μ(B) table above that range; explicit: given in the request;
 * shop: the effective low-field permeability fitted to the shop's measured lots.
 */
export type MuSource = "initial" | "material-curve" | "explicit" | "shop";

/** Above the curve's last point (at saturation) μ falls steeply toward 1. */
const COLLAPSE_EXPONENT = 8;

/** μ(B) by log-log interpolation of the table; flat below its first point (the low-field range). */
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

/** The flux density up to which μ stays at its initial value. */
export const lowFieldLimit_T = (material: Pick<MaterialProperties, "muCurve">): number => material.muCurve[0]?.B_T ?? 0;

export interface PermeabilityChoice {
  mu_r: number;
  muSource: MuSource;
}

/**
 * μ for a library material in the given state, at the wall's mean flux density (the flux it
 * carries over its thickness: at AC the outer face carries more, but the table is read at the
 * mean so that a crowded wall is not credited with the higher μ of its most loaded skin).
 * `effectiveInitial`: the shop's fitted low-field μ, which scales the whole table.
 */
export function permeabilityFor(material: MaterialProperties, state: MaterialState, meanWallFlux_T: number, effectiveInitial?: number): PermeabilityChoice {
  const initial = material.muCurve[0]?.mu_r ?? material.relativePermeability.initial;
  const scale = effectiveInitial !== undefined && initial > 0 ? effectiveInitial / initial : 1;
  // a non-magnetic metal's table is flat at 1: it has no low-field range to leave
  const flat = material.relativePermeability.maximum <= material.relativePermeability.initial;
  const low = flat || !(meanWallFlux_T > lowFieldLimit_T(material));
  let mu = (low ? initial : muFromCurve(material.muCurve, meanWallFlux_T, material.saturation_T)) * scale;
  if (state === "as-formed") mu *= material.asFormedFactor;
  const muSource: MuSource = low ? (effectiveInitial !== undefined ? "shop" : "initial") : "material-curve";
  return { mu_r: Math.max(1, mu), muSource };
}
