import { describe, expect, it } from "vitest";
import { annealDeviations, defaultAnnealWindows } from "../../shared/shop-floor/anneal";

// domain.md section 5 [practice]: final anneal of 80 % Ni-Fe-Mo about 1100–1180 °C for 2–4 h in dry
// hydrogen (dew point −40 °C or drier), then a controlled rate of the order of 100–300 °C/h
// through 600–300 °C. The seeded window must say exactly that, and the check must use its edges.
const ni80 = defaultAnnealWindows.find((w) => w.materialId === "ni80")!;
const inside = { peakTemperature_c: 1150, soak_min: 180, dewPoint_c: -55, dewPointOut_c: -45, coolingRate_c_per_h: 200 };

describe("the 80 % Ni-Fe-Mo anneal window [practice]", () => {
  it("is seeded from the trade's figures", () => {
    expect(ni80).toMatchObject({ peak_c: { min: 1100, max: 1180 }, soak_min: { min: 120, max: 240 }, dewPointMax_c: -40, coolingRate_c_per_h: { min: 100, max: 300 } });
    expect(ni80.source).toMatch(/\[practice\]/);
  });
  it("a run at the window's edges is inside; a degree, a minute or a degree of dew point past them is not", () => {
    expect(annealDeviations({ peakTemperature_c: 1100, soak_min: 120, dewPoint_c: -40, dewPointOut_c: -40, coolingRate_c_per_h: 300 }, ni80)).toEqual([]);
    expect(annealDeviations({ ...inside, peakTemperature_c: 1181 }, ni80).map((d) => d.field)).toEqual(["peakTemperature_c"]);
    expect(annealDeviations({ ...inside, soak_min: 119 }, ni80).map((d) => d.message)).toEqual(["Time at temperature 119 min is below the window's 120 min"]);
    expect(annealDeviations({ ...inside, dewPointOut_c: -39 }, ni80).map((d) => d.field)).toEqual(["dewPointOut_c"]);
    expect(annealDeviations({ ...inside, coolingRate_c_per_h: 350, peakTemperature_c: 1090 }, ni80).map((d) => d.field)).toEqual(["peakTemperature_c", "coolingRate_c_per_h"]);
  });
  it("50 % Ni-Fe: similar, less sensitive to cooling rate (its wider cooling range is [memory])", () => {
    const ni50 = defaultAnnealWindows.find((w) => w.materialId === "ni50")!;
    expect(ni50.coolingRate_c_per_h.max - ni50.coolingRate_c_per_h.min).toBeGreaterThan(ni80.coolingRate_c_per_h.max - ni80.coolingRate_c_per_h.min);
    expect(ni50.source).toMatch(/\[memory\]/);
    expect(annealDeviations({ ...inside, coolingRate_c_per_h: 450 }, ni50)).toEqual([]);
  });
});
