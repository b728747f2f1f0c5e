/**
 * Nesting of flat blanks on stock sheets.
 *
 * Algorithm: shelf packing, first-fit decreasing height (FFDH) over several sheets. Each blank
 * is turned "landscape" (short side across the shelf) when 90° rotation is allowed and it fits;
 * blanks are sorted by that height, then each goes on the first shelf of the first open sheet
 * where it fits (either orientation), else on a new shelf, else on a new sheet. Discs enter as
 * their bounding squares. When every blank is the same disc, an offset-row (hexagonal) layout is
 * tried as well, rows along either sheet side, and the one with more discs per sheet is kept:
 * rows of pitch p = d + gap, row spacing p·√3/2, odd rows shifted by p/2 — about 15 % more discs
 * than squares on large sheets. Discs of several sizes (a can and its lid, the layers of a nest),
 * alone or beside rectangles, go in offset-row bands, largest first, after the rectangles' shelves,
 * as a shop lays out a disc sheet; that layout is kept unless plain shelves need fewer sheets.
 * Shelf packing is not optimal (guillotine-friendly, fast: O(n·shelves)), good enough to price
 * material and plan shearing.
 *
 * `gap_mm` is the kerf/web left between blanks, `edge_mm` the trim margin on the sheet edges.
 */
import type { Point } from "./types";

export type NestBlank =
  | { id?: string; kind: "rectangle"; length_mm: number; width_mm: number }
  | { id?: string; kind: "disc"; diameter_mm: number };

export interface NestSheet {
  width_mm: number;
  length_mm: number;
}

export interface NestOptions {
  /** web between blanks, default 3 mm */
  gap_mm?: number;
  /** margin at the sheet edges, default = gap */
  edge_mm?: number;
  /** allow 90° rotation, default true */
  allowRotation?: boolean;
}

export interface Placement {
  /** index into the input list */
  index: number;
  id?: string;
  sheet: number;
  kind: "rectangle" | "disc";
  /** lower-left corner of the blank (or of a disc's bounding square); x across the sheet width */
  x: number;
  y: number;
  w: number;
  h: number;
  rotated: boolean;
}

export interface NestResult {
  algorithm: "shelf-ffdh" | "disc-offset-rows" | "shelves-and-offset-rows";
  sheetsNeeded: number;
  partsPerSheet: number[];
  placements: Placement[];
  /** blanks larger than the sheet */
  unplaced: number[];
  /** placed blank area / area of the sheets used (discs count their true area) */
  utilisation: number;
  scrapFraction: number;
  sheetUtilisation: number[];
}

export const DEFAULT_NEST_GAP_MM = 3;

const blankArea = (b: NestBlank): number => (b.kind === "disc" ? (Math.PI * b.diameter_mm * b.diameter_mm) / 4 : b.length_mm * b.width_mm);

const footprint = (b: NestBlank): [number, number] => (b.kind === "disc" ? [b.diameter_mm, b.diameter_mm] : [b.length_mm, b.width_mm]);

interface Shelf {
  y: number;
  h: number;
  used: number; // width used, including one trailing gap per blank
}
interface OpenSheet {
  shelves: Shelf[];
  top: number; // next free y, including trailing gap
  count: number;
}

function finish(algorithm: NestResult["algorithm"], blanks: readonly NestBlank[], sheet: NestSheet, placements: Placement[], unplaced: number[], sheets: number): NestResult {
  const sheetArea = sheet.width_mm * sheet.length_mm;
  const perSheetArea = new Array<number>(sheets).fill(0);
  const partsPerSheet = new Array<number>(sheets).fill(0);
  for (const p of placements) {
    perSheetArea[p.sheet] += blankArea(blanks[p.index]);
    partsPerSheet[p.sheet]++;
  }
  const placed = perSheetArea.reduce((s, a) => s + a, 0);
  const utilisation = sheets > 0 ? placed / (sheets * sheetArea) : 0;
  return {
    algorithm,
    sheetsNeeded: sheets,
    partsPerSheet,
    placements,
    unplaced,
    utilisation,
    scrapFraction: sheets > 0 ? 1 - utilisation : 0,
    sheetUtilisation: perSheetArea.map((a) => a / sheetArea),
  };
}

function shelfNest(blanks: readonly NestBlank[], sheet: NestSheet, gap: number, edge: number, rotate: boolean): NestResult {
  const Wu = sheet.width_mm - 2 * edge; // across the shelf
  const Lu = sheet.length_mm - 2 * edge; // shelves stack along the length
  const cap = Wu + gap; // every blank books w + gap; the last one's gap may hang over the usable edge
  const capL = Lu + gap;
  const items: Array<{ i: number; w: number; h: number; rotated: boolean }> = [];
  const unplaced: number[] = [];
  blanks.forEach((b, i) => {
    const [bl, bw] = footprint(b);
    // natural orientation: length across the sheet width
    let w = bl, h = bw, rotated = false;
    const fitsNatural = bl <= Wu && bw <= Lu;
    const fitsRotated = rotate && bw <= Wu && bl <= Lu;
    if (b.kind === "disc") {
      if (!fitsNatural) return void unplaced.push(i);
    } else if (fitsNatural && fitsRotated) {
      // landscape: the short side is the shelf height
      if (bw > bl) { w = bw; h = bl; rotated = true; }
    } else if (fitsRotated) {
      w = bw; h = bl; rotated = true;
    } else if (!fitsNatural) {
      return void unplaced.push(i);
    }
    items.push({ i, w, h, rotated });
  });
  items.sort((p, q) => q.h - p.h || q.w - p.w);

  const sheets: OpenSheet[] = [];
  const placements: Placement[] = [];
  const place = (it: { i: number; w: number; h: number; rotated: boolean }, s: number, shelf: Shelf, w: number, h: number, rotated: boolean) => {
    const b = blanks[it.i];
    placements.push({ index: it.i, id: b.id, sheet: s, kind: b.kind, x: edge + shelf.used, y: edge + shelf.y, w, h, rotated });
    shelf.used += w + gap;
    sheets[s].count++;
  };
  for (const it of items) {
    let done = false;
    const b = blanks[it.i];
    const canTurn = rotate && b.kind !== "disc";
    for (let s = 0; s < sheets.length && !done; s++) {
      for (const shelf of sheets[s].shelves) {
        if (it.h <= shelf.h && shelf.used + it.w + gap <= cap + 1e-9) {
          place(it, s, shelf, it.w, it.h, it.rotated);
          done = true;
          break;
        }
        // turned the other way it may still slip into a taller shelf's leftover width
        if (canTurn && it.w <= shelf.h && shelf.used + it.h + gap <= cap + 1e-9) {
          place(it, s, shelf, it.h, it.w, !it.rotated);
          done = true;
          break;
        }
      }
      if (!done && sheets[s].top + it.h + gap <= capL + 1e-9) {
        const shelf: Shelf = { y: sheets[s].top, h: it.h, used: 0 };
        sheets[s].shelves.push(shelf);
        sheets[s].top += it.h + gap;
        place(it, s, shelf, it.w, it.h, it.rotated);
        done = true;
      }
    }
    if (!done) {
      const shelf: Shelf = { y: 0, h: it.h, used: 0 };
      sheets.push({ shelves: [shelf], top: it.h + gap, count: 0 });
      place(it, sheets.length - 1, shelf, it.w, it.h, it.rotated);
    }
  }
  placements.sort((p, q) => p.index - q.index);
  return finish("shelf-ffdh", blanks, sheet, placements, unplaced, sheets.length);
}

/** Disc centres for one sheet in offset rows; rows along x (sheet width) spaced along y. */
function offsetRowCentres(d: number, gap: number, across: number, along: number): Point[] {
  const p = d + gap;
  const v = (p * Math.sqrt(3)) / 2;
  const out: Point[] = [];
  if (d > across || d > along) return out;
  const rows = Math.floor((along - d) / v + 1e-9) + 1;
  for (let r = 0; r < rows; r++) {
    const shift = r % 2 === 1 ? p / 2 : 0;
    if (d + shift > across + 1e-9) continue;
    const n = Math.floor((across - d - shift) / p + 1e-9) + 1;
    for (let k = 0; k < n; k++) out.push([d / 2 + shift + k * p, d / 2 + r * v]);
  }
  return out;
}

function discNest(blanks: readonly NestBlank[], d: number, sheet: NestSheet, gap: number, edge: number): NestResult | null {
  const Wu = sheet.width_mm - 2 * edge;
  const Lu = sheet.length_mm - 2 * edge;
  const a = offsetRowCentres(d, gap, Wu, Lu);
  const b = offsetRowCentres(d, gap, Lu, Wu).map(([x, y]): Point => [y, x]);
  const centres = a.length >= b.length ? a : b;
  if (centres.length === 0) return null;
  const placements: Placement[] = blanks.map((bl, i) => {
    const s = Math.floor(i / centres.length);
    const [cx, cy] = centres[i % centres.length];
    return { index: i, id: bl.id, sheet: s, kind: "disc", x: edge + cx - d / 2, y: edge + cy - d / 2, w: d, h: d, rotated: false };
  });
  return finish("disc-offset-rows", blanks, sheet, placements, [], Math.ceil(blanks.length / centres.length));
}

/**
 * Rectangles on shelves, then the discs in offset-row bands (largest size first) in the length the
 * shelves leave, each band starting where the one before ended, then on new sheets.
 */
function bandNest(blanks: readonly NestBlank[], sheet: NestSheet, gap: number, edge: number, rotate: boolean): NestResult {
  const Wu = sheet.width_mm - 2 * edge;
  const Lu = sheet.length_mm - 2 * edge;
  const rectIdx = blanks.flatMap((b, i) => (b.kind === "rectangle" ? [i] : []));
  const placements: Placement[] = [];
  const unplaced: number[] = [];
  // next free length on each sheet (from the usable edge, trailing gap included)
  const tops: number[] = [];
  if (rectIdx.length) {
    const shelf = shelfNest(rectIdx.map((i) => blanks[i]), sheet, gap, edge, rotate);
    for (const p of shelf.placements) {
      placements.push({ ...p, index: rectIdx[p.index] });
      tops[p.sheet] = Math.max(tops[p.sheet] ?? 0, p.y - edge + p.h + gap);
    }
    for (let s = 0; s < shelf.sheetsNeeded; s++) tops[s] ??= 0;
    unplaced.push(...shelf.unplaced.map((i) => rectIdx[i]));
  }
  const bySize = new Map<number, number[]>();
  blanks.forEach((b, i) => {
    if (b.kind !== "disc") return;
    if (b.diameter_mm > Wu + 1e-9 || b.diameter_mm > Lu + 1e-9) return void unplaced.push(i);
    (bySize.get(b.diameter_mm) ?? bySize.set(b.diameter_mm, []).get(b.diameter_mm)!).push(i);
  });
  let s = 0;
  for (const [d, indices] of [...bySize.entries()].sort((a, b) => b[0] - a[0])) {
    let k = 0;
    while (k < indices.length) {
      if (s >= tops.length) tops.push(0);
      const centres = offsetRowCentres(d, gap, Wu, Lu - tops[s]);
      if (centres.length === 0) {
        s++;
        continue;
      }
      const n = Math.min(centres.length, indices.length - k);
      let reach = 0;
      for (let j = 0; j < n; j++) {
        const [cx, cy] = centres[j];
        const i = indices[k + j];
        placements.push({ index: i, id: blanks[i].id, sheet: s, kind: "disc", x: edge + cx - d / 2, y: edge + tops[s] + cy - d / 2, w: d, h: d, rotated: false });
        reach = Math.max(reach, cy + d / 2);
      }
      tops[s] += reach + gap;
      k += n;
      if (k < indices.length) s++;
    }
  }
  placements.sort((p, q) => p.index - q.index);
  return finish("shelves-and-offset-rows", blanks, sheet, placements, unplaced, tops.length);
}

export function nestBlanks(blanks: readonly NestBlank[], sheet: NestSheet, options: NestOptions = {}): NestResult {
  const gap = options.gap_mm ?? DEFAULT_NEST_GAP_MM;
  const edge = options.edge_mm ?? gap;
  const rotate = options.allowRotation ?? true;
  if (!(sheet.width_mm > 0 && sheet.length_mm > 0)) throw new RangeError("sheet size must be positive");
  if (!(gap >= 0 && edge >= 0)) throw new RangeError("gap and edge must not be negative");
  const shelf = shelfNest(blanks, sheet, gap, edge, rotate);
  const first = blanks[0];
  if (blanks.length > 1 && first.kind === "disc" && blanks.every((b) => b.kind === "disc" && b.diameter_mm === first.diameter_mm)) {
    const hex = discNest(blanks, first.diameter_mm, sheet, gap, edge);
    // offset rows as a shop lays discs out, unless square rows need fewer sheets (a tie costs the same material)
    if (hex && hex.sheetsNeeded <= shelf.sheetsNeeded) return hex;
    return shelf;
  }
  if (blanks.some((b) => b.kind === "disc")) {
    const bands = bandNest(blanks, sheet, gap, edge, rotate);
    if (bands.unplaced.length <= shelf.unplaced.length && bands.sheetsNeeded <= shelf.sheetsNeeded) return bands;
  }
  return shelf;
}

/** How many copies of one blank fit a sheet (the shop's "parts per sheet"). */
export function partsPerSheet(blank: NestBlank, sheet: NestSheet, options: NestOptions = {}, limit = 2000): number {
  // nest more copies than can fit, then count what landed on the first sheet
  const [l, w] = footprint(blank);
  const estimate = Math.min(limit, Math.ceil((sheet.width_mm * sheet.length_mm) / Math.max(1, l * w) * 1.3) + 1);
  const r = nestBlanks(Array.from({ length: estimate }, () => blank), sheet, options);
  return r.partsPerSheet[0] ?? 0;
}
