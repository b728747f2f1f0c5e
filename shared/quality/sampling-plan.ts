import {
  aqlColumn, aqlLabel, codeLetterFor, lettersOf, sampleSizeOf, tableCell, type CodeLetter, type Inspection, type PlanCell, type TableLetter,
} from "./sampling-tables";

export const SAMPLING_STANDARD = "ISO 2859-1 (ANSI/ASQ Z1.4), single sampling, general inspection level II";

export interface SamplingPlan {
  inspection: Inspection;
  lotSize: number;
  aql: number;
  /** Table I's letter for the lot size */
  codeLetter: CodeLetter;
  /** the letter whose plan is used after following the table's arrows */
  planCodeLetter: TableLetter;
  /** that plan's sample size as printed */
  tableSampleSize: number;
  /** parts to test: the printed sample, or the whole lot when the sample would reach it */
  sampleSize: number;
  accept: number;
  reject: number;
  /** every part of the lot is tested (the 100 % rule) */
  everyPart: boolean;
  /** the arrow followed from Table I's letter, if any */
  arrow: "down" | "up" | null;
  /** how the plan was found, in words */
  note: string;
}

/**
 * Follows the arrows from a cell to its plan: "use the first sampling plan below (above) the arrow",
 * with that plan's sample size. Two cells at the edges of the printed tables point off the table
 * (II-A: letter A at AQL 10 points up, letter R at AQL 0.015 points down; II-B: R at 0.015 points
 * down to an S cell that points further down): there the first plan the other way is taken, the
 * only plan that column offers next to it.
 */
export function resolvePlan(inspection: Inspection, letter: TableLetter, column: number): { letter: TableLetter; cell: PlanCell; arrow: "down" | "up" | null; offTable: boolean } {
  const letters = lettersOf(inspection);
  const start = letters.indexOf(letter);
  const first = tableCell(inspection, letter, column);
  if (first.kind === "plan") return { letter, cell: first, arrow: null, offTable: false };
  const search = (step: 1 | -1) => {
    for (let row = start + step; row >= 0 && row < letters.length; row += step) {
      const cell = tableCell(inspection, letters[row], column);
      if (cell.kind === "plan") return { letter: letters[row], cell };
    }
    return null;
  };
  const step = first.kind === "down" ? 1 : -1;
  const along = search(step);
  const found = along ?? search(step === 1 ? -1 : 1);
  if (!found) throw new Error(`no plan in the AQL column ${column} of the ${inspection} table`);
  return { ...found, arrow: first.kind, offTable: !along };
}

/**
 * The single sampling plan for a lot: Table I's code letter from the lot size, the master table's
 * plan for the AQL after following its arrows, and the 100 % rule: when the plan's sample is as
 * large as the lot or larger, every part of the lot is tested, and the plan's Ac and Re apply to
 * the count of nonconforming parts found in the whole lot.
 */
export function samplingPlan(lotSize: number, aql: number, inspection: Inspection = "normal"): SamplingPlan {
  const column = aqlColumn(aql);
  if (column < 0) throw new RangeError(`AQL ${aql} is not a column of the sampling tables`);
  const codeLetter = codeLetterFor(lotSize);
  const { letter, cell, arrow, offTable } = resolvePlan(inspection, codeLetter, column);
  const tableSampleSize = sampleSizeOf(inspection, letter);
  const everyPart = tableSampleSize >= lotSize;
  const sampleSize = everyPart ? lotSize : tableSampleSize;
  const said = [`Lot of ${lotSize}: code letter ${codeLetter}`];
  if (arrow && !offTable) said.push(`the ${inspection} table's arrow at AQL ${aqlLabel(aql)} points ${arrow} to letter ${letter} (sample ${tableSampleSize})`);
  if (arrow && offTable) said.push(`the ${inspection} table's arrow at AQL ${aqlLabel(aql)} points ${arrow}, off the table; the nearest plan the other way is letter ${letter}'s (sample ${tableSampleSize})`);
  said.push(`Ac ${cell.accept}, Re ${cell.reject}`);
  if (everyPart) said.push(`the sample (${tableSampleSize}) reaches the lot, so every part is tested`);
  return {
    inspection, lotSize, aql, codeLetter, planCodeLetter: letter, tableSampleSize, sampleSize,
    accept: cell.accept, reject: cell.reject, everyPart, arrow, note: `${said.join("; ")}.`,
  };
}

export type LotDecision = "accepted" | "rejected" | "accepted-back-to-normal";

/**
 * The lot's decision from its count of nonconforming parts: accepted at Ac or fewer, rejected at
 * Re or more. Only the reduced plans of Table II-C leave a gap between them: a count in the gap
 * accepts the lot, and normal inspection is reinstated from the next lot.
 */
export function judgeLot(plan: Pick<SamplingPlan, "accept" | "reject">, nonconforming: number): LotDecision {
  if (!Number.isInteger(nonconforming) || nonconforming < 0) throw new RangeError("the count of nonconforming parts must be a whole number, 0 or more");
  if (nonconforming <= plan.accept) return "accepted";
  if (nonconforming >= plan.reject) return "rejected";
  return "accepted-back-to-normal";
}
