import { describe, expect, it } from "vitest";
import { bentBox, boxLid, computeBlank, drawnCup, partsForDesign, polygonArea, rolledCan, blankMass_kg } from "../../shared/fabrication";

describe("draw stages", () => {
  it("contract cup 50 × 60, T = 1, r = 3: two stages, punch 62.66 then 50, one process anneal [derived]", () => {
    // D = 120.953, d = 51. First draw to D/1.9 = 63.659 mean → punch 62.659.
    // Redraws: ln(63.659/51)/ln(1.3) = 0.845 → one redraw, ratio 1.248 ≤ 1.3, punch = 50 (inside).
    const cup = drawnCup({ insideDiameter_mm: 50, insideHeight_mm: 60, thickness_mm: 1, cornerRadius_mm: 3 });
    expect(cup.drawStages.map((s) => s.stage)).toEqual([1, 2]);
    expect(cup.drawStages[0].punchDiameter_mm).toBeCloseTo(120.953 / 1.9 - 1, 2);
    expect(cup.drawStages[0].ratio).toBeCloseTo(1.9, 12);
    expect(cup.drawStages[1].punchDiameter_mm).toBeCloseTo(50, 12);
    expect(cup.drawStages[1].ratio).toBeCloseTo(1.2482, 4);
    // nickel-iron: anneal after every draw but the last, the final hydrogen anneal follows [practice]
    expect(cup.processAnneals).toBe(1);
    expect(cup.drawStages.map((s) => s.annealAfter)).toEqual([true, false]);
  });

  it("shallow cup within the first-draw limit 1.9 [practice] needs one stage", () => {
    const cup = drawnCup({ insideDiameter_mm: 100, insideHeight_mm: 20, thickness_mm: 1, cornerRadius_mm: 5 });
    expect(cup.drawRatio).toBeLessThan(1.9);
    expect(cup.drawStages).toHaveLength(1);
    expect(cup.drawStages[0].punchDiameter_mm).toBe(100);
    expect(cup.processAnneals).toBe(0);
  });

  it("deep narrow cup: five stages within limits 1.9 / 1.3 [practice], DRAW_STAGES_EXCESSIVE", () => {
    // d = 20.5, h = 100.25: D = √(420.25 + 8220.5) = 92.9556; D/d = 4.534.
    // d₁ = 48.924; ln(48.924/20.5)/ln 1.3 = 3.32 → 4 redraws of (2.3865)^(1/4) = 1.2429 each.
    const cup = drawnCup({ insideDiameter_mm: 20, insideHeight_mm: 100, thickness_mm: 0.5 });
    expect(cup.blankDiameter_mm).toBeCloseTo(92.9556, 3);
    expect(cup.drawStages).toHaveLength(5);
    expect(cup.drawStages[0].ratio).toBeLessThanOrEqual(1.9 + 1e-12);
    for (const s of cup.drawStages.slice(1)) expect(s.ratio).toBeCloseTo(1.2429, 4);
    const product = cup.drawStages.reduce((p, s) => p * s.ratio, 1);
    expect(product).toBeCloseTo(cup.drawRatio, 10);
    expect(cup.drawStages.at(-1)!.punchDiameter_mm).toBeCloseTo(20, 12);
    expect(cup.processAnneals).toBe(4);
    expect(cup.warnings.map((w) => w.code)).toContain("DRAW_STAGES_EXCESSIVE");
  });

  it("editable limits per material: a steel without process anneals", () => {
    const cup = drawnCup({ insideDiameter_mm: 20, insideHeight_mm: 100, thickness_mm: 0.5, limits: { firstDrawRatio: 2.0, redrawRatio: 1.4, processAnnealBetweenDraws: false } });
    expect(cup.drawStages.length).toBeLessThan(5);
    expect(cup.processAnneals).toBe(0);
  });

  it("corner radius over half the diameter is refused", () => {
    expect(() => drawnCup({ insideDiameter_mm: 20, insideHeight_mm: 30, thickness_mm: 1, cornerRadius_mm: 11 })).toThrow(/half the inside diameter/);
  });
});

describe("rolled can", () => {
  it("contract can 50 × 60, T = 1, lap 6: wall π·51 + 6 = 166.221 × 60; caps 52 + 2·5 = 62 [derived]", () => {
    // K = 0.5 → mean diameter 51; flange default 2T + 3 = 5 mm; OD = 52
    const can = rolledCan({ insideDiameter_mm: 50, length_mm: 60, thickness_mm: 1, seamOverlap_mm: 6 });
    expect(can.wall.length_mm).toBeCloseTo(Math.PI * 51 + 6, 10);
    expect(can.wall.length_mm).toBeCloseTo(166.2212, 4);
    expect(can.wall.width_mm).toBe(60);
    expect(can.endCaps).toEqual([{ kind: "disc", diameter_mm: 62 }, { kind: "disc", diameter_mm: 62 }]);
    expect(can.seam).toBe("lap");
    expect(can.area_mm2).toBeCloseTo(can.wall.length_mm * 60 + 2 * Math.PI * 31 * 31, 8);
  });

  it("butt seam adds nothing; capFlange_mm is honoured", () => {
    const can = rolledCan({ insideDiameter_mm: 100, length_mm: 200, thickness_mm: 2, capFlange_mm: 8 });
    expect(can.wall.length_mm).toBeCloseTo(Math.PI * 102, 10);
    expect(can.seam).toBe("butt");
    expect(can.endCaps[0].diameter_mm).toBe(104 + 16);
  });
});

describe("bent box", () => {
  it("contract box 80 × 60 × 40, T = 1, R = 1.5, K = 0.44: cross 160.095 × 140.095 [derived]", () => {
    // BA₉₀ = π/2·(1.5 + 0.44) = 3.0473; along W: (80 − 3) + 2·3.0473 + 2·(40 − 1.5) = 77 + 6.0947 + 77 = 160.0947
    // along D: (60 − 3) + 6.0947 + 77 = 140.0947
    const box = bentBox({ width_mm: 80, depth_mm: 60, height_mm: 40, thickness_mm: 1, bendRadius_mm: 1.5, kFactor: 0.44 });
    expect(box.bendAllowance_mm).toBeCloseTo(3.0473449, 6);
    expect(box.length_mm).toBeCloseTo(160.0946897, 6);
    expect(box.width_mm).toBeCloseTo(140.0946897, 6);
    // area: bottom 77·57 + 2·(38.5 + 3.0473)·(77 + 57) = 4389 + 11134.69 = 15523.69
    expect(box.area_mm2).toBeCloseTo(15523.688, 2);
    expect(polygonArea(box.geometry.outline)).toBeCloseTo(box.area_mm2, 8);
    expect(box.geometry.bendLines).toHaveLength(4);
    expect(box.geometry.reliefs).toHaveLength(4);
    expect(box.bendCount).toBe(4);
  });

  it("lid fits over the body's outside with the clearance", () => {
    const body = { width_mm: 80, depth_mm: 60, height_mm: 40, thickness_mm: 1, bendRadius_mm: 1.5, kFactor: 0.44 };
    const lid = boxLid({ body, lidHeight_mm: 12, lidClearance_mm: 0.3 });
    expect(lid.inside).toEqual({ width_mm: 82.6, depth_mm: 62.6, height_mm: 12 });
    expect(lid.length_mm).toBeCloseTo(82.6 - 3 + 2 * 3.0473449 + 2 * 10.5, 6);
  });

  it("computeBlank answers the contract fields", () => {
    const r = computeBlank({ shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1, bendRadius_mm: 1.5, kFactor: 0.44 }, { density_kg_m3: 8740 });
    expect(r.blank).toEqual({ kind: "cross", length_mm: expect.closeTo(160.0947, 3), width_mm: expect.closeTo(140.0947, 3) });
    if (r.method !== "bent") throw new Error("bent expected");
    expect(r.bendAllowance_mm).toBeCloseTo(3.0473, 4);
    expect(r.mass_kg).toBeCloseTo(blankMass_kg(r.area_mm2, 1, 8740), 12);
    expect(r.mass_kg).toBeCloseTo(0.13568, 4);
  });
});

describe("parts of a nested design", () => {
  it("layer inside dimensions grow by 2·Σ(T + gap); collars per hole per layer", () => {
    const parts = partsForDesign({
      shape: "cylinder",
      method: "rolled",
      dimensions_mm: { diameter: 50, length: 120 },
      layers: [
        { thickness_mm: 1, gap_mm: 10, materialId: "ni80", density_kg_m3: 8740 },
        { thickness_mm: 1.5, materialId: "ni50", density_kg_m3: 8250 },
      ],
      holes: [{ diameter_mm: 8, collarLength_mm: 16 }],
    });
    const walls = parts.filter((p) => p.role === "wall");
    expect(walls).toHaveLength(2);
    // layer 1 inside = 50 + 2·(1 + 10) = 72 → mean 73.5; length 120 + 22 = 142
    expect(walls[1].blank).toEqual({ kind: "rectangle", length_mm: expect.closeTo(Math.PI * 73.5, 9), width_mm: 142 });
    expect(parts.filter((p) => p.role === "end-cap").every((p) => p.quantityPerAssembly === 2)).toBe(true);
    const collars = parts.filter((p) => p.role === "collar");
    expect(collars).toHaveLength(2);
    expect(collars[1].blank).toEqual({ kind: "rectangle", length_mm: expect.closeTo(Math.PI * (8 + 2 + 1.5), 9), width_mm: 16 });
    for (const p of parts) expect(p.mass_kg).toBeCloseTo(blankMass_kg(p.area_mm2, p.thickness_mm, p.density_kg_m3!), 12);
  });

  it("bent box design has body and lid per layer with bends and welds", () => {
    const parts = partsForDesign({ shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, layers: [{ thickness_mm: 1, gap_mm: 5 }, { thickness_mm: 1 }], bendRadius_mm: 1.5, kFactor: 0.44 });
    expect(parts.map((p) => `${p.layer}:${p.role}`)).toEqual(["0:body", "0:lid", "1:body", "1:lid"]);
    expect(parts[0].blank).toEqual({ kind: "cross", length_mm: expect.closeTo(160.0947, 3), width_mm: expect.closeTo(140.0947, 3) });
    expect(parts[2].blank.kind === "cross" && parts[2].blank.length_mm).toBeCloseTo(160.0947 + 3 * 12, 3);
    expect(parts[0].bendCount).toBe(4);
  });

  it("drawn design reports draw stages per layer", () => {
    const parts = partsForDesign({ shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, cornerRadius_mm: 3, layers: [{ thickness_mm: 1 }] });
    expect(parts).toHaveLength(1);
    expect(parts[0].drawStages).toBe(2);
    expect(parts[0].processAnneals).toBe(1);
  });
});
