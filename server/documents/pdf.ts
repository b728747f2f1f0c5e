import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { inflateSync } from "node:zlib";
import PDFDocument from "pdfkit";
import type { PaperSize } from "../../shared/schemas/shop-settings";

// The shared pieces of every PDF the shop sends: fonts shipped with the app (static .woff files:
// pdfkit cannot read the variable .woff2 ones), the house colours, a header with the shop's
// details, tables, and page numbers. Text goes through pdfText so no glyph is missing.

const require = createRequire(import.meta.url);
const font = (pkg: string, file: string) => woffToSfnt(readFileSync(require.resolve(`@fontsource/${pkg}/files/${file}`)));

/**
 * A WOFF 1.0 font as the plain TrueType/OpenType file it wraps (W3C WOFF 1.0, sections 4–6), unpacked
 * once with node's zlib: handed the .woff, fontkit inflates every table again in JavaScript for
 * each document (most of a certificate's rendering time).
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString("latin1", 0, 4) !== "wOFF") return woff;
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const raw = woff.subarray(offset, offset + compLength);
    return { tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data: compLength < origLength ? inflateSync(raw) : raw };
  });
  const pow = 2 ** Math.floor(Math.log2(numTables));
  const header = Buffer.alloc(12 + numTables * 16);
  header.writeUInt32BE(flavor, 0);
  header.writeUInt16BE(numTables, 4);
  header.writeUInt16BE(pow * 16, 6);
  header.writeUInt16BE(Math.log2(pow), 8);
  header.writeUInt16BE(numTables * 16 - pow * 16, 10);
  const parts: Buffer[] = [header];
  let offset = header.length;
  tables.forEach((t, i) => {
    header.writeUInt32BE(t.tag, 12 + i * 16);
    header.writeUInt32BE(t.checksum, 16 + i * 16);
    header.writeUInt32BE(offset, 20 + i * 16);
    header.writeUInt32BE(t.data.length, 24 + i * 16);
    const padded = Buffer.alloc((t.data.length + 3) & ~3);
    t.data.copy(padded);
    parts.push(padded);
    offset += padded.length;
  });
  return Buffer.concat(parts);
}

let fonts: Record<string, Buffer> | undefined;
function loadFonts(): Record<string, Buffer> {
  fonts ??= {
    body: font("ibm-plex-sans", "ibm-plex-sans-latin-400-normal.woff"),
    bold: font("ibm-plex-sans", "ibm-plex-sans-latin-600-normal.woff"),
    mono: font("ibm-plex-mono", "ibm-plex-mono-latin-400-normal.woff"),
    display: font("space-grotesk", "space-grotesk-latin-600-normal.woff"),
  };
  return fonts;
}

export const INK = "#1d2834";
export const MUTED = "#5a6f84";
export const RULE = "#c5d2de";
export const ACCENT = "#b34a0c";
export const STEEL = "#384859";
export const COPPER = "#f9a867";
export const MARGIN = 50;

/** The fonts carry Latin-1 and common punctuation: map the few signs outside it. */
export function pdfText(s: string): string {
  return s
    .replace(/μ/g, "µ")
    .replace(/⌀\s?/g, "dia. ")
    .replace(/≥/g, ">=")
    .replace(/≤/g, "<=")
    .replace(/≈/g, "~")
    .replace(/[^\n\t\u0020-\u00ff\u0131\u0152\u0153\u02c6\u02dc\u2000-\u206f\u20ac\u2122\u2212]/g, "?");
}

export type Doc = PDFKit.PDFDocument;

export function createDocument(props: { paperSize: PaperSize; title: string; author: string; subject: string }): Doc {
  const doc = new PDFDocument({
    size: props.paperSize === "LETTER" ? "LETTER" : "A4",
    margins: { top: MARGIN, bottom: MARGIN + 20, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: { Title: pdfText(props.title), Author: pdfText(props.author), Subject: pdfText(props.subject), Creator: "Fluxwright" },
  });
  const f = loadFonts();
  for (const [name, data] of Object.entries(f)) doc.registerFont(name, data);
  doc.font("body").fontSize(10).fillColor(INK);
  return doc;
}

export function toBuffer(doc: Doc): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
    doc.end();
  });
}

export const contentWidth = (doc: Doc) => doc.page.width - doc.page.margins.left - doc.page.margins.right;

export interface ShopDetails {
  name: string;
  address: string;
  email: string;
  phone: string;
  taxId: string;
}

/** The shop's block at the top right and the document's title at the left. */
export function header(doc: Doc, shop: ShopDetails, title: string, lines: Array<[string, string]>): void {
  const left = doc.page.margins.left;
  const width = contentWidth(doc);
  const top = doc.page.margins.top;
  doc.font("display").fontSize(20).fillColor(INK).text(pdfText(title), left, top, { width: width * 0.55 });
  let y = doc.y + 6;
  for (const [label, value] of lines) {
    doc.font("body").fontSize(9).fillColor(MUTED).text(pdfText(label), left, y, { width: 95 });
    doc.font("bold").fontSize(9).fillColor(INK).text(pdfText(value), left + 95, y, { width: width * 0.55 - 95 });
    y = Math.max(doc.y, y + 12) + 1;
  }
  const shopLines = [shop.address, [shop.email, shop.phone].filter(Boolean).join(" · "), shop.taxId ? `Tax number ${shop.taxId}` : ""].filter(Boolean);
  doc.font("bold").fontSize(11).fillColor(INK).text(pdfText(shop.name), left + width * 0.58, top + 2, { width: width * 0.42, align: "right" });
  doc.font("body").fontSize(8.5).fillColor(MUTED).text(pdfText(shopLines.join("\n")), { width: width * 0.42, align: "right" });
  const bottom = Math.max(y, doc.y) + 10;
  doc.moveTo(left, bottom).lineTo(left + width, bottom).lineWidth(1).strokeColor(ACCENT).stroke();
  doc.x = left;
  doc.y = bottom + 12;
}

/** Starts a new page when fewer than `needed` points are left. */
export function ensureSpace(doc: Doc, needed: number): void {
  if (doc.y + needed > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

export function heading(doc: Doc, text: string): void {
  ensureSpace(doc, 40);
  doc.moveDown(0.6);
  doc.font("display").fontSize(12.5).fillColor(INK).text(pdfText(text), doc.page.margins.left, doc.y);
  doc.moveDown(0.25);
  doc.font("body").fontSize(10).fillColor(INK);
}

export function paragraph(doc: Doc, text: string, opts: { color?: string; size?: number; font?: string } = {}): void {
  doc.font(opts.font ?? "body").fontSize(opts.size ?? 9.5).fillColor(opts.color ?? INK).text(pdfText(text), doc.page.margins.left, doc.y, { width: contentWidth(doc) });
}

export interface Column {
  header: string;
  width: number;
  align?: "left" | "right";
  font?: string;
}

/** A table with a header row; `widths` are fractions of the content width. Rows break across pages. */
export function table(doc: Doc, columns: Column[], rows: string[][], opts: { boldLast?: boolean } = {}): void {
  const left = doc.page.margins.left;
  const width = contentWidth(doc);
  const xs: number[] = [];
  let x = left;
  for (const c of columns) {
    xs.push(x);
    x += c.width * width;
  }
  const drawRow = (cells: string[], kind: "head" | "body" | "last") => {
    const size = kind === "head" ? 8.5 : 9.5;
    const heights = cells.map((cell, i) => {
      doc.font(kind === "head" ? "bold" : columns[i].font ?? "body").fontSize(size);
      return doc.heightOfString(pdfText(cell), { width: columns[i].width * width - 8 });
    });
    const h = Math.max(...heights) + 6;
    ensureSpace(doc, h + 4);
    const y = doc.y;
    cells.forEach((cell, i) => {
      doc.font(kind === "head" ? "bold" : kind === "last" && opts.boldLast ? "bold" : columns[i].font ?? "body").fontSize(size).fillColor(kind === "head" ? MUTED : INK);
      doc.text(pdfText(cell), xs[i] + 4, y + 3, { width: columns[i].width * width - 8, align: columns[i].align ?? "left" });
    });
    doc.y = y + h;
    doc.moveTo(left, doc.y).lineTo(left + width, doc.y).lineWidth(kind === "head" ? 0.8 : 0.4).strokeColor(RULE).stroke();
  };
  drawRow(columns.map((c) => c.header), "head");
  rows.forEach((r, i) => drawRow(r, i === rows.length - 1 ? "last" : "body"));
  doc.x = left;
  doc.moveDown(0.3);
}

/** Page numbers and a line at the foot of every page (drawn last, over the buffered pages). */
export function footers(doc: Doc, text: string): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0; // writing inside the bottom margin must not add a page
    const y = doc.page.height - MARGIN + 8;
    doc.font("body").fontSize(7.5).fillColor(MUTED);
    doc.text(pdfText(text), doc.page.margins.left, y, { width: contentWidth(doc) - 60, lineBreak: false });
    doc.text(`Page ${i + 1} of ${range.count}`, doc.page.margins.left, y, { width: contentWidth(doc), align: "right", lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
}

export const fmtDate = (d: Date) => d.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
/** A number with up to `digits` decimals, no trailing zeros. */
export const num = (x: number, digits = 2) => String(+x.toFixed(digits));
