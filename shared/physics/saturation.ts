// The saturation warnings a design review would raise, from each wall's peak flux density (the
// exact solution's field in the wall at the asked frequency: see exact.ts), and the μ → ∞
// estimate that the axial can still needs. In a nested shield each layer sees the field the
// layers outside it let through.

export type WarningCode =
  | "NEAR_SATURATION"
  | "SATURATED"
  | "LAYER_ORDER"
  | "THICK_WALL"
  | "OUTSIDE_MODEL"
  | "BOX_ESTIMATE"
  | "OPEN_END_ESTIMATE"
  | "SHORT_COLLAR"
  | "HOLE_LIMITED"
  | "NON_MAGNETIC_LOW_FREQUENCY"
  | "BEYOND_REPORT_LIMIT";

export interface PredictionWarning {
  code: WarningCode;
  message: string;
}

/** How the flux is gathered into the wall. */
export type FluxPath = "cylinder-transverse" | "cylinder-axial" | "sphere" | "box";

/**
 * B_wall from the μ → ∞ solution for applied (local) field B0 [derived]: cylinder across the
 * field B0·D/t; sphere 0.75·B0·D/t; closed can along the axis B0·D/(4·N·t); box as its
 * circumscribed sphere (D = the corner-to-corner diagonal). D is the layer's outer diameter (the
 * flux it gathers). The static estimate only: at AC the exact field is several times higher.
 */
export function wallFluxDensity_T(path: FluxPath, B0_T: number, D: number, t: number, N = 1 / 3): number {
  switch (path) {
    case "cylinder-transverse":
      return (B0_T * D) / t;
    case "sphere":
    case "box":
      return (0.75 * B0_T * D) / t;
    case "cylinder-axial":
      return (B0_T * D) / (4 * N * t);
  }
}

/** Margins above this are stated as this (the wall is far from saturation). */
export const MAX_MARGIN = 1e9;

/** saturation_T / B_wall; null where the material has no saturation (copper, aluminium). */
export function saturationMargin(saturation_T: number | null, wallFlux_T: number): number | null {
  if (saturation_T == null) return null;
  return wallFlux_T > saturation_T / MAX_MARGIN ? saturation_T / wallFlux_T : MAX_MARGIN;
}

/** Keep B_wall at or below about a third of saturation. [practice] */
export const NEAR_SATURATION_FRACTION = 1 / 3;
/** Field strong enough that layer order matters: outermost wall above this share of saturation. [practice] */
export const STRONG_FIELD_FRACTION = 0.2;

export interface LayerFlux {
  label: string;
  wallFlux_T: number;
  saturation_T: number | null;
}

/** NEAR_SATURATION, SATURATED and LAYER_ORDER for layers given innermost first; `ac`: the figures are AC peaks. */
export function saturationWarnings(layers: LayerFlux[], ac = false): PredictionWarning[] {
  const out: PredictionWarning[] = [];
  const where = ac ? " at its outer face (eddy currents crowd the flux there)" : "";
  layers.forEach((l) => {
    if (l.saturation_T == null) return;
    const B = `${l.wallFlux_T.toPrecision(3)} T${where}`;
    if (l.wallFlux_T >= l.saturation_T) {
      out.push({
        code: "SATURATED",
        message: `${l.label}: the wall would carry about ${B}, at or above its saturation of ${l.saturation_T} T. A saturated wall stops shielding; use a thicker wall, a larger-saturation alloy outside, or another layer.`,
      });
    } else if (l.wallFlux_T > NEAR_SATURATION_FRACTION * l.saturation_T) {
      out.push({
        code: "NEAR_SATURATION",
        message: `${l.label}: the wall would carry about ${B}, more than a third of its saturation of ${l.saturation_T} T. Permeability drops near saturation, so the shield may do less than predicted.`,
      });
    }
  });
  const outer = layers[layers.length - 1];
  if (outer && outer.saturation_T != null && outer.wallFlux_T >= STRONG_FIELD_FRACTION * outer.saturation_T) {
    const higher = layers.slice(0, -1).find((l) => l.saturation_T != null && l.saturation_T > outer.saturation_T!);
    if (higher)
      out.push({
        code: "LAYER_ORDER",
        message: `In a field this strong put the higher-saturation alloy outermost: ${outer.label} (${outer.saturation_T} T) is outside ${higher.label} (${higher.saturation_T} T).`,
      });
  }
  return out;
}
