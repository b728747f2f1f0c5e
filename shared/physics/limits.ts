// What a prediction accepts and what it states. Inputs outside these ranges are beyond physical
// sense for a passive magnetic shield (or would break the arithmetic: a resistivity of 1e-300,
// a wall a nanometre thick) and are refused, naming the field, as "too large" or "too small".
// The request schema and the engine read the same figures.

export interface Range {
  min: number;
  max: number;
  /** the unit as the message states it */
  unit: string;
  /** min itself is allowed (0 Hz is a static field; a gap of 0 is touching layers) */
  minInclusive?: boolean;
}

export const INPUT_LIMITS = {
  /** inside sizes of the innermost layer: a 1 mm sensor can up to a 10 m room */
  dimension_mm: { min: 1, max: 10_000, unit: "mm", minInclusive: true },
  /** foil to plate */
  thickness_mm: { min: 0.01, max: 100, unit: "mm", minInclusive: true },
  gap_mm: { min: 0, max: 10_000, unit: "mm", minInclusive: true },
  holeDiameter_mm: { min: 0.5, max: 10_000, unit: "mm", minInclusive: true },
  collarLength_mm: { min: 0, max: 10_000, unit: "mm", minInclusive: true },
  /** the permeability data and formulas hold to about 100 kHz */
  frequency_hz: { min: 0, max: 100_000, unit: "Hz", minInclusive: true },
  /** 1 pT to 10 T */
  amplitude_uT: { min: 1e-6, max: 10_000_000, unit: "µT", minInclusive: true },
  /** no alloy reaches a relative permeability of a million */
  mu_r: { min: 1, max: 1_000_000, unit: "", minInclusive: true },
  /** silver (1.6e-8) with margin, to an insulator for all purposes here */
  resistivity_ohm_m: { min: 1e-9, max: 1, unit: "Ω·m", minInclusive: true },
  saturation_T: { min: 0.01, max: 5, unit: "T", minInclusive: true },
} satisfies Record<string, Range>;

export type LimitName = keyof typeof INPUT_LIMITS;

/**
 * Figures above this are stated as "more than 300 dB" and flagged (`beyondLimit`): no
 * measurement reaches there, and what a built shield does is set long before by its construction.
 */
export const REPORT_LIMIT_DB = 300;

/** The message for a value outside its range, or null when it is inside. */
export function rangeProblem(what: string, value: number, range: Range): string | null {
  if (!Number.isFinite(value)) return `${what} must be a number.`;
  const unit = range.unit ? ` ${range.unit}` : "";
  const low = range.minInclusive ? value < range.min : value <= range.min;
  if (low) return `${what} is too small: ${range.minInclusive ? "at least" : "more than"} ${range.min}${unit}.`;
  if (value > range.max) return `${what} is too large: at most ${range.max}${unit}.`;
  return null;
}
