// Control charts of measured attenuation per alloy and forming route: an individuals and
// moving-range chart of each lot's mean margin (measured minus required, dB), in the order the
// lots were decided, with limits from the average moving range; the usual run rules flagged by
// name; and the process capability against the required attenuation (a lower specification only).
//
// Constants for moving ranges of two [pub: Montgomery, Introduction to Statistical Quality
// Control, appendix table "Factors for constructing variables control charts", n = 2]:
// d2 = 1.128, D3 = 0, D4 = 3.267 (checked in tests/references/calibration-control-chart.test.ts,
// also against d2 = 2/√π and d3 = √(2 − 4/π), which they round).
// Individuals: centre x̄, limits x̄ ± 3·MR̄/d2; moving ranges: centre MR̄, limits D3·MR̄ and D4·MR̄.
// Capability: Cpk = (x̄ − LSL)/(3σ̂) with σ̂ = MR̄/d2 (the within-process σ the limits use) and
// LSL = 0 on the margin; its approximate confidence interval Cpk ± z·√(1/(9n) + Cpk²/(2(n − 1)))
// [pub: Bissell, "How reliable is your capability index?", Applied Statistics 39:331, 1990;
// Montgomery, ibid., chapter on process capability]. Ppk uses the overall standard deviation.

import { mean, normalQuantile, sampleSd } from "./stats";
import type { LotDisposition, MeasuredLot } from "./types";

export const D2_N2 = 1.128;
export const D3_N2 = 0;
export const D4_N2 = 3.267;
/** lots before the limits stop being trial limits and the capability is given [memory: Montgomery advises 20–25 subgroups] */
export const CAPABILITY_MIN_LOTS = 20;

export type RunRuleId = "nelson-1" | "nelson-2" | "nelson-3" | "nelson-4" | "nelson-5" | "nelson-6" | "nelson-7" | "nelson-8" | "moving-range";

export interface RunRule {
  id: RunRuleId;
  name: string;
  /** what it means, and its Western Electric counterpart where there is one */
  description: string;
}

/**
 * Nelson's eight tests for special causes [pub: L. S. Nelson, "The Shewhart control chart — tests
 * for special causes", Journal of Quality Technology 16(4):237, 1984]; tests 1, 5 and 6 are the
 * Western Electric rules 1–3 [pub: Western Electric, Statistical Quality Control Handbook, 1956],
 * whose rule 4 takes eight points on one side where Nelson's test 2 takes nine.
 */
export const RUN_RULES: Record<RunRuleId, RunRule> = {
  "nelson-1": { id: "nelson-1", name: "Beyond a control limit", description: "One lot beyond 3σ from the centre line (Western Electric rule 1)." },
  "nelson-2": { id: "nelson-2", name: "Nine on one side", description: "Nine lots in a row on the same side of the centre line: the level has shifted (Western Electric rule 4 takes eight)." },
  "nelson-3": { id: "nelson-3", name: "Six rising or falling", description: "Six lots in a row steadily rising or falling: a trend." },
  "nelson-4": { id: "nelson-4", name: "Fourteen alternating", description: "Fourteen lots in a row alternating up and down: two sources taking turns." },
  "nelson-5": { id: "nelson-5", name: "Two of three beyond 2σ", description: "Two of three lots in a row beyond 2σ on the same side (Western Electric rule 2)." },
  "nelson-6": { id: "nelson-6", name: "Four of five beyond 1σ", description: "Four of five lots in a row beyond 1σ on the same side (Western Electric rule 3)." },
  "nelson-7": { id: "nelson-7", name: "Fifteen hugging the centre", description: "Fifteen lots in a row within 1σ of the centre line: the limits are too wide for this data (mixed streams, or limits from another period)." },
  "nelson-8": { id: "nelson-8", name: "Eight avoiding the centre", description: "Eight lots in a row beyond 1σ on either side: two processes mixed." },
  "moving-range": { id: "moving-range", name: "Moving range beyond its limit", description: "A jump from one lot to the next larger than D4·MR̄." },
};

export interface ChartLot {
  lotId: string;
  number: string;
  decidedAt: string;
  disposition?: LotDisposition;
  /** the lot's mean measured attenuation minus the required, dB */
  margin_db: number;
}

export interface ChartPoint extends ChartLot {
  /** |this − previous|, null for the first lot */
  movingRange_db: number | null;
  /** the rules this lot completes */
  signals: RunRuleId[];
}

export interface Signal {
  rule: RunRuleId;
  chart: "individuals" | "moving-range";
  /** the lots of the pattern, the last one completing it */
  lotIds: string[];
}

export interface Capability {
  lots: number;
  cpk: number;
  /** the approximate 95 % interval (Bissell) */
  interval: { low: number; high: number; confidence: number };
  ppk: number;
  sigmaWithin_db: number;
  sigmaOverall_db: number;
  basis: string;
}

export interface IndividualsChart {
  points: ChartPoint[];
  individuals: { center_db: number; ucl_db: number; lcl_db: number; sigma_db: number } | null;
  movingRange: { center_db: number; ucl_db: number; lcl_db: number } | null;
  signals: Signal[];
  rules: RunRule[];
  /** fewer than CAPABILITY_MIN_LOTS lots: the limits are trial limits */
  trial: boolean;
  capability: Capability | null;
  /** why there is no capability, when there is none */
  capabilityNote: string | null;
  constants: { d2: number; D3: number; D4: number };
}

/** Each decided lot's mean margin (measured minus required, dB), oldest first. */
export function chartLotsOf(lots: MeasuredLot[]): ChartLot[] {
  return lots
    .filter((l) => l.parts.length > 0)
    .map((l) => ({ lotId: l.lotId, number: l.number, decidedAt: l.decidedAt, disposition: l.disposition, margin_db: mean(l.parts.map((p) => p.measured_db)) - l.requiredAttenuation_db }))
    .sort((a, b) => (a.decidedAt < b.decidedAt ? -1 : a.decidedAt > b.decidedAt ? 1 : a.number < b.number ? -1 : a.number > b.number ? 1 : 0));
}

/** Cpk against a lower specification only (Cpl), with Bissell's approximate interval. */
export function cpkLower(props: { mean: number; sigma: number; lsl: number; n: number; confidence?: number }): { cpk: number; low: number; high: number } {
  const cpk = (props.mean - props.lsl) / (3 * props.sigma);
  const z = normalQuantile(0.5 + (props.confidence ?? 0.95) / 2);
  const half = z * Math.sqrt(1 / (9 * props.n) + (cpk * cpk) / (2 * (props.n - 1)));
  return { cpk, low: cpk - half, high: cpk + half };
}

/** The limits of an individuals chart and its moving-range chart, from the mean and the average moving range. */
export function individualsLimits(center: number, mrBar: number): { individuals: NonNullable<IndividualsChart["individuals"]>; movingRange: NonNullable<IndividualsChart["movingRange"]> } {
  const sigma = mrBar / D2_N2;
  return {
    individuals: { center_db: center, ucl_db: center + 3 * sigma, lcl_db: center - 3 * sigma, sigma_db: sigma },
    movingRange: { center_db: mrBar, ucl_db: D4_N2 * mrBar, lcl_db: D3_N2 * mrBar },
  };
}

/** Nelson's tests on a series with its centre and σ: the index each rule fires at and the run's first index. */
export function runRuleHits(x: number[], center: number, sigma: number): { rule: RunRuleId; at: number; from: number }[] {
  const hits: { rule: RunRuleId; at: number; from: number }[] = [];
  if (!(sigma > 0)) return hits;
  const z = x.map((v) => (v - center) / sigma);
  const side = (v: number) => (v > 0 ? 1 : v < 0 ? -1 : 0);
  for (let i = 0; i < z.length; i++) {
    if (Math.abs(z[i]) > 3) hits.push({ rule: "nelson-1", at: i, from: i });
    // run rules fire where the run first completes, and again only after it is broken
    const window = (n: number) => (i >= n - 1 ? z.slice(i - n + 1, i + 1) : null);
    const w9 = window(9);
    if (w9 && side(w9[0]) !== 0 && w9.every((v) => side(v) === side(w9[0])) && !(i >= 9 && side(z[i - 9]) === side(w9[0]))) hits.push({ rule: "nelson-2", at: i, from: i - 8 });
    const w6 = window(6);
    if (w6) {
      const diffs = w6.slice(1).map((v, k) => side(v - w6[k]));
      const trend = diffs[0] !== 0 && diffs.every((d) => d === diffs[0]);
      const before = i >= 6 && side(w6[0] - z[i - 6]) === diffs[0];
      if (trend && !before) hits.push({ rule: "nelson-3", at: i, from: i - 5 });
    }
    const w14 = window(14);
    if (w14) {
      const diffs = w14.slice(1).map((v, k) => side(v - w14[k]));
      const alternating = diffs.every((d, k) => d !== 0 && (k === 0 || d === -diffs[k - 1]));
      const before = i >= 14 && side(w14[0] - z[i - 14]) === -diffs[0];
      if (alternating && !before) hits.push({ rule: "nelson-4", at: i, from: i - 13 });
    }
    const w3 = window(3);
    if (w3 && Math.abs(z[i]) > 2)
      for (const s of [1, -1]) if (side(z[i]) === s && w3.filter((v) => v * s > 2).length >= 2) hits.push({ rule: "nelson-5", at: i, from: i - 2 });
    const w5 = window(5);
    if (w5 && Math.abs(z[i]) > 1)
      for (const s of [1, -1]) if (side(z[i]) === s && w5.filter((v) => v * s > 1).length >= 4) hits.push({ rule: "nelson-6", at: i, from: i - 4 });
    const w15 = window(15);
    if (w15 && w15.every((v) => Math.abs(v) < 1) && !(i >= 15 && Math.abs(z[i - 15]) < 1)) hits.push({ rule: "nelson-7", at: i, from: i - 14 });
    const w8 = window(8);
    if (w8 && w8.every((v) => Math.abs(v) > 1) && !(i >= 8 && Math.abs(z[i - 8]) > 1)) hits.push({ rule: "nelson-8", at: i, from: i - 7 });
  }
  return hits;
}

/** The chart of one alloy and route from its lots' margins (oldest first). */
export function individualsChart(lots: ChartLot[]): IndividualsChart {
  const x = lots.map((l) => l.margin_db);
  const mr = x.map((v, i) => (i === 0 ? null : Math.abs(v - x[i - 1])));
  const points: ChartPoint[] = lots.map((l, i) => ({ ...l, movingRange_db: mr[i], signals: [] }));
  const base = {
    points,
    rules: Object.values(RUN_RULES),
    trial: lots.length < CAPABILITY_MIN_LOTS,
    constants: { d2: D2_N2, D3: D3_N2, D4: D4_N2 },
  };
  if (lots.length < 2)
    return { ...base, individuals: null, movingRange: null, signals: [], capability: null, capabilityNote: "Limits need at least two lots (one moving range)." };
  const ranges = mr.filter((v): v is number => v !== null);
  const limits = individualsLimits(mean(x), mean(ranges));
  const signals: Signal[] = [];
  for (const h of runRuleHits(x, limits.individuals.center_db, limits.individuals.sigma_db)) {
    points[h.at].signals.push(h.rule);
    signals.push({ rule: h.rule, chart: "individuals", lotIds: lots.slice(h.from, h.at + 1).map((l) => l.lotId) });
  }
  mr.forEach((v, i) => {
    if (v !== null && limits.movingRange.center_db > 0 && v > limits.movingRange.ucl_db) {
      points[i].signals.push("moving-range");
      signals.push({ rule: "moving-range", chart: "moving-range", lotIds: [lots[i - 1].lotId, lots[i].lotId] });
    }
  });

  let capability: Capability | null = null;
  let capabilityNote: string | null = null;
  const sigmaWithin = limits.individuals.sigma_db;
  if (lots.length < CAPABILITY_MIN_LOTS) capabilityNote = `Capability needs at least ${CAPABILITY_MIN_LOTS} lots; there are ${lots.length}.`;
  else if (!(sigmaWithin > 0)) capabilityNote = "The lots' margins do not vary: no capability index.";
  else {
    const c = cpkLower({ mean: limits.individuals.center_db, sigma: sigmaWithin, lsl: 0, n: lots.length });
    const overall = sampleSd(x);
    capability = {
      lots: lots.length,
      cpk: c.cpk,
      interval: { low: c.low, high: c.high, confidence: 0.95 },
      ppk: overall > 0 ? limits.individuals.center_db / (3 * overall) : c.cpk,
      sigmaWithin_db: sigmaWithin,
      sigmaOverall_db: overall,
      basis: "Cpk against the required attenuation (lower specification only: the margin's mean over 3σ, σ = MR̄/d2), with Bissell's approximate 95 % interval; Ppk with the overall standard deviation. Meaningful only while the chart shows no special causes.",
    };
  }
  return { ...base, individuals: limits.individuals, movingRange: limits.movingRange, signals, capability, capabilityNote };
}
