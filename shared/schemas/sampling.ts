/** Sampling plans (the public route's query and answer) and the AQL settings: the shop's default and an order's own. */
import { z } from "zod";
import { AQL_COLUMNS, AQL_LABELS, isAqlColumn } from "../quality/sampling-tables";

export const MAX_LOT_SIZE = 100_000_000;

const aqlList = AQL_LABELS.join(", ");

const aqlMessage = "Give the AQL as a number, e.g. 1.0.";
const columnMessage = `The AQL must be one of the table's columns: ${aqlList}.`;
/** An AQL as text (a query string), e.g. "1.0", "0.65", "10". */
const aqlText = z
  .string({ error: `Give the AQL, one of ${aqlList}.` })
  .trim()
  .regex(/^(?:\d+(?:\.\d*)?|\.\d+)$/, { error: aqlMessage })
  .transform(Number)
  .refine((n) => isAqlColumn(n), { error: columnMessage });
/** An AQL in a JSON body: a number that is a column of the tables. */
export const aqlSchema = z.number({ error: aqlMessage }).refine((n) => isAqlColumn(n), { error: columnMessage });

/** GET /api/sampling-plan?lotSize=N&aql=1.0 (query strings) */
export const samplingPlanQuerySchema = z.object({
  lotSize: z
    .string({ error: "Give the lot size: a whole number of parts, 1 or more." })
    .trim()
    .regex(/^\d+$/, { error: "Give the lot size as a whole number of parts, 1 or more." })
    .transform(Number)
    .pipe(z.number().int().min(1, { error: "The lot size must be at least 1 part." }).max(MAX_LOT_SIZE, { error: `The lot size must be at most ${MAX_LOT_SIZE.toLocaleString("en")} parts.` })),
  aql: aqlText,
});
export type SamplingPlanQuery = z.input<typeof samplingPlanQuerySchema>;

/** The answer: the contract's five fields, then how the plan was found. */
export interface SamplingPlanJson {
  /** Table I's letter for the lot size */
  codeLetter: string;
  /** parts to test: the plan's sample after the arrows, or the whole lot when that sample would reach it */
  sampleSize: number;
  accept: number;
  reject: number;
  standard: string;
  lotSize: number;
  aql: number;
  inspection: "normal" | "tightened" | "reduced";
  /** the letter whose plan is used after following the arrows */
  planCodeLetter: string;
  /** that plan's sample size as printed */
  tableSampleSize: number;
  /** the sample reaches the lot: every part is tested, Ac and Re apply to the whole lot */
  everyPart: boolean;
  note: string;
}

/** The shop's default AQL (the planner's setting; each new order takes it). */
export const qualitySettingsSchema = z.object({ defaultAql: aqlSchema });
export type QualitySettingsInput = z.input<typeof qualitySettingsSchema>;
export interface QualitySettingsJson {
  defaultAql: number;
  /** the columns a person may choose from, as printed */
  aqlColumns: Array<{ value: number; label: string }>;
  updatedAt: string;
}
export const aqlChoices = AQL_COLUMNS.map((value, i) => ({ value: value as number, label: AQL_LABELS[i] }));

/** An order's own AQL (the planner may change it until the order ships). */
export const orderAqlSchema = z.object({ aql: aqlSchema });
export type OrderAqlInput = z.input<typeof orderAqlSchema>;
export interface OrderAqlJson {
  orderId: string;
  aql: number;
}
