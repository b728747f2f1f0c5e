/**
 * Bend allowance, outside setback and bend deduction for air/brake bends.
 * Machinery's Handbook (Industrial Press), sheet-metal section:
 *   BA = (π/180)·A·(R + K·T)   arc length of the neutral axis
 *   OSSB = tan(A/2)·(R + T)    from the bend's tangent point to the mould line
 *   BD = 2·OSSB − BA           what to subtract from the sum of outside flange lengths
 * A in degrees, R inside radius, T thickness, K neutral-axis position as a fraction of T.
 */
import { requireNonNegative, requirePositive } from "./types";

const DEG = Math.PI / 180;

export function bendAllowance(angle_deg: number, insideRadius_mm: number, thickness_mm: number, kFactor: number): number {
  return DEG * angle_deg * (insideRadius_mm + kFactor * thickness_mm);
}

export function outsideSetback(angle_deg: number, insideRadius_mm: number, thickness_mm: number): number {
  return Math.tan((DEG * angle_deg) / 2) * (insideRadius_mm + thickness_mm);
}

export function bendDeduction(angle_deg: number, insideRadius_mm: number, thickness_mm: number, kFactor: number): number {
  return 2 * outsideSetback(angle_deg, insideRadius_mm, thickness_mm) - bendAllowance(angle_deg, insideRadius_mm, thickness_mm, kFactor);
}

export interface BendFigures {
  angle_deg: number;
  bendAllowance_mm: number;
  outsideSetback_mm: number;
  bendDeduction_mm: number;
}

export function bendFigures(angle_deg: number, insideRadius_mm: number, thickness_mm: number, kFactor: number): BendFigures {
  requireNonNegative(insideRadius_mm, "bendRadius_mm");
  requirePositive(thickness_mm, "thickness_mm");
  if (!(kFactor >= 0 && kFactor <= 0.5)) throw new RangeError("kFactor must lie in 0–0.5");
  return {
    angle_deg,
    bendAllowance_mm: bendAllowance(angle_deg, insideRadius_mm, thickness_mm, kFactor),
    outsideSetback_mm: outsideSetback(angle_deg, insideRadius_mm, thickness_mm),
    bendDeduction_mm: bendDeduction(angle_deg, insideRadius_mm, thickness_mm, kFactor),
  };
}

/**
 * Typical K-factor from R/T [practice]: 0.33 for R < T, rising toward 0.5 for large radii
 * (the neutral axis moves back to mid-thickness as the bend gets gentle). Piecewise-linear
 * through R/T = 1 → 0.33, 3 → 0.42, 5 → 0.45, 10 → 0.5. A starting value only: the shop's own
 * test bends on the alloy and gauge rule.
 */
export function suggestKFactor(insideRadius_mm: number, thickness_mm: number): number {
  const rt = insideRadius_mm / thickness_mm;
  const table: Array<[number, number]> = [
    [1, 0.33],
    [3, 0.42],
    [5, 0.45],
    [10, 0.5],
  ];
  if (!(rt > table[0][0])) return table[0][1];
  for (let i = 1; i < table.length; i++) {
    const [x1, k1] = table[i];
    if (rt <= x1) {
      const [x0, k0] = table[i - 1];
      return k0 + ((k1 - k0) * (rt - x0)) / (x1 - x0);
    }
  }
  return 0.5;
}
