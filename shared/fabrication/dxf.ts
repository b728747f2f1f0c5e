/**
 * Flat pattern as DXF for the laser/punch and the drawing: cut outline on layer CUT as a closed
 * polyline, bend lines on layer BEND (dashed), disc blanks as circles on CUT, reliefs on layer
 * RELIEF for reference (the outline already contains them). Units millimetres ($INSUNITS = 4).
 */
import Drawing from "dxf-writer";
import type { FlatPatternGeometry } from "./types";

export const DXF_LAYERS = { cut: "CUT", bend: "BEND", relief: "RELIEF" } as const;

export function flatPatternDxf(geometry: FlatPatternGeometry): string {
  const d = new Drawing();
  d.setUnits("Millimeters");
  d.addLayer(DXF_LAYERS.cut, Drawing.ACI.WHITE, "CONTINUOUS");
  d.addLayer(DXF_LAYERS.bend, Drawing.ACI.YELLOW, "DASHED");
  d.addLayer(DXF_LAYERS.relief, Drawing.ACI.CYAN, "DOTTED");
  d.setActiveLayer(DXF_LAYERS.cut);
  if (geometry.outline.length >= 3) d.drawPolyline(geometry.outline.map(([x, y]) => [x, y]), true);
  for (const c of geometry.circles) d.drawCircle(c.cx, c.cy, c.diameter / 2);
  d.setActiveLayer(DXF_LAYERS.bend);
  for (const [[x1, y1], [x2, y2]] of geometry.bendLines) d.drawLine(x1, y1, x2, y2);
  if (geometry.reliefs.length > 0) {
    d.setActiveLayer(DXF_LAYERS.relief);
    for (const r of geometry.reliefs) d.drawRect(r.x, r.y, r.x + r.size, r.y + r.size);
  }
  return d.toDxfString();
}
