import { describe, expect, it } from "vitest";
import { calibrate, fitClass, libraryMuOf } from "../../shared/calibration";
import { exactResponse } from "../../shared/calibration/response-grid";
import { syntheticLots } from "../../shared/calibration/synthetic";
import { buildModelFrom, DEFAULT_CONSTRUCTION_SETTINGS } from "../../shared/physics/build-model";
import { materialLibrary } from "../../shared/physics/materials";
import { predictShield, responseDb } from "../../shared/physics/predict";
import { CAN_DESIGNS, NI80_DRAWN } from "../support/calibration-lots";

const model = buildModelFrom(DEFAULT_CONSTRUCTION_SETTINGS);
const shop = { materials: materialLibrary, model };
const libraryMu = libraryMuOf(materialLibrary, "ni80")!;

describe("the fit's response is the engine's figure", () => {
  it("responseDb(ceilingResponse) equals predictShield with the class's μ and ceiling set, for one and two layers, DC to 1 kHz", () => {
    for (const design of CAN_DESIGNS)
      for (const frequency_hz of [0, 60, 1000])
        for (const [mu, ceiling] of [[10_000, 55], [40_000, 80]]) {
          const input = { ...design, field: { frequency_hz, amplitude_uT: 50, orientation: "transverse" as const }, state: "annealed" as const };
          const direct = predictShield(input, materialLibrary, { ...model, fits: [{ ...NI80_DRAWN, mu_effective: mu, ceiling_db: ceiling }] }).attenuation_db;
          expect(responseDb(exactResponse(input, materialLibrary, model, NI80_DRAWN, mu), ceiling)).toBeCloseTo(direct, 6);
        }
  });
});

describe("when a fit is used", () => {
  const make = (lots: number, mu = 0.6 * libraryMu, ceiling = 60, designs = CAN_DESIGNS) =>
    syntheticLots({ key: NI80_DRAWN, mu_effective: mu, ceiling_db: ceiling, designs, frequencies_hz: [10, 60, 400], lots, partsPerLot: 4, partNoise_db: 0.5, lotNoise_db: 1, requiredAttenuation_db: 30, seed: 5 });

  it("a class with fewer lots than the shop setting keeps the library values, and says why", () => {
    const fit = fitClass(NI80_DRAWN, make(4), { ...shop, minLots: 5 })!;
    expect(fit.inUse).toBe(false);
    expect(fit.verdict).toMatch(/4 lots of the 5/);
    expect(fitClass(NI80_DRAWN, make(4), { ...shop, minLots: 3 })!.inUse).toBe(true);
  });

  it("lots made with the library's own values: the fit cannot beat the library in cross-validation and is not used", () => {
    const fit = fitClass(NI80_DRAWN, make(20, libraryMu, DEFAULT_CONSTRUCTION_SETTINGS.ceilings["closed-can"].firstLayer_db), shop)!;
    expect(fit.error_db.crossValidated).toBeGreaterThanOrEqual(fit.error_db.library);
    expect(fit.inUse).toBe(false);
    expect(fit.verdict).toMatch(/Not better than the library/);
  });

  it("lots of one design at one frequency cannot tell μ from the ceiling: μ only", () => {
    const lots = syntheticLots({ key: NI80_DRAWN, mu_effective: 0.6 * libraryMu, ceiling_db: 60, designs: [CAN_DESIGNS[0]], frequencies_hz: [60], lots: 12, partsPerLot: 3, partNoise_db: 0.5, lotNoise_db: 1, requiredAttenuation_db: 30, seed: 9 });
    const fit = fitClass(NI80_DRAWN, lots, shop)!;
    expect(fit.mode).toBe("mu-only");
    expect(fit.ceiling_db).toBe(DEFAULT_CONSTRUCTION_SETTINGS.ceilings["closed-can"].firstLayer_db);
    expect(fit.uncertainty.ceiling_db).toBeNull();
    expect(fit.identifiability).toMatch(/cannot be told apart/);
  });

  it("calibrate sorts parts into classes; a single lot waits, an explicit-μ outer layer is named as unclassified", () => {
    const lots = make(6);
    const box = { ...lots[0], lotId: "box-1", number: "B-1", parts: lots[0].parts.map((p) => ({ ...p, lotId: "box-1", design: { shape: "box" as const, method: "bent" as const, dimensions_mm: { width: 60, depth: 50, height: 40 }, layers: [{ material: "ni50", thickness_mm: 1 }] } })) };
    const own = { ...lots[1], lotId: "own-1", number: "O-1", parts: lots[1].parts.map((p) => ({ ...p, lotId: "own-1", design: { ...p.design, layers: [{ mu_r: 20000, resistivity_ohm_m: 6e-7, thickness_mm: 1 }] } })) };
    const c = calibrate([...lots, box, own], shop);
    expect(c.fits.map((f) => `${f.material}|${f.method}|${f.construction}`)).toEqual(["ni80|drawn|closed-can"]);
    expect(c.waiting).toEqual([{ material: "ni50", method: "bent", construction: "box", lots: 1 }]);
    expect(c.unclassified).toHaveLength(1);
    expect(c.unclassified[0].lotNumber).toBe("O-1");
  });
});
