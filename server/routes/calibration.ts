import { Router } from "express";
import { QueryTypes } from "sequelize";
import { chartLotsOf, individualsChart, type Calibration, type MeasuredLot } from "../../shared/calibration";
import { classOf } from "../../shared/physics/build-model";
import { calibrationSettingsSchema, type CalibrationOverviewJson, type ControlChartJson } from "../../shared/schemas/calibration";
import type { AppDeps } from "../deps";
import { openRefitRequestCount, queueCalibrationRefit } from "../jobs/calibration-refit";
import { NotFoundError } from "../errors";
import { parseInput } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { recordEvent } from "../models";
import { requireRole } from "../policies/utils";
import { presentCalibration, presentRun, type FitRecord, type RunRecord } from "../presenters/calibration";
import { calibrationMinLots } from "../services/calibrationRefitter";
import type { MeasuredLotsReader } from "../services/measuredLotsReader";

const FITS_OF_LATEST = `select id, material, method, construction, in_use, lots, mu_effective, ceiling_db, error_db, fit, fitted_at from calibration_fits
  where run_id = (select id from calibration_runs order by fitted_at desc limit 1) order by material, method, construction`;
const RUNS = `select r.id, r.fitted_at, r.fitted_by_id, u.name as fitted_by_name, r.reason, r.min_lots, r.lots, r.waiting, r.unclassified,
    (select count(*) from calibration_fits f where f.run_id = r.id and f.in_use)::int as classes_in_use
  from calibration_runs r left join users u on u.id = r.fitted_by_id order by r.fitted_at desc limit 20`;

/** Each lot grouped by its alloy (outermost layer) and forming route, for the control charts. */
export function chartsOf(lots: MeasuredLot[]): ControlChartJson[] {
  const groups = new Map<string, { material: string; method: ControlChartJson["method"]; lots: MeasuredLot[] }>();
  for (const lot of lots) {
    const c = classOf(lot.parts[0].design);
    if (!c.material) continue;
    const key = `${c.material}|${c.method}`;
    if (!groups.has(key)) groups.set(key, { material: c.material, method: c.method, lots: [] });
    groups.get(key)!.lots.push(lot);
  }
  return [...groups.values()]
    .sort((a, b) => (a.material + a.method < b.material + b.method ? -1 : 1))
    .map((g) => ({ material: g.material, method: g.method, lots: g.lots.length, chart: individualsChart(chartLotsOf(g.lots)) }));
}

/** The shop's calibration from its measured lots and the control charts of those lots (quality inspectors and the planner). */
export function calibrationRouter({ sequelize, jobs }: AppDeps, { readLots }: { readLots: MeasuredLotsReader }): Router {
  const router = Router();

  router.get("/calibration", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const rows = await sequelize.query<FitRecord>(FITS_OF_LATEST, { type: QueryTypes.SELECT });
    res.json(rows.map(presentCalibration));
  });

  router.get("/calibration/overview", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const [fits, runs, minLots, openAsks] = await Promise.all([
      sequelize.query<FitRecord>(FITS_OF_LATEST, { type: QueryTypes.SELECT }),
      sequelize.query<RunRecord & Pick<Calibration, "waiting" | "unclassified">>(RUNS, { type: QueryTypes.SELECT }),
      calibrationMinLots(sequelize),
      openRefitRequestCount(sequelize),
    ]);
    const latest = runs[0];
    const answer: CalibrationOverviewJson = {
      run: latest ? presentRun(latest) : null,
      fits: fits.map((f) => ({ ...f.fit, id: f.id, fittedAt: new Date(f.fitted_at).toISOString() })),
      waiting: latest?.waiting ?? [],
      unclassified: latest?.unclassified ?? [],
      settings: { minLots },
      // an ask stays open until the refit that answers it commits (not the queue's state: a job left
      // active by a process that died would say "running" for its 15 minutes)
      refitPending: openAsks > 0,
      history: runs.map(presentRun),
    };
    res.json(answer);
  });

  router.get("/calibration/control-charts", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    res.json(chartsOf(await readLots()));
  });

  // one measured lot as the calibration read it (the page's links to the lots left out)
  router.get("/calibration/lots/:lotId", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const lot = (await readLots()).find((l) => l.lotId === req.params.lotId);
    if (!lot) throw NotFoundError("measured lot");
    res.json(lot);
  });

  // a refit by hand: queued like the one a certificate queues
  router.post("/calibration/refits", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    await sequelize.transaction(async (transaction) => {
      await recordEvent({ actor: req.user!, action: "calibration.refit-requested", subject: { type: "calibration" }, ip: req.ip ?? null }, transaction);
      await queueCalibrationRefit({ jobs, sequelize }, { actorId: req.user!.id, reason: "asked for by hand", force: true }, transaction);
    });
    res.status(202).json({ queued: true });
  });

  // the shop setting: lots a class needs before its fit is used (the planner's)
  router.put("/calibration/settings", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const input = parseInput(calibrationSettingsSchema, req.body);
    await sequelize.transaction(async (transaction) => {
      await sequelize.query("update calibration_settings set min_lots = $1, updated_by_id = $2, updated_at = now() where id = 1", { bind: [input.minLots, req.user!.id], transaction });
      await recordEvent({ actor: req.user!, action: "calibration.settings-changed", subject: { type: "calibration" }, data: { minLots: input.minLots }, ip: req.ip ?? null }, transaction);
      await queueCalibrationRefit({ jobs, sequelize }, { actorId: req.user!.id, reason: `lots a class needs set to ${input.minLots}`, force: true }, transaction);
    });
    res.json({ minLots: input.minLots });
  });

  return router;
}
