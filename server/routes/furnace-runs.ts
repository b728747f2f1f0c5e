import { Router, type Request } from "express";
import { QueryTypes } from "sequelize";
import { HYDROGEN_CAUTION } from "../../shared/shop-floor/anneal";
import { furnaceRunCreateSchema, furnaceRunListQuerySchema, type FurnaceRunJson, type FurnaceRunSummaryJson, type FurnacesJson } from "../../shared/schemas/furnace-runs";
import type { AppDeps } from "../deps";
import { NotFoundError } from "../errors";
import { discardUploads, receiveUploads } from "../files/upload";
import { parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { FurnaceRun, ShopSettings, StoredFile, User } from "../models";
import { furnaceRoles } from "../policies/shop-floor";
import { requireRole } from "../policies/utils";
import { presentStoredFile } from "../presenters/files";
import { furnaceChartAttacher, furnaceRunRecorder, MAX_CHART_BYTES } from "../services/furnaceRunRecorder";
import { sendStoredFile } from "./heats";
import { materialNames } from "./jobs";

const staff = ["operator", "qa", "admin"] as const;

/** The hydrogen furnaces, their anneal windows, and the furnace runs with their lots and charts. */
export function furnaceRunsRouter(deps: AppDeps): Router {
  const { sequelize, files: store } = deps;
  const router = Router();
  const ip = (req: Request) => req.ip ?? null;

  async function present(run: FurnaceRun): Promise<FurnaceRunJson> {
    const [lots, operator, chart, names] = await Promise.all([
      sequelize.query<{ id: string; on_hold: boolean }>(`select id, hold_reason is not null as on_hold from lots where id = any($1::uuid[])`, {
        bind: [run.lots.map((l) => l.id)],
        type: QueryTypes.SELECT,
      }),
      run.operatorId ? User.findByPk(run.operatorId, { attributes: ["id", "name"] }) : null,
      run.chartFileId ? StoredFile.findByPk(run.chartFileId) : null,
      materialNames(),
    ]);
    return {
      id: run.id,
      number: run.number,
      furnace: run.furnace,
      material: { id: run.materialId, name: names(run.materialId) },
      lots: run.lots.map((l) => ({ ...l, onHold: lots.find((x) => x.id === l.id)?.on_hold ?? false })),
      pieces: run.pieces,
      load_kg: run.loadKg,
      setpoint_c: run.setpointC,
      peakTemperature_c: run.peakTemperatureC,
      soak_min: run.soakMin,
      dewPoint_c: run.dewPointC,
      dewPointOut_c: run.dewPointOutC,
      coolingRate_c_per_h: run.coolingRateCPerH,
      window: run.window,
      withinWindow: run.withinWindow,
      deviations: run.deviations,
      chart: chart ? presentStoredFile(chart, `/api/furnace-runs/${run.id}/chart`) : null,
      operator: operator ? { id: operator.id, name: operator.name } : null,
      notes: run.notes,
      ranAt: run.ranAt.toISOString(),
      createdAt: run.createdAt.toISOString(),
      abilities: { attachChart: true },
    };
  }

  async function loadRun(id: unknown): Promise<FurnaceRun> {
    const run = await FurnaceRun.findByPk(recordId(id, "furnace run"));
    if (!run) throw NotFoundError("furnace run");
    return run;
  }

  router.get("/furnaces", requireUser, async (req, res) => {
    requireRole(req.user!, ...staff);
    const settings = await ShopSettings.current();
    const body: FurnacesJson = { furnaces: settings.furnaces, annealWindows: settings.annealWindows, caution: HYDROGEN_CAUTION };
    res.json(body);
  });

  router.get("/furnace-runs", requireUser, async (req, res) => {
    requireRole(req.user!, ...staff);
    const q = parseInput(furnaceRunListQuerySchema, req.query);
    const bind: unknown[] = [];
    const param = (v: unknown) => `$${bind.push(v)}`;
    const where: string[] = [];
    if (q.withinWindow) where.push(`r.within_window = ${param(q.withinWindow === "true")}`);
    if (q.q) {
      const text = param(q.q.trim().toUpperCase());
      where.push(`(r.number = ${text} or r.lots @> jsonb_build_array(jsonb_build_object('number', ${text}::text)))`);
    }
    const rows = await sequelize.query<{ id: string; number: string; furnace: { name: string }; material_id: string; pieces: number; load_kg: number; peak_temperature_c: number; within_window: boolean; chart: boolean; ran_at: Date; lot_numbers: string[] | null; total: string }>(
      `select r.id, r.number, r.furnace, r.material_id, r.pieces, r.load_kg, r.peak_temperature_c, r.within_window, r.chart_file_id is not null as chart, r.ran_at,
         (select array_agg(x->>'number' order by x->>'number') from jsonb_array_elements(r.lots) x) as lot_numbers, count(*) over () as total
       from furnace_runs r ${where.length ? `where ${where.join(" and ")}` : ""}
       order by ${q.sort === "number" ? "r.seq" : "r.created_at"} ${q.dir === "asc" ? "asc" : "desc"}
       limit ${param(q.pageSize)} offset ${param((q.page - 1) * q.pageSize)}`,
      { bind, type: QueryTypes.SELECT },
    );
    const items: FurnaceRunSummaryJson[] = rows.map((r) => ({
      id: r.id, number: r.number, furnaceName: r.furnace.name, materialId: r.material_id, lotNumbers: r.lot_numbers ?? [], pieces: r.pieces,
      load_kg: r.load_kg, peakTemperature_c: r.peak_temperature_c, withinWindow: r.within_window, chart: r.chart, ranAt: new Date(r.ran_at).toISOString(),
    }));
    res.json({ items, total: rows.length ? Number(rows[0].total) : 0, page: q.page, pageSize: q.pageSize });
  });

  router.post("/furnace-runs", requireUser, async (req, res) => {
    requireRole(req.user!, ...furnaceRoles);
    const input = parseInput(furnaceRunCreateSchema, req.body);
    const run = await sequelize.transaction((transaction) => furnaceRunRecorder({ actor: req.user!, input, sequelize, ip: ip(req), transaction }));
    res.status(201).json(await present(run));
  });

  router.get("/furnace-runs/:id", requireUser, async (req, res) => {
    requireRole(req.user!, ...staff);
    res.json(await present(await loadRun(req.params.id)));
  });

  router.post("/furnace-runs/:id/chart", requireUser, async (req, res) => {
    requireRole(req.user!, ...furnaceRoles);
    await loadRun(req.params.id);
    const uploads = await receiveUploads(req, res, { store, field: "file", maxBytes: MAX_CHART_BYTES, maxFiles: 1, what: "a furnace chart" });
    try {
      const run = await sequelize.transaction(async (transaction) => {
        const run = await FurnaceRun.findByPk(String(req.params.id), { transaction, lock: transaction.LOCK.UPDATE });
        if (!run) throw NotFoundError("furnace run");
        return furnaceChartAttacher({ actor: req.user!, run, uploads, store, ip: ip(req), transaction });
      });
      res.status(201).json(await present(run));
    } finally {
      await discardUploads(uploads);
    }
  });

  router.get("/furnace-runs/:id/chart", requireUser, async (req, res) => {
    requireRole(req.user!, ...staff);
    const run = await loadRun(req.params.id);
    const file = run.chartFileId ? await StoredFile.findByPk(run.chartFileId) : null;
    if (!file) throw NotFoundError("furnace chart");
    sendStoredFile(res, file, store.pathOf(file.storageKey));
  });

  return router;
}
