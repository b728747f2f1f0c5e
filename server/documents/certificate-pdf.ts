import bwipjs from "bwip-js/node";
import type { CertificateContent } from "../../shared/schemas/quality";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import { ACCENT, contentWidth, createDocument, ensureSpace, footers, heading, INK, MUTED, num, paragraph, pdfText, RULE, STEEL, table, toBuffer, type Doc } from "./pdf";

// The certificate of conformance: everything the content certifies, a chart of each sampled part's
// measured attenuation against the required and predicted figures, the QR code to the public
// verification page and the digest of the canonical content. Rendered once, at issue, and kept.

/** The QR code of the verification address, as a PNG for pdfkit (white ground, quiet zone). */
function qrCode(text: string): Promise<Buffer> {
  return bwipjs.toBuffer({ bcid: "qrcode", text, scale: 3, paddingwidth: 4, paddingheight: 4, backgroundcolor: "FFFFFF" });
}

/** Measured dB per part as bars against the required line and the predicted line. */
function chart(doc: Doc, c: CertificateContent): void {
  const rows = c.measurements;
  if (!rows.length) return;
  ensureSpace(doc, 190);
  const left = doc.page.margins.left + 34;
  const width = contentWidth(doc) - 44;
  const top = doc.y + 6;
  const height = 140;
  const values = rows.map((m) => m.attenuation_db);
  const figures = [...values, c.order.requiredAttenuation_db, ...(c.predicted_db !== null ? [c.predicted_db] : [])];
  const hi = Math.ceil((Math.max(...figures) + 5) / 10) * 10;
  const lo = Math.max(0, Math.floor((Math.min(...figures) - 10) / 10) * 10);
  const y = (db: number) => top + height - ((db - lo) / (hi - lo)) * height;
  doc.lineWidth(0.5).strokeColor(RULE);
  for (let g = lo; g <= hi; g += 10) {
    doc.moveTo(left, y(g)).lineTo(left + width, y(g)).stroke();
    doc.font("body").fontSize(7.5).fillColor(MUTED).text(`${g} dB`, left - 34, y(g) - 4, { width: 30, align: "right" });
  }
  const step = width / rows.length;
  const bar = Math.max(1, Math.min(18, step * 0.7));
  rows.forEach((m, i) => {
    const x = left + i * step + (step - bar) / 2;
    doc.rect(x, y(m.attenuation_db), bar, top + height - y(m.attenuation_db)).fill(m.pass ? STEEL : ACCENT);
  });
  doc.lineWidth(1.2).strokeColor(ACCENT).moveTo(left, y(c.order.requiredAttenuation_db)).lineTo(left + width, y(c.order.requiredAttenuation_db)).stroke();
  if (c.predicted_db !== null) doc.lineWidth(1).strokeColor(INK).dash(4, { space: 3 }).moveTo(left, y(c.predicted_db)).lineTo(left + width, y(c.predicted_db)).stroke().undash();
  doc.font("body").fontSize(8).fillColor(MUTED).text(
    pdfText(`Bars: measured attenuation per sampled part (${rows.length}). Solid line: required ${num(c.order.requiredAttenuation_db, 1)} dB.${c.predicted_db !== null ? ` Dashed line: predicted ${num(c.predicted_db, 1)} dB (an estimate).` : ""}`),
    doc.page.margins.left, top + height + 6, { width: contentWidth(doc) },
  );
  doc.moveDown(0.5);
}

export async function renderCertificatePdf(props: { content: CertificateContent; digest: string; verifyUrl: string; paperSize: PaperSize }): Promise<Buffer> {
  const { content: c, digest } = props;
  const title = `Certificate of conformance ${c.certificate.number} rev. ${c.certificate.revision}`;
  const doc = createDocument({ paperSize: props.paperSize, title, author: c.issuer.name, subject: `Lot ${c.lot.number}, order ${c.order.number}` });
  // a fixed creation date: the file is the record of the issue
  doc.info.CreationDate = new Date(c.issuedAt);
  const left = doc.page.margins.left;
  const width = contentWidth(doc);

  doc.font("display").fontSize(19).fillColor(INK).text("Certificate of conformance", left, doc.page.margins.top, { width: width - 120 });
  doc.font("bold").fontSize(10).text(pdfText(`${c.certificate.number}, revision ${c.certificate.revision}`), { width: width - 120 });
  doc.font("body").fontSize(9).fillColor(MUTED).text(pdfText(`${c.issuer.name}, ${c.issuer.address.replace(/\n/g, ", ")}`), { width: width - 120 });
  const qr = await qrCode(props.verifyUrl);
  doc.image(qr, left + width - 100, doc.page.margins.top - 6, { width: 100 });
  doc.font("body").fontSize(7).fillColor(MUTED).text("Scan to verify", left + width - 100, doc.page.margins.top + 96, { width: 100, align: "center" });
  doc.y = Math.max(doc.y, doc.page.margins.top + 110);
  if (c.certificate.supersedes) {
    paragraph(doc, `This revision supersedes revision ${c.certificate.supersedes.revision} (digest ${c.certificate.supersedes.digest}). Reason: ${c.certificate.revisionReason ?? ""}`, { color: ACCENT, size: 9 });
  }
  doc.moveTo(left, doc.y + 4).lineTo(left + width, doc.y + 4).lineWidth(1).strokeColor(ACCENT).stroke();
  doc.y += 10;

  const facts: Array<[string, string]> = [
    ["Customer", c.customer.organization],
    ["Order", `${c.order.number}${c.order.purchaseOrder ? ` (purchase order ${c.order.purchaseOrder})` : ""}`],
    ["Part", c.part.description],
    ["Drawing / design", c.part.drawingRevision],
    ["Lot and quantity", `${c.lot.number}, ${c.lot.quantity} pieces`],
    ["Material", `${c.material.alloy}; heats ${c.material.heats.map((h) => `${h.heatNumber} (${h.supplier}, mill certificate ${h.millCertificate})`).join("; ") || "none recorded"}`],
    ["Forming route", c.formingRoute.join(" > ")],
    ["Furnace run", c.furnaceRun ? `${c.furnaceRun.number}: peak ${num(c.furnaceRun.peakTemperature_c, 0)} °C, soak ${num(c.furnaceRun.soak_min, 0)} min, dew point ${num(c.furnaceRun.dewPoint_c, 0)} °C, cooling ${num(c.furnaceRun.coolingRate_c_per_h, 0)} °C/h, ${c.furnaceRun.ranAt.slice(0, 10)}` : "none recorded"],
    ["Sampling plan", `${c.samplingPlan.standard}; code letter ${c.samplingPlan.codeLetter}, AQL ${c.samplingPlan.aql}, sample ${c.samplingPlan.sampleSize}, Ac ${c.samplingPlan.accept}, Re ${c.samplingPlan.reject}`],
    ["Required attenuation", `${num(c.order.requiredAttenuation_db, 1)} dB; predicted ${c.predicted_db === null ? "n/a" : `${num(c.predicted_db, 1)} dB (an estimate)`}`],
    ["Result", `${c.result.measured} measured, ${c.result.failures} failing: lot ${c.result.decision}${c.result.concession ? ` by concession (${c.result.concession})` : ""}`],
  ];
  table(doc, [{ header: "", width: 0.24, font: "bold" }, { header: "", width: 0.76 }], facts.map(([k, v]) => [k, v]));

  heading(doc, "Measured against predicted");
  chart(doc, c);

  heading(doc, "Sampled parts");
  table(
    doc,
    [
      { header: "Serial", width: 0.16 },
      { header: "Applied (µT)", width: 0.13, align: "right" },
      { header: "Inside (µT)", width: 0.13, align: "right" },
      { header: "Freq. (Hz)", width: 0.1, align: "right" },
      { header: "Orientation / probe", width: 0.2 },
      { header: "S", width: 0.1, align: "right" },
      { header: "dB", width: 0.09, align: "right" },
      { header: "Pass", width: 0.09 },
    ],
    c.measurements.map((m) => [m.serial, num(m.appliedField_uT, 3), num(m.insideField_uT, 4), num(m.frequency_hz, 1), `${m.orientation}, ${m.probePosition}`, num(m.shieldingFactor, 1), num(m.attenuation_db, 1), m.pass ? "pass" : "FAIL"]),
  );

  heading(doc, "Instruments");
  table(
    doc,
    [{ header: "Instrument", width: 0.34 }, { header: "Kind", width: 0.22 }, { header: "Serial", width: 0.16 }, { header: "Calibrated", width: 0.14 }, { header: "Due", width: 0.14 }],
    c.instruments.map((i) => [i.name, i.kind, i.serialNumber, i.lastCalibratedOn, i.calibrationDue]),
  );

  heading(doc, "Statement");
  paragraph(doc, c.statement);
  doc.moveDown(0.6);
  paragraph(doc, `Signed: ${c.signer.name} (${c.signer.role}), ${c.issuedAt.slice(0, 10)}`, { font: "bold" });
  doc.moveDown(0.6);
  paragraph(doc, `SHA-256 digest of the certified content (canonical form): ${digest}`, { size: 8, font: "bold" });
  paragraph(doc, `Verify at ${props.verifyUrl}`, { size: 8, color: MUTED });
  footers(doc, `${c.certificate.number} rev. ${c.certificate.revision} · lot ${c.lot.number}`);
  return toBuffer(doc);
}
