import { customerPrice, type PriceBuildUp } from "../../shared/fabrication";
import type { PredictionResult } from "../../shared/physics/predict";
import { documentNumber, formatMoney } from "../../shared/schemas/documents";
import type { QuoteConfiguration } from "../../shared/schemas/quote";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import { drawCrossSection } from "./cross-section";
import {
  ACCENT, INK, MUTED, contentWidth, createDocument, ensureSpace, fmtDate, footers, header, heading, num, paragraph, pdfText, table, toBuffer, type ShopDetails,
} from "./pdf";

export const ESTIMATE_CAUTION =
  "Predicted attenuation is an engineering estimate, not a guarantee: seams, lid joints, holes and handling after the anneal " +
  "decide what a built shield reaches, and the measured values on each lot's certificate of conformance rule. " +
  "Safety-critical uses (medical, life safety) need your own qualified review.";

export interface QuoteDocumentData {
  number: number;
  createdAt: Date;
  expiresAt: Date;
  quantity: number;
  configuration: QuoteConfiguration;
  prediction: PredictionResult;
  price: PriceBuildUp;
  leadTimeWorkingDays: number;
  validityDays: number;
  massKg: number | null;
  organizationName: string;
  preparedFor: string | null;
  paperSize: PaperSize;
  shop: ShopDetails & { quoteTerms: string };
  materialNames: Map<string, string>;
}

const money = (cents: number, currency: string) => formatMoney(cents, currency);

function designLines(c: QuoteConfiguration, massKg: number | null): Array<[string, string]> {
  const d = c.dimensions_mm as Record<string, number>;
  const lines: Array<[string, string]> = [
    ["Shape", `${c.shape === "box" ? "Rectangular box" : "Cylindrical can"}, ${c.method === "drawn" ? "deep drawn" : c.method === "rolled" ? "rolled and seam-welded" : "bent and corner-welded"}`],
    ["Inside size", c.shape === "box" ? `${num(d.width)} × ${num(d.depth)} × ${num(d.height)} mm (width × depth × height)` : `dia. ${num(d.diameter)} mm × ${num(d.length)} mm long`],
  ];
  if (c.shape === "cylinder") lines.push(["Ends", c.ends === "open" ? "open" : "closed"]);
  if (c.shape === "box") lines.push(["Lid", c.lid === false ? "none" : "yes"]);
  const holes = c.holes ?? [];
  if (holes.length) lines.push(["Cable holes", holes.map((h) => `dia. ${num(h.diameter_mm)} mm${h.collarLength_mm ? ` with a ${num(h.collarLength_mm)} mm collar` : ""}`).join("; ")]);
  const f = c.field;
  lines.push(["Field", `${num(f.amplitude_uT, 3)} µT ${f.frequency_hz === 0 ? "static" : `at ${num(f.frequency_hz, 3)} Hz`}, ${f.orientation === "axial" ? "along the axis" : "across the axis"}`]);
  lines.push(["Material state", c.state === "as-formed" ? "as formed (no final anneal)" : "hydrogen-annealed after forming"]);
  lines.push(["Attenuation needed", `${num(c.requiredAttenuation_db, 1)} dB`]);
  if (massKg !== null) lines.push(["Mass", `${num(massKg, 3)} kg per assembly`]);
  return lines;
}

/** The quote as the customer receives it: shop, design and cross-section, prediction, every price line, validity, terms. */
export async function renderQuotePdf(q: QuoteDocumentData): Promise<Buffer> {
  const number = documentNumber("quote", q.number);
  const currency = q.price.currency;
  const doc = createDocument({ paperSize: q.paperSize, title: `Quote ${number}`, author: q.shop.name, subject: `Quote ${number} for ${q.organizationName}` });
  const left = doc.page.margins.left;
  const width = contentWidth(doc);

  header(doc, q.shop, `Quote ${number}`, [
    ["Date", fmtDate(q.createdAt)],
    ["Valid until", fmtDate(q.expiresAt)],
    ["Customer", q.organizationName],
    ...(q.preparedFor ? ([["Prepared for", q.preparedFor]] as Array<[string, string]>) : []),
    ["Quantity", `${q.quantity} assembl${q.quantity === 1 ? "y" : "ies"}`],
    ["Lead time", `${q.leadTimeWorkingDays} working days from payment`],
  ]);

  // --- the design, with its cross-section beside it ---
  heading(doc, "The design");
  const drawing = 180;
  const top = doc.y;
  ensureSpace(doc, drawing + 10);
  const textWidth = width - drawing - 16;
  let y = doc.y;
  for (const [label, value] of designLines(q.configuration, q.massKg)) {
    doc.font("body").fontSize(9).fillColor(MUTED).text(pdfText(label), left, y, { width: 105 });
    doc.font("body").fontSize(9.5).fillColor(INK).text(pdfText(value), left + 105, y, { width: textWidth - 105 });
    y = Math.max(doc.y, y + 12) + 2;
  }
  drawCrossSection(doc, q.configuration, left + width - drawing, Math.max(top, doc.page.margins.top), drawing);
  doc.font("body").fontSize(7.5).fillColor(MUTED).text("Section across the axis, to scale", left + width - drawing, top + drawing, { width: drawing, align: "center" });
  doc.x = left;
  doc.y = Math.max(y, top + drawing + 14) + 4;
  table(
    doc,
    [
      { header: "Layer (inside out)", width: 0.2 },
      { header: "Material", width: 0.5 },
      { header: "Wall", width: 0.15, align: "right" },
      { header: "Gap outside it", width: 0.15, align: "right" },
    ],
    q.configuration.layers.map((l, i) => [
      String(i + 1),
      l.material
        ? (q.materialNames.get(l.material) ?? l.material)
        : `µr ${num(l.mu_r ?? 1, 0)}, ${l.resistivity_ohm_m} Ω·m as given, made in ${q.materialNames.get(l.pricedAs ?? "") ?? l.pricedAs}`,
      `${num(l.thickness_mm, 3)} mm`,
      i < q.configuration.layers.length - 1 ? `${num(l.gap_mm ?? 0, 3)} mm` : "-",
    ]),
  );

  // --- the prediction ---
  heading(doc, "Predicted attenuation");
  const p = q.prediction as PredictionResult & { ideal?: { attenuation_db: number } };
  const f = q.configuration.field;
  paragraph(doc, `${num(p.attenuation_db, 1)} dB (shielding factor ${num(p.shieldingFactor, 1)}) for ${num(f.amplitude_uT, 3)} µT ${f.frequency_hz === 0 ? "static" : `at ${num(f.frequency_hz, 3)} Hz`}.`, { font: "bold", size: 11 });
  if (p.band) paragraph(doc, `Expected band: ${num(p.band.low_db, 1)} to ${num(p.band.high_db, 1)} dB (${p.band.basis}).`);
  if (p.ideal) paragraph(doc, `An ideal seamless shell of these layers would reach ${num(p.ideal.attenuation_db, 1)} dB.`, { color: MUTED });
  const low = p.band?.low_db ?? p.attenuation_db;
  const need = q.configuration.requiredAttenuation_db;
  paragraph(doc, low >= need ? `You need ${num(need, 1)} dB: the low end of the band meets it with ${num(low - need, 1)} dB to spare.` : `You need ${num(need, 1)} dB: the low end of the band falls ${num(need - low, 1)} dB short of it. Talk to us before ordering.`, {
    color: low >= need ? INK : ACCENT,
  });
  for (const w of p.warnings ?? []) paragraph(doc, `Note: ${w.message}`, { color: ACCENT });
  paragraph(doc, `Method: ${p.method}.`, { color: MUTED, size: 8.5 });
  doc.moveDown(0.3);
  paragraph(doc, ESTIMATE_CAUTION, { color: MUTED, size: 8.5 });

  // --- the price: selling amounts only, never the shop's rates or margin ---
  heading(doc, "Price");
  const selling = customerPrice(q.price);
  const rows = selling.lines.filter((l) => l.total_cents !== 0).map((l) => [l.label, num(l.quantity, 3), money(l.total_cents, currency)]);
  rows.push(["Sum of the lines", "", money(selling.subtotal_cents, currency)]);
  if (q.price.discount_cents) rows.push([`Quantity discount (${num(q.price.discountPercent)} %)`, "", `-${money(q.price.discount_cents, currency)}`]);
  if (q.price.rounding_cents) rows.push(["Rounding to whole cents per assembly", "", money(q.price.rounding_cents, currency)]);
  rows.push(["Price per assembly", "", money(q.price.unitPrice_cents, currency)]);
  rows.push([`Total for ${q.quantity} assembl${q.quantity === 1 ? "y" : "ies"} (${currency})`, String(q.quantity), money(q.price.total_cents, currency)]);
  table(doc, [{ header: "Item", width: 0.62 }, { header: "Quantity", width: 0.14, align: "right" }, { header: "Amount", width: 0.24, align: "right" }], rows, { boldLast: true });

  heading(doc, "Validity and lead time");
  paragraph(doc, `This quote holds its price for ${q.validityDays} days, until ${fmtDate(q.expiresAt)}. After that, ask for a new quote at the rates of the day. Lead time: ${q.leadTimeWorkingDays} working days from the day the payment arrives, subject to material in stock.`);
  if (q.shop.quoteTerms.trim()) {
    heading(doc, "Terms");
    paragraph(doc, q.shop.quoteTerms, { size: 8.5 });
  }
  footers(doc, `Quote ${number} · ${q.shop.name} · predicted figures are engineering estimates`);
  return toBuffer(doc);
}
