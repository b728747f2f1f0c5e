import DxfParser from "dxf-parser";
import { describe, expect, it } from "vitest";
import { computeBlank, defaultPriceList, DXF_LAYERS, flatPatternDxf, flatPatternFilename, nestBlanks, partNoteLines, shopLimitWarnings } from "../../shared/fabrication";
import type { BlankRequest } from "../../shared/schemas/blank";

const sheets = defaultPriceList.stockSheets;

describe("the flat blank against what the shop can make it from", () => {
  it("warns when a blank is larger than every stock sheet of its alloy and gauge", () => {
    const big: BlankRequest = { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 500, length: 400 }, thickness_mm: 1, cornerRadius_mm: 5, material: "ni80" };
    const w = shopLimitWarnings({ result: computeBlank(big), thickness_mm: 1, materialId: "ni80", stockSheets: sheets });
    expect(w.map((x) => x.code)).toContain("LARGER_THAN_STOCK");
    expect(w.find((x) => x.code === "LARGER_THAN_STOCK")!.message).toMatch(/larger than any stock sheet of ni80 1 mm the shop keeps \(the largest is 610 mm × 1524 mm\)/);
    const small: BlankRequest = { ...big, dimensions_mm: { diameter: 50, length: 60 } };
    expect(shopLimitWarnings({ result: computeBlank(small), thickness_mm: 1, materialId: "ni80", stockSheets: sheets })).toEqual([]);
  });

  it("says when the gauge is not stocked, and when nickel-iron is beyond the forming limits (too thick, too tight a bend)", () => {
    const odd: BlankRequest = { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 3.5, bendRadius_mm: 2, kFactor: 0.4, material: "ni80" };
    const codes = shopLimitWarnings({ result: computeBlank(odd), thickness_mm: 3.5, materialId: "ni80", stockSheets: sheets, bendRadius_mm: 2 }).map((w) => w.code);
    expect(codes).toEqual(expect.arrayContaining(["GAUGE_NOT_STOCKED", "BEYOND_FORMING_LIMIT"]));
    expect(codes.filter((c) => c === "BEYOND_FORMING_LIMIT")).toHaveLength(2);
  });
});

describe("the DXF says what it is", () => {
  const request: BlankRequest = { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1, bendRadius_mm: 1.5, kFactor: 0.44, material: "ni80" };
  const dxf = new DxfParser().parseSync(flatPatternDxf(computeBlank(request).geometry, partNoteLines(request, "80 % Ni-Fe-Mo"))) as unknown as { entities: Array<{ type: string; layer: string; text?: string }>; tables: { layer: { layers: Record<string, unknown> } } };

  it("carries the part, material and thickness as text on its own layer, read back by an independent parser", () => {
    const texts = dxf.entities.filter((e) => e.type === "TEXT" && e.layer === DXF_LAYERS.note).map((e) => e.text);
    expect(texts).toEqual(["Part: box, bent, inside 80 x 60 x 40 mm", "Material: ni80 (80 % Ni-Fe-Mo)", "Thickness: 1 mm"]);
  });

  it("names its layers in Fluxwright's own words", () => {
    expect(Object.keys(dxf.tables.layer.layers)).toEqual(expect.arrayContaining(["FW-BLANK-EDGE", "FW-BEND-CENTRE", "FW-CORNER-RELIEF", "FW-PART-NOTE"]));
    expect(Object.keys(dxf.tables.layer.layers)).not.toEqual(expect.arrayContaining(["CUT"]));
  });

  it("its file name says the part, material and thickness", () => {
    expect(flatPatternFilename(request)).toBe("blank-box-bent-80x60x40-ni80-1mm.dxf");
    expect(flatPatternFilename({ shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 120 }, thickness_mm: 0.75 })).toBe("blank-can-drawn-d50x120-0.75mm.dxf");
  });
});

describe("discs nest as the shop lays them out: offset rows", () => {
  const sheet = { width_mm: 610, length_mm: 1524 };
  it("a can's body and lid discs (two sizes) go in offset-row bands, not a square grid", () => {
    const blanks = Array.from({ length: 30 }, (_, i) => ({ kind: "disc" as const, diameter_mm: i % 2 ? 80 : 164 }));
    const r = nestBlanks(blanks, sheet);
    expect(r.algorithm).toBe("shelves-and-offset-rows");
    expect(r.unplaced).toEqual([]);
    // in one band the rows alternate: odd rows shifted by half a pitch
    const big = r.placements.filter((p) => p.w === 164 && p.sheet === 0);
    const rows = [...new Set(big.map((p) => Math.round(p.y)))].sort((a, b) => a - b);
    expect(rows.length).toBeGreaterThan(1);
    const firstX = (y: number) => Math.min(...big.filter((p) => Math.round(p.y) === y).map((p) => p.x));
    expect(Math.abs(firstX(rows[1]) - firstX(rows[0]) - (164 + 3) / 2)).toBeLessThan(1e-6);
    // rows closer than a diameter apart: the discs sit in the gaps of the row before
    expect(rows[1] - rows[0]).toBeLessThan(164);
    // no two blanks overlap
    for (const [i, a] of r.placements.entries())
      for (const b of r.placements.slice(i + 1)) {
        if (a.sheet !== b.sheet) continue;
        const d = Math.hypot(a.x + a.w / 2 - (b.x + b.w / 2), a.y + a.h / 2 - (b.y + b.h / 2));
        expect(d).toBeGreaterThanOrEqual((a.w + b.w) / 2 - 1e-6);
      }
  });

  it("discs beside rectangles (a rolled can's wall and end discs) fill the length the shelves leave", () => {
    const blanks = [{ kind: "rectangle" as const, length_mm: 160, width_mm: 120 }, { kind: "disc" as const, diameter_mm: 52 }, { kind: "disc" as const, diameter_mm: 52 }];
    const r = nestBlanks(blanks, sheet);
    expect(r.sheetsNeeded).toBe(1);
    expect(r.unplaced).toEqual([]);
  });
});

describe("equal discs that fit one sheet either way", () => {
  it("are laid in offset rows, as the shop lays them, when square rows need no fewer sheets", () => {
    const blanks = Array.from({ length: 50 }, () => ({ kind: "disc" as const, diameter_mm: 167 }));
    const r = nestBlanks(blanks, { width_mm: 1000, length_mm: 2000 });
    expect(r.algorithm).toBe("disc-offset-rows");
    expect(r.sheetsNeeded).toBe(1);
  });
});
