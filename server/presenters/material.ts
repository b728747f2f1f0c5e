import type { MaterialChangeJson, MaterialJson, MaterialRecordJson } from "../../shared/schemas/material";
import type { Event, Material } from "../models";

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
export function presentMaterialForAdmin(m: Material): MaterialRecordJson {
  return { ...presentMaterial(m), active: m.active, createdAt: m.createdAt.toISOString(), updatedAt: m.updatedAt.toISOString() };
}

/** One recorded edit of a material, with its author's name when the author still exists. */
export function presentMaterialChange(e: Event, actorName: string | undefined): MaterialChangeJson {
  const data = e.data as { changes?: MaterialChangeJson["changes"]; before?: unknown; after?: unknown };
  return {
    id: String(e.id),
    action: e.action,
    at: e.createdAt.toISOString(),
    actor: e.actorId ? { id: e.actorId, name: actorName ?? "unknown" } : null,
    changes: data.changes ?? [],
    before: data.before ?? null,
    after: data.after ?? null,
  };
}
