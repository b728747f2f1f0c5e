// The chart's frequency range as the person types it, checked, and widened to take in the asked
// frequency (the curve always shows the point the figures above are for).

import { MAX_FREQUENCY_HZ, SWEEP_FROM_HZ, SWEEP_TO_HZ } from "../../../shared/schemas/prediction";
import type { SweepRange } from "../../api/predictions";

export interface RangeDraft {
  from: string;
  to: string;
}

export const MIN_CHART_HZ = 0.01;
export const defaultRange = (): RangeDraft => ({ from: String(SWEEP_FROM_HZ), to: String(SWEEP_TO_HZ) });

export type RangeCheck =
  | { ok: true; range: SweepRange; widened: boolean }
  | { ok: false; errors: Partial<Record<keyof RangeDraft, string>> };

const parse = (s: string) => (s.trim() === "" ? NaN : Number(s.trim().replace(",", ".")));

/** The range to draw, or what is wrong with it; `asked` (Hz, 0 for DC) is taken in. */
export function checkRange(d: RangeDraft, asked: number | null): RangeCheck {
  const from = parse(d.from), to = parse(d.to);
  const errors: Partial<Record<keyof RangeDraft, string>> = {};
  if (!Number.isFinite(from)) errors.from = "Enter the lowest frequency in hertz.";
  else if (from < MIN_CHART_HZ) errors.from = `Too small: at least ${MIN_CHART_HZ} Hz (a log scale cannot start at DC).`;
  else if (from > MAX_FREQUENCY_HZ) errors.from = `Too large: at most ${MAX_FREQUENCY_HZ} Hz.`;
  if (!Number.isFinite(to)) errors.to = "Enter the highest frequency in hertz.";
  else if (to > MAX_FREQUENCY_HZ) errors.to = `Too large: at most ${MAX_FREQUENCY_HZ} Hz.`;
  else if (Number.isFinite(from) && to < from * 1.5) errors.to = "Make it at least 1.5 times the lowest.";
  if (Object.keys(errors).length) return { ok: false, errors };
  let lo = from, hi = to;
  if (asked !== null && asked > 0) {
    lo = Math.min(lo, asked);
    hi = Math.max(hi, asked);
    if (hi < lo * 1.5) hi = Math.min(MAX_FREQUENCY_HZ, lo * 1.5);
  }
  return { ok: true, range: { from_hz: lo, to_hz: hi }, widened: lo !== from || hi !== to };
}

/** Decade ticks inside the range, with its ends when fewer than two decades fall in it. */
export function chartTicks({ from_hz, to_hz }: SweepRange): number[] {
  const ticks: number[] = [];
  for (let k = Math.ceil(Math.log10(from_hz) - 1e-9); 10 ** k <= to_hz * (1 + 1e-9); k++) ticks.push(10 ** k);
  if (ticks.length < 2) return [from_hz, ...ticks.filter((t) => t > from_hz && t < to_hz), to_hz];
  return ticks;
}
