import { describe, expect, it } from "vitest";
import { bendAllowance, bendDeduction, bendFigures, outsideSetback, suggestKFactor } from "../../shared/fabrication/bend";

describe("bend allowance, setback and deduction — Machinery's Handbook sheet-metal formulas [pub]", () => {
  it("90°, R = 1.5, T = 1.0, K = 0.44 worked by hand [derived]", () => {
    // BA = π/2·(1.5 + 0.44·1.0) = 1.5707963·1.94 = 3.0473449 mm
    // OSSB = tan 45°·(1.5 + 1.0) = 2.5 mm;  BD = 2·2.5 − 3.0473449 = 1.9526551 mm
    expect(bendAllowance(90, 1.5, 1.0, 0.44)).toBeCloseTo(3.0473449, 6);
    expect(outsideSetback(90, 1.5, 1.0)).toBeCloseTo(2.5, 12);
    expect(bendDeduction(90, 1.5, 1.0, 0.44)).toBeCloseTo(1.9526551, 6);
  });

  it("120° bend, R = 3, T = 2, K = 0.42 by hand [derived]", () => {
    // BA = (π/180)·120·(3 + 0.84) = 2.0943951·3.84 = 8.0424772; OSSB = tan 60°·5 = 8.6602540
    // BD = 17.3205081 − 8.0424772 = 9.2780309
    const f = bendFigures(120, 3, 2, 0.42);
    expect(f.bendAllowance_mm).toBeCloseTo(8.0424772, 6);
    expect(f.outsideSetback_mm).toBeCloseTo(8.660254, 6);
    expect(f.bendDeduction_mm).toBeCloseTo(9.2780309, 6);
  });

  it("flat length two ways agree: sum of outside flanges − BD = sum of tangent flats + BA [derived]", () => {
    // L-bracket, outside legs 30 and 20, 90°, R = 2, T = 1.5, K = 0.4
    const [R, T, K] = [2, 1.5, 0.4];
    const viaBD = 30 + 20 - bendDeduction(90, R, T, K);
    const viaBA = 30 - (R + T) + (20 - (R + T)) + bendAllowance(90, R, T, K);
    expect(viaBD).toBeCloseTo(viaBA, 12);
  });

  it("K = 0.5 gives the mid-surface arc [derived]", () => {
    expect(bendAllowance(180, 4, 2, 0.5)).toBeCloseTo(Math.PI * 5, 12);
  });

  it("typical K: 0.33 for R < T, rising toward 0.5 for large radii [practice]", () => {
    expect(suggestKFactor(0.5, 1)).toBe(0.33);
    expect(suggestKFactor(3, 1)).toBeCloseTo(0.42, 12);
    expect(suggestKFactor(50, 1)).toBe(0.5);
    let last = 0;
    for (let rt = 0; rt <= 12; rt += 0.25) {
      const k = suggestKFactor(rt, 1);
      expect(k).toBeGreaterThanOrEqual(last);
      last = k;
    }
  });

  it("rejects K outside 0–0.5", () => {
    expect(() => bendFigures(90, 1, 1, 0.6)).toThrow();
  });
});
