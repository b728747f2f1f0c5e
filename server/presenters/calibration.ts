import type { ClassFit } from "../../shared/calibration";
import type { CalibrationJson, CalibrationRunJson } from "../../shared/schemas/calibration";

export interface FitRecord {
  id: string;
  material: string;
  method: CalibrationJson["method"];
  construction: CalibrationJson["construction"];
  in_use: boolean;
  lots: number;
  mu_effective: number;
  ceiling_db: number;
  error_db: CalibrationJson["error_db"];
  fit: ClassFit;
  fitted_at: Date | string;
}

export interface RunRecord {
  id: string;
  fitted_at: Date | string;
  fitted_by_id: string | null;
  fitted_by_name: string | null;
  reason: string;
  min_lots: number;
  lots: number;
  classes_in_use: number;
}

const iso = (d: Date | string) => new Date(d).toISOString();

export function presentCalibration(r: FitRecord): CalibrationJson {
  return {
    id: r.id, material: r.material, method: r.method, construction: r.construction, lots: r.lots,
    mu_effective: r.mu_effective, ceiling_db: r.ceiling_db,
    error_db: { library: r.error_db.library, fitted: r.error_db.fitted, crossValidated: r.error_db.crossValidated },
    inUse: r.in_use, fittedAt: iso(r.fitted_at),
  };
}

export function presentRun(r: RunRecord): CalibrationRunJson {
  return {
    id: r.id, fittedAt: iso(r.fitted_at), fittedBy: r.fitted_by_id ? { id: r.fitted_by_id, name: r.fitted_by_name ?? "" } : null,
    reason: r.reason, minLots: r.min_lots, lots: r.lots, classesInUse: Number(r.classes_in_use),
  };
}
