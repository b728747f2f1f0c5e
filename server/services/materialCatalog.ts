import type { MaterialProperties } from "../../shared/physics/materials";
import { Material } from "../models";
import { presentMaterial, type MaterialJson } from "../presenters/material";
import { processCache } from "./processCache";

// The active materials, held in this process so a prediction costs no database round trip.

export interface MaterialCatalog {
  list: MaterialProperties[];
  byId: Map<string, MaterialProperties>;
  /** GET /api/materials, serialised once per load */
  json: string;
}

const cache = processCache<MaterialCatalog>(async () => {
  const rows = await Material.ordered({ active: true });
  const list = rows.map((r) => r.toProperties());
  const presented: MaterialJson[] = rows.map(presentMaterial);
  return { list, byId: new Map(list.map((m) => [m.id, m])), json: JSON.stringify(presented) };
});

/** The active materials; loads them on first use. */
export const materialCatalog = (): Promise<MaterialCatalog> | MaterialCatalog => cache.get();

/** After an edit (call once the transaction has committed). */
export const invalidateMaterialCatalog = (): void => cache.invalidate();

/** The last loaded list without waiting, or null before the first load. */
export const materialSnapshot = (): MaterialProperties[] | null => cache.snapshot()?.list ?? null;
