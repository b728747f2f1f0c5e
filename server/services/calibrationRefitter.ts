import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { calibrateSteps, type Calibration } from "../../shared/calibration";
import { buildModelFrom } from "../../shared/physics/build-model";
import { constructionSettingsOf } from "../../shared/schemas/pricing";
import { PriceListVersion, recordEvent } from "../models";
import { materialCatalog } from "./materialCatalog";
import { measuredLotsFingerprint, type MeasuredLotsReader } from "./measuredLotsReader";
import { referenceDataChanged } from "./referenceData";

/** The longest reason a refit keeps (calibration_runs.reason, migration 0042): a refit answering several asks names each. */
export const RUN_REASON_MAX = 1000;

/** Lots a class needs before its fit is used (the shop setting). */
export async function calibrationMinLots(sequelize: Sequelize): Promise<number> {
  const [row] = await sequelize.query<{ min_lots: number }>("select min_lots from calibration_settings where id = 1", { type: QueryTypes.SELECT });
  return row?.min_lots ?? 5;
}

/** Runs a generator to its end, giving the event loop back every 25 ms (a class of 1 000 lots takes about a second). */
async function runSliced<T>(steps: Generator<void, T>): Promise<T> {
  let slice = Date.now();
  for (;;) {
    const s = steps.next();
    if (s.done) return s.value;
    if (Date.now() - slice > 25) {
      await new Promise((r) => setImmediate(r));
      slice = Date.now();
    }
  }
}

/**
 * Fits every class of the measured lots and keeps the result as a new refit (its fits, who asked,
 * when, the lots used), then makes predictions in this process use it (others within 30 s).
 * Unless `force`, does nothing when the lots have not changed since the last refit.
 */
export async function calibrationRefitter(props: {
  sequelize: Sequelize;
  readLots: MeasuredLotsReader;
  actor: { id: string } | null;
  reason: string;
  force?: boolean;
  /** the asks for a refit this one answers (calibration_refit_requests), marked in the same transaction */
  answers?: string[];
}): Promise<{ runId: string; calibration: Calibration } | null> {
  const { sequelize, readLots } = props;
  const answers = props.answers ?? [];
  const markAnswered = (runId: string | null, transaction?: Transaction) =>
    answers.length
      ? sequelize.query("update calibration_refit_requests set answered_at = now(), run_id = $1 where id = any($2::uuid[]) and answered_at is null", { bind: [runId, answers], transaction })
      : Promise.resolve();
  const fingerprint = await measuredLotsFingerprint(sequelize);
  const minLots = await calibrationMinLots(sequelize);
  if (!props.force) {
    const [last] = await sequelize.query<{ fingerprint: string; min_lots: number }>(
      "select fingerprint, min_lots from calibration_runs order by fitted_at desc limit 1",
      { type: QueryTypes.SELECT },
    );
    if (last && last.fingerprint === fingerprint && last.min_lots === minLots) {
      await markAnswered(null);
      return null;
    }
  }
  const [lots, catalog, priceList] = await Promise.all([readLots(), materialCatalog(), PriceListVersion.current()]);
  // the shop's construction settings without any fit: the library values a fit is judged against
  const model = buildModelFrom(constructionSettingsOf(priceList?.data ?? {}));
  const calibration = await runSliced(calibrateSteps(lots, { materials: (id) => catalog.byId.get(id), model, minLots }));

  const runId = await sequelize.transaction(async (transaction) => {
    const [run] = await sequelize.query<{ id: string; fitted_at: Date }>(
      `insert into calibration_runs (fitted_by_id, reason, min_lots, lots, fingerprint, waiting, unclassified)
       values ($1, $2, $3, $4, $5, $6, $7) returning id, fitted_at`,
      {
        type: QueryTypes.SELECT, transaction,
        bind: [props.actor?.id ?? null, props.reason.slice(0, RUN_REASON_MAX), minLots, lots.length, fingerprint, JSON.stringify(calibration.waiting), JSON.stringify(calibration.unclassified)],
      },
    );
    for (const fit of calibration.fits)
      await sequelize.query(
        `insert into calibration_fits (run_id, material, method, construction, in_use, lots, mu_effective, ceiling_db, error_db, lots_used, fit, fitted_at)
         values ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12)`,
        {
          transaction,
          bind: [run.id, fit.material, fit.method, fit.construction, fit.inUse, fit.lots, fit.mu_effective, fit.ceiling_db,
            JSON.stringify(fit.error_db), JSON.stringify(fit.lotsUsed), JSON.stringify(fit), run.fitted_at],
        },
      );
    await recordEvent(
      {
        actor: props.actor ?? undefined, action: "calibration.refitted", subject: { type: "calibration-run", id: run.id },
        data: { reason: props.reason, lots: lots.length, classes: calibration.fits.length, inUse: calibration.fits.filter((f) => f.inUse).map((f) => `${f.material} ${f.method} ${f.construction}`) },
      },
      transaction,
    );
    await markAnswered(run.id, transaction);
    return run.id;
  });
  await referenceDataChanged(sequelize, "build-model");
  return { runId, calibration };
}

/** Fits once when there are measured lots and no refit yet (a fresh start); false when there was nothing to do. */
export async function firstCalibration(props: { sequelize: Sequelize; readLots: MeasuredLotsReader }): Promise<boolean> {
  const [row] = await props.sequelize.query<{ runs: number; lots: number }>(
    "select (select count(*) from calibration_runs)::int as runs, (select count(*) from calibration_measured_parts)::int as lots",
    { type: QueryTypes.SELECT },
  );
  if (row.runs > 0 || row.lots === 0) return false;
  return (await calibrationRefitter({ ...props, actor: null, reason: "the first fit of the measured lots", force: true })) !== null;
}
