import bwipjs from "bwip-js/node";

// Barcodes as PNG images for pdfkit, drawn by bwip-js. The text below a symbol is printed by the
// document in its own font, so people read the same characters the scanner does. An opaque white
// ground, so the symbol prints the same on any paper and viewer.

/** A Code 128 symbol of `text` (job codes, step barcodes); `heightMm` is the bars' height. */
export function code128(text: string, heightMm = 10): Promise<Buffer> {
  return bwipjs.toBuffer({ bcid: "code128", text, scale: 3, height: heightMm, includetext: false, paddingwidth: 0, paddingheight: 0, backgroundcolor: "FFFFFF" });
}

/** A Data Matrix symbol of `text` (lot labels). */
export function dataMatrix(text: string): Promise<Buffer> {
  return bwipjs.toBuffer({ bcid: "datamatrix", text, scale: 4, paddingwidth: 0, paddingheight: 0, backgroundcolor: "FFFFFF" });
}
