// Reads the barcodes printed in a PDF with a decoder that is not the one that drew them: poppler's
// pdfimages takes the embedded images out, ZXing (a general-purpose reader) decodes each.
import { BarcodeFormat, BinaryBitmap, DecodeHintType, HybridBinarizer, MultiFormatReader, RGBLuminanceSource } from "@zxing/library";
import { execFileSync } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { PNG } from "pngjs";

function decode(png: PNG): string | null {
  // as printed, then four times larger (a symbol drawn one pixel a module is too fine for the binarizer)
  return decodeAt(png, 1, false) ?? decodeAt(png, 4, false) ?? decodeAt(png, 1, true);
}

function decodeAt(png: PNG, scale: number, pure: boolean): string | null {
  // a white quiet zone round the symbol, as the paper gives it
  const pad = 24;
  const w = png.width * scale + 2 * pad;
  const h = png.height * scale + 2 * pad;
  const lum = new Uint8ClampedArray(w * h).fill(255);
  for (let y = 0; y < png.height * scale; y++) {
    for (let x = 0; x < png.width * scale; x++) {
      const i = (Math.floor(y / scale) * png.width + Math.floor(x / scale)) * 4;
      const a = png.data[i + 3] / 255;
      const grey = (png.data[i] + png.data[i + 1] + png.data[i + 2]) / 3;
      lum[(y + pad) * w + x + pad] = Math.round(grey * a + 255 * (1 - a));
    }
  }
  const reader = new MultiFormatReader();
  const hints = new Map<DecodeHintType, unknown>([
    [DecodeHintType.POSSIBLE_FORMATS, [BarcodeFormat.CODE_128, BarcodeFormat.DATA_MATRIX, BarcodeFormat.QR_CODE]],
    [DecodeHintType.TRY_HARDER, true],
    // a generated symbol on its own quiet zone, unrotated: read it module by module
    ...(pure ? [[DecodeHintType.PURE_BARCODE, true] as [DecodeHintType, unknown]] : []),
  ]);
  // ZXing warns on the console for each format that finds no symbol where it looks (pure mode): a
  // miss here is the answer null, and the warnings buried real failures in the suite's output
  const warn = console.warn;
  console.warn = () => {};
  try {
    return reader.decode(new BinaryBitmap(new HybridBinarizer(new RGBLuminanceSource(lum, w, h))), hints).getText();
  } catch {
    return null;
  } finally {
    console.warn = warn;
  }
}

/** The text of every barcode image embedded in the PDF, in page order. */
export function pdfBarcodes(pdf: Buffer): string[] {
  const dir = mkdtempSync(path.join(tmpdir(), "fw-barcodes-"));
  try {
    const file = path.join(dir, "doc.pdf");
    writeFileSync(file, pdf);
    execFileSync("pdfimages", ["-png", file, path.join(dir, "img")]);
    const out: string[] = [];
    for (const name of readdirSync(dir).filter((f) => f.endsWith(".png")).sort()) {
      const text = decode(PNG.sync.read(readFileSync(path.join(dir, name))));
      if (text !== null) out.push(text);
    }
    return out;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
