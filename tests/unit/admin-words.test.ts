import { describe, expect, it } from "vitest";
import { describeMaterialChange, grouped } from "../../src/features/materials-admin/change-words";
import { muCurveSummary } from "../../src/features/materials-admin/mu-curve-plot";
import { describeChanges } from "../../src/lib/announce";

describe("the materials change log in words", () => {
  it("reads 'Density: 8 750 → 8 740 kg/m³'", () => {
    expect(describeMaterialChange({ path: "density_kg_m3", before: 8750, after: 8740 })).toBe("Density: 8 750 → 8 740 kg/m³");
    expect(describeMaterialChange({ path: "relativePermeability.initial", before: 60000, after: 55000 })).toBe("Initial μr: 60 000 → 55 000");
    expect(describeMaterialChange({ path: "resistivity_ohm_m", before: 5.8e-7, after: 5.5e-7 })).toBe("Resistivity: 0.58 → 0.55 µΩ·m");
    expect(describeMaterialChange({ path: "saturation_T", before: 0.75, after: null })).toBe("Saturation: 0.75 T → none (non-magnetic)");
    expect(describeMaterialChange({ path: "active", before: true, after: false })).toBe("In use: yes → no");
  });
  it("words the μ(B) curve and the sources", () => {
    expect(describeMaterialChange({ path: "muCurve.2.mu_r", before: 120000, after: 110000 })).toBe("μ(B) point 3: μr 120 000 → 110 000");
    expect(describeMaterialChange({ path: "muCurve.5", before: null, after: { B_T: 0.5, mu_r: 20000 } })).toBe("μ(B) point 6 added: 0.5 T, μr 20 000");
    expect(describeMaterialChange({ path: "sourceTags.density_kg_m3", before: "[pub] ASTM A753", after: "[practice] mill data" })).toBe("Source of density: “[pub] ASTM A753” → “[practice] mill data”");
  });
  it("groups digits as tables print them", () => {
    expect(grouped(8750)).toBe("8 750");
    expect(grouped(250000)).toBe("250 000");
    expect(grouped(0.58)).toBe("0.58");
    expect(grouped(-1234.5)).toBe("\u22121 234.5");
  });
  it("says a μ(B) curve in words for the plot's name", () => {
    expect(muCurveSummary([{ B_T: 0.001, mu_r: 60000 }, { B_T: 0.3, mu_r: 250000 }, { B_T: 0.75, mu_r: 1000 }])).toBe("μr 60 000 at 1 mT, rising to 250 000 at 300 mT, falling to 1 000 at 750 mT");
  });
});

describe("results announce only what changed", () => {
  it("says each changed figure with its old value, and nothing for the first figures or for no change", () => {
    const a = { "attenuation as built": "63.3 dB at 60 Hz", "likely range": "55 to 69 dB", saturation: "no wall saturates" };
    expect(describeChanges(null, a)).toBe("");
    expect(describeChanges(a, { ...a })).toBe("");
    expect(describeChanges(a, { ...a, "attenuation as built": "70.1 dB at 60 Hz" })).toBe("Attenuation as built now 70.1 dB at 60 Hz (was 63.3 dB at 60 Hz).");
  });
});
