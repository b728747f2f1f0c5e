import { fileTypeFromFile } from "file-type";
import { open } from "node:fs/promises";
import { drawingKinds, type DrawingKind } from "../../shared/schemas/order";

// What an upload (a drawing, a certificate) is, decided by its bytes (file-type's signatures; DXF and STEP, being text, by
// their headers), never by its name. The name's extension must then agree with the content.

const HEAD_BYTES = 4096;

/** file-type's extension → our kind */
const SNIFFED: Record<string, string> = { pdf: "pdf", png: "png", jpg: "jpg", tif: "tif", webp: "webp" };

async function head(file: string): Promise<string> {
  const handle = await open(file, "r");
  try {
    const buffer = Buffer.alloc(HEAD_BYTES);
    const { bytesRead } = await handle.read(buffer, 0, HEAD_BYTES, 0);
    return buffer.subarray(0, bytesRead).toString("latin1");
  } finally {
    await handle.close();
  }
}

/** ASCII DXF: optional 999 comments, then group code 0 and SECTION; binary DXF has its own sentinel. */
const DXF_ASCII = /^\uFEFF?(?:\s*999\r?\n[^\n]*\n)*\s*0\r?\nSECTION\r?\n/;
const DXF_BINARY = "AutoCAD Binary DXF\r\n\x1a\x00";
/** STEP physical file (ISO 10303-21) */
const STEP = /^\uFEFF?\s*ISO-10303-21;/;

export type SniffResult<K extends string = DrawingKind> = { ok: true; kind: K; mime: string } | { ok: false; reason: string };

/** The kinds an upload may be: file-type's extension (or "dxf"/"step" for those text formats) → label, MIME type, allowed name endings. */
export type UploadKinds<K extends string> = Record<K, { label: string; mime: string; extensions: readonly string[] }>;

/**
 * What an upload is, by its bytes, among the kinds allowed; the name's extension must agree.
 * `described` names the allowed kinds in the refusal ("a PDF or image certificate").
 */
export async function sniffUpload<K extends string>(file: string, filename: string, kinds: UploadKinds<K>, described: string): Promise<SniffResult<K>> {
  const ext = path_ext(filename);
  const allowed = (k: string) => Object.prototype.hasOwnProperty.call(kinds, k);
  const detected = await fileTypeFromFile(file);
  let found: string;
  if (detected) {
    const ours = SNIFFED[detected.ext];
    if (!ours || !allowed(ours)) return { ok: false, reason: `its content is ${describe(detected.ext, detected.mime)}, not ${described}` };
    found = ours;
  } else {
    const text = await head(file);
    if (allowed("dxf") && (text.startsWith(DXF_BINARY) || DXF_ASCII.test(text))) found = "dxf";
    else if (allowed("step") && STEP.test(text)) found = "step";
    else return { ok: false, reason: `its content is not ${described}` };
  }
  const kind = found as K;
  const endings: readonly string[] = kinds[kind].extensions;
  if (!endings.includes(ext)) {
    return { ok: false, reason: `its content is a ${kinds[kind].label} but the name ends in ${ext ? `.${ext}` : "no extension"}; name it .${endings[0]}` };
  }
  return { ok: true, kind, mime: kinds[kind].mime };
}

export function sniffDrawing(file: string, filename: string): Promise<SniffResult> {
  return sniffFile(file, filename, DRAWINGS);
}

/** The kinds a use accepts, and how to name them to people. */
export interface Accepted {
  kinds: readonly DrawingKind[];
  what: string;
}
/** Drawings: PDF, DXF, STEP or an image. */
export const DRAWINGS: Accepted = { kinds: Object.keys(drawingKinds) as DrawingKind[], what: "a PDF, DXF, STEP or image (PNG, JPEG, TIFF, WebP) drawing" };
/** A scanned paper record (a mill certificate, a furnace chart): PDF or an image. */
export const PAPER_RECORDS: Accepted = { kinds: ["pdf", "png", "jpg", "tif", "webp"], what: "a PDF or an image (PNG, JPEG, TIFF, WebP)" };

/** The file's kind by its content, when it is one of the accepted kinds and its name agrees. */
export async function sniffFile(file: string, filename: string, accepted: Accepted): Promise<SniffResult> {
  const sniffed = await sniffUpload(file, filename, drawingKinds, accepted.what);
  if (sniffed.ok && !accepted.kinds.includes(sniffed.kind)) return { ok: false, reason: `its content is a ${drawingKinds[sniffed.kind].label}, not ${accepted.what}` };
  return sniffed;
}

function path_ext(filename: string): string {
  const m = /\.([A-Za-z0-9]{1,8})$/.exec(filename);
  return m ? m[1].toLowerCase() : "";
}

function describe(ext: string, mime: string): string {
  const named: Record<string, string> = { exe: "a Windows program", elf: "a Linux program", mach: "a macOS program", zip: "a ZIP archive", rar: "a RAR archive", "7z": "a 7-Zip archive", msi: "a Windows installer", cab: "a cabinet archive", gz: "a gzip archive" };
  return named[ext] ?? `${mime} (.${ext})`;
}

/** A name as uploaded must be a plain file name: no folders, no control characters, not too long. */
export function badFilename(name: string): string | null {
  if (!name || !name.trim()) return "the file has no name";
  if (/[/\\]/.test(name) || name.includes("..")) return "the file name must not contain a folder path";
  // eslint-disable-next-line no-control-regex
  if (/[\x00-\x1f\x7f]/.test(name)) return "the file name contains control characters";
  if (name.length > 200) return "the file name is longer than 200 characters";
  return null;
}
