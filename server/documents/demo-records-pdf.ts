import { createDocument, heading, INK, MUTED, ACCENT, paragraph, table, toBuffer, contentWidth, header, type ShopDetails } from "./pdf";

// Paper records the demo scenario attaches: a supplier's mill certificate and a furnace's chart
// recorder trace. Invented, and marked as such on the page.

export async function renderDemoMillCertificate(p: { supplier: string; heatNumber: string; alloy: string; thickness_mm: number; quantity: string; issuedOn: string }): Promise<Buffer> {
  const doc = createDocument({ paperSize: "A4", title: `Mill certificate ${p.heatNumber}`, author: p.supplier, subject: `Heat ${p.heatNumber}` });
  const supplier: ShopDetails = { name: p.supplier, address: "Invented supplier for the demo scenario", email: "", phone: "", taxId: "" };
  header(doc, supplier, "Inspection certificate (demo)", [
    ["Heat number", p.heatNumber],
    ["Product", `${p.alloy}, cold-rolled strip ${p.thickness_mm} mm`],
    ["Quantity", p.quantity],
    ["Issued", p.issuedOn],
  ]);
  heading(doc, "Chemical analysis, % by mass (invented demo values)");
  table(doc, [{ header: "Ni", width: 0.2 }, { header: "Mo", width: 0.2 }, { header: "Mn", width: 0.2 }, { header: "Si", width: 0.2 }, { header: "Fe", width: 0.2 }], [
    p.alloy.includes("50") ? ["48.1", "-", "0.45", "0.22", "balance"] : ["80.2", "4.9", "0.48", "0.31", "balance"],
  ]);
  heading(doc, "Statement");
  paragraph(doc, "This document belongs to the invented demo scenario of Fluxwright. It stands in for the producer's certificate that a real delivery carries.", { color: MUTED });
  return toBuffer(doc);
}

/** A time–temperature trace as a chart recorder draws it: ramp, soak, furnace cool, controlled cool. */
export async function renderDemoFurnaceChart(p: { runNumber: string; furnace: string; peak_c: number; soak_min: number; coolingRate_c_per_h: number }): Promise<Buffer> {
  const doc = createDocument({ paperSize: "A4", title: `Furnace chart ${p.runNumber}`, author: p.furnace, subject: `Run ${p.runNumber}` });
  const left = doc.page.margins.left;
  const width = contentWidth(doc);
  doc.font("display").fontSize(16).fillColor(INK).text(`Chart recorder trace, run ${p.runNumber} (demo)`, left, doc.page.margins.top);
  doc.font("body").fontSize(9).fillColor(MUTED).text(`${p.furnace} · peak ${p.peak_c} °C · ${p.soak_min} min at temperature · cooling ${p.coolingRate_c_per_h} °C/h through 600–300 °C`);
  const top = doc.y + 16;
  const h = 300;
  doc.rect(left, top, width, h).lineWidth(0.5).strokeColor(MUTED).stroke();
  // hours along x, 0–1300 °C up y
  const ramp = 6;
  const soak = p.soak_min / 60;
  const furnaceCool = 4;
  const controlled = 300 / p.coolingRate_c_per_h;
  const total = ramp + soak + furnaceCool + controlled + 2;
  const X = (t: number) => left + (t / total) * width;
  const Y = (c: number) => top + h - (c / 1300) * h;
  const points: Array<[number, number]> = [[0, 20], [ramp, p.peak_c], [ramp + soak, p.peak_c], [ramp + soak + furnaceCool, 600], [ramp + soak + furnaceCool + controlled, 300], [total, 80]];
  doc.moveTo(X(points[0][0]), Y(points[0][1]));
  for (const [t, c] of points.slice(1)) doc.lineTo(X(t), Y(c));
  doc.lineWidth(1.5).strokeColor(ACCENT).stroke();
  doc.font("body").fontSize(8).fillColor(MUTED);
  for (const c of [300, 600, 900, 1200]) doc.text(`${c} °C`, left + 4, Y(c) - 10);
  doc.text(`${Math.round(total)} h`, left + width - 30, top + h + 4);
  doc.y = top + h + 24;
  paragraph(doc, "Invented trace for the demo scenario.", { color: MUTED });
  return toBuffer(doc);
}
