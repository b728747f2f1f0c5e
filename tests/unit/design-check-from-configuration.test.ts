// A candidate of the design advisor opened in the design check: the form shows exactly that
// design, so what the page predicts and prices is what the advisor listed.
import { describe, expect, it } from "vitest";
import { adviceProblemFor, adviseDesigns, configurationOf } from "../../shared/advisor";
import { defaultPriceList } from "../../shared/fabrication";
import { DEFAULT_BUILD_MODEL, materialLibrary } from "../../shared/physics";
import { designAdviceRequestSchema, type DesignAdviceRequestInput } from "../../shared/schemas/design-advice";
import { predictionRequestSchema } from "../../shared/schemas/prediction";
import { DEFAULT_DESIGN_SEARCH_SETTINGS } from "../../shared/schemas/pricing";
import { checkDraft } from "../../src/features/design-check/design-model";
import { draftFromConfiguration } from "../../src/features/design-check/draft-from-configuration";
import { methodOf, toPriceEstimateBody } from "../../src/features/design-check/make-model";

const byId = new Map(materialLibrary.map((m) => [m.id, m]));

function configurations(body: DesignAdviceRequestInput) {
  const r = adviceProblemFor(designAdviceRequestSchema.parse(body), { materials: materialLibrary, priceList: defaultPriceList, settings: DEFAULT_DESIGN_SEARCH_SETTINGS });
  if ("fields" in r) throw new Error(JSON.stringify(r.fields));
  const answer = adviseDesigns(r.problem, { materials: (id) => byId.get(id), buildModel: DEFAULT_BUILD_MODEL, priceList: defaultPriceList, minSaturationMargin: 3 });
  return answer.candidates.map((c) => configurationOf(r.problem, c.design));
}

describe("an advisor's candidate → the design check's form", () => {
  const cases: Array<[string, DesignAdviceRequestInput]> = [
    ["cans, drawn and rolled, across the axis", { requiredAttenuation_db: 60, field: { frequency_hz: 60, amplitude_uT: 100 }, shape: "cylinder", dimensions_mm: { diameter: 50, length: 120 }, constraints: { maxLayers: 2, materials: ["ni80", "ni50"], gauges_mm: [0.5, 1] }, quantity: 10 }],
    ["cans along the axis, odd sizes", { requiredAttenuation_db: 30, field: { frequency_hz: 400, amplitude_uT: 37.5, orientation: "axial" }, shape: "cylinder", dimensions_mm: { diameter: 33.3, length: 71.7 }, constraints: { maxLayers: 2, materials: ["ni80"], gauges_mm: [0.35, 0.75] }, quantity: 3 }],
    ["boxes", { requiredAttenuation_db: 45, field: { frequency_hz: 50, amplitude_uT: 80 }, shape: "box", dimensions_mm: { width: 80, depth: 60, height: 40 }, constraints: { maxLayers: 2, materials: ["ni80", "steel-lc"], gauges_mm: [1] }, quantity: 10 }],
  ];
  for (const [what, body] of cases) {
    it(`${what}: the form sends the candidate's own prediction body and price configuration`, () => {
      const all = configurations(body);
      expect(all.length).toBeGreaterThan(0);
      for (const c of all) {
        const checked = checkDraft(draftFromConfiguration(c));
        if (!checked.request) throw new Error(JSON.stringify(checked.errors));
        expect(checked.request).toEqual(predictionRequestSchema.parse(c));
        const price = toPriceEstimateBody(checked.request, methodOf(checked.request), 10);
        if (!price.ok) throw new Error(price.message);
        // every fabrication field the candidate was priced with, the same
        const { configuration } = price.body;
        expect(configuration).toMatchObject({ shape: c.shape, method: c.method, dimensions_mm: c.dimensions_mm, layers: c.layers });
        if (c.shape === "box") expect(configuration).toMatchObject({ lid: c.lid });
        else if (c.method === "drawn") expect(configuration).toMatchObject({ cornerRadius_mm: c.cornerRadius_mm, trim_mm: c.trim_mm });
        else expect(configuration).toMatchObject({ seamOverlap_mm: c.seamOverlap_mm });
      }
    });
  }
});
