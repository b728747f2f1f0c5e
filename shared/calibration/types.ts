// What calibration reads: the measured parts of decided lots, grouped by lot. The data comes from
// the quality inspector's measurements (the server's measured-lot reader); the fit and the
// control charts are pure functions of it.

import type { BuildMethod, Construction } from "../physics/build-model";
import type { Orientation, PredictionInput } from "../physics/predict";

/** The design a lot was made to, as a prediction body (method included; the field is the measurement's). */
export type MeasuredDesign = Omit<PredictionInput, "field" | "state"> & { method?: BuildMethod };

export type LotDisposition = "accepted" | "rejected";

/** One measured part: its design, the test field, the attenuation found, and its lot. */
export interface MeasuredPart {
  lotId: string;
  disposition: LotDisposition;
  serial: string;
  design: MeasuredDesign;
  frequency_hz: number;
  appliedField_uT: number;
  orientation?: Orientation;
  measured_db: number;
}

/** A decided lot (accepted or rejected) with its measured parts. */
export interface MeasuredLot {
  lotId: string;
  /** the lot number people read (links and charts) */
  number: string;
  disposition: LotDisposition;
  /** when the lot was decided: orders the control chart */
  decidedAt: string;
  /** the order's required attenuation, dB: the lower specification */
  requiredAttenuation_db: number;
  parts: MeasuredPart[];
}

/** Parts as a list (each carries its lot id and disposition), grouped into lots with the lots' own facts. */
export function groupByLot(parts: MeasuredPart[], lots: Omit<MeasuredLot, "parts">[]): MeasuredLot[] {
  const byId = new Map(lots.map((l) => [l.lotId, { ...l, parts: [] as MeasuredPart[] }]));
  for (const p of parts) byId.get(p.lotId)?.parts.push(p);
  return [...byId.values()].filter((l) => l.parts.length > 0);
}

/** A class of the calibration: the alloy of the outermost layer, the forming method, the construction. */
export interface ClassKey {
  material: string;
  method: BuildMethod;
  construction: Construction;
}

export const classKeyText = (k: ClassKey): string => `${k.material}|${k.method}|${k.construction}`;

/** Defaults of the shop setting and of the method. */
export const CALIBRATION_DEFAULTS = {
  /** lots a class needs before its fit is used (the shop setting `calibrationMinLots`) */
  minLots: 5,
  /** folds of the cross-validation (fewer when a class has fewer lots) */
  folds: 5,
} as const;

/** The range the shop setting accepts. */
export const MIN_LOTS_RANGE = { min: 2, max: 200 } as const;
