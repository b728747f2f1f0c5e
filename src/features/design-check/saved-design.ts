// A design on the design check ↔ a saved design's (and a quote's) configuration, as pure
// functions: the checked prediction request plus what it takes to make (the same blank fields the
// price estimate sends) and the attenuation the customer needs. The server checks the result with
// the same quote schema; the inverse opens a saved design on the page.

import type { PredictionRequest } from "../../../shared/schemas/prediction";
import { closestLibraryMaterial, type QuoteConfiguration, type QuoteConfigurationInput } from "../../../shared/schemas/quote";
import { draftFromConfiguration } from "./draft-from-configuration";
import { newHole, type DesignDraft } from "./design-model";
import { methodOf, toPriceEstimateBody } from "./make-model";

export type ConfigurationResult = { ok: true; configuration: QuoteConfigurationInput } | { ok: false; message: string };

/**
 * The configuration a design is saved and quoted as. A layer given by its own μr keeps it for the
 * prediction and is made in the closest library alloy (the server names it in `pricedAs`).
 */
export function configurationFromRequest(request: PredictionRequest, requiredAttenuation_db: number): ConfigurationResult {
  const method = methodOf(request);
  // the blank fields come from the price estimate's body, with every layer in a library alloy
  const making = { ...request, layers: request.layers.map((l) => ({ ...l, material: l.material ?? closestLibraryMaterial(l) })) };
  const priced = toPriceEstimateBody(making, method, 1);
  if (!priced.ok) return { ok: false, message: priced.reason === "not-made" ? "A sphere is not made here, so it cannot be saved for a quote. Check a can or a box of similar size." : priced.message };
  const { layers: _fabricationLayers, holes: _fabricationHoles, ...fabrication } = priced.body.configuration as Record<string, unknown>;
  const configuration = {
    ...fabrication,
    ...request,
    method: method!,
    layers: request.layers,
    requiredAttenuation_db,
  } as unknown as QuoteConfigurationInput;
  return { ok: true, configuration };
}

/** A saved configuration back into the design check's form (holes included). */
export function draftFromSaved(c: QuoteConfiguration): DesignDraft {
  const draft = draftFromConfiguration(c as never);
  const last = c.layers.length - 1;
  const layers = c.layers.map((l, i) =>
    l.material !== undefined
      ? draft.layers[i]
      : {
          ...draft.layers[i],
          kind: "custom" as const,
          mu_r: l.mu_r ?? null,
          resistivity_uohm_m: l.resistivity_ohm_m === undefined ? null : +(l.resistivity_ohm_m * 1e6).toPrecision(12),
          saturation_T: l.saturation_T ?? null,
          thickness_mm: l.thickness_mm,
          ...(i < last && l.gap_mm !== undefined ? { gap_mm: l.gap_mm } : {}),
        },
  );
  const holes = (c.holes ?? []).map((h) => newHole({ diameter_mm: h.diameter_mm, collar_mm: h.collarLength_mm ?? 0 }));
  return { ...draft, layers, holes };
}
