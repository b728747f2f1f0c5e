// The chart's frequency range as the person sets it (hertz; null for an empty box, NaN for one
// that is not a number), checked, and widened to take in the asked frequency (the curve always
// shows the point the figures above are for).

import { MAX_FREQUENCY_HZ, SWEEP_FROM_HZ, SWEEP_TO_HZ } from "../../../shared/schemas/prediction";
import type { SweepRange } from "../../api/predictions";
import type { ChartRangeDraft } from "./design-url";

export type { ChartRangeDraft };
export const MIN_CHART_HZ = 0.01;
export const defaultRange = (): ChartRangeDraft => ({ from_hz: SWEEP_FROM_HZ, to_hz: SWEEP_TO_HZ });

export type RangeCheck =
  | { ok: true; range: SweepRange; widened: boolean }
  | { ok: false; errors: Partial<Record<"from" | "to", string>> };

/** The range to draw, or what is wrong with it; `asked` (Hz, 0 for DC) is taken in. */
export function checkRange(d: ChartRangeDraft, asked: number | null): RangeCheck {
  const from = d.from_hz ?? NaN, to = d.to_hz ?? NaN;
  const errors: Partial<Record<"from" | "to", string>> = {};
  if (d.from_hz === null) errors.from = "Enter the chart's lowest frequency.";
  else if (!Number.isFinite(from)) errors.from = "The chart's lowest frequency must be a number.";
  else if (from < MIN_CHART_HZ) errors.from = `The chart's lowest frequency must be at least ${MIN_CHART_HZ} Hz (a log scale cannot start at DC).`;
  else if (from > MAX_FREQUENCY_HZ) errors.from = `The chart's lowest frequency must be at most ${MAX_FREQUENCY_HZ / 1000} kHz.`;
  if (d.to_hz === null) errors.to = "Enter the chart's highest frequency.";
  else if (!Number.isFinite(to)) errors.to = "The chart's highest frequency must be a number.";
  else if (to > MAX_FREQUENCY_HZ) errors.to = `The chart's highest frequency must be at most ${MAX_FREQUENCY_HZ / 1000} kHz.`;
  else if (Number.isFinite(from) && to < from * 1.5) errors.to = "The chart's highest frequency must be at least 1.5 times its lowest.";
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
