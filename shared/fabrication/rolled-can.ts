/**
 * Rolled and seam-welded can: a rectangular wall blank rolled to a cylinder plus two
 * flanged end caps.
 *   wall length = π·(d_inside + 2·K·T) + seam allowance     [derived]/[practice]
 * K = 0.5 by default: a rolled cylinder of gentle curvature bends about its mid-thickness, so the
 * developed length is the mean circumference π·d_mean. Seam allowance 0 for a butt weld (fusion,
 * no filler, keeps the magnetic path continuous), the overlap for a lap joint.
 * Wall width = can length. End caps: discs of diameter = can outside diameter + 2·flange, the
 * flange turned down over the wall. Default flange = 2·T + 3 mm (room for the cap's bend radius
 * plus a short leg to weld to).
 */
import { discArea, requireNonNegative, requirePositive } from "./types";

export const DEFAULT_ROLLED_K = 0.5;

export const defaultCapFlange = (thickness_mm: number): number => 2 * thickness_mm + 3;

export interface RolledCanInput {
  insideDiameter_mm: number;
  length_mm: number;
  thickness_mm: number;
  /** 0 or absent: butt seam */
  seamOverlap_mm?: number;
  capFlange_mm?: number;
  kFactor?: number;
  /** false for an open-ended tube (collars): no caps */
  endCaps?: boolean;
}

export interface RolledCanResult {
  wall: { length_mm: number; width_mm: number };
  endCaps: Array<{ kind: "disc"; diameter_mm: number }>;
  capFlange_mm: number;
  outsideDiameter_mm: number;
  area_mm2: number;
  /** longitudinal seam + cap-to-wall circumferential welds */
  weldLength_mm: number;
  seam: "butt" | "lap";
}

export function rolledCan(input: RolledCanInput): RolledCanResult {
  const { insideDiameter_mm: di, length_mm: len, thickness_mm: t } = input;
  requirePositive(di, "dimensions_mm.diameter");
  requirePositive(len, "dimensions_mm.length");
  requirePositive(t, "thickness_mm");
  const overlap = input.seamOverlap_mm ?? 0;
  requireNonNegative(overlap, "seamOverlap_mm");
  const k = input.kFactor ?? DEFAULT_ROLLED_K;
  const flange = input.capFlange_mm ?? defaultCapFlange(t);
  requireNonNegative(flange, "capFlange_mm");

  const wallLength = Math.PI * (di + 2 * k * t) + overlap;
  const od = di + 2 * t;
  const withCaps = input.endCaps !== false;
  const capD = od + 2 * flange;
  const endCaps = withCaps ? [{ kind: "disc" as const, diameter_mm: capD }, { kind: "disc" as const, diameter_mm: capD }] : [];
  const area = wallLength * len + endCaps.reduce((s, c) => s + discArea(c.diameter_mm), 0);
  return {
    wall: { length_mm: wallLength, width_mm: len },
    endCaps,
    capFlange_mm: flange,
    outsideDiameter_mm: od,
    area_mm2: area,
    weldLength_mm: len + (withCaps ? 2 * Math.PI * od : 0),
    seam: overlap > 0 ? "lap" : "butt",
  };
}
