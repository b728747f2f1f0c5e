// ISO 2859-1 (≡ ANSI/ASQ Z1.4, ≡ MIL-STD-105E) single sampling by attributes, general inspection
// level II: Table I (sample size code letters) and the master tables II-A (normal), II-B
// (tightened) and II-C (reduced), read as printed: a cell holds a plan (Ac, Re) or an arrow.
//
// The master tables are diagonal: moving one code letter down (the sample grows by about 1.6)
// is the same as moving one AQL column right (the AQL grows by about 1.6). So every cell is
// found from its diagonal position k = letter index + column index − offset, and each table is a
// short sequence along that diagonal. The sequences below are the printed ones; the test in
// tests/references/sampling-tables.test.ts spells every row out letter by letter.
//
// Where the tables come from (see DEVELOPERS.md, "Sampling plans"): Table I and Table II-A as
// printed in ISO 2859-1 / ANSI/ASQ Z1.4 / MIL-STD-105E (a public-domain edition); Tables II-B and
// II-C of Z1.4 / MIL-STD-105E (II-C with the gap between Ac and Re that the 1999 ISO edition later
// removed). Values written down from memory and cross-checked against a public copy of
// MIL-STD-105E for the AQL columns 0.65 … 15.

export const CODE_LETTERS = ["A", "B", "C", "D", "E", "F", "G", "H", "J", "K", "L", "M", "N", "P", "Q", "R"] as const;
export type CodeLetter = (typeof CODE_LETTERS)[number];
/** Tightened inspection has one more letter, reached only by following an arrow down from R. */
export type TableLetter = CodeLetter | "S";

/** Table I, general inspection level II: the largest lot size of each code letter (R is never given by a lot size). */
const LOT_SIZE_LIMITS: ReadonlyArray<readonly [number, CodeLetter]> = [
  [8, "A"], [15, "B"], [25, "C"], [50, "D"], [90, "E"], [150, "F"], [280, "G"], [500, "H"],
  [1200, "J"], [3200, "K"], [10000, "L"], [35000, "M"], [150000, "N"], [500000, "P"], [Infinity, "Q"],
];

/**
 * Table I, general inspection level II. The printed table starts at a lot of 2; a lot of a single
 * part takes letter A as well (its one part is tested: see the 100 % rule in sampling-plan.ts).
 */
export function codeLetterFor(lotSize: number): CodeLetter {
  if (!Number.isInteger(lotSize) || lotSize < 1) throw new RangeError("lot size must be a whole number of parts, at least 1");
  for (const [max, letter] of LOT_SIZE_LIMITS) if (lotSize <= max) return letter;
  return "Q";
}

/** The lot sizes each letter covers (for showing Table I). */
export function lotSizeRange(letter: CodeLetter): { from: number; to: number | null } | null {
  const i = LOT_SIZE_LIMITS.findIndex(([, l]) => l === letter);
  if (i < 0) return null;
  const from = i === 0 ? 2 : LOT_SIZE_LIMITS[i - 1][0] + 1;
  const to = LOT_SIZE_LIMITS[i][0];
  return { from, to: Number.isFinite(to) ? to : null };
}

/**
 * The AQL columns of Tables II-A/B/C, in percent nonconforming (up to 10) or nonconformities per
 * 100 units (all of them; above 10 only that). As numbers, so "1.0", "1" and "1.00" are one column.
 */
export const AQL_COLUMNS = [
  0.01, 0.015, 0.025, 0.04, 0.065, 0.1, 0.15, 0.25, 0.4, 0.65, 1, 1.5, 2.5, 4, 6.5, 10, 15, 25, 40, 65, 100, 150, 250, 400, 650, 1000,
] as const;
/** As printed at the head of the tables. */
export const AQL_LABELS = AQL_COLUMNS.map((a) => (a < 0.1 ? a.toFixed(3) : a < 1 ? a.toFixed(2) : a < 10 ? a.toFixed(1) : String(a)));

export function aqlColumn(aql: number): number {
  return AQL_COLUMNS.indexOf(aql as (typeof AQL_COLUMNS)[number]);
}
export const isAqlColumn = (aql: number) => aqlColumn(aql) >= 0;
export const aqlLabel = (aql: number) => AQL_LABELS[aqlColumn(aql)] ?? String(aql);

export type Inspection = "normal" | "tightened" | "reduced";
export const INSPECTIONS: readonly Inspection[] = ["normal", "tightened", "reduced"];

export interface PlanCell {
  kind: "plan";
  accept: number;
  reject: number;
}
export type TableCell = PlanCell | { kind: "down" } | { kind: "up" };

const plan = (accept: number, reject: number): PlanCell => ({ kind: "plan", accept, reject });
const DOWN = { kind: "down" } as const;
const UP = { kind: "up" } as const;

interface MasterTable {
  name: string;
  letters: readonly TableLetter[];
  sampleSizes: Readonly<Record<string, number>>;
  /** k = letter index + column index − offset puts the Ac = 0 plan at k = 0 */
  offset: number;
  /** cells along the diagonal from k = 0; past the end the arrow points up */
  sequence: readonly TableCell[];
  /** letters A…E carry on into larger acceptance numbers (the nonconformities-per-100 columns) */
  extension: readonly TableCell[];
  /** cells printed otherwise than the diagonal gives, "letter:column index" */
  exceptions?: Readonly<Record<string, TableCell>>;
}

const NORMAL_SIZES = { A: 2, B: 3, C: 5, D: 8, E: 13, F: 20, G: 32, H: 50, J: 80, K: 125, L: 200, M: 315, N: 500, P: 800, Q: 1250, R: 2000 };

/** Table II-A: after Ac 0 an arrow up (back to it), then one down (to Ac 1). */
const TABLE_II_A: MasterTable = {
  name: "Table II-A (normal inspection)",
  letters: CODE_LETTERS,
  sampleSizes: NORMAL_SIZES,
  offset: 14,
  sequence: [plan(0, 1), UP, DOWN, plan(1, 2), plan(2, 3), plan(3, 4), plan(5, 6), plan(7, 8), plan(10, 11), plan(14, 15), plan(21, 22)],
  extension: [plan(30, 31), plan(44, 45)],
};

/**
 * Table II-B: the same sample size for a letter as in II-A (plus S, 3150), the Ac 0 plans one
 * letter further down, two arrows down after Ac 0. Letter A at AQL 10 is printed as an arrow down
 * (to D's 1 2), not as the Ac 0 plan the diagonal would put there.
 */
const TABLE_II_B: MasterTable = {
  name: "Table II-B (tightened inspection)",
  letters: [...CODE_LETTERS, "S"],
  sampleSizes: { ...NORMAL_SIZES, S: 3150 },
  offset: 15,
  sequence: [plan(0, 1), DOWN, DOWN, plan(1, 2), plan(2, 3), plan(3, 4), plan(5, 6), plan(8, 9), plan(12, 13), plan(18, 19)],
  extension: [plan(27, 28), plan(41, 42)],
  exceptions: { "A:15": DOWN },
};

/**
 * Table II-C: samples of about 40 % of normal (A, B and C all 2), the Ac 0 plans where II-A has
 * them, and a gap between Ac and Re: a count between them accepts the lot but sends the next lots
 * back to normal inspection (see switching.ts).
 */
const TABLE_II_C: MasterTable = {
  name: "Table II-C (reduced inspection)",
  letters: CODE_LETTERS,
  sampleSizes: { A: 2, B: 2, C: 2, D: 3, E: 5, F: 8, G: 13, H: 20, J: 32, K: 50, L: 80, M: 125, N: 200, P: 315, Q: 500, R: 800 },
  offset: 14,
  sequence: [plan(0, 1), UP, DOWN, plan(0, 2), plan(1, 3), plan(1, 4), plan(2, 5), plan(3, 6), plan(5, 8), plan(7, 10), plan(10, 13)],
  extension: [plan(14, 17), plan(21, 24)],
};

export const MASTER_TABLES: Record<Inspection, MasterTable> = { normal: TABLE_II_A, tightened: TABLE_II_B, reduced: TABLE_II_C };

/** The letters that go on into the extension (larger Ac, nonconformities per 100 units). */
const EXTENDED_ROWS = 5;

/** One cell of a master table, as printed. */
export function tableCell(inspection: Inspection, letter: TableLetter, column: number): TableCell {
  const table = MASTER_TABLES[inspection];
  const row = table.letters.indexOf(letter);
  if (row < 0) throw new RangeError(`${table.name} has no code letter ${letter}`);
  if (column < 0 || column >= AQL_COLUMNS.length) throw new RangeError(`no AQL column ${column}`);
  const exception = table.exceptions?.[`${letter}:${column}`];
  if (exception) return exception;
  const k = row + column - table.offset;
  if (k < 0) return DOWN;
  const cells = row < EXTENDED_ROWS ? [...table.sequence, ...table.extension] : table.sequence;
  return k < cells.length ? cells[k] : UP;
}

export function sampleSizeOf(inspection: Inspection, letter: TableLetter): number {
  const n = MASTER_TABLES[inspection].sampleSizes[letter];
  if (n === undefined) throw new RangeError(`${MASTER_TABLES[inspection].name} has no code letter ${letter}`);
  return n;
}

export function lettersOf(inspection: Inspection): readonly TableLetter[] {
  return MASTER_TABLES[inspection].letters;
}
