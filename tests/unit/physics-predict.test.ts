import { describe, expect, it } from "vitest";
import {
  logFrequencies,
  PredictionInputError,
  predictShield,
  sweepAttenuation,
  type PredictionInput,
} from "../../shared/physics/predict";
import { materialLibrary, findMaterial } from "../../shared/physics/materials";
import { muFromCurve, permeabilityFor } from "../../shared/physics/permeability";
import { cylindricalShieldingFactor, staticCylindricalShell } from "../../shared/physics/exact";
import { demagnetizingFactor } from "../../shared/physics/thin";
import { contractPredictionExample } from "../../shared/schemas/contract-examples";

// The contract's example body.
const example: PredictionInput = structuredClone(contractPredictionExample) as PredictionInput;

describe("material library", () => {
  it("has the contract's ids with SI values and sources", () => {
    expect(materialLibrary.map((m) => m.id)).toEqual(["ni80", "ni50", "steel-lc", "copper", "aluminium"]);
    expect(findMaterial("ni80")!.resistivity_ohm_m).toBeCloseTo(0.58e-6, 12);
    expect(findMaterial("copper")!.resistivity_ohm_m).toBeCloseTo(1.68e-8, 14);
    for (const m of materialLibrary) {
      expect(m.source.length).toBeGreaterThan(20);
      expect(m.muCurve[0].mu_r).toBeCloseTo(m.relativePermeability.initial, 6);
      expect(Math.max(...m.muCurve.map((p) => p.mu_r))).toBeCloseTo(m.relativePermeability.maximum, 6);
      for (let i = 1; i < m.muCurve.length; i++) expect(m.muCurve[i].B_T).toBeGreaterThan(m.muCurve[i - 1].B_T);
    }
    expect(findMaterial("ni80")!.source).toMatch(/ASTM A753/);
    expect(findMaterial("ni80")!.source).toMatch(/\[practice\]/);
  });
});

describe("permeability", () => {
  const ni80 = findMaterial("ni80")!;
  it("is flat at the initial (design) value through the low-field range, then follows the μ(B) table on log-log scales, collapsing above saturation", () => {
    // the low-field range ends at the table's first point (10 mT): any flux below it gets the initial value
    for (const B of [0, 1e-9, 1e-4, 5e-3, 0.01]) expect(muFromCurve(ni80.muCurve, B, ni80.saturation_T)).toBe(35_000);
    // halfway in log B between 0.01 T (35 000) and 0.05 T (60 000): geometric mean
    expect(muFromCurve(ni80.muCurve, Math.sqrt(0.01 * 0.05), ni80.saturation_T)).toBeCloseTo(Math.sqrt(35_000 * 60_000), 3);
    expect(muFromCurve(ni80.muCurve, 2, ni80.saturation_T)).toBeLessThan(10);
  });

  it("says where μ came from, never rewards more flux inside the low-field range, and scales for the as-formed state and a shop fit", () => {
    expect(permeabilityFor(ni80, "annealed", 1e-4)).toEqual({ mu_r: 35_000, muSource: "initial" });
    expect(permeabilityFor(ni80, "annealed", 9e-3)).toEqual({ mu_r: 35_000, muSource: "initial" });
    expect(permeabilityFor(ni80, "annealed", 0.05).mu_r).toBeCloseTo(60_000, 6);
    expect(permeabilityFor(ni80, "annealed", 0.05).muSource).toBe("material-curve");
    expect(permeabilityFor(ni80, "as-formed", 1e-4).mu_r).toBeCloseTo(3_500, 6);
    // a fitted effective μ of 25 000 replaces the design value and scales the table with it
    expect(permeabilityFor(ni80, "annealed", 1e-4, 25_000)).toEqual({ mu_r: 25_000, muSource: "shop" });
    expect(permeabilityFor(ni80, "annealed", 0.05, 25_000).mu_r).toBeCloseTo((60_000 * 25_000) / 35_000, 6);
  });

  it("a thinner wall (more wall flux, still low-field) gets the same μ, not a higher one", () => {
    const at = (t: number) => predictShield({ ...example, layers: [{ material: "ni80", thickness_mm: t }], field: { frequency_hz: 0, amplitude_uT: 50 } }).layers[0];
    const thick = at(2), thin = at(0.5);
    expect(thin.wallFluxMean_T).toBeGreaterThan(thick.wallFluxMean_T * 3);
    expect(thin.mu_r).toBe(thick.mu_r);
    expect(thin.muSource).toBe("initial");
    expect(thin.muReason).toMatch(/low-field range/);
  });
});

describe("predictShield", () => {
  it("answers the contract's fields: the as-built figure with its band, and the ideal beside it", () => {
    const r = predictShield(example, materialLibrary);
    expect(r.shieldingFactor).toBeGreaterThanOrEqual(1);
    expect(r.attenuation_db).toBeCloseTo(20 * Math.log10(r.shieldingFactor), 6);
    expect(r.ideal.attenuation_db).toBeCloseTo(20 * Math.log10(r.ideal.shieldingFactor), 6);
    expect(r.attenuation_db).toBeLessThanOrEqual(r.ideal.attenuation_db);
    expect(r.layers).toHaveLength(2);
    for (const l of r.layers) {
      expect(l).toHaveProperty("wallFluxDensity_T");
      expect(l).toHaveProperty("saturation_T");
      expect(l).toHaveProperty("saturationMargin");
      expect(l.muReason.length).toBeGreaterThan(5);
    }
    expect(r.method).toMatch(/exact multilayer cylinder/);
    expect(r.estimate).toBe(true);
    expect(r.band.low_db).toBeLessThanOrEqual(r.attenuation_db);
    expect(r.band.high_db).toBeGreaterThanOrEqual(r.attenuation_db);
    expect(r.band.high_db).toBeLessThanOrEqual(r.ideal.attenuation_db);
    expect(r.band.basis).toMatch(/spread/);
    expect(r.asBuilt).toMatchObject({ construction: "closed-can", method: "drawn", layers: 2 });
    expect(r.asBuilt.summary).toMatch(/dB/);
    expect(r.fieldDirection).toBe("across the can's axis");
    expect(JSON.parse(JSON.stringify(r))).toEqual(r); // JSON-safe: no Infinity, NaN or undefined
  });

  it("uses an explicit μr exactly as given, whatever the state or field", () => {
    for (const state of ["annealed", "as-formed"] as const)
      for (const amplitude_uT of [1, 100_000]) {
        const r = predictShield({ ...example, state, field: { ...example.field, amplitude_uT } });
        expect(r.layers[1].mu_r).toBe(20_000);
        expect(r.layers[1].muSource).toBe("explicit");
        expect(r.layers[1].muReason).toBe("as you gave it");
        expect(["initial", "material-curve"]).toContain(r.layers[0].muSource);
      }
  });

  it("its ideal equals the exact solution with the μ it reports (layers innermost first, gaps as clear space)", () => {
    const r = predictShield(example);
    const exact = cylindricalShieldingFactor(
      [
        { innerRadius_m: 0.025, thickness_m: 0.001, mu_r: r.layers[0].mu_r, resistivity_ohm_m: 0.58e-6 },
        { innerRadius_m: 0.036, thickness_m: 0.001, mu_r: 20_000, resistivity_ohm_m: 5.8e-7 },
      ],
      60,
      true,
    );
    expect(r.ideal.attenuation_db).toBeCloseTo(exact.attenuation_db, 9);
    expect(r.layers[1].innerRadius_mm).toBeCloseTo(36, 9);
    // and each wall's flux is the exact solution's, for the applied 100 µT
    expect(r.layers[0].wallFluxDensity_T).toBeCloseTo(exact.walls![0].peak * 100e-6, 12);
    expect(r.layers[1].wallFluxDensity_T).toBeCloseTo(exact.walls![1].peak * 100e-6, 12);
  });

  it("[derived] an inner layer sees the field left by the outer ones; at DC the walls carry about B0·D/t (the μ → ∞ estimate)", () => {
    const r = predictShield({ ...example, field: { ...example.field, frequency_hz: 0 } });
    // outer layer: B0·D/t with its outer diameter 74 mm, within a few per cent
    expect(r.layers[1].wallFluxDensity_T / ((100e-6 * 74) / 1)).toBeGreaterThan(0.97);
    expect(r.layers[1].wallFluxDensity_T / ((100e-6 * 74) / 1)).toBeLessThan(1.05);
    // inner layer: the field the outer one leaves, B0/S2, times D/t, raised by the outer shell's
    // image of the inner one, 1/(1 − (b2/a1)²): the gap factor of the two-shell formula
    const S2 = staticCylindricalShell(20_000, 36, 37);
    const image = 1 / (1 - (26 / 36) ** 2);
    expect(r.layers[0].wallFluxDensity_T / ((100e-6 / S2) * 52 * image)).toBeGreaterThan(0.95);
    expect(r.layers[0].wallFluxDensity_T / ((100e-6 / S2) * 52 * image)).toBeLessThan(1.05);
    expect(r.layers[1].saturationMargin).toBeCloseTo(0.75 / r.layers[1].wallFluxDensity_T, 9);
  });

  it("axial closed can at DC is 1 + 4N(S_T0 − 1) ideally, and its AC figure → DC as f → 0", () => {
    const input: PredictionInput = { ...example, layers: [{ mu_r: 20_000, resistivity_ohm_m: 5.8e-7, thickness_mm: 1 }], field: { frequency_hz: 0, amplitude_uT: 10, orientation: "axial" } };
    const dc = predictShield(input);
    const N = demagnetizingFactor(121 / 51);
    expect(dc.ideal.shieldingFactor).toBeCloseTo(1 + 4 * N * (staticCylindricalShell(20_000, 25, 26) - 1), 6);
    expect(dc.fieldDirection).toBe("along the can's axis");
    const ac = predictShield({ ...input, field: { ...input.field, frequency_hz: 1e-6 } });
    expect(ac.ideal.shieldingFactor).toBeCloseTo(dc.ideal.shieldingFactor, 4);
    expect(ac.attenuation_db).toBeCloseTo(dc.attenuation_db, 4);
  });

  it("reports skin depth in mm at AC and null at DC", () => {
    expect(predictShield(example).layers[1].skinDepth_mm).toBeCloseTo(0.35, 2);
    expect(predictShield({ ...example, field: { ...example.field, frequency_hz: 0 } }).layers[1].skinDepth_mm).toBeNull();
  });

  it("throws PredictionInputError naming layers.N.material for an unknown material", () => {
    const bad = { ...example, layers: [example.layers[0], { material: "unobtainium", thickness_mm: 1 }] };
    try {
      predictShield(bad);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(PredictionInputError);
      expect((e as PredictionInputError).field).toBe("layers.1.material");
    }
    // a lookup function works as well as an array
    expect(() => predictShield(example, () => undefined)).toThrow(PredictionInputError);
  });

  it("warns with codes and plain words", () => {
    const codes = (i: PredictionInput) => predictShield(i).warnings.map((w) => w.code);
    expect(codes({ ...example, shape: "box", method: "bent", dimensions_mm: { width: 60, depth: 50, height: 40 } })).toContain("BOX_ESTIMATE");
    expect(codes({ ...example, ends: "open" })).toContain("OPEN_END_ESTIMATE");
    expect(codes({ ...example, layers: [{ material: "ni80", thickness_mm: 4 }] })).toContain("THICK_WALL");
    expect(() => predictShield({ ...example, field: { ...example.field, frequency_hz: 200_000 } })).toThrow(/too large/);
    expect(codes({ ...example, dimensions_mm: { diameter: 50, length: 2000 }, field: { ...example.field, orientation: "axial" } })).toContain("OUTSIDE_MODEL");
    expect(codes({ ...example, layers: [{ material: "copper", thickness_mm: 1 }] })).toContain("NON_MAGNETIC_LOW_FREQUENCY");
    expect(codes({ ...example, holes: [{ diameter_mm: 10, collarLength_mm: 5 }] })).toContain("SHORT_COLLAR");
    expect(codes({ ...example, holes: [{ diameter_mm: 10, collarLength_mm: 500 }] })).not.toContain("SHORT_COLLAR");
    const strong: PredictionInput = {
      ...example,
      layers: [{ material: "ni50", thickness_mm: 1, gap_mm: 5 }, { material: "ni80", thickness_mm: 1 }],
      field: { ...example.field, amplitude_uT: 3000 },
    };
    expect(codes(strong)).toContain("LAYER_ORDER");
    const swapped = { ...strong, layers: [{ material: "ni80", thickness_mm: 1, gap_mm: 5 }, { material: "ni50", thickness_mm: 1 }] };
    expect(codes(swapped)).not.toContain("LAYER_ORDER");
    for (const w of predictShield(strong).warnings) expect(w.message.length).toBeGreaterThan(20);
  });

  it("sweeps attenuation over log-spaced frequencies", () => {
    const f = logFrequencies(1, 10_000, 200);
    expect(f).toHaveLength(200);
    expect(f[0]).toBeCloseTo(1, 12);
    expect(f[199]).toBeCloseTo(10_000, 8);
    expect(f[100] / f[99]).toBeCloseTo(f[1] / f[0], 9);
    const s = sweepAttenuation(example, materialLibrary, [0, 60, 600]);
    expect(s.map((p) => p.frequency_hz)).toEqual([0, 60, 600]);
    // the same two figures the prediction gives at that frequency
    expect(s[1].attenuation_db).toBeCloseTo(predictShield(example).attenuation_db, 9);
    expect(s[1].ideal_db).toBeCloseTo(predictShield(example).ideal.attenuation_db, 9);
    expect(s[2].attenuation_db).toBeGreaterThan(s[0].attenuation_db);
    for (const p of s) expect(p.attenuation_db).toBeLessThanOrEqual(p.ideal_db);
  });
});
