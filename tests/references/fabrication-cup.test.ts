import { describe, expect, it } from "vitest";
import fc from "fast-check";
import integrate from "integrate-adaptive-simpson";
import { cupBlankDiameter, cupMidSurfaceArea, drawnCup } from "../../shared/fabrication/drawn-cup";

/**
 * Independent area of the cup's mid-surface as a surface of revolution: A = 2π ∫ ρ(s) ds along
 * the meridian (s = arc length), integrated numerically piece by piece:
 * flat bottom ρ = s, quarter-torus ρ = (d/2 − r) + r·sin(s/r), wall ρ = d/2.
 */
function numericalArea(d: number, h: number, r: number): number {
  const rc = d / 2 - r;
  const tol = 1e-10 * d * d; // absolute tolerance scaled to the part
  const bottom = rc > 0 ? integrate((s) => 2 * Math.PI * s, 0, rc, tol) : 0;
  const torus = r > 0 ? integrate((s) => 2 * Math.PI * (rc + r * Math.sin(s / r)), 0, (Math.PI * r) / 2, tol) : 0;
  const wall = integrate(() => 2 * Math.PI * (d / 2), 0, h - r, tol);
  return bottom + torus + wall;
}

describe("drawn cup blank", () => {
  it("sharp corner matches the die-design handbook D = √(d² + 4dh) [pub]", () => {
    // d = 50, h = 40: D = √(2500 + 8000) = √10500 = 102.4695 mm
    expect(cupBlankDiameter(50, 40, 0)).toBeCloseTo(Math.sqrt(10500), 10);
    expect(cupBlankDiameter(50, 40)).toBeCloseTo(102.469508, 5);
  });

  it("approximate coefficients 1.717 and 0.566 of the corner-radius form [derived]", () => {
    expect(8 - 2 * Math.PI).toBeCloseTo(1.717, 3);
    expect(4 * Math.PI - 12).toBeCloseTo(0.566, 3);
  });

  it("corner-radius form equals a numerical integration of the mid-surface area within 1e-6 [derived]", () => {
    for (const [d, h, r] of [
      [51, 60.5, 3.5],
      [20, 5, 2],
      [100, 30, 25],
      [40, 20, 20], // r = d/2: hemispherical bottom
    ] as const) {
      const D = cupBlankDiameter(d, h, r);
      const numeric = numericalArea(d, h, r);
      expect(Math.abs((Math.PI * D * D) / 4 - numeric) / numeric).toBeLessThan(1e-6);
    }
  });

  it("contract example 50 × 60 inside, T = 1, r = 3: D by hand [derived]", () => {
    // d = 51, h = 60.5, r = 3.5: D² = 2601 + 12342 − 1.716815·178.5 − 0.566371·12.25 = 14629.56 → D = 120.953
    const cup = drawnCup({ insideDiameter_mm: 50, insideHeight_mm: 60, thickness_mm: 1, cornerRadius_mm: 3, trim_mm: 0 });
    expect(cup.blankDiameter_mm).toBeCloseTo(120.953, 3);
  });

  it("property: blank disc area = cup mid-surface area (Pappus), for random valid d, h, r [derived]", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 500, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0.01, max: 3, noNaN: true }),
        (d, rf, hf) => {
          const r = (rf * d) / 2;
          const h = r + hf * d; // wall at least the corner radius high
          const D = cupBlankDiameter(d, h, r);
          const disc = (Math.PI * D * D) / 4;
          const closed = cupMidSurfaceArea(d, h, r);
          expect(Math.abs(disc - closed) / closed).toBeLessThan(1e-9);
          expect(Math.abs(disc - numericalArea(d, h, r)) / closed).toBeLessThan(1e-6);
        },
      ),
      { numRuns: 200 },
    );
  });
});
