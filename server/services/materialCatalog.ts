import type { MaterialProperties } from "../../shared/physics/materials";
import { Material } from "../models";
import { presentMaterial, type MaterialJson } from "../presenters/material";

// The active materials, held in this process so a prediction costs no database round trip.
// An edit through this process invalidates it at once; another process's edit is picked up
// within REFRESH_MS (served from the old copy while the new one loads).

export interface MaterialCatalog {
  list: MaterialProperties[];
  byId: Map<string, MaterialProperties>;
  /** GET /api/materials, serialised once per load */
  json: string;
  loadedAt: number;
}

const REFRESH_MS = 30_000;

let current: MaterialCatalog | null = null;
let loading: Promise<MaterialCatalog> | null = null;
let generation = 0;

async function load(): Promise<MaterialCatalog> {
  const started = generation;
  const rows = await Material.ordered({ active: true });
  const list = rows.map((r) => r.toProperties());
  const presented: MaterialJson[] = rows.map(presentMaterial);
  const catalog: MaterialCatalog = { list, byId: new Map(list.map((m) => [m.id, m])), json: JSON.stringify(presented), loadedAt: Date.now() };
  // an edit while this was loading makes it stale: keep it for this caller, not for the next
  if (started === generation) current = catalog;
  return catalog;
}

function reload(): Promise<MaterialCatalog> {
  if (loading) return loading;
  const p: Promise<MaterialCatalog> = load().finally(() => {
    if (loading === p) loading = null;
  });
  return (loading = p);
}

/** The active materials; loads them on first use. */
export function materialCatalog(): Promise<MaterialCatalog> | MaterialCatalog {
  if (!current) return reload();
  if (Date.now() - current.loadedAt > REFRESH_MS) void reload().catch(() => {});
  return current;
}

/** After an edit (call once the transaction has committed). */
export function invalidateMaterialCatalog(): void {
  generation++;
  current = null;
  loading = null; // a load already under way read the old rows
}

/** The last loaded list without waiting, or null before the first load. */
export function materialSnapshot(): MaterialProperties[] | null {
  return current?.list ?? null;
}
