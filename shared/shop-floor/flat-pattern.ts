/**
 * The flat pattern a job's traveler shows: a disc, a rectangle, or a bent box's cross with its
 * bend lines and corner reliefs. Box bodies and lids are laid out again from the design with the
 * fabrication engine (the same layer growth and bend defaults as partsForDesign), so the drawing
 * matches the blank the parts list sized.
 */
import { bentBox, boxLid, layerGrowth_mm, suggestKFactor, type DesignConfig, type FabricatedPart, type FlatPatternGeometry } from "../fabrication";
import { defaultBendRadius_mm } from "../construction-defaults";

export type FlatPatternDesign = Pick<DesignConfig, "dimensions_mm" | "bendRadius_mm" | "kFactor" | "lidHeight_mm" | "lidClearance_mm"> & {
  layers: ReadonlyArray<{ thickness_mm: number; gap_mm?: number }>;
};

export function flatPatternOf(config: FlatPatternDesign, part: Pick<FabricatedPart, "blank" | "layer" | "thickness_mm" | "role">): FlatPatternGeometry {
  const blank = part.blank;
  if (blank.kind === "disc") {
    const d = blank.diameter_mm;
    return { outline: [], bendLines: [], reliefs: [], circles: [{ cx: d / 2, cy: d / 2, diameter: d }] };
  }
  if (blank.kind === "rectangle") {
    const { length_mm: l, width_mm: w } = blank;
    return { outline: [[0, 0], [l, 0], [l, w], [0, w]], bendLines: [], reliefs: [], circles: [] };
  }
  const add = layerGrowth_mm(config.layers, part.layer);
  const t = part.thickness_mm;
  const bendRadius_mm = config.bendRadius_mm ?? defaultBendRadius_mm(t);
  const body = {
    width_mm: (config.dimensions_mm.width ?? NaN) + add,
    depth_mm: (config.dimensions_mm.depth ?? NaN) + add,
    height_mm: (config.dimensions_mm.height ?? NaN) + add,
    thickness_mm: t,
    bendRadius_mm,
    kFactor: config.kFactor ?? suggestKFactor(bendRadius_mm, t),
  };
  if (part.role === "lid") return boxLid({ body, lidHeight_mm: config.lidHeight_mm, lidClearance_mm: config.lidClearance_mm }).geometry;
  return bentBox(body).geometry;
}
