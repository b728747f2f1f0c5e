// The calibration's computations against outside sources. Tags as in domain.md: [pub] published
// source named, [derived] derived and checked numerically, [memory] recalled, not re-checked
// against a printed copy.
import { describe, expect, it } from "vitest";
import {
  chartLotsOf, cpkLower, D2_N2, D3_N2, D4_N2, fitClass, individualsChart, individualsLimits, libraryMuOf, normalQuantile, runRuleHits, type ChartLot,
} from "../../shared/calibration";
import { syntheticLots } from "../../shared/calibration/synthetic";
import { buildModelFrom, DEFAULT_CONSTRUCTION_SETTINGS } from "../../shared/physics/build-model";
import { materialLibrary } from "../../shared/physics/materials";
import { CAN_DESIGNS, NI80_DRAWN } from "../support/calibration-lots";

const shop = { materials: materialLibrary, model: buildModelFrom(DEFAULT_CONSTRUCTION_SETTINGS) };
const libraryMu = libraryMuOf(materialLibrary, "ni80")!;

describe("the fit recovers known parameters from synthetic lots [derived: lots made by the engine from known μ and ceiling, plus normal noise]", () => {
  const partNoise = 0.5, lotNoise = 1;
  const lots = syntheticLots({
    key: NI80_DRAWN, mu_effective: 0.6 * libraryMu, ceiling_db: 60, designs: CAN_DESIGNS, frequencies_hz: [10, 60, 400],
    lots: 40, partsPerLot: 5, partNoise_db: partNoise, lotNoise_db: lotNoise, requiredAttenuation_db: 30, seed: 7,
  });
  const fit = fitClass(NI80_DRAWN, lots, shop)!;

  it("fits both parameters within 3 standard uncertainties and 5 % / 1.5 dB", () => {
    expect(fit.mode).toBe("mu-and-ceiling");
    expect(fit.converged).toBe(true);
    expect(Math.abs(fit.mu_effective - 0.6 * libraryMu)).toBeLessThan(Math.max(3 * fit.uncertainty.mu_effective!, 0));
    expect(Math.abs(fit.mu_effective / (0.6 * libraryMu) - 1)).toBeLessThan(0.05);
    expect(Math.abs(fit.ceiling_db - 60)).toBeLessThan(Math.min(1.5, 4 * fit.uncertainty.ceiling_db!));
  });

  it("the cross-validated error matches the noise: the median |error| of a normal spread is 0.6745 σ [pub: standard normal table, Φ⁻¹(0.75) = 0.6745]", () => {
    const sigma = Math.hypot(partNoise, lotNoise);
    expect(fit.error_db.crossValidated).toBeGreaterThan(0.6745 * sigma * 0.75);
    expect(fit.error_db.crossValidated).toBeLessThan(0.6745 * sigma * 1.3);
    // the library's μ and ceiling are far from the truth: the fit beats them and is used
    expect(fit.error_db.library).toBeGreaterThan(3 * fit.error_db.crossValidated);
    expect(fit.inUse).toBe(true);
    // the 90 % band from the cross-validated errors: about ±1.645 σ [pub: standard normal table]
    expect(fit.band_db.below + fit.band_db.above).toBeGreaterThan(2 * 1.645 * sigma * 0.7);
    expect(fit.band_db.below + fit.band_db.above).toBeLessThan(2 * 1.645 * sigma * 1.4);
  });

  it("a class of 1 000 lots is fitted (the bench times it; here only that it completes and agrees)", () => {
    const many = syntheticLots({
      key: NI80_DRAWN, mu_effective: 1.4 * libraryMu, ceiling_db: 66, designs: CAN_DESIGNS, frequencies_hz: [10, 60, 400],
      lots: 1000, partsPerLot: 3, partNoise_db: 0.5, lotNoise_db: 1, requiredAttenuation_db: 30, seed: 11,
    });
    const big = fitClass(NI80_DRAWN, many, shop)!;
    expect(Math.abs(big.mu_effective / (1.4 * libraryMu) - 1)).toBeLessThan(0.03);
    expect(Math.abs(big.ceiling_db - 66)).toBeLessThan(0.5);
  });

  it("a re-annealed lot and a knocked part are left out and named; the fit stays on the truth [pub: Iglewicz & Hoaglin, modified z-score > 3.5]", () => {
    const shifted = syntheticLots({
      key: NI80_DRAWN, mu_effective: 0.6 * libraryMu, ceiling_db: 60, designs: CAN_DESIGNS, frequencies_hz: [10, 60, 400],
      lots: 30, partsPerLot: 5, partNoise_db: 0.5, lotNoise_db: 1, requiredAttenuation_db: 30, seed: 3, lotShifts: { 12: -15 },
    });
    shifted[20].parts[2] = { ...shifted[20].parts[2], measured_db: shifted[20].parts[2].measured_db - 12 };
    const robust = fitClass(NI80_DRAWN, shifted, shop)!;
    expect(robust.leftOut.find((o) => o.kind === "lot")?.lotNumber).toBe(shifted[12].number);
    // the knocked part is named; normal noise may flag a chance part or two beside it, no more
    const parts = robust.leftOut.filter((o) => o.kind === "part");
    expect(parts.map((o) => o.serial)).toContain(shifted[20].parts[2].serial);
    expect(parts.length).toBeLessThanOrEqual(3);
    expect(robust.lots).toBe(29);
    expect(Math.abs(robust.mu_effective / (0.6 * libraryMu) - 1)).toBeLessThan(0.06);
    expect(Math.abs(robust.ceiling_db - 60)).toBeLessThan(1.5);
  });
});

describe("control-chart constants for moving ranges of two [pub: Montgomery, Introduction to Statistical Quality Control, appendix table of factors for variables control charts, n = 2]", () => {
  it("d2 = 1.128, D3 = 0, D4 = 3.267", () => {
    expect(D2_N2).toBe(1.128);
    expect(D3_N2).toBe(0);
    expect(D4_N2).toBe(3.267);
  });
  it("they round the exact values d2 = 2/√π and D4 = 1 + 3·d3/d2 with d3 = √(2 − 4/π)·… for n = 2 [derived: range of two normal values, E|X1 − X2| = 2σ/√π, sd = σ√(2 − 4/π)]", () => {
    const d2 = 2 / Math.sqrt(Math.PI);
    const d3 = Math.sqrt(2 - 4 / Math.PI);
    expect(D2_N2).toBeCloseTo(d2, 3);
    expect(D4_N2).toBeCloseTo(1 + (3 * d3) / d2, 2);
    // Montgomery's E2 = 3/d2 = 2.66 for individuals limits x̄ ± 2.66·MR̄ [pub: same table]
    const lim = individualsLimits(10, 1);
    expect(lim.individuals.ucl_db - 10).toBeCloseTo(2.66, 2);
    expect(lim.movingRange.ucl_db).toBe(3.267);
  });
});

describe("process capability", () => {
  it("Cpk against a lower specification only: bursting strength x̄ = 264, s = 32, LSL = 200 gives Cpl = 0.67 [memory: Montgomery, ibid., chapter on process capability, glass-bottle example]", () => {
    expect(cpkLower({ mean: 264, sigma: 32, lsl: 200, n: 100 }).cpk).toBeCloseTo(0.667, 3);
  });
  it("Bissell's 95 % interval: Cpk = 1.33 from n = 20 gives about 0.88 to 1.78 [memory: Montgomery, ibid., worked example of the approximate interval; pub: Bissell, Applied Statistics 39:331, 1990]", () => {
    // a margin with mean 1.33·3·σ over σ = 1
    const c = cpkLower({ mean: 3.99, sigma: 1, lsl: 0, n: 20 });
    expect(c.cpk).toBeCloseTo(1.33, 2);
    expect(c.low).toBeCloseTo(0.88, 1);
    expect(c.high).toBeCloseTo(1.78, 1);
  });
  it("the normal quantiles the interval and the band use [pub: standard normal table: z0.975 = 1.960, z0.95 = 1.645]", () => {
    expect(normalQuantile(0.975)).toBeCloseTo(1.959964, 5);
    expect(normalQuantile(0.95)).toBeCloseTo(1.644854, 5);
    expect(normalQuantile(0.001)).toBeCloseTo(-3.090232, 5);
  });
});

describe("run rules [pub: Nelson, J. Quality Technology 16(4):237, 1984; Western Electric Statistical Quality Control Handbook, 1956]", () => {
  const series = (xs: number[]) => runRuleHits(xs, 0, 1).map((h) => `${h.rule}@${h.at}`);
  it("a point beyond 3σ (test 1) and nine on one side (test 2), each where it completes", () => {
    expect(series([0.1, -0.2, 3.5, 0])).toEqual(["nelson-1@2"]);
    const nine = [-0.5, 0.5, 0.6, 0.2, 0.3, 0.4, 0.1, 0.2, 0.3, 0.6, 0.2];
    expect(series(nine).filter((s) => s.startsWith("nelson-2"))).toEqual(["nelson-2@9"]);
  });
  it("six rising (test 3), two of three beyond 2σ (test 5), four of five beyond 1σ (test 6)", () => {
    expect(series([0, -0.9, -0.6, -0.3, 0, 0.3, 0.6])).toContain("nelson-3@6");
    expect(series([0, 2.5, 0.1, 2.2])).toContain("nelson-5@3");
    expect(series([1.5, 1.2, 0.1, 1.1, 1.3])).toContain("nelson-6@4");
    expect(series([0, 0.1, -0.1, 0.2])).toEqual([]);
  });
  it("the chart of lots flags the lot that fell and says its limits are trial limits below 20 lots", () => {
    const lots: ChartLot[] = [5, 5.5, 4.8, 5.2, 5.1, 4.9, 5.3, 5, 5.2, 4.7, -2].map((m, i) => ({ lotId: `l${i}`, number: `L${i}`, decidedAt: `2026-01-${String(i + 1).padStart(2, "0")}`, margin_db: m }));
    const chart = individualsChart(lots);
    expect(chart.trial).toBe(true);
    expect(chart.capability).toBeNull();
    expect(chart.points[10].signals).toContain("nelson-1");
    expect(chart.points[10].signals).toContain("moving-range");
    expect(chart.signals.some((s) => s.rule === "nelson-1" && s.lotIds[0] === "l10")).toBe(true);
  });
  it("each lot's margin is its parts' mean attenuation minus the required, in the order decided", () => {
    const lots = chartLotsOf([
      { lotId: "b", number: "B", disposition: "accepted", decidedAt: "2026-02-02", requiredAttenuation_db: 40, parts: [{ measured_db: 45 }, { measured_db: 47 }] as never },
      { lotId: "a", number: "A", disposition: "rejected", decidedAt: "2026-02-01", requiredAttenuation_db: 50, parts: [{ measured_db: 49 }] as never },
    ]);
    expect(lots.map((l) => [l.lotId, l.margin_db])).toEqual([["a", -1], ["b", 6]]);
  });
});
