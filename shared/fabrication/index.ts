/**
 * Fabrication engine: flat blanks, draw stages, parts, nesting, price build-up, DXF.
 * Pure TypeScript, no I/O; runs in the server and the browser.
 */
import type { BentBlankRequest, BlankRequest, DrawnBlankRequest, RolledBlankRequest } from "../schemas/blank";
import { suggestKFactor } from "./bend";
import { bentBox, boxLid } from "./bent-box";
import { drawnCup, DEFAULT_DRAW_LIMITS, type DrawLimits, type DrawStage } from "./drawn-cup";
import { blankMass_kg } from "./mass";
import { rolledCan } from "./rolled-can";
import type { FlatPatternGeometry, Point, Warning } from "./types";

export * from "./types";
export * from "./bend";
export * from "./drawn-cup";
export * from "./rolled-can";
export * from "./bent-box";
export * from "./mass";
export * from "./parts";
export * from "./nesting";
export * from "./pricing";
export * from "./dxf";
export * from "./filenames";
export * from "./shop-limits";

/** Shown where blanks are sheared, punched and formed [practice]. */
export const PRESS_WORK_CAUTION =
  "Sheet edges and press work: sheared and punched edges cut; wear cut-resistant gloves and keep press and shear guarding and interlocks in place.";

export interface BlankMaterial {
  id?: string;
  density_kg_m3?: number;
  /** forming limits for drawn parts; default 1.9 / 1.3 with process anneals [practice] */
  formingLimits?: DrawLimits;
}

interface BlankCommon {
  area_mm2: number;
  mass_kg?: number;
  geometry: FlatPatternGeometry;
  warnings: Warning[];
}

export interface DrawnBlankResult extends BlankCommon {
  shape: "cylinder";
  method: "drawn";
  blank: { kind: "disc"; diameter_mm: number };
  drawRatio: number;
  drawStages: DrawStage[];
  processAnneals: number;
}

export interface RolledBlankResult extends BlankCommon {
  shape: "cylinder";
  method: "rolled";
  blank: { kind: "rectangle"; length_mm: number; width_mm: number };
  endCaps: Array<{ kind: "disc"; diameter_mm: number }>;
  seam: "butt" | "lap";
  capFlange_mm: number;
  weldLength_mm: number;
}

export interface BentBlankResult extends BlankCommon {
  shape: "box";
  method: "bent";
  blank: { kind: "cross"; length_mm: number; width_mm: number };
  /** per 90° bend */
  bendAllowance_mm: number;
  bendDeduction_mm: number;
  outsideSetback_mm: number;
  kFactor: number;
  relief_mm: number;
  bendCount: number;
  weldLength_mm: number;
  /** present when lidHeight_mm is asked for; area_mm2 and mass_kg then include it */
  lid?: { blank: { kind: "cross"; length_mm: number; width_mm: number }; area_mm2: number; lidHeight_mm: number; lidClearance_mm: number; geometry: FlatPatternGeometry };
}

export type BlankResult = DrawnBlankResult | RolledBlankResult | BentBlankResult;

/** Answers POST /api/blanks for a request already checked by blankRequestSchema. */
export function computeBlank(request: DrawnBlankRequest, material?: BlankMaterial): DrawnBlankResult;
export function computeBlank(request: RolledBlankRequest, material?: BlankMaterial): RolledBlankResult;
export function computeBlank(request: BentBlankRequest, material?: BlankMaterial): BentBlankResult;
export function computeBlank(request: BlankRequest, material?: BlankMaterial): BlankResult;
export function computeBlank(request: BlankRequest, material?: BlankMaterial): BlankResult {
  const t = request.thickness_mm;
  const mass = (area: number) => (material?.density_kg_m3 !== undefined ? { mass_kg: blankMass_kg(area, t, material.density_kg_m3) } : {});
  if (request.method === "drawn") {
    const cup = drawnCup({
      insideDiameter_mm: request.dimensions_mm.diameter,
      insideHeight_mm: request.dimensions_mm.length,
      thickness_mm: t,
      cornerRadius_mm: request.cornerRadius_mm,
      trim_mm: request.trim_mm,
      limits: material?.formingLimits ?? DEFAULT_DRAW_LIMITS,
    });
    const D = cup.blankDiameter_mm;
    return {
      shape: "cylinder",
      method: "drawn",
      blank: { kind: "disc", diameter_mm: D },
      drawRatio: cup.drawRatio,
      drawStages: cup.drawStages,
      processAnneals: cup.processAnneals,
      area_mm2: cup.area_mm2,
      ...mass(cup.area_mm2),
      geometry: { outline: [], bendLines: [], reliefs: [], circles: [{ cx: D / 2, cy: D / 2, diameter: D }] },
      warnings: cup.warnings,
    };
  }
  if (request.method === "rolled") {
    const can = rolledCan({
      insideDiameter_mm: request.dimensions_mm.diameter,
      length_mm: request.dimensions_mm.length,
      thickness_mm: t,
      seamOverlap_mm: request.seamOverlap_mm,
      capFlange_mm: request.capFlange_mm,
    });
    const { length_mm: L, width_mm: W } = can.wall;
    const capD = can.endCaps[0].diameter_mm;
    const space = 10; // drawing only: caps laid out beside the wall
    return {
      shape: "cylinder",
      method: "rolled",
      blank: { kind: "rectangle", length_mm: L, width_mm: W },
      endCaps: can.endCaps,
      seam: can.seam,
      capFlange_mm: can.capFlange_mm,
      weldLength_mm: can.weldLength_mm,
      area_mm2: can.area_mm2,
      ...mass(can.area_mm2),
      geometry: {
        outline: [[0, 0], [L, 0], [L, W], [0, W]] as Point[],
        bendLines: [],
        reliefs: [],
        circles: [
          { cx: L + space + capD / 2, cy: capD / 2, diameter: capD },
          { cx: L + space + capD / 2, cy: capD + space + capD / 2, diameter: capD },
        ],
      },
      warnings: [],
    };
  }
  const body = {
    width_mm: request.dimensions_mm.width,
    depth_mm: request.dimensions_mm.depth,
    height_mm: request.dimensions_mm.height,
    thickness_mm: t,
    bendRadius_mm: request.bendRadius_mm,
    kFactor: request.kFactor,
  };
  const box = bentBox(body);
  const warnings: Warning[] = [];
  const kTypical = suggestKFactor(body.bendRadius_mm, t);
  if (Math.abs(request.kFactor - kTypical) > 0.1) {
    warnings.push({ code: "K_FACTOR_UNUSUAL", message: `K-factor ${request.kFactor} is far from the typical ${kTypical.toFixed(2)} for R/T = ${(body.bendRadius_mm / t).toFixed(2)}; check with a test bend.` });
  }
  let lid: BentBlankResult["lid"];
  if (request.lidHeight_mm !== undefined || request.lidClearance_mm !== undefined) {
    const l = boxLid({ body, lidHeight_mm: request.lidHeight_mm, lidClearance_mm: request.lidClearance_mm });
    lid = { blank: { kind: "cross", length_mm: l.length_mm, width_mm: l.width_mm }, area_mm2: l.area_mm2, lidHeight_mm: l.lidHeight_mm, lidClearance_mm: l.lidClearance_mm, geometry: l.geometry };
  }
  const area = box.area_mm2 + (lid?.area_mm2 ?? 0);
  return {
    shape: "box",
    method: "bent",
    blank: { kind: "cross", length_mm: box.length_mm, width_mm: box.width_mm },
    bendAllowance_mm: box.bendAllowance_mm,
    bendDeduction_mm: box.bendDeduction_mm,
    outsideSetback_mm: box.outsideSetback_mm,
    kFactor: request.kFactor,
    relief_mm: box.relief_mm,
    bendCount: box.bendCount,
    weldLength_mm: box.weldLength_mm,
    ...(lid ? { lid } : {}),
    area_mm2: area,
    ...mass(area),
    geometry: box.geometry,
    warnings,
  };
}
