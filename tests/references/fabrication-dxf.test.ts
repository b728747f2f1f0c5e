import { describe, expect, it } from "vitest";
import DxfParser from "dxf-parser";
import { computeBlank, flatPatternDxf } from "../../shared/fabrication";

type Entity = { type: string; layer: string; vertices?: Array<{ x: number; y: number }>; shape?: boolean; center?: { x: number; y: number }; radius?: number };

function parse(text: string) {
  const dxf = new DxfParser().parseSync(text);
  if (!dxf) throw new Error("DXF did not parse");
  return dxf as unknown as { entities: Entity[]; header: Record<string, unknown>; tables: { layer: { layers: Record<string, unknown> } } };
}

describe("flat pattern DXF read back by an independent parser (dxf-parser) [derived]", () => {
  const box = computeBlank({ shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1, bendRadius_mm: 1.5, kFactor: 0.44 });
  const text = flatPatternDxf(box.geometry);
  const dxf = parse(text);

  it("the blank edge (cut) is one closed polyline with the same vertices", () => {
    const cut = dxf.entities.filter((e) => e.layer === "FW-BLANK-EDGE");
    expect(cut).toHaveLength(1);
    expect(cut[0].shape).toBe(true);
    const v = cut[0].vertices!.map((p) => [p.x, p.y]);
    expect(v).toHaveLength(box.geometry.outline.length);
    v.forEach(([x, y], i) => {
      expect(x).toBeCloseTo(box.geometry.outline[i][0], 6);
      expect(y).toBeCloseTo(box.geometry.outline[i][1], 6);
    });
  });

  it("four bend lines on layer FW-BEND-CENTRE, dashed; layers present; units mm", () => {
    expect(dxf.entities.filter((e) => e.layer === "FW-BEND-CENTRE" && e.type === "LINE")).toHaveLength(4);
    expect(Object.keys(dxf.tables.layer.layers)).toEqual(expect.arrayContaining(["FW-BLANK-EDGE", "FW-BEND-CENTRE"]));
    // the BEND layer record names its linetype (group code 6) within its next few codes
    expect(text).toMatch(/\n2\nFW-BEND-CENTRE\n(?:\d+\n[^\n]*\n){0,4}6\nDASHED\n/);
    expect(dxf.header["$INSUNITS"]).toBe(4);
  });

  it("disc blank becomes a circle of the blank's radius", () => {
    const cup = computeBlank({ shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, thickness_mm: 1, cornerRadius_mm: 3 });
    const circles = parse(flatPatternDxf(cup.geometry)).entities.filter((e) => e.type === "CIRCLE" && e.layer === "FW-BLANK-EDGE");
    expect(circles).toHaveLength(1);
    expect(circles[0].radius! * 2).toBeCloseTo(cup.blank.diameter_mm, 6);
  });
});
