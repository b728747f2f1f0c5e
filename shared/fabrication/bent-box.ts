/**
 * Bent box: a cross-shaped blank, the bottom in the middle and a wall on each arm, four 90°
 * bends, the four vertical corners welded.
 *
 * Inside W × D × H (H from the inside of the bottom to the top edge), inside bend radius R:
 *   bottom flat between tangent lines  W − 2R  (and D − 2R)
 *   each bend zone                     BA₉₀ = (π/2)·(R + K·T)
 *   each wall flat                     H − R
 *   overall length along W = (W − 2R) + 2·BA₉₀ + 2·(H − R), likewise along D.  [derived]
 *
 * Layout (x along W, y along D, origin at the blank's lower-left): the cross's notches reach the
 * bottom's bend tangent lines, so the square where two bend zones would cross is cut away.
 * That notch is the corner relief: a square of side max(R + T, BA₉₀) at each bend intersection
 * (R + T clears the bend's outer fibre; never less than the bend zone, so no material is left
 * to tear where two bends meet). The wall edges then stand back from the corner by about R,
 * and the corner weld closes that gap.
 *
 * Lid: a second, shallower box of the same gauge and bend radius whose inside fits over the
 * body's outside: lid inside = body inside + 2·T + 2·clearance (clearance per side).
 */
import { bendAllowance, bendDeduction, outsideSetback } from "./bend";
import { FabricationInputError, requireNonNegative, requirePositive, type FlatPatternGeometry, type Point, type Relief, type Segment } from "./types";

import { DEFAULT_LID_CLEARANCE_MM, defaultLidHeight } from "../construction-defaults";

export { DEFAULT_LID_CLEARANCE_MM, defaultLidHeight };

export interface BentBoxInput {
  width_mm: number;
  depth_mm: number;
  height_mm: number;
  thickness_mm: number;
  bendRadius_mm: number;
  kFactor: number;
}

export interface BentBoxResult {
  /** overall flat size along W */
  length_mm: number;
  /** overall flat size along D */
  width_mm: number;
  bendAllowance_mm: number;
  bendDeduction_mm: number;
  outsideSetback_mm: number;
  relief_mm: number;
  area_mm2: number;
  bendCount: number;
  /** four vertical corner seams, each the inside height */
  weldLength_mm: number;
  inside: { width_mm: number; depth_mm: number; height_mm: number };
  geometry: FlatPatternGeometry;
}

export function bentBox(input: BentBoxInput, heightField = "dimensions_mm.height"): BentBoxResult {
  const { width_mm: W, depth_mm: D, height_mm: H, thickness_mm: T, bendRadius_mm: R, kFactor: K } = input;
  requirePositive(W, "dimensions_mm.width");
  requirePositive(D, "dimensions_mm.depth");
  requirePositive(H, heightField);
  requirePositive(T, "thickness_mm");
  requireNonNegative(R, "bendRadius_mm");
  if (!(K >= 0 && K <= 0.5)) throw new FabricationInputError("kFactor", "K-factor must be between 0 and 0.5.");
  if (2 * R >= Math.min(W, D)) throw new FabricationInputError("bendRadius_mm", "Bend radius must be less than half the smaller side.");
  if (R >= H) throw new FabricationInputError(heightField, "Height must be more than the bend radius.");
  if (T >= Math.min(W, D, H)) throw new FabricationInputError("thickness_mm", "Sheet thickness must be less than every inside size of the box.");

  const ba = bendAllowance(90, R, T, K);
  const a = H - R; // wall flat
  const wf = W - 2 * R;
  const df = D - 2 * R;
  const L = wf + 2 * ba + 2 * a;
  const Wd = df + 2 * ba + 2 * a;
  const x0 = a + ba;
  const x1 = x0 + wf;
  const y0 = a + ba;
  const y1 = y0 + df;
  const outline: Point[] = [
    [x0, 0], [x1, 0], [x1, y0], [L, y0], [L, y1], [x1, y1],
    [x1, Wd], [x0, Wd], [x0, y1], [0, y1], [0, y0], [x0, y0],
  ];
  // bend lines on the centre of each bend zone
  const bendLines: Segment[] = [
    [[a + ba / 2, y0], [a + ba / 2, y1]],
    [[x1 + ba / 2, y0], [x1 + ba / 2, y1]],
    [[x0, a + ba / 2], [x1, a + ba / 2]],
    [[x0, y1 + ba / 2], [x1, y1 + ba / 2]],
  ];
  const s = Math.max(R + T, ba);
  const reliefs: Relief[] = [
    { x: x0 - s, y: y0 - s, size: s },
    { x: x1, y: y0 - s, size: s },
    { x: x1, y: y1, size: s },
    { x: x0 - s, y: y1, size: s },
  ];
  return {
    length_mm: L,
    width_mm: Wd,
    bendAllowance_mm: ba,
    bendDeduction_mm: bendDeduction(90, R, T, K),
    outsideSetback_mm: outsideSetback(90, R, T),
    relief_mm: s,
    area_mm2: wf * df + 2 * (a + ba) * (wf + df),
    bendCount: 4,
    weldLength_mm: 4 * H,
    inside: { width_mm: W, depth_mm: D, height_mm: H },
    geometry: { outline, bendLines, reliefs, circles: [] },
  };
}

export interface LidInput {
  body: BentBoxInput;
  lidHeight_mm?: number;
  lidClearance_mm?: number;
}

export function boxLid(input: LidInput): BentBoxResult & { lidHeight_mm: number; lidClearance_mm: number } {
  const { body } = input;
  const c = input.lidClearance_mm ?? DEFAULT_LID_CLEARANCE_MM;
  requireNonNegative(c, "lidClearance_mm");
  const h = input.lidHeight_mm ?? defaultLidHeight(body.height_mm);
  requirePositive(h, "lidHeight_mm");
  const lid = bentBox(
    {
      ...body,
      width_mm: body.width_mm + 2 * body.thickness_mm + 2 * c,
      depth_mm: body.depth_mm + 2 * body.thickness_mm + 2 * c,
      height_mm: h,
    },
    "lidHeight_mm",
  );
  return { ...lid, lidHeight_mm: h, lidClearance_mm: c };
}
