/** Calibration from measured lots: the shop setting's request body and the answers of /api/calibration*. */
import { z } from "zod";
import type { Calibration, ClassFit, IndividualsChart } from "../calibration";
import { MIN_LOTS_RANGE } from "../calibration/types";
import type { BuildMethod, Construction } from "../physics/build-model";

export const calibrationSettingsSchema = z.object({
  minLots: z
    .number({ error: "Give the lots a class needs as a whole number." })
    .int({ error: "Give the lots a class needs as a whole number." })
    .min(MIN_LOTS_RANGE.min, { error: `A class needs at least ${MIN_LOTS_RANGE.min} lots (one to fit, one to check).` })
    .max(MIN_LOTS_RANGE.max, { error: `At most ${MIN_LOTS_RANGE.max} lots.` }),
});
export type CalibrationSettingsInput = z.infer<typeof calibrationSettingsSchema>;

/** `GET /api/calibration`: one row per class of the latest refit (the contract's fields, and the fit's id). */
export interface CalibrationJson {
  id: string;
  material: string;
  method: BuildMethod;
  construction: Construction;
  lots: number;
  mu_effective: number;
  ceiling_db: number;
  /** median absolute error of predicted against measured dB */
  error_db: { library: number; fitted: number; crossValidated: number };
  inUse: boolean;
  fittedAt: string;
}

export interface CalibrationRunJson {
  id: string;
  fittedAt: string;
  /** who asked for it (null: the scheduled check) */
  fittedBy: { id: string; name: string } | null;
  reason: string;
  minLots: number;
  lots: number;
  classesInUse: number;
}

/** `GET /api/calibration/overview`: the latest refit in full, the setting, the refits before it. */
export interface CalibrationOverviewJson {
  run: CalibrationRunJson | null;
  fits: (ClassFit & { id: string; fittedAt: string })[];
  waiting: Calibration["waiting"];
  unclassified: Calibration["unclassified"];
  settings: { minLots: number };
  /** an ask for a refit is waiting for the refit that answers it (queued or running) */
  refitPending: boolean;
  history: CalibrationRunJson[];
}

/** `GET /api/calibration/control-charts`: one chart per alloy (outermost layer) and forming route. */
export interface ControlChartJson {
  material: string;
  method: BuildMethod;
  lots: number;
  chart: IndividualsChart;
}
