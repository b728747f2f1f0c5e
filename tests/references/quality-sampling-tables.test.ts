import { describe, expect, it } from "vitest";
import {
  AQL_COLUMNS, AQL_LABELS, CODE_LETTERS, codeLetterFor, lettersOf, lotSizeRange, resolvePlan, sampleSizeOf, samplingPlan, tableCell,
  type Inspection, type TableLetter,
} from "../../shared/quality";

// Sources:
// [pub] ISO 2859-1 Table I / Table II-A ≡ ANSI/ASQ Z1.4 Tables I and II-A ≡ MIL-STD-105E (10 May 1989,
//       public domain) Tables I, II-A, II-B and II-C. The "printed" rows below are written down
//       from memory of those tables ([memory]); the rows marked "105E copy" are a public
//       copy of MIL-STD-105E for the AQL columns 0.65 … 15 (rejection numbers and arrows),
//       and the plan sequences per row are MIL-STD-105E Table II-A's ([pub]).
// Notation: "Ac/Re" a plan, "↓" use the first plan below the arrow, "↑" the first plan above.

const cellText = (inspection: Inspection, letter: TableLetter, column: number) => {
  const c = tableCell(inspection, letter, column);
  return c.kind === "plan" ? `${c.accept}/${c.reject}` : c.kind === "down" ? "↓" : "↑";
};
const rowText = (inspection: Inspection, letter: TableLetter) => AQL_COLUMNS.map((_, j) => cellText(inspection, letter, j)).join(" ");
const tabledCells = (inspection: Inspection, letter: TableLetter) =>
  [9, 10, 11, 12, 13, 14, 15, 16]
    .map((j) => {
      const c = tableCell(inspection, letter, j);
      return c.kind === "plan" ? String(c.reject) : c.kind === "down" ? "↓" : "↑";
    })
    .join(" ");

describe("Table I, general inspection level II: code letters from the lot size [pub]", () => {
  // lot sizes as printed: 2–8 A, 9–15 B, 16–25 C, 26–50 D, 51–90 E, 91–150 F, 151–280 G, 281–500 H,
  // 501–1200 J, 1201–3200 K, 3201–10000 L, 10001–35000 M, 35001–150000 N, 150001–500000 P, 500001 and over Q
  const ranges: Array<[number, number | null, string]> = [
    [2, 8, "A"], [9, 15, "B"], [16, 25, "C"], [26, 50, "D"], [51, 90, "E"], [91, 150, "F"], [151, 280, "G"], [281, 500, "H"],
    [501, 1200, "J"], [1201, 3200, "K"], [3201, 10000, "L"], [10001, 35000, "M"], [35001, 150000, "N"], [150001, 500000, "P"], [500001, null, "Q"],
  ];
  it.each(ranges)("from %s to %s parts: letter %s, at both ends of the range", (from, to, letter) => {
    expect(codeLetterFor(from)).toBe(letter);
    expect(codeLetterFor(to ?? 10_000_000)).toBe(letter);
    if (to !== null) expect(codeLetterFor(to + 1)).not.toBe(letter);
    expect(lotSizeRange(letter as "A")).toEqual({ from, to });
  });
  it("a lot of one part takes letter A (the printed table starts at 2) [derived]", () => {
    expect(codeLetterFor(1)).toBe("A");
    expect(() => codeLetterFor(0)).toThrow();
    expect(() => codeLetterFor(2.5)).toThrow();
  });
  it("sample sizes per letter, Tables II-A/II-B (S only in II-B) and II-C [pub]", () => {
    const normal = [2, 3, 5, 8, 13, 20, 32, 50, 80, 125, 200, 315, 500, 800, 1250, 2000];
    const reduced = [2, 2, 2, 3, 5, 8, 13, 20, 32, 50, 80, 125, 200, 315, 500, 800];
    CODE_LETTERS.forEach((l, i) => {
      expect(sampleSizeOf("normal", l)).toBe(normal[i]);
      expect(sampleSizeOf("tightened", l)).toBe(normal[i]);
      expect(sampleSizeOf("reduced", l)).toBe(reduced[i]);
    });
    expect(sampleSizeOf("tightened", "S")).toBe(3150);
    expect(() => sampleSizeOf("normal", "S")).toThrow();
  });
  it("the AQL columns, 0.010 … 1000 [pub]", () => {
    expect(AQL_LABELS.join(" ")).toBe("0.010 0.015 0.025 0.040 0.065 0.10 0.15 0.25 0.40 0.65 1.0 1.5 2.5 4.0 6.5 10 15 25 40 65 100 150 250 400 650 1000");
  });
});

describe("Table II-A, normal inspection, every letter and AQL column as printed [pub, written down from memory]", () => {
  const printed: Record<string, string> = {
    A: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 30/31",
    B: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 30/31 44/45",
    C: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 30/31 44/45 ↑",
    D: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 30/31 44/45 ↑ ↑",
    E: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 30/31 44/45 ↑ ↑ ↑",
    F: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑",
    G: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    H: "↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    J: "↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    K: "↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    L: "↓ ↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    M: "↓ ↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    N: "↓ ↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    P: "↓ 0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    Q: "0/1 ↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    R: "↑ ↓ 1/2 2/3 3/4 5/6 7/8 10/11 14/15 21/22 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
  };
  it.each(CODE_LETTERS.map((l) => [l]))("letter %s", (letter) => {
    expect(rowText("normal", letter)).toBe(printed[letter]);
  });

  // MIL-STD-105E Table II-A, public copy, AQL 0.65 1.0 1.5 2.5 4.0 6.5 10 15: Re or arrow [pub]
  const publicCopy: Record<string, string> = {
    A: "↓ ↓ ↓ ↓ ↓ 1 ↑ ↓", B: "↓ ↓ ↓ ↓ 1 ↑ ↓ 2", C: "↓ ↓ ↓ 1 ↑ ↓ 2 3", D: "↓ ↓ 1 ↑ ↓ 2 3 4", E: "↓ 1 ↑ ↓ 2 3 4 6",
    F: "1 ↑ ↓ 2 3 4 6 8", G: "↑ ↓ 2 3 4 6 8 11", H: "↓ 2 3 4 6 8 11 15", J: "2 3 4 6 8 11 15 22", K: "3 4 6 8 11 15 22 ↑",
    L: "4 6 8 11 15 22 ↑ ↑", M: "6 8 11 15 22 ↑ ↑ ↑", N: "8 11 15 22 ↑ ↑ ↑ ↑", P: "11 15 22 ↑ ↑ ↑ ↑ ↑", Q: "15 22 ↑ ↑ ↑ ↑ ↑ ↑",
  };
  it.each(Object.keys(publicCopy).map((l) => [l]))("letter %s against the 105E copy, AQL 0.65 … 15 [pub]", (letter) => {
    expect(tabledCells("normal", letter as TableLetter)).toBe(publicCopy[letter]);
  });

  // MIL-STD-105E Table II-A: the plans of each row, left to right [pub]
  it("each row's plans in order, as printed [pub]", () => {
    const plansOf = (l: TableLetter) =>
      AQL_COLUMNS.map((_, j) => tableCell("normal", l, j))
        .flatMap((c) => (c.kind === "plan" ? [`${c.accept} ${c.reject}`] : []))
        .join(" ");
    const base = "0 1 1 2 2 3 3 4 5 6 7 8 10 11 14 15 21 22";
    expect(plansOf("A")).toBe(`${base} 30 31`);
    for (const l of ["B", "C", "D", "E"] as const) expect(plansOf(l)).toBe(`${base} 30 31 44 45`);
    for (const l of ["F", "G", "H", "J", "K", "L", "M", "N", "P", "Q"] as const) expect(plansOf(l)).toBe(base);
    expect(plansOf("R")).toBe("1 2 2 3 3 4 5 6 7 8 10 11 14 15 21 22");
  });
});

describe("Table II-B, tightened inspection, as printed [pub, written down from memory]", () => {
  const printed: Record<string, string> = {
    A: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 27/28",
    B: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 27/28 41/42",
    C: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 27/28 41/42 ↑",
    D: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 27/28 41/42 ↑ ↑",
    E: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 27/28 41/42 ↑ ↑ ↑",
    F: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑",
    G: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    H: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    J: "↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    K: "↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    L: "↓ ↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    M: "↓ ↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    N: "↓ ↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    P: "↓ ↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    Q: "↓ 0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    R: "0/1 ↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    S: "↓ ↓ 1/2 2/3 3/4 5/6 8/9 12/13 18/19 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
  };
  it.each([...CODE_LETTERS, "S"].map((l) => [l]))("letter %s", (letter) => {
    expect(rowText("tightened", letter as TableLetter)).toBe(printed[letter]);
  });
  // MIL-STD-105E Table II-B, public copy, AQL 0.65 … 15: Re or arrow [pub]
  const publicCopy: Record<string, string> = {
    A: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓", B: "↓ ↓ ↓ ↓ ↓ 1 ↓ ↓", C: "↓ ↓ ↓ ↓ 1 ↓ ↓ 2", D: "↓ ↓ ↓ 1 ↓ ↓ 2 3", E: "↓ ↓ 1 ↓ ↓ 2 3 4",
    F: "↓ 1 ↓ ↓ 2 3 4 6", G: "1 ↓ ↓ 2 3 4 6 9", H: "↓ ↓ 2 3 4 6 9 13", J: "↓ 2 3 4 6 9 13 19", K: "2 3 4 6 9 13 19 ↑", L: "3 4 6 9 13 19 ↑ ↑",
  };
  it.each(Object.keys(publicCopy).map((l) => [l]))("letter %s against the 105E copy, AQL 0.65 … 15 [pub]", (letter) => {
    expect(tabledCells("tightened", letter as TableLetter)).toBe(publicCopy[letter]);
  });
});

describe("Table II-C, reduced inspection (Z1.4 / MIL-STD-105E, with the Ac–Re gap), as printed [pub, written down from memory]", () => {
  const printed: Record<string, string> = {
    A: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 14/17",
    B: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 14/17 21/24",
    C: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 14/17 21/24 ↑",
    D: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 14/17 21/24 ↑ ↑",
    E: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 14/17 21/24 ↑ ↑ ↑",
    F: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑",
    G: "↓ ↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    H: "↓ ↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    J: "↓ ↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    K: "↓ ↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    L: "↓ ↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    M: "↓ ↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    N: "↓ ↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    P: "↓ 0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    Q: "0/1 ↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
    R: "↑ ↓ 0/2 1/3 1/4 2/5 3/6 5/8 7/10 10/13 ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑ ↑",
  };
  it.each(CODE_LETTERS.map((l) => [l]))("letter %s", (letter) => {
    expect(rowText("reduced", letter)).toBe(printed[letter]);
  });
});

describe("following the arrows: the plan below or above, with ITS sample size [pub]", () => {
  it("AQL 1.0, lot 151–280 (G, 32): ↓ to H, n 50, Ac 1 Re 2", () => {
    expect(samplingPlan(200, 1)).toMatchObject({ codeLetter: "G", planCodeLetter: "H", sampleSize: 50, accept: 1, reject: 2, arrow: "down", everyPart: false });
  });
  it("AQL 1.0, lot 91–150 (F, 20): ↑ to E, n 13, Ac 0 Re 1", () => {
    expect(samplingPlan(120, 1)).toMatchObject({ codeLetter: "F", planCodeLetter: "E", sampleSize: 13, accept: 0, reject: 1, arrow: "up" });
  });
  it("AQL 1.0, lot 281–500 (H): its own plan, n 50, Ac 1 Re 2", () => {
    expect(samplingPlan(500, 1)).toMatchObject({ codeLetter: "H", planCodeLetter: "H", sampleSize: 50, accept: 1, reject: 2, arrow: null });
  });
  it("AQL 2.5, lot 1201–3200 (K): n 125, Ac 7 Re 8", () => {
    expect(samplingPlan(3000, 2.5)).toMatchObject({ codeLetter: "K", sampleSize: 125, accept: 7, reject: 8 });
  });
  it("AQL 0.10, lot 1201–3200 (K): the plan itself, n 125, Ac 0 Re 1", () => {
    expect(samplingPlan(2000, 0.1)).toMatchObject({ codeLetter: "K", planCodeLetter: "K", sampleSize: 125, accept: 0, reject: 1, arrow: null });
  });
  it("AQL 0.010, lot 2000 (K): ↓ all the way to Q, n 1250, Ac 0 Re 1", () => {
    expect(samplingPlan(2000, 0.01)).toMatchObject({ codeLetter: "K", planCodeLetter: "Q", tableSampleSize: 1250, sampleSize: 1250, accept: 0, reject: 1 });
  });
  it("AQL 6.5, lot 10001–35000 (M): ↑ to L's 21/22, n 200", () => {
    expect(samplingPlan(20000, 6.5)).toMatchObject({ codeLetter: "M", planCodeLetter: "L", sampleSize: 200, accept: 21, reject: 22, arrow: "up" });
  });
  it("AQL 1000, lot 51–90 (E): ↑ to B's 44/45, n 3", () => {
    expect(samplingPlan(60, 1000)).toMatchObject({ codeLetter: "E", planCodeLetter: "B", sampleSize: 3, accept: 44, reject: 45 });
  });
  it("every column of every letter resolves to a plan whose cell is a plan in the same column [derived]", () => {
    for (const inspection of ["normal", "tightened", "reduced"] as const) {
      for (const letter of lettersOf(inspection)) {
        AQL_COLUMNS.forEach((_, j) => {
          const r = resolvePlan(inspection, letter, j);
          expect(tableCell(inspection, r.letter, j)).toEqual(r.cell);
          const from = lettersOf(inspection).indexOf(letter);
          const to = lettersOf(inspection).indexOf(r.letter);
          if (!r.offTable && r.arrow === "down") expect(to).toBeGreaterThan(from);
          if (!r.offTable && r.arrow === "up") expect(to).toBeLessThan(from);
        });
      }
    }
  });
  it("arrows that point off the table take the nearest plan the other way [memory: how the edge cells are read]", () => {
    // II-A, letter A at AQL 10: ↑ with nothing above → C's 1/2 (n 5)
    expect(resolvePlan("normal", "A", 15)).toMatchObject({ letter: "C", cell: { accept: 1, reject: 2 }, arrow: "up", offTable: true });
    // II-A, letter R at AQL 0.015: ↓ with nothing below → P's 0/1 (n 800)
    expect(resolvePlan("normal", "R", 1)).toMatchObject({ letter: "P", cell: { accept: 0, reject: 1 }, arrow: "down", offTable: true });
    // II-B, letter R at 0.015: ↓ to S, which points further down → Q's 0/1 (n 1250); at 0.025 ↓ to S's 1/2 (n 3150)
    expect(resolvePlan("tightened", "R", 1)).toMatchObject({ letter: "Q", offTable: true });
    expect(resolvePlan("tightened", "R", 2)).toMatchObject({ letter: "S", cell: { accept: 1, reject: 2 }, offTable: false });
  });
});

describe("the 100 % rule: a sample that reaches the lot means every part is tested [pub]", () => {
  it("lot 5, AQL 1.0: A ↓ to E (n 13 ≥ 5): all 5 parts, Ac 0 Re 1", () => {
    expect(samplingPlan(5, 1)).toMatchObject({ codeLetter: "A", planCodeLetter: "E", tableSampleSize: 13, sampleSize: 5, accept: 0, reject: 1, everyPart: true });
  });
  it("lot 1: its one part, Ac 0 Re 1 at AQL 0.65", () => {
    expect(samplingPlan(1, 0.65)).toMatchObject({ codeLetter: "A", sampleSize: 1, accept: 0, reject: 1, everyPart: true });
  });
  it("lot 8, AQL 6.5: A's own plan, n 2 < 8: a sample, not every part", () => {
    expect(samplingPlan(8, 6.5)).toMatchObject({ codeLetter: "A", sampleSize: 2, accept: 0, reject: 1, everyPart: false });
  });
  it("lot 40, AQL 0.25: D ↓ to H (n 50 ≥ 40): all 40 parts, Ac 0 Re 1", () => {
    expect(samplingPlan(40, 0.25)).toMatchObject({ codeLetter: "D", planCodeLetter: "H", sampleSize: 40, accept: 0, reject: 1, everyPart: true });
  });
  it("the sample never exceeds the lot, for lot sizes from 1 to 3200 and every AQL [derived]", () => {
    for (let lot = 1; lot <= 3200; lot += lot < 100 ? 1 : 37) {
      for (const aql of AQL_COLUMNS) {
        const p = samplingPlan(lot, aql);
        expect(p.sampleSize).toBeLessThanOrEqual(lot);
        expect(p.everyPart).toBe(p.tableSampleSize >= lot);
        expect(p.reject).toBe(p.accept + 1);
      }
    }
  });
  it("refuses an AQL that is not a column", () => {
    expect(() => samplingPlan(500, 2)).toThrow(/not a column/);
  });
});
