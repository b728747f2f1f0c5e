import type { BlankRequest } from "../schemas/blank";

const fmt = (x: number) => String(+x.toFixed(2));
const safe = (s: string) => s.toLowerCase().replace(/[^a-z0-9.-]+/g, "-").replace(/^-+|-+$/g, "");

/**
 * The DXF's file name says the part, its material and its thickness, so a folder of them reads
 * like a parts list: blank-box-bent-80x60x40-ni80-1mm.dxf, blank-can-drawn-d50x120-ni80-1mm.dxf
 * (server header and browser save agree).
 */
export function flatPatternFilename(r: BlankRequest): string {
  const size =
    r.shape === "box"
      ? `box-bent-${fmt(r.dimensions_mm.width)}x${fmt(r.dimensions_mm.depth)}x${fmt(r.dimensions_mm.height)}`
      : `can-${r.method}-d${fmt(r.dimensions_mm.diameter)}x${fmt(r.dimensions_mm.length)}`;
  const material = r.material ? `-${safe(r.material)}` : "";
  return `blank-${size}${material}-${fmt(r.thickness_mm)}mm.dxf`;
}
