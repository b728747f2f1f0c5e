import type { FlatPatternGeometry } from "../../shared/fabrication";
import type { JobPartJson } from "../../shared/schemas/jobs";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import { AFTER_ANNEAL_CAUTION, HYDROGEN_CAUTION_SHORT } from "../../shared/shop-floor/anneal";
import { stepBarcode } from "../../shared/shop-floor/codes";
import { stepLabels, type RoutingStep } from "../../shared/shop-floor/routing";
import { code128 } from "./barcodes";
import { ACCENT, INK, MUTED, RULE, STEEL, contentWidth, createDocument, fmtDate, footers, num, pdfText, toBuffer, type Doc, type ShopDetails } from "./pdf";

export interface TravelerData {
  code: string;
  orderNumber: string;
  customer: string;
  lotNumber: string;
  description: string;
  materialName: string;
  thickness_mm: number;
  quantity: number;
  blank: JobPartJson["blank"];
  flatPattern: FlatPatternGeometry;
  weldLength_mm: number;
  dueDate: string;
  heatNumber: string | null;
  /** the piece an end cap or collar is welded to */
  weldedTo: string | null;
  /** end caps and collars welded to this piece */
  components: string[];
  routing: RoutingStep[];
}

export function blankText(b: JobPartJson["blank"]): string {
  return b.kind === "disc" ? `disc, dia. ${num(b.diameter_mm, 1)} mm` : `${b.kind === "cross" ? "cross" : "rectangle"}, ${num(b.length_mm, 1)} × ${num(b.width_mm, 1)} mm`;
}

const PRESS_CAUTION = "Press work: guards and interlocks in place; cut-resistant gloves for sheared edges.";

/** The cautions printed at a step, where the hazard is (domain.md section 7). */
function cautionsAt(step: RoutingStep, routing: RoutingStep[]): string[] {
  const out: string[] = [];
  if (step.key === "blank" || step.key === "form") out.push(PRESS_CAUTION);
  if (step.key === "anneal") out.push(HYDROGEN_CAUTION_SHORT);
  const anneal = routing.findIndex((s) => s.key === "anneal");
  if (anneal >= 0 && routing.indexOf(step) === anneal + 1) out.push(AFTER_ANNEAL_CAUTION);
  return out;
}

function stepDetail(step: RoutingStep, t: TravelerData): string {
  const parts: string[] = [];
  if (step.key === "material") parts.push(`Issue ${t.materialName}, ${num(t.thickness_mm, 3)} mm. Record the heat number on the sheet${t.heatNumber ? ` (issued: heat ${t.heatNumber})` : ""}.`);
  if (step.key === "blank") parts.push(`Cut the ${blankText(t.blank)}.`);
  if (step.key === "form" && step.drawStages) {
    parts.push(`${step.drawStages} draw${step.drawStages === 1 ? "" : "s"}${step.processAnneals ? `, ${step.processAnneals} process anneal${step.processAnneals === 1 ? "" : "s"} between heavy draws` : ""}. Record the draws done.`);
  }
  if (step.key === "weld") {
    if (t.components.length) parts.push(`Weld on ${t.components.join(", ")} when they are finished.`);
    if (t.weldLength_mm > 0) parts.push(`About ${num(t.weldLength_mm / 1000, 2)} m of fusion weld, no filler. Inspect and record the result.`);
  }
  if (step.key === "clean") parts.push("Degrease completely before the furnace.");
  if (step.key === "verify") parts.push("Sampled attenuation measurement by quality.");
  if (step.key === "pack") parts.push("Padded packing, no shock.");
  if (step.note) parts.push(`Planner: ${step.note}`);
  return parts.join(" ");
}

/** The flat pattern scaled into a box, with its overall size written under it. */
function drawFlatPattern(doc: Doc, g: FlatPatternGeometry, blank: JobPartJson["blank"], x: number, y: number, size: number): void {
  doc.save();
  doc.rect(x, y, size, size).lineWidth(0.5).strokeColor(RULE).stroke();
  const xs: number[] = [];
  const ys: number[] = [];
  for (const [px, py] of g.outline) {
    xs.push(px);
    ys.push(py);
  }
  for (const c of g.circles) {
    xs.push(c.cx - c.diameter / 2, c.cx + c.diameter / 2);
    ys.push(c.cy - c.diameter / 2, c.cy + c.diameter / 2);
  }
  if (xs.length) {
    const [minX, maxX, minY, maxY] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
    const pad = 10;
    const k = Math.min((size - 2 * pad) / Math.max(maxX - minX, 1e-9), (size - 2 * pad) / Math.max(maxY - minY, 1e-9));
    const ox = x + pad + ((size - 2 * pad) - (maxX - minX) * k) / 2;
    const oy = y + pad + ((size - 2 * pad) - (maxY - minY) * k) / 2;
    // y up in the drawing, down on the page
    const P = (px: number, py: number): [number, number] => [ox + (px - minX) * k, oy + (maxY - py) * k];
    if (g.outline.length) {
      const [sx, sy] = P(...g.outline[0]);
      doc.moveTo(sx, sy);
      for (const p of g.outline.slice(1)) doc.lineTo(...P(...p));
      doc.closePath().fillAndStroke("#eef2f6", STEEL);
    }
    for (const c of g.circles) {
      const [cx, cy] = P(c.cx, c.cy);
      doc.circle(cx, cy, (c.diameter / 2) * k).lineWidth(0.8).fillAndStroke("#eef2f6", STEEL);
    }
    doc.lineWidth(0.6).dash(3, { space: 2 }).strokeColor(ACCENT);
    for (const [a, b] of g.bendLines) doc.moveTo(...P(...a)).lineTo(...P(...b)).stroke();
    doc.undash();
  }
  doc.restore();
  doc.font("body").fontSize(7.5).fillColor(MUTED).text(pdfText(`Flat blank: ${blankText(blank)}${g.bendLines.length ? "; dashed: bend lines" : ""}`), x, y + size + 3, { width: size });
}

async function travelerPage(doc: Doc, t: TravelerData, shop: ShopDetails, printedAt: Date): Promise<void> {
  const left = doc.page.margins.left;
  const width = contentWidth(doc);
  const top = doc.page.margins.top;

  // --- the job's code, big, and its barcode ---
  doc.font("body").fontSize(8.5).fillColor(MUTED).text(pdfText(`${shop.name} · traveler`), left, top, { width: width * 0.5 });
  doc.font("display").fontSize(26).fillColor(INK).text(t.code, left, top + 12, { width: width * 0.5 });
  doc.font("bold").fontSize(10.5).fillColor(INK).text(pdfText(t.description), left, doc.y + 2, { width: width * 0.55 });
  const barWidth = Math.min(230, width * 0.42);
  doc.image(await code128(t.code, 12), left + width - barWidth, top, { width: barWidth, height: 46 });
  doc.font("mono").fontSize(10).fillColor(INK).text(t.code, left + width - barWidth, top + 49, { width: barWidth, align: "center" });
  let y = Math.max(doc.y, top + 66) + 6;
  doc.moveTo(left, y).lineTo(left + width, y).lineWidth(1).strokeColor(ACCENT).stroke();
  y += 10;

  // --- what the job makes, with its flat pattern beside it ---
  const drawing = 130;
  const facts: Array<[string, string]> = [
    ["Order", `${t.orderNumber} · ${t.customer}`],
    ["Lot", t.lotNumber],
    ["Layer and part", t.description],
    ["Material", `${t.materialName}, ${num(t.thickness_mm, 3)} mm`],
    ["Quantity", `${t.quantity} piece${t.quantity === 1 ? "" : "s"}`],
    ["Blank", blankText(t.blank)],
    ["Due", fmtDate(new Date(`${t.dueDate}T00:00:00Z`))],
  ];
  if (t.weldedTo) facts.push(["Welded to", t.weldedTo]);
  if (t.components.length) facts.push(["Takes", t.components.join(", ")]);
  const textWidth = width - drawing - 20;
  let fy = y;
  for (const [label, value] of facts) {
    doc.font("body").fontSize(9).fillColor(MUTED).text(pdfText(label), left, fy, { width: 90 });
    doc.font("bold").fontSize(9).fillColor(INK).text(pdfText(value), left + 90, fy, { width: textWidth - 90 });
    fy = Math.max(doc.y, fy + 12) + 2;
  }
  drawFlatPattern(doc, t.flatPattern, t.blank, left + width - drawing, y, drawing);
  y = Math.max(fy, y + drawing + 16) + 8;

  // --- the routing: one row per step, each with its own barcode and lines for the floor ---
  doc.font("display").fontSize(12).fillColor(INK).text("Routing", left, y);
  doc.font("body").fontSize(8).fillColor(MUTED).text("Scan the job, then the step's barcode; start when the work begins, complete when it is done.", left + 70, y + 3, { width: width - 70 });
  y = doc.y + 6;
  const colNo = 22;
  const colText = width * 0.44;
  const colBar = width * 0.25;
  const colSign = width - colNo - colText - colBar;
  for (const [i, step] of t.routing.entries()) {
    const detail = stepDetail(step, t);
    const cautions = cautionsAt(step, t.routing);
    doc.font("bold").fontSize(10);
    const labelH = doc.heightOfString(stepLabels[step.key], { width: colText - 8 });
    doc.font("body").fontSize(8);
    const detailH = detail ? doc.heightOfString(pdfText(detail), { width: colText - 8 }) : 0;
    doc.fontSize(7);
    const cautionH = cautions.reduce((s, c) => s + doc.heightOfString(pdfText(`! ${c}`), { width: colText - 8 }) + 2, 0);
    const rowH = Math.max(62, labelH + detailH + cautionH + 12);
    if (y + rowH > doc.page.height - doc.page.margins.bottom) {
      doc.addPage();
      y = doc.page.margins.top;
      doc.font("bold").fontSize(10).fillColor(INK).text(pdfText(`${t.code} · routing, continued`), left, y);
      y = doc.y + 6;
    }
    doc.moveTo(left, y).lineTo(left + width, y).lineWidth(0.5).strokeColor(RULE).stroke();
    doc.font("display").fontSize(14).fillColor(ACCENT).text(String(i + 1), left, y + 5, { width: colNo });
    let ty = y + 5;
    doc.font("bold").fontSize(10).fillColor(INK).text(stepLabels[step.key], left + colNo, ty, { width: colText - 8 });
    ty = doc.y + 1;
    if (detail) {
      doc.font("body").fontSize(8).fillColor(INK).text(pdfText(detail), left + colNo, ty, { width: colText - 8 });
      ty = doc.y + 2;
    }
    for (const c of cautions) {
      doc.font("bold").fontSize(7).fillColor(ACCENT).text(pdfText(`! ${c}`), left + colNo, ty, { width: colText - 8 });
      ty = doc.y + 2;
    }
    const barX = left + colNo + colText;
    const value = stepBarcode(t.code, step.key);
    doc.image(await code128(value, 7), barX, y + 7, { width: colBar - 12, height: 26 });
    doc.font("mono").fontSize(7.5).fillColor(INK).text(value, barX, y + 36, { width: colBar - 12, align: "center" });
    const signX = barX + colBar;
    doc.font("body").fontSize(7.5).fillColor(MUTED);
    const line = (label: string, ly: number) => {
      doc.text(label, signX, ly, { width: 44 });
      doc.moveTo(signX + 44, ly + 8).lineTo(signX + colSign - 44, ly + 8).lineWidth(0.4).strokeColor(MUTED).stroke();
      doc.text("init.", signX + colSign - 40, ly, { width: 16 });
      doc.moveTo(signX + colSign - 22, ly + 8).lineTo(signX + colSign, ly + 8).stroke();
    };
    line("Started", y + 7);
    line("Done", y + 23);
    doc.text("Notes", signX, y + 39, { width: 44 });
    doc.moveTo(signX + 44, y + 47).lineTo(signX + colSign, y + 47).stroke();
    doc.moveTo(signX, y + 59).lineTo(signX + colSign, y + 59).stroke();
    y += rowH;
  }
  doc.moveTo(left, y).lineTo(left + width, y).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.font("body").fontSize(7.5).fillColor(MUTED).text(pdfText(`Printed ${fmtDate(printedAt)}. The scans in Fluxwright are the record; this sheet travels with the parts.`), left, y + 6, { width });
}

/** One traveler per job (a page each, more when the routing runs over), A4 or US Letter. */
export async function renderTravelers(props: { jobs: TravelerData[]; paperSize: PaperSize; shop: ShopDetails; printedAt: Date }): Promise<Buffer> {
  const title = props.jobs.length === 1 ? `Traveler ${props.jobs[0].code}` : `Travelers ${props.jobs[0]?.code ?? ""}–${props.jobs.at(-1)?.code ?? ""}`;
  const doc = createDocument({ paperSize: props.paperSize, title, author: props.shop.name, subject: title });
  for (const [i, job] of props.jobs.entries()) {
    if (i > 0) doc.addPage();
    await travelerPage(doc, job, props.shop, props.printedAt);
  }
  footers(doc, title);
  return toBuffer(doc);
}
