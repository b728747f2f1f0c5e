// Conversions to the canonical units of the API: millimetres for lengths, microtesla for fields,
// hertz for frequencies, integer minor units (cents) for money. Field units given as H (A/m, Oe)
// are taken in air, B = μ0·H; 1 Oe ↔ 1 G = 100 µT there.
//
// A person's unit is a way of showing a quantity, never part of it: forms keep the canonical value
// and derive what they show (toCanonical / fromCanonical / showInUnit), so switching a unit and
// back leaves the quantity exactly as it was.

export const lengthUnits = ["mm", "cm", "m", "in", "mil"] as const;
export type LengthUnit = (typeof lengthUnits)[number];

export const fieldUnits = ["uT", "nT", "mT", "T", "mG", "G", "A/m", "Oe"] as const;
export type FieldUnit = (typeof fieldUnits)[number];

export const frequencyUnits = ["Hz", "kHz"] as const;
export type FrequencyUnit = (typeof frequencyUnits)[number];

const MU0 = 4e-7 * Math.PI;

/** millimetres per unit */
const MM_PER: Record<LengthUnit, number> = { mm: 1, cm: 10, m: 1000, in: 25.4, mil: 0.0254 };

/** microtesla per unit (in air for A/m and Oe) */
const UT_PER: Record<FieldUnit, number> = {
  uT: 1,
  nT: 1e-3,
  mT: 1e3,
  T: 1e6,
  mG: 0.1,
  G: 100,
  "A/m": MU0 * 1e6, // ≈ 1.2566 µT
  Oe: 100, // 1 Oe = 1000/(4π) A/m → μ0·H = 1e-4 T
};

/** hertz per unit */
const HZ_PER: Record<FrequencyUnit, number> = { Hz: 1, kHz: 1000 };

/** Labels for selects in the client. */
export const lengthUnitLabels: Record<LengthUnit, string> = { mm: "mm", cm: "cm", m: "m", in: "in", mil: "mil (0.001 in)" };
export const fieldUnitLabels: Record<FieldUnit, string> = {
  uT: "µT",
  nT: "nT",
  mT: "mT",
  T: "T",
  mG: "mG",
  G: "G (gauss)",
  "A/m": "A/m (in air)",
  Oe: "Oe (in air)",
};
export const frequencyUnitLabels: Record<FrequencyUnit, string> = { Hz: "Hz", kHz: "kHz" };

/** The short symbol written after a number ("12 in", "100 µT"). */
export const unitSymbols: Record<LengthUnit | FieldUnit | FrequencyUnit, string> = {
  mm: "mm", cm: "cm", m: "m", in: "in", mil: "mil",
  uT: "µT", nT: "nT", mT: "mT", T: "T", mG: "mG", G: "G", "A/m": "A/m", Oe: "Oe",
  Hz: "Hz", kHz: "kHz",
};

function check<U extends string>(table: Record<U, number>, unit: U, kind: string): number {
  const f = table[unit];
  if (f === undefined) throw new RangeError(`Unknown ${kind} unit "${unit}"`);
  return f;
}

export const isLengthUnit = (u: string): u is LengthUnit => (lengthUnits as readonly string[]).includes(u);
export const isFieldUnit = (u: string): u is FieldUnit => (fieldUnits as readonly string[]).includes(u);
export const isFrequencyUnit = (u: string): u is FrequencyUnit => (frequencyUnits as readonly string[]).includes(u);

export function toMillimetres(value: number, unit: LengthUnit): number {
  return value * check(MM_PER, unit, "length");
}
export function fromMillimetres(value_mm: number, unit: LengthUnit): number {
  return value_mm / check(MM_PER, unit, "length");
}
export function toMicrotesla(value: number, unit: FieldUnit): number {
  return value * check(UT_PER, unit, "field");
}
export function fromMicrotesla(value_uT: number, unit: FieldUnit): number {
  return value_uT / check(UT_PER, unit, "field");
}
export function toHertz(value: number, unit: FrequencyUnit): number {
  return value * check(HZ_PER, unit, "frequency");
}
export function fromHertz(value_hz: number, unit: FrequencyUnit): number {
  return value_hz / check(HZ_PER, unit, "frequency");
}

// --- quantities: one description per kind, so one input component serves them all ---

export interface QuantityUnits {
  length: LengthUnit;
  flux: FieldUnit;
  frequency: FrequencyUnit;
}
export type QuantityKind = keyof QuantityUnits;

/** The canonical unit each kind is kept and sent in. */
export const canonicalUnits: QuantityUnits = { length: "mm", flux: "uT", frequency: "Hz" };

/** canonical value ← a value in the person's unit */
export function toCanonical<K extends QuantityKind>(kind: K, value: number, unit: QuantityUnits[K]): number {
  if (kind === "length") return toMillimetres(value, unit as LengthUnit);
  if (kind === "flux") return toMicrotesla(value, unit as FieldUnit);
  return toHertz(value, unit as FrequencyUnit);
}

/** a value in the person's unit ← the canonical value */
export function fromCanonical<K extends QuantityKind>(kind: K, value: number, unit: QuantityUnits[K]): number {
  if (kind === "length") return fromMillimetres(value, unit as LengthUnit);
  if (kind === "flux") return fromMicrotesla(value, unit as FieldUnit);
  return fromHertz(value, unit as FrequencyUnit);
}

/**
 * A converted figure as a person would type it: six significant figures at most, without the
 * binary noise of the conversion (120 mm → "4.72441" in, 60 mm → "2.3622" in, 25.4 mm → "1").
 */
export function tidyNumber(x: number, significant = 6): string {
  if (!Number.isFinite(x)) return "";
  if (x === 0) return "0";
  return String(+x.toPrecision(significant));
}

/** The canonical value shown in `unit`, ready for an input box; "" for a missing value. */
export function showInUnit<K extends QuantityKind>(kind: K, value: number | null | undefined, unit: QuantityUnits[K]): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  return tidyNumber(fromCanonical(kind, value, unit));
}

/**
 * What a person typed, as a number: a comma is a decimal point, blanks and thin spaces between
 * digit groups are ignored; "" is null (nothing entered), anything else unreadable is NaN.
 */
export function readNumber(text: string): number | null {
  const t = text.trim().replace(/[\s\u00a0\u2009\u202f]/g, "").replace(",", ".").replace(/^\u2212/, "-");
  if (t === "") return null;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return NaN;
  return Number(t);
}

// --- money: typed in currency units, kept and sent in integer minor units (cents) ---

const minorDigits = new Map<string, number>();

/** Digits after the decimal point for an ISO 4217 currency (EUR 2, JPY 0). */
export function minorUnitDigits(currency: string): number {
  let d = minorDigits.get(currency);
  if (d === undefined) {
    try {
      d = new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
    } catch {
      d = 2; // an unknown code: the schema says what is wrong with it
    }
    minorDigits.set(currency, d);
  }
  return d;
}

/** 12.34 EUR → 1234; rounded half away from zero to whole minor units. */
export function centsFromAmount(amount: number, currency: string): number {
  const scaled = amount * 10 ** minorUnitDigits(currency);
  // toPrecision drops the float noise of the multiplication (19.99 × 100 = 1998.9999…)
  const clean = +scaled.toPrecision(12);
  return Math.sign(clean) * Math.round(Math.abs(clean));
}

/** 1234 cents EUR → 12.34 */
export function amountFromCents(cents: number, currency: string): number {
  return cents / 10 ** minorUnitDigits(currency);
}

/** The amount for an input box: "12.34", "1500.00", "-3.50". */
export function showAmount(cents: number | null | undefined, currency: string): string {
  if (cents === null || cents === undefined || !Number.isFinite(cents)) return "";
  return amountFromCents(cents, currency).toFixed(minorUnitDigits(currency));
}
