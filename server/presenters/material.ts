import type { MaterialJson } from "../../shared/schemas/material";
import type { Material } from "../models";

export type { MaterialJson };

export function presentMaterial(m: Material): MaterialJson {
  return {
    id: m.id,
    name: m.name,
    relativePermeability: { initial: m.muInitial, maximum: m.muMaximum },
    saturation_T: m.saturationT,
    resistivity_ohm_m: m.resistivityOhmM,
    density_kg_m3: m.densityKgM3,
    source: m.source,
    muCurve: m.muCurve,
    asFormedFactor: m.asFormedFactor,
    sourceTags: m.sourceTags,
  };
}

/** The admin's view adds the flag and the dates. */
export function presentMaterialForAdmin(m: Material) {
  return { ...presentMaterial(m), active: m.active, createdAt: m.createdAt.toISOString(), updatedAt: m.updatedAt.toISOString() };
}
