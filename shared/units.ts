// Conversions to the canonical units of the API: millimetres for lengths, microtesla for fields.
// Field units given as H (A/m, Oe) are taken in air, B = μ0·H; 1 Oe ↔ 1 G = 100 µT there.

export const lengthUnits = ["mm", "cm", "m", "in", "mil"] as const;
export type LengthUnit = (typeof lengthUnits)[number];

export const fieldUnits = ["uT", "nT", "mT", "T", "mG", "G", "A/m", "Oe"] as const;
export type FieldUnit = (typeof fieldUnits)[number];

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

function check<U extends string>(table: Record<U, number>, unit: U, kind: string): number {
  const f = table[unit];
  if (f === undefined) throw new RangeError(`Unknown ${kind} unit "${unit}"`);
  return f;
}

export const isLengthUnit = (u: string): u is LengthUnit => (lengthUnits as readonly string[]).includes(u);
export const isFieldUnit = (u: string): u is FieldUnit => (fieldUnits as readonly string[]).includes(u);

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
