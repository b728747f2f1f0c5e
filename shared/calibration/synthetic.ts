// Measured lots made up from known parameters: the engine's own figure with the class's μ and
// ceiling set, plus normal noise. The reference tests check that a fit recovers the parameters;
// the demo scenario's invented lots are made the same way (never real data).

import { buildModelFrom, DEFAULT_CONSTRUCTION_SETTINGS, type BuildModel } from "../physics/build-model";
import { materialLibrary } from "../physics/materials";
import { predictShield, type MaterialLookup, type Orientation } from "../physics/predict";
import { seededRandom } from "./stats";
import type { ClassKey, MeasuredDesign, MeasuredLot } from "./types";

export interface SyntheticProps {
  key: ClassKey;
  /** the true effective μ and one-layer ceiling */
  mu_effective: number;
  ceiling_db: number;
  /** the designs the lots are made to (taken in turn) */
  designs: MeasuredDesign[];
  /** test frequencies, Hz (taken in turn, offset from the designs) */
  frequencies_hz: number[];
  lots: number;
  partsPerLot: number;
  /** standard deviation of the noise, dB: within a lot, and of each lot's own level */
  partNoise_db: number;
  lotNoise_db: number;
  requiredAttenuation_db: number | ((design: MeasuredDesign, predicted_db: number) => number);
  seed: number;
  /** the first lot's decision date; one lot a day after it */
  start?: string;
  /** lots shifted by this many dB (a re-anneal, a furnace problem): index → shift */
  lotShifts?: Record<number, number>;
  appliedField_uT?: number;
  orientation?: Orientation;
  materials?: MaterialLookup;
  model?: BuildModel;
  numberPrefix?: string;
}

/** Standard normal draws from a uniform generator (Box–Muller). */
export function normalDraws(random: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

export function syntheticLots(p: SyntheticProps): MeasuredLot[] {
  const materials = p.materials ?? materialLibrary;
  const base = p.model ?? buildModelFrom(DEFAULT_CONSTRUCTION_SETTINGS);
  const truth: BuildModel = { ...base, fits: [{ ...p.key, mu_effective: p.mu_effective, ceiling_db: p.ceiling_db }] };
  const normal = normalDraws(seededRandom(p.seed));
  const start = Date.parse(p.start ?? "2026-06-01T10:00:00Z");
  const prefix = p.numberPrefix ?? "L";
  const lots: MeasuredLot[] = [];
  for (let i = 0; i < p.lots; i++) {
    const design = p.designs[i % p.designs.length];
    const frequency_hz = p.frequencies_hz[(i + Math.floor(i / p.designs.length)) % p.frequencies_hz.length];
    const field = { frequency_hz, amplitude_uT: p.appliedField_uT ?? 50, orientation: p.orientation ?? "transverse" };
    const predicted = predictShield({ ...design, field, state: "annealed" }, materials, truth, { detail: false }).attenuation_db;
    const level = predicted + p.lotNoise_db * normal() + (p.lotShifts?.[i] ?? 0);
    const number = `${prefix}-${String(i + 1).padStart(4, "0")}`;
    const lotId = `${prefix.toLowerCase()}-${i + 1}`;
    const required = typeof p.requiredAttenuation_db === "function" ? p.requiredAttenuation_db(design, predicted) : p.requiredAttenuation_db;
    lots.push({
      lotId,
      number,
      disposition: "accepted",
      decidedAt: new Date(start + i * 86_400_000).toISOString(),
      requiredAttenuation_db: required,
      parts: Array.from({ length: p.partsPerLot }, (_, k) => ({
        lotId,
        disposition: "accepted" as const,
        serial: `${number}-${String(k + 1).padStart(2, "0")}`,
        design,
        frequency_hz,
        appliedField_uT: field.amplitude_uT,
        orientation: field.orientation,
        measured_db: Math.round((level + p.partNoise_db * normal()) * 100) / 100,
      })),
    });
  }
  return lots;
}
