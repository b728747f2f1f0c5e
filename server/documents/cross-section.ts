import type { QuoteConfiguration } from "../../shared/schemas/quote";
import { COPPER, INK, MUTED, STEEL, num, pdfText, type Doc } from "./pdf";

const MAGNETIC = new Set(["ni80", "ni50", "steel-lc"]);

/** A round length for a scale bar about a quarter of `span`. */
function scaleLength(span: number): number {
  const target = span / 4;
  const p = 10 ** Math.floor(Math.log10(target));
  return [1, 2, 5, 10].map((m) => m * p).filter((v) => v <= target).pop() ?? p;
}

/**
 * The layers drawn to scale inside the square (x, y, size): a cylinder's section across its axis,
 * a box's width × depth section. Each wall is filled (nickel-iron and steel dark, conductors
 * copper-coloured); the gaps stay white. A scale bar and the outside size go beneath.
 */
export function drawCrossSection(doc: Doc, c: QuoteConfiguration, x: number, y: number, size: number): void {
  const d = c.dimensions_mm as Record<string, number>;
  const box = c.shape === "box";
  let hx = box ? d.width / 2 : d.diameter / 2;
  let hy = box ? d.depth / 2 : d.diameter / 2;
  const rings = c.layers.map((l, i) => {
    const ring = { hx, hy, t: l.thickness_mm, material: l.material ?? l.pricedAs ?? "" };
    hx += l.thickness_mm + (i < c.layers.length - 1 ? (l.gap_mm ?? 0) : 0);
    hy += l.thickness_mm + (i < c.layers.length - 1 ? (l.gap_mm ?? 0) : 0);
    return ring;
  });
  const last = rings[rings.length - 1];
  const X = last.hx + last.t;
  const Y = last.hy + last.t;
  const scale = (size * 0.42) / Math.max(X, Y);
  const cx = x + size / 2;
  const cy = y + size / 2 - 6;

  doc.save();
  for (const r of [...rings].reverse()) {
    const colour = MAGNETIC.has(r.material) ? STEEL : COPPER;
    const ox = (r.hx + r.t) * scale;
    const oy = (r.hy + r.t) * scale;
    const ix = r.hx * scale;
    const iy = r.hy * scale;
    if (box) doc.rect(cx - ox, cy - oy, 2 * ox, 2 * oy).rect(cx - ix, cy - iy, 2 * ix, 2 * iy);
    else doc.circle(cx, cy, ox).circle(cx, cy, ix);
    doc.fill(colour, "even-odd");
  }
  // the protected space
  doc.font("body").fontSize(7).fillColor(MUTED).text("protected space", cx - 40, cy - 4, { width: 80, align: "center", lineBreak: false });

  const bar = scaleLength(2 * X);
  const barY = y + size - 14;
  doc.moveTo(x + 8, barY).lineTo(x + 8 + bar * scale, barY).lineWidth(1.2).strokeColor(INK).stroke();
  doc.moveTo(x + 8, barY - 3).lineTo(x + 8, barY + 3).stroke();
  doc.moveTo(x + 8 + bar * scale, barY - 3).lineTo(x + 8 + bar * scale, barY + 3).stroke();
  doc.font("body").fontSize(7.5).fillColor(INK).text(`${num(bar)} mm`, x + 12 + bar * scale, barY - 4, { lineBreak: false });
  const outside = box ? `${num(2 * X)} × ${num(2 * Y)} mm outside` : `dia. ${num(2 * X)} mm outside`;
  doc.text(pdfText(outside), x, barY - 4, { width: size - 6, align: "right", lineBreak: false });
  doc.restore();
}
