// Nesting is the dearest step of a price (hundreds of blanks on each stock sheet), and designs
// of one search share most of their layers' blanks: the innermost layer of every three-layer
// nest with the same first choice is the same disc. A memo of the nesting for one search, keyed
// by the exact blanks, so the price is exactly what nestBlanks gives.

import { nestBlanks, type NestBlank, type NestOptions, type NestResult } from "../fabrication/nesting";
import type { StockSheet } from "../schemas/pricing";

type Nested = Pick<NestResult, "unplaced" | "sheetsNeeded" | "utilisation">;

const sameBlank = (a: NestBlank, b: NestBlank) => {
  // a price build-up lists each part's shape object as often as it is cut
  if (a === b) return true;
  return a.kind === "disc" ? b.kind === "disc" && a.diameter_mm === b.diameter_mm : b.kind === "rectangle" && a.length_mm === b.length_mm && a.width_mm === b.width_mm;
};

const blankKey = (b: NestBlank) => (b.kind === "disc" ? `d${b.diameter_mm}` : `r${b.length_mm}x${b.width_mm}`);

/** The blanks as text; the price build-up nests copies of one assembly, so a repeating list is written once with its count. */
export function blanksKey(blanks: readonly NestBlank[]): string {
  const n = blanks.length;
  for (let period = 1; period <= Math.min(32, n); period++) {
    if (n % period !== 0) continue;
    let repeats = true;
    for (let i = period; i < n && repeats; i++) repeats = sameBlank(blanks[i], blanks[i % period]);
    if (repeats) return `${n / period}*${blanks.slice(0, period).map(blankKey).join(",")}`;
  }
  return blanks.map(blankKey).join(",");
}

export function memoNest(): (blanks: NestBlank[], sheet: StockSheet, options: NestOptions) => Nested {
  const memo = new Map<string, Nested>();
  return (blanks, sheet, options) => {
    const key = `${sheet.width_mm}x${sheet.length_mm}/${options.gap_mm}/${options.edge_mm}/${options.allowRotation}/${blanksKey(blanks)}`;
    let hit = memo.get(key);
    if (!hit) {
      const r = nestBlanks(blanks, sheet, options);
      // only what the price reads, so the memo stays small
      hit = { unplaced: r.unplaced, sheetsNeeded: r.sheetsNeeded, utilisation: r.utilisation };
      memo.set(key, hit);
    }
    return hit;
  };
}
