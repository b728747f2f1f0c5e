import { DEFAULT_DRAW_LIMITS, formingLimitsFor, type BlankMaterial } from "../../shared/fabrication";
import type { PriceList } from "../../shared/schemas/pricing";
import { findMaterial, materialLibrary, type MaterialProperties } from "../../shared/physics/materials";
import { ValidationError } from "../errors";
import { materialSnapshot } from "./materialCatalog";

export interface ResolvedMaterial extends Required<Pick<BlankMaterial, "density_kg_m3" | "formingLimits">> {
  id: string;
  name: string;
}

/**
 * A material id → density (from the material library) and forming limits (from the shop's
 * current price list, else the engine's defaults). Unknown ids are a 400 naming `field`.
 * The library is the materials table, through the in-process catalog (pass `materials` from
 * `await materialCatalog()`); the seed list stands in only before the catalog's first load.
 */
export function materialResolver(props: { id: string; field: string; priceList?: PriceList | null; materials?: MaterialProperties[] }): ResolvedMaterial {
  const m = findMaterial(props.id, props.materials ?? materialSnapshot() ?? materialLibrary);
  if (!m) throw ValidationError({ [props.field]: `There is no material "${props.id}" in the library; choose one from the list.` });
  const limits = props.priceList ? formingLimitsFor(m.id, props.priceList) : undefined;
  return {
    id: m.id,
    name: m.name,
    density_kg_m3: m.density_kg_m3,
    formingLimits: limits
      ? { firstDrawRatio: limits.firstDrawRatio, redrawRatio: limits.redrawRatio, processAnnealBetweenDraws: limits.processAnnealBetweenDraws }
      : DEFAULT_DRAW_LIMITS,
  };
}
