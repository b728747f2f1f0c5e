import type { BlankRequest } from "../schemas/blank";

const fmt = (x: number) => String(+x.toFixed(2));

/** e.g. flat-pattern-box-80x60x40.dxf, flat-pattern-cylinder-drawn-50x60.dxf (server header and browser save agree). */
export function flatPatternFilename(r: BlankRequest): string {
  if (r.shape === "box") {
    const { width, depth, height } = r.dimensions_mm;
    return `flat-pattern-box-${fmt(width)}x${fmt(depth)}x${fmt(height)}.dxf`;
  }
  const { diameter, length } = r.dimensions_mm;
  return `flat-pattern-cylinder-${r.method}-${fmt(diameter)}x${fmt(length)}.dxf`;
}
