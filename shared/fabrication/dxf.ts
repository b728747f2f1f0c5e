/**
 * Flat pattern as DXF for the laser/punch and the drawing, in Fluxwright's own layer names:
 * FW-BLANK-EDGE the cut outline (a closed polyline) and disc blanks (circles), FW-BEND-CENTRE the
 * bend lines (dashed, on the bend's centre), FW-CORNER-RELIEF the reliefs for reference (the
 * outline already contains them), FW-PART-NOTE the text that says which part, material and
 * thickness the pattern is for. Units millimetres ($INSUNITS = 4). Text is plain ASCII, which every
 * DXF reader takes.
 */
import Drawing from "dxf-writer";
import type { BlankRequest } from "../schemas/blank";
import type { FlatPatternGeometry } from "./types";

export const DXF_LAYERS = { edge: "FW-BLANK-EDGE", bend: "FW-BEND-CENTRE", relief: "FW-CORNER-RELIEF", note: "FW-PART-NOTE" } as const;

const n = (x: number) => String(+x.toFixed(2));

/** The note's lines for a blank request: the part as asked (inside sizes), its material and its thickness. */
export function partNoteLines(r: BlankRequest, materialName?: string | null): string[] {
  const part =
    r.shape === "box"
      ? `Part: box, bent, inside ${n(r.dimensions_mm.width)} x ${n(r.dimensions_mm.depth)} x ${n(r.dimensions_mm.height)} mm`
      : `Part: can, ${r.method === "drawn" ? "deep-drawn" : "rolled and seam-welded"}, inside dia. ${n(r.dimensions_mm.diameter)} x ${n(r.dimensions_mm.length)} mm`;
  const material = r.material ? `Material: ${r.material}${materialName ? ` (${materialName.replace(/[^\x20-\x7e]/g, "")})` : ""}` : "Material: not given";
  return [part, material, `Thickness: ${n(r.thickness_mm)} mm`];
}

export function flatPatternDxf(geometry: FlatPatternGeometry, note: string[] = []): string {
  const d = new Drawing();
  d.setUnits("Millimeters");
  d.addLayer(DXF_LAYERS.edge, Drawing.ACI.WHITE, "CONTINUOUS");
  d.addLayer(DXF_LAYERS.bend, Drawing.ACI.YELLOW, "DASHED");
  d.addLayer(DXF_LAYERS.relief, Drawing.ACI.CYAN, "DOTTED");
  d.setActiveLayer(DXF_LAYERS.edge);
  if (geometry.outline.length >= 3) d.drawPolyline(geometry.outline.map(([x, y]) => [x, y]), true);
  for (const c of geometry.circles) d.drawCircle(c.cx, c.cy, c.diameter / 2);
  d.setActiveLayer(DXF_LAYERS.bend);
  for (const [[x1, y1], [x2, y2]] of geometry.bendLines) d.drawLine(x1, y1, x2, y2);
  if (geometry.reliefs.length > 0) {
    d.setActiveLayer(DXF_LAYERS.relief);
    for (const r of geometry.reliefs) d.drawRect(r.x, r.y, r.x + r.size, r.y + r.size);
  }
  if (note.length > 0) {
    // under the pattern, left-aligned with it, in lines of a height readable at the part's scale
    const xs = [...geometry.outline.map((p) => p[0]), ...geometry.circles.flatMap((c) => [c.cx - c.diameter / 2, c.cx + c.diameter / 2])];
    const ys = [...geometry.outline.map((p) => p[1]), ...geometry.circles.map((c) => c.cy - c.diameter / 2)];
    const left = Math.min(...xs), bottom = Math.min(...ys), span = Math.max(...xs) - left;
    const h = Math.max(2.5, Math.min(10, span * 0.025));
    d.addLayer(DXF_LAYERS.note, Drawing.ACI.GREEN, "CONTINUOUS");
    d.setActiveLayer(DXF_LAYERS.note);
    note.forEach((line, i) => d.drawText(left, bottom - (i + 2) * h * 1.6, h, 0, line.replace(/[^\x20-\x7e]/g, "")));
  }
  return d.toDxfString();
}
