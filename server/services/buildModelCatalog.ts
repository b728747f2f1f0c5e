import { QueryTypes } from "sequelize";
import type { ClassFit } from "../../shared/calibration";
import { buildModelFrom, type BuildFit, type BuildModel } from "../../shared/physics/build-model";
import { constructionSettingsOf } from "../../shared/schemas/pricing";
import { PriceListVersion } from "../models";
import { processCache } from "./processCache";

// The as-built model the predictions use: the construction settings of the current shop-rates
// version (the defaults from practice before any is saved) and the fits of the latest calibration
// refit, held in this process like the materials, so a prediction costs no database query. A save
// of the settings or a refit invalidates it.

interface FitRow {
  id: string;
  material: string;
  method: BuildFit["method"];
  construction: BuildFit["construction"];
  in_use: boolean;
  lots: number;
  mu_effective: number;
  ceiling_db: number;
  fit: ClassFit;
  fitted_at: Date;
}

/** A stored fit as the engine takes it: in use, its parameters and band; otherwise only the note that the library stands. */
export function buildFitOf(row: FitRow): BuildFit {
  const key = { material: row.material, method: row.method, construction: row.construction, id: row.id };
  const calibration = { source: row.in_use ? ("shop" as const) : ("library" as const), lots: row.lots, fittedAt: new Date(row.fitted_at).toISOString(), fitId: row.id };
  if (!row.in_use) return { ...key, calibration };
  return { ...key, mu_effective: row.mu_effective, ceiling_db: row.ceiling_db, band_db: row.fit.band_db, calibration };
}

/** The fits of the latest refit. */
export async function currentFits(): Promise<BuildFit[]> {
  const rows = await PriceListVersion.sequelize!.query<FitRow>(
    `select id, material, method, construction, in_use, lots, mu_effective, ceiling_db, fit, fitted_at from calibration_fits
     where run_id = (select id from calibration_runs order by fitted_at desc limit 1)`,
    { type: QueryTypes.SELECT },
  );
  return rows.map(buildFitOf);
}

const cache = processCache<BuildModel>(async () => {
  const [current, fits] = await Promise.all([PriceListVersion.current(), currentFits()]);
  return buildModelFrom(constructionSettingsOf(current?.data ?? {}), { fits });
});

export const buildModelCatalog = (): Promise<BuildModel> | BuildModel => cache.get();
export const invalidateBuildModel = (): void => cache.invalidate();

/** The fits last loaded, without waiting (a quote prices synchronously; the app warms the cache at start). */
export const calibrationFitsSnapshot = (): BuildFit[] => cache.snapshot()?.fits ?? [];
