// The arithmetic of a post-anneal attenuation measurement: the applied field from a Helmholtz
// pair, the inside field from a search coil's voltage, the shielding factor, its decibels and the
// pass against the order's required attenuation. SI units inside; the API's µT at the edge.

/** μ0, N/A² (CODATA 2018: 1.25663706212(19)e-6; 4π·1e-7 differs by 5.5e-10 relative). */
export const MU0 = 1.25663706212e-6;

/** (4/5)^{3/2}: the Helmholtz pair's centre field relative to μ0·n·I/R */
export const HELMHOLTZ_FACTOR = Math.pow(4 / 5, 1.5);

const positive = (value: number, what: string) => {
  if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${what} must be a number above 0`);
  return value;
};

/**
 * Flux density at the centre of a Helmholtz pair: B = (4/5)^{3/2}·μ0·n·I/R, n turns on each of the
 * two coils, current I (A; an RMS current gives an RMS field), coil radius R (m) equal to the spacing.
 * Returns tesla.
 */
export function helmholtzCentreField(props: { turnsPerCoil: number; current_A: number; radius_m: number }): number {
  return (HELMHOLTZ_FACTOR * MU0 * positive(props.turnsPerCoil, "the turns per coil") * positive(props.current_A, "the current")) / positive(props.radius_m, "the coil radius");
}

/**
 * Faraday's law for a search coil in a sinusoidal field: V_rms = 2π·f·N·A·B_rms (N turns of area A
 * m², field B perpendicular to the turns). Returns volts RMS for a field in tesla RMS.
 */
export function searchCoilVoltage(props: { frequency_hz: number; turns: number; area_m2: number; field_T: number }): number {
  return 2 * Math.PI * positive(props.frequency_hz, "the frequency") * positive(props.turns, "the turns") * positive(props.area_m2, "the coil area") * positive(props.field_T, "the field");
}

/** The inverse: the field (tesla RMS) that a search coil's RMS voltage means. DC fields induce nothing (f > 0). */
export function searchCoilField(props: { frequency_hz: number; turns: number; area_m2: number; voltage_V: number }): number {
  return positive(props.voltage_V, "the coil voltage") / (2 * Math.PI * positive(props.frequency_hz, "the frequency") * positive(props.turns, "the turns") * positive(props.area_m2, "the coil area"));
}

/** S = B_applied / B_inside (the same units for both). */
export function shieldingFactor(applied: number, inside: number): number {
  return positive(applied, "the applied field") / positive(inside, "the inside field");
}

/** Attenuation in dB: 20·log10(S). */
export const attenuationDb = (factor: number) => 20 * Math.log10(positive(factor, "the shielding factor"));

/** The shielding factor a number of decibels means: 10^{dB/20}. */
export const factorFromDb = (db: number) => Math.pow(10, db / 20);

/** Floating-point noise allowed in the pass comparison (20·log10 of an exact ratio may miss by 1e-15). */
const DB_TOLERANCE = 1e-9;

/** The figures a measurement records. A part passes when its attenuation is at least the required decibels. */
export function judgeMeasurement(props: { applied_uT: number; inside_uT: number; required_db: number }): { shieldingFactor: number; attenuation_db: number; pass: boolean } {
  const factor = shieldingFactor(props.applied_uT, props.inside_uT);
  const db = attenuationDb(factor);
  if (!Number.isFinite(props.required_db)) throw new RangeError("the required attenuation must be a number");
  return { shieldingFactor: factor, attenuation_db: db, pass: db >= props.required_db - DB_TOLERANCE };
}

/** Millivolts, as a person types them, to volts. */
export const millivoltsToVolts = (mV: number) => mV / 1000;
/** Tesla to the API's microtesla. */
export const teslaToMicrotesla = (T: number) => T * 1e6;
/** Square millimetres (a coil's area as a person gives it) to square metres. */
export const squareMillimetresToSquareMetres = (mm2: number) => mm2 * 1e-6;
