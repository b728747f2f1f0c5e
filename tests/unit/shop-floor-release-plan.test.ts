import { describe, expect, it } from "vitest";
import { partsForDesign } from "../../shared/fabrication";
import { flatPatternOf } from "../../shared/shop-floor/flat-pattern";
import { planRelease, ReleasePlanError, shareOut } from "../../shared/shop-floor/release-plan";

const box = {
  shape: "box" as const, method: "bent" as const, dimensions_mm: { width: 80, depth: 60, height: 40 }, bendRadius_mm: 1.5, kFactor: 0.44, lid: true,
  holes: [{ diameter_mm: 8, collarLength_mm: 12 }],
  layers: [{ thickness_mm: 1, gap_mm: 6, materialId: "ni80", density_kg_m3: 8740 }, { thickness_mm: 1, materialId: "ni50", density_kg_m3: 8250 }],
};
const magnetic = () => true;

describe("release plan", () => {
  it("one lot per alloy, one job per part for the quantity; collars point at their layer's body, not the lid", () => {
    const parts = partsForDesign(box);
    const lots = planRelease({ parts, quantity: 3, annealed: magnetic, maxLoad_kg: 250 });
    expect(lots.map((l) => [l.materialId, l.assemblies, l.pieces])).toEqual([["ni80", 3, 6], ["ni50", 3, 6]]);
    const inner = lots[0];
    const role = (i: number) => parts[inner.jobs[i].part].role;
    expect(inner.jobs.map((_, i) => role(i))).toEqual(["body", "lid", "collar"]);
    expect(inner.jobs[2].assembly).toBe(0);
    expect(inner.jobs.map((j) => j.quantity)).toEqual([3, 3, 3]);
    // the lot's load is the mass of every blank in it
    const mass = parts.filter((p) => p.materialId === "ni80").reduce((s, p) => s + p.mass_kg! * p.quantityPerAssembly, 0);
    expect(inner.mass_kg).toBeCloseTo(3 * mass, 9);
  });

  it("assemblies heavier than the largest furnace takes are shared over lots of nearly equal size; one too heavy is refused", () => {
    const parts = partsForDesign(box);
    const perAssembly = parts.filter((p) => p.materialId === "ni80").reduce((s, p) => s + p.mass_kg! * p.quantityPerAssembly, 0);
    const lots = planRelease({ parts, quantity: 10, annealed: magnetic, maxLoad_kg: perAssembly * 4.5 }).filter((l) => l.materialId === "ni80");
    expect(lots.map((l) => l.assemblies)).toEqual([4, 3, 3]);
    for (const l of lots) expect(l.mass_kg).toBeLessThanOrEqual(perAssembly * 4.5);
    expect(() => planRelease({ parts, quantity: 1, annealed: magnetic, maxLoad_kg: perAssembly / 2 })).toThrow(ReleasePlanError);
    expect(shareOut(7, 3)).toEqual([3, 2, 2]);
  });

  it("the flat patterns drawn on travelers are the blanks the parts list sized", () => {
    const parts = partsForDesign(box);
    for (const p of parts) {
      const g = flatPatternOf(box, p);
      if (p.blank.kind === "cross") {
        const xs = g.outline.map(([x]) => x);
        const ys = g.outline.map(([, y]) => y);
        expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(p.blank.length_mm, 6);
        expect(Math.max(...ys) - Math.min(...ys)).toBeCloseTo(p.blank.width_mm, 6);
        expect(g.bendLines).toHaveLength(4);
      } else if (p.blank.kind === "rectangle") {
        expect(g.outline[2]).toEqual([p.blank.length_mm, p.blank.width_mm]);
      }
    }
  });
});
