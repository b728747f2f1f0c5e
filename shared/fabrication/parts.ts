/**
 * Parts list of a nested design: every layer is its own part (or parts), sized from that
 * layer's inside dimensions:
 *   inside(i) = innermost inside + 2·Σ_{j<i} (T_j + gap_j)   on every dimension
 * (the gap is the clear space to the next layer outward, on all sides). Drawn cups keep the
 * gap round the corner: inside corner radius grows by the same Σ. Bent boxes keep the tooling
 * bend radius. Cable-hole collars (chimneys) are rolled, butt-welded tubes, one per hole on each
 * layer; a layer's collar telescopes over the collars inside it, so its inside diameter is the
 * hole diameter + 2·Σ of the inner collars' thicknesses.
 */
import { blankMass_kg } from "./mass";
import { drawnCup, DEFAULT_DRAW_LIMITS, type DrawLimits } from "./drawn-cup";
import { rolledCan } from "./rolled-can";
import { bentBox, boxLid } from "./bent-box";
import { FabricationInputError } from "./types";
import { suggestKFactor } from "./bend";
import { defaultBendRadius_mm } from "../construction-defaults";

export interface DesignLayer {
  thickness_mm: number;
  /** clear space to the next layer outward */
  gap_mm?: number;
  materialId?: string;
  density_kg_m3?: number;
  limits?: DrawLimits;
}

export interface DesignConfig {
  shape: "cylinder" | "box";
  method: "drawn" | "rolled" | "bent";
  /** inside dimensions of the innermost layer: cylinder {diameter, length}; box {width, depth, height} */
  dimensions_mm: { diameter?: number; length?: number; width?: number; depth?: number; height?: number };
  /** innermost first */
  layers: DesignLayer[];
  cornerRadius_mm?: number;
  trim_mm?: number;
  seamOverlap_mm?: number;
  capFlange_mm?: number;
  bendRadius_mm?: number;
  kFactor?: number;
  /** bent boxes: make a lid (default true) */
  lid?: boolean;
  lidHeight_mm?: number;
  lidClearance_mm?: number;
  holes?: Array<{ diameter_mm: number; collarLength_mm: number }>;
}

export type PartBlank =
  | { kind: "disc"; diameter_mm: number }
  | { kind: "rectangle"; length_mm: number; width_mm: number }
  | { kind: "cross"; length_mm: number; width_mm: number };

export interface FabricatedPart {
  layer: number;
  role: "cup" | "wall" | "end-cap" | "body" | "lid" | "collar";
  method: "drawn" | "rolled" | "bent";
  materialId?: string;
  thickness_mm: number;
  density_kg_m3?: number;
  /** pieces of this blank per assembly */
  quantityPerAssembly: number;
  blank: PartBlank;
  /** per piece */
  area_mm2: number;
  mass_kg?: number;
  bendCount: number;
  weldLength_mm: number;
  drawStages: number;
  processAnneals: number;
  /** goes through cleaning, anneal and packing as its own piece; caps and collars are welded on first */
  finishedPiece: boolean;
}

/**
 * How much every dimension of layer i's inside exceeds the innermost layer's: 2·Σ_{j<i}(T_j + gap_j).
 * The one rule for sizing the layers of a nest; partsForDesign and the design check's parts use it.
 */
export function layerGrowth_mm(layers: ReadonlyArray<Pick<DesignLayer, "thickness_mm" | "gap_mm">>, i: number): number {
  let grow = 0;
  for (let j = 0; j < i; j++) grow += layers[j].thickness_mm + (layers[j].gap_mm ?? 0);
  return 2 * grow;
}

export function partsForDesign(config: DesignConfig): FabricatedPart[] {
  if (config.layers.length === 0) throw new FabricationInputError("layers", "Give at least one layer.");
  const parts: FabricatedPart[] = [];
  let grow = 0; // Σ (T + gap) of the layers inside
  let collarGrow = 0; // Σ T of the collars inside
  const dims = config.dimensions_mm;
  config.layers.forEach((layer, i) => {
    const t = layer.thickness_mm;
    const mk = (p: Omit<FabricatedPart, "layer" | "materialId" | "thickness_mm" | "density_kg_m3" | "mass_kg">): FabricatedPart => ({
      layer: i,
      materialId: layer.materialId,
      thickness_mm: t,
      density_kg_m3: layer.density_kg_m3,
      ...p,
      mass_kg: layer.density_kg_m3 !== undefined ? blankMass_kg(p.area_mm2, t, layer.density_kg_m3) : undefined,
    });
    const add = layerGrowth_mm(config.layers, i);
    if (config.shape === "cylinder") {
      const d = (dims.diameter ?? NaN) + add;
      const len = (dims.length ?? NaN) + add;
      if (config.method === "drawn") {
        const cup = drawnCup({
          insideDiameter_mm: d,
          insideHeight_mm: len,
          thickness_mm: t,
          cornerRadius_mm: config.cornerRadius_mm !== undefined && config.cornerRadius_mm > 0 ? config.cornerRadius_mm + grow : 0,
          trim_mm: config.trim_mm,
          limits: layer.limits ?? DEFAULT_DRAW_LIMITS,
        });
        parts.push(mk({ role: "cup", method: "drawn", quantityPerAssembly: 1, blank: { kind: "disc", diameter_mm: cup.blankDiameter_mm }, area_mm2: cup.area_mm2, bendCount: 0, weldLength_mm: 0, drawStages: cup.drawStages.length, processAnneals: cup.processAnneals, finishedPiece: true }));
      } else if (config.method === "rolled") {
        const can = rolledCan({ insideDiameter_mm: d, length_mm: len, thickness_mm: t, seamOverlap_mm: config.seamOverlap_mm, capFlange_mm: config.capFlange_mm });
        const cap = can.endCaps[0];
        parts.push(mk({ role: "wall", method: "rolled", quantityPerAssembly: 1, blank: { kind: "rectangle", length_mm: can.wall.length_mm, width_mm: can.wall.width_mm }, area_mm2: can.wall.length_mm * can.wall.width_mm, bendCount: 0, weldLength_mm: can.weldLength_mm, drawStages: 0, processAnneals: 0, finishedPiece: true }));
        parts.push(mk({ role: "end-cap", method: "rolled", quantityPerAssembly: 2, blank: { kind: "disc", diameter_mm: cap.diameter_mm }, area_mm2: (Math.PI * cap.diameter_mm ** 2) / 4, bendCount: 0, weldLength_mm: 0, drawStages: 0, processAnneals: 0, finishedPiece: false }));
      } else throw new FabricationInputError("method", "A cylinder is made drawn or rolled.");
    } else {
      if (config.method !== "bent") throw new FabricationInputError("method", "A box is made bent.");
      const body = {
        width_mm: (dims.width ?? NaN) + add,
        depth_mm: (dims.depth ?? NaN) + add,
        height_mm: (dims.height ?? NaN) + add,
        thickness_mm: t,
        bendRadius_mm: config.bendRadius_mm ?? defaultBendRadius_mm(t),
        kFactor: config.kFactor ?? suggestKFactor(config.bendRadius_mm ?? defaultBendRadius_mm(t), t),
      };
      const box = bentBox(body);
      parts.push(mk({ role: "body", method: "bent", quantityPerAssembly: 1, blank: { kind: "cross", length_mm: box.length_mm, width_mm: box.width_mm }, area_mm2: box.area_mm2, bendCount: box.bendCount, weldLength_mm: box.weldLength_mm, drawStages: 0, processAnneals: 0, finishedPiece: true }));
      if (config.lid !== false) {
        const lid = boxLid({ body, lidHeight_mm: config.lidHeight_mm, lidClearance_mm: config.lidClearance_mm });
        parts.push(mk({ role: "lid", method: "bent", quantityPerAssembly: 1, blank: { kind: "cross", length_mm: lid.length_mm, width_mm: lid.width_mm }, area_mm2: lid.area_mm2, bendCount: lid.bendCount, weldLength_mm: lid.weldLength_mm, drawStages: 0, processAnneals: 0, finishedPiece: true }));
      }
    }
    for (const hole of config.holes ?? []) {
      const tube = rolledCan({ insideDiameter_mm: hole.diameter_mm + 2 * collarGrow, length_mm: hole.collarLength_mm, thickness_mm: t, endCaps: false });
      parts.push(mk({
        role: "collar",
        method: "rolled",
        quantityPerAssembly: 1,
        blank: { kind: "rectangle", length_mm: tube.wall.length_mm, width_mm: tube.wall.width_mm },
        area_mm2: tube.area_mm2,
        bendCount: 0,
        // seam + the weld round the collar's foot on the layer
        weldLength_mm: tube.weldLength_mm + Math.PI * tube.outsideDiameter_mm,
        drawStages: 0,
        processAnneals: 0,
        finishedPiece: false,
      }));
    }
    grow += t + (layer.gap_mm ?? 0);
    collarGrow += t;
  });
  return parts;
}
