import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { nestBlanks, partsPerSheet, type NestBlank, type NestResult, type NestSheet } from "../../shared/fabrication/nesting";

const area = (b: NestBlank) => (b.kind === "disc" ? (Math.PI * b.diameter_mm ** 2) / 4 : b.length_mm * b.width_mm);

function checkLayout(blanks: NestBlank[], sheet: NestSheet, r: NestResult, gap: number) {
  const eps = 1e-9;
  for (const p of r.placements) {
    // inside the sheet
    expect(p.x).toBeGreaterThanOrEqual(-eps);
    expect(p.y).toBeGreaterThanOrEqual(-eps);
    expect(p.x + p.w).toBeLessThanOrEqual(sheet.width_mm + eps);
    expect(p.y + p.h).toBeLessThanOrEqual(sheet.length_mm + eps);
  }
  // no overlaps (with the web): rectangles by box separation, disc pairs by centre distance
  for (let s = 0; s < r.sheetsNeeded; s++) {
    const on = r.placements.filter((p) => p.sheet === s);
    for (let i = 0; i < on.length; i++)
      for (let j = i + 1; j < on.length; j++) {
        const a = on[i], b = on[j];
        if (a.kind === "disc" && b.kind === "disc") {
          const dist = Math.hypot(a.x + a.w / 2 - (b.x + b.w / 2), a.y + a.h / 2 - (b.y + b.h / 2));
          expect(dist).toBeGreaterThanOrEqual(a.w / 2 + b.w / 2 + gap - 1e-6);
        } else {
          const apart = a.x + a.w + gap <= b.x + eps || b.x + b.w + gap <= a.x + eps || a.y + a.h + gap <= b.y + eps || b.y + b.h + gap <= a.y + eps;
          expect(apart).toBe(true);
        }
      }
  }
  const placed = r.placements.reduce((s, p) => s + area(blanks[p.index]), 0);
  expect(r.utilisation).toBeCloseTo(placed / (r.sheetsNeeded * sheet.width_mm * sheet.length_mm), 12);
  expect(r.scrapFraction).toBeCloseTo(1 - r.utilisation, 12);
  expect(r.placements.length + r.unplaced.length).toBe(blanks.length);
}

describe("nesting", () => {
  const sheet = { width_mm: 610, length_mm: 1524 };

  it("mixed rectangles and discs: no overlaps, inside sheet, utilisation = placed area / sheet area", () => {
    const blanks: NestBlank[] = [];
    for (let i = 0; i < 60; i++) blanks.push({ kind: "rectangle", length_mm: 40 + ((i * 37) % 200), width_mm: 30 + ((i * 53) % 120) });
    for (let i = 0; i < 20; i++) blanks.push({ kind: "disc", diameter_mm: 40 + ((i * 29) % 90) });
    const r = nestBlanks(blanks, sheet, { gap_mm: 3 });
    checkLayout(blanks, sheet, r, 3);
    expect(r.unplaced).toEqual([]);
    expect(r.partsPerSheet.reduce((a, b) => a + b, 0)).toBe(80);
  });

  it("property: random rectangle sets always nest legally", () => {
    fc.assert(
      fc.property(fc.array(fc.record({ l: fc.integer({ min: 5, max: 700 }), w: fc.integer({ min: 5, max: 300 }) }), { minLength: 1, maxLength: 60 }), fc.integer({ min: 0, max: 5 }), (dims, gap) => {
        const blanks: NestBlank[] = dims.map((d) => ({ kind: "rectangle", length_mm: d.l, width_mm: d.w }));
        checkLayout(blanks, sheet, nestBlanks(blanks, sheet, { gap_mm: gap }), gap);
      }),
      { numRuns: 60 },
    );
  });

  it("rotation lets a long blank fit across a narrow sheet", () => {
    const blanks: NestBlank[] = [{ kind: "rectangle", length_mm: 1000, width_mm: 100 }];
    expect(nestBlanks(blanks, sheet, { allowRotation: false }).unplaced).toEqual([0]);
    const r = nestBlanks(blanks, sheet);
    expect(r.placements[0].rotated).toBe(true);
    checkLayout(blanks, sheet, r, 3);
  });

  it("many equal discs use offset rows and beat bounding squares", () => {
    const blanks: NestBlank[] = Array.from({ length: 400 }, () => ({ kind: "disc", diameter_mm: 62 }));
    const r = nestBlanks(blanks, sheet, { gap_mm: 3 });
    expect(r.algorithm).toBe("disc-offset-rows");
    checkLayout(blanks, sheet, r, 3);
    // squares: floor((604 − 62)/65 + 1) = 9 across × floor((1518 − 62)/65 + 1) = 23 → 207 per sheet
    expect(r.partsPerSheet[0]).toBeGreaterThan(207);
    expect(partsPerSheet({ kind: "disc", diameter_mm: 62 }, sheet, { gap_mm: 3 })).toBe(r.partsPerSheet[0]);
  });

  it("200 blanks nest in well under 50 ms", () => {
    const blanks: NestBlank[] = Array.from({ length: 200 }, (_, i) => (i % 4 === 0 ? { kind: "disc", diameter_mm: 50 + (i % 30) } : { kind: "rectangle", length_mm: 60 + (i % 80), width_mm: 40 + (i % 50) }));
    const t0 = performance.now();
    const r = nestBlanks(blanks, { width_mm: 1000, length_mm: 2000 });
    expect(performance.now() - t0).toBeLessThan(50);
    expect(r.placements).toHaveLength(200);
  });
});
