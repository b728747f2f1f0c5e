// What the design on screen takes to make: the request bodies for each layer's blank
// (POST /api/blanks) and for the whole nest's price (POST /api/price-estimates), and the link
// that opens a layer's blank on the flat-blank page. Pure functions of the checked design, so the
// sizes come from the server's engine and the price from its list; nothing is worked out here
// except which layer is which size (the engine's own layerGrowth_mm).

import { suggestKFactor } from "../../../shared/fabrication/bend";
import { layerGrowth_mm } from "../../../shared/fabrication/parts";
import { DEFAULT_CORNER_RADIUS_MM, DEFAULT_SEAM_OVERLAP_MM, DEFAULT_TRIM_MM, defaultBendRadius_mm, defaultLidHeight } from "../../../shared/construction-defaults";
import type { BlankRequest } from "../../../shared/schemas/blank";
import type { PredictionRequest } from "../../../shared/schemas/prediction";
import { MAX_ESTIMATE_QUANTITY, type DesignConfigurationInput } from "../../../shared/schemas/price-estimate";
import type { FlatBlankPrefill } from "../../config/paths";

export type MakeMethod = "drawn" | "rolled" | "bent";

/** Beyond this many draws a rolled and welded can is usually cheaper: fewer tools, fewer anneals. */
export const MAX_DRAW_STAGES = 4;

/** The method the design is made by: its own for a can, bent for a box; a sphere is not made here. */
export function methodOf(request: PredictionRequest): MakeMethod | null {
  if (request.shape === "sphere") return null;
  if (request.shape === "box") return "bent";
  return request.method ?? "drawn";
}

/** The most draws any layer needs, when a drawn can needs more than MAX_DRAW_STAGES; else null. */
export function tooManyDraws(drawStagesPerLayer: readonly number[] | null): number | null {
  if (!drawStagesPerLayer || drawStagesPerLayer.length === 0) return null;
  const most = Math.max(...drawStagesPerLayer);
  return most > MAX_DRAW_STAGES ? most : null;
}

/** A drawn cup's inside corner radius: the shared default grown with the layers inside, within what the cup allows. */
function cornerRadius(diameter: number, length: number, add: number): number {
  return Math.min(DEFAULT_CORNER_RADIUS_MM + add / 2, diameter / 2, length);
}

/** Each layer's blank request, sized from that layer's inside (the inner layers' walls and gaps added). */
export function layerBlankRequests(request: PredictionRequest, method: MakeMethod): BlankRequest[] {
  if (request.shape === "sphere") return [];
  const d = request.dimensions_mm as Record<string, number>;
  return request.layers.map((layer, i) => {
    const add = layerGrowth_mm(request.layers, i);
    const t = layer.thickness_mm;
    const material = layer.material ? { material: layer.material } : {};
    if (request.shape === "box") {
      const height = d.height + add;
      // the shared defaults: bend radius one thickness, the typical K for it; the lid at its default height
      const R = defaultBendRadius_mm(t);
      return { shape: "box", method: "bent", dimensions_mm: { width: d.width + add, depth: d.depth + add, height }, thickness_mm: t, bendRadius_mm: R, kFactor: suggestKFactor(R, t), lidHeight_mm: defaultLidHeight(height), ...material };
    }
    const dimensions_mm = { diameter: d.diameter + add, length: d.length + add };
    if (method === "rolled") return { shape: "cylinder", method: "rolled", dimensions_mm, thickness_mm: t, seamOverlap_mm: DEFAULT_SEAM_OVERLAP_MM, ...material };
    return { shape: "cylinder", method: "drawn", dimensions_mm, thickness_mm: t, cornerRadius_mm: cornerRadius(dimensions_mm.diameter, dimensions_mm.length, add), trim_mm: DEFAULT_TRIM_MM, ...material };
  });
}

export type PriceEstimateBody = { configuration: DesignConfigurationInput; quantity: number };
export type PriceEstimateBodyResult =
  | { ok: true; body: PriceEstimateBody }
  | { ok: false; reason: "not-made" | "custom-material" | "quantity"; message: string; layers?: number[] };

/**
 * The design-check form's state → POST /api/price-estimates' body: the innermost layer's inside
 * dimensions, every layer's library material, thickness and gap, the cable holes with their
 * collars, the method and the quantity.
 * Says in plain words when the design cannot be priced.
 */
export function toPriceEstimateBody(request: PredictionRequest, method: MakeMethod | null, quantity: number | null): PriceEstimateBodyResult {
  if (request.shape === "sphere" || method === null) return { ok: false, reason: "not-made", message: "A sphere is not made on this shop's routings, so it has no price." };
  const custom = request.layers.flatMap((l, i) => (l.material ? [] : [i]));
  if (custom.length > 0) {
    const which = custom.map((i) => i + 1).join(" and ");
    return {
      ok: false,
      reason: "custom-material",
      layers: custom,
      message: `Layer ${which} ${custom.length === 1 ? "has" : "have"} a custom μr rather than a material from the library, so the shop has no price for ${custom.length === 1 ? "it" : "them"}. Choose a library material to see the price.`,
    };
  }
  if (quantity === null) return { ok: false, reason: "quantity", message: "Enter the quantity." };
  if (!Number.isInteger(quantity) || quantity < 1 || quantity > MAX_ESTIMATE_QUANTITY) {
    return { ok: false, reason: "quantity", message: `Quantity must be a whole number of pieces from 1 to ${MAX_ESTIMATE_QUANTITY.toLocaleString("en-GB")}.` };
  }
  const d = request.dimensions_mm as Record<string, number>;
  const layers = request.layers.map((l, i) => ({
    material: l.material!,
    thickness_mm: l.thickness_mm,
    ...(i < request.layers.length - 1 && l.gap_mm !== undefined ? { gap_mm: l.gap_mm } : {}),
  }));
  // every hole goes with the design: a collar is a rolled tube on each layer, priced as a part;
  // a plain hole (0 mm collar) is cut in the blank and costs no part of its own
  const holes = request.holes?.length ? { holes: request.holes.map((h) => ({ diameter_mm: h.diameter_mm, collarLength_mm: h.collarLength_mm })) } : {};
  // the engine takes each layer's bend radius and K from the same shared defaults as the blanks above
  const configuration: DesignConfigurationInput =
    request.shape === "box"
      ? { shape: "box", method: "bent", dimensions_mm: { width: d.width, depth: d.depth, height: d.height }, layers, lid: true, ...holes }
      : method === "rolled"
        ? { shape: "cylinder", method: "rolled", dimensions_mm: { diameter: d.diameter, length: d.length }, layers, seamOverlap_mm: DEFAULT_SEAM_OVERLAP_MM, ...holes }
        : { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: d.diameter, length: d.length }, layers, cornerRadius_mm: cornerRadius(d.diameter, d.length, 0), trim_mm: DEFAULT_TRIM_MM, ...holes };
  return { ok: true, body: { configuration, quantity } };
}

/** A layer's blank request as the flat-blank page's inputs, for a link that opens it pre-filled. */
export function flatBlankPrefill(blank: BlankRequest): FlatBlankPrefill {
  const s = (x: number | undefined) => (x === undefined ? undefined : String(+x.toFixed(6)));
  // "none": a custom-μr layer has no library material, so the page shows no mass
  const common = { thickness: s(blank.thickness_mm), material: blank.material ?? "none" };
  if (blank.method === "bent") {
    const { width, depth, height } = blank.dimensions_mm;
    return { kind: "box-bent", width: s(width), depth: s(depth), height: s(height), bendRadius: s(blank.bendRadius_mm), kFactor: s(blank.kFactor), ...common };
  }
  const { diameter, length } = blank.dimensions_mm;
  if (blank.method === "rolled") return { kind: "cylinder-rolled", diameter: s(diameter), length: s(length), seamOverlap: s(blank.seamOverlap_mm ?? 0), ...common };
  return { kind: "cylinder-drawn", diameter: s(diameter), length: s(length), cornerRadius: s(blank.cornerRadius_mm ?? 0), trim: s(blank.trim_mm ?? 0), ...common };
}
