// A checked request and the shop's current data → the space to search: which alloys, which of
// their stocked gauges, which methods and gaps. What the shop cannot offer is named by field.

import { DEFAULT_DRAW_LIMITS } from "../fabrication/drawn-cup";
import { formingLimitsFor } from "../fabrication/pricing";
import type { MaterialProperties } from "../physics/materials";
import type { DesignAdviceRequest } from "../schemas/design-advice";
import type { DesignSearchSettings, PriceList } from "../schemas/pricing";
import { countDesigns, METHODS_FOR_SHAPE, type AdviceProblem, type LayerOption } from "./space";

export interface ShopOffer {
  /** the active material library */
  materials: readonly MaterialProperties[];
  priceList: PriceList;
  settings: DesignSearchSettings;
}

export type ProblemOrFields = { problem: AdviceProblem; designs: number } | { fields: Record<string, string> };

/** A material that shields at low frequency: it saturates, so it is magnetic (copper and aluminium are not). */
const magnetic = (m: MaterialProperties) => m.saturation_T !== null && m.relativePermeability.initial > 1;

const fmt = (x: number) => String(+x.toPrecision(4));

export function adviceProblemFor(request: DesignAdviceRequest, shop: ShopOffer): ProblemOrFields {
  const { priceList } = shop;
  const byId = new Map(shop.materials.map((m) => [m.id, m]));
  const priced = new Set(priceList.materials.map((m) => m.materialId));
  const stocked = (id: string) => [...new Set(priceList.stockSheets.filter((s) => s.materialId === id).map((s) => s.thickness_mm))].sort((a, b) => a - b);
  const fields: Record<string, string> = {};
  const c = request.constraints;

  let alloys: MaterialProperties[];
  if (c.materials) {
    alloys = [];
    c.materials.forEach((id, i) => {
      const m = byId.get(id);
      const field = `constraints.materials.${i}`;
      if (!m) fields[field] = `Unknown material "${id}".`;
      else if (!priced.has(id)) fields[field] = `The shop has no price for ${id}.`;
      else if (!stocked(id).length) fields[field] = `The shop stocks no sheet of ${id}.`;
      else alloys.push(m);
    });
  } else {
    alloys = shop.materials.filter((m) => magnetic(m) && priced.has(m.id) && stocked(m.id).length > 0);
    if (!alloys.length) fields["constraints.materials"] = "The shop prices and stocks no magnetic alloy; ask the planner to set up the shop rates.";
  }

  // the gauges asked for, else the ones the shop offers in the advisor; always of those it stocks
  const wanted = c.gauges_mm ?? shop.settings.gauges_mm;
  const options: LayerOption[] = [];
  for (const m of alloys) {
    const limits = formingLimitsFor(m.id, priceList);
    for (const thickness_mm of stocked(m.id)) {
      if (!wanted.some((g) => Math.abs(g - thickness_mm) < 1e-9)) continue;
      options.push({
        material: m.id,
        thickness_mm,
        density_kg_m3: m.density_kg_m3,
        // as the price estimate resolves them: the shop's limits for the alloy, else the engine's defaults
        limits: limits ? { firstDrawRatio: limits.firstDrawRatio, redrawRatio: limits.redrawRatio, processAnnealBetweenDraws: limits.processAnnealBetweenDraws } : DEFAULT_DRAW_LIMITS,
        pricePerKg_cents: priceList.materials.find((p) => p.materialId === m.id)!.pricePerKg_cents,
      });
    }
  }
  c.gauges_mm?.forEach((g, i) => {
    if (alloys.length && !options.some((o) => Math.abs(o.thickness_mm - g) < 1e-9))
      fields[`constraints.gauges_mm.${i}`] = `The shop stocks no ${fmt(g)} mm sheet of ${alloys.map((m) => m.id).join(", ")}.`;
  });
  if (!c.gauges_mm && alloys.length && !options.length)
    fields["constraints.gauges_mm"] = `The shop stocks none of the gauges the advisor offers (${shop.settings.gauges_mm.map(fmt).join(", ")} mm) in ${alloys.map((m) => m.id).join(", ")}; name gauges it stocks.`;
  if (Object.keys(fields).length) return { fields };

  const problem: AdviceProblem = {
    requiredAttenuation_db: request.requiredAttenuation_db,
    field: request.field,
    shape: request.shape,
    dimensions_mm: { ...request.dimensions_mm },
    quantity: request.quantity,
    maxLayers: c.maxLayers,
    methods: c.methods ?? METHODS_FOR_SHAPE[request.shape],
    options,
    gapSteps_mm: [...shop.settings.gapSteps_mm].sort((a, b) => a - b),
    ...(c.maxOutside_mm ? { maxOutside_mm: { ...c.maxOutside_mm } } : {}),
    ...(c.maxMass_kg !== undefined ? { maxMass_kg: c.maxMass_kg } : {}),
  };
  return { problem, designs: countDesigns(problem) };
}
