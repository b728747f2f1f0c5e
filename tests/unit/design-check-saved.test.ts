import { describe, expect, it } from "vitest";
import { quoteConfigurationSchema } from "../../shared/schemas/quote";
import { checkDraft, defaultDesign, newHole, newLayer } from "../../src/features/design-check/design-model";
import { designToParams } from "../../src/features/design-check/design-url";
import { configurationFromRequest, draftFromSaved } from "../../src/features/design-check/saved-design";

const request = (draft = defaultDesign()) => {
  const checked = checkDraft(draft);
  if (!checked.request) throw new Error(JSON.stringify(checked.errors));
  return checked.request;
};

describe("a design on the page as a saved design's configuration, and back", () => {
  const designs = {
    "the default drawn can": defaultDesign(),
    "a rolled can with two layers and a collared hole": { ...defaultDesign(), method: "rolled" as const, layers: [newLayer({ gap_mm: 8 }), newLayer({ material: "ni50", thickness_mm: 1.5 })], holes: [newHole({ diameter_mm: 12, collar_mm: 24 })] },
    "a bent box": { ...defaultDesign(), shape: "box" as const },
    "a layer given by its own μr": { ...defaultDesign(), layers: [newLayer({ gap_mm: 5 }), newLayer({ kind: "custom", mu_r: 20000, resistivity_uohm_m: 0.58, saturation_T: 0.75 })] },
  };
  for (const [name, draft] of Object.entries(designs)) {
    it(`${name}: the server's quote schema accepts it, and opening it gives the same design`, () => {
      const made = configurationFromRequest(request(draft), 45);
      expect(made.ok).toBe(true);
      if (!made.ok) return;
      const parsed = quoteConfigurationSchema.safeParse(made.configuration);
      expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
      expect(parsed.data!.requiredAttenuation_db).toBe(45);
      const back = draftFromSaved(parsed.data!);
      expect(designToParams(back).toString()).toBe(designToParams(draft).toString());
    });
  }

  it("a sphere is not made here: no configuration, a sentence saying why", () => {
    const made = configurationFromRequest(request({ ...defaultDesign(), shape: "sphere" }), 40);
    expect(made).toMatchObject({ ok: false, message: expect.stringMatching(/sphere/) });
  });
});
