import { Router, type Request } from "express";
import { QueryTypes } from "sequelize";
import { jobListQuerySchema, lotHoldReleaseSchema, lotHoldSchema, lotListQuerySchema, paperQuerySchema, routingUpdateSchema, type JobSummaryJson } from "../../shared/schemas/jobs";
import type { Page } from "../../shared/schemas/list";
import { normalizeCode } from "../../shared/shop-floor/codes";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import type { AppDeps } from "../deps";
import { lotLabelDocument, travelerDocument } from "../documents";
import { NotFoundError } from "../errors";
import { containsPattern, parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Job, Lot, Organization, recordEvent } from "../models";
import { jobPolicy, lotPolicy } from "../policies/shop-floor";
import { authorize, requireRole, type Actor } from "../policies/utils";
import { presentJob } from "../presenters/jobs";
import { presentJobSummary, presentLot, presentLotSummary } from "../presenters/lots";
import { loadJobView, type JobView } from "../services/jobViews";
import { lotHoldReleaser, lotHolder } from "../services/lotHolds";
import { listLotViews, loadLotView, lotHeats, lotJobs, type LotJobRow } from "../services/lotViews";
import { materialCatalog } from "../services/materialCatalog";
import { routingEditor } from "../services/routingEditor";

const JOB_SORTS = { dueDate: "j.due_date", code: "j.seq", createdAt: "j.created_at" } as const;
const JOB_STATUS_SQL = {
  released: "j.completed_at is null and l.hold_reason is null and j.step_index = 0 and j.step_started_at is null",
  in_progress: "j.completed_at is null and l.hold_reason is null and (j.step_index > 0 or j.step_started_at is not null)",
  on_hold: "j.completed_at is null and l.hold_reason is not null",
  completed: "j.completed_at is not null and l.shipment_id is null",
  shipped: "l.shipment_id is not null",
} as const;

/** The material names the presenters print, from the in-process catalog. */
export async function materialNames(): Promise<(id: string) => string> {
  const catalog = await materialCatalog();
  return (id) => catalog.byId.get(id)?.name ?? id;
}

/** The paper a download is printed on: asked for, else the signed-in person's organisation's. */
export async function paperFor(req: Request): Promise<PaperSize> {
  const { paper } = parseInput(paperQuerySchema, req.query);
  if (paper) return paper;
  return ((await Organization.findByPk(req.user!.organizationId, { attributes: ["paperSize"] }))?.paperSize ?? "A4") as PaperSize;
}

/** Jobs and lots: the floor's lists, a job by id or barcode, routing edits, travelers, lot labels and holds. */
export function jobsRouter(deps: AppDeps): Router {
  const { sequelize } = deps;
  const router = Router();
  const ip = (req: Request) => req.ip ?? null;

  async function viewJob(by: { id: string } | { code: string }, actor: Actor): Promise<JobView> {
    const view = await loadJobView(sequelize, by);
    if (!view) throw NotFoundError("job");
    authorize(actor, "read", jobPolicy, { organizationId: view.organization_id });
    return view;
  }

  router.get("/jobs", requireUser, async (req, res) => {
    requireRole(req.user!, "operator", "qa", "admin");
    const q = parseInput(jobListQuerySchema, req.query);
    const where: string[] = [];
    const bind: unknown[] = [];
    const param = (v: unknown) => `$${bind.push(v)}`;
    if (q.status) where.push(JOB_STATUS_SQL[q.status]);
    if (q.step) where.push(`j.current_step = ${param(q.step)} and j.completed_at is null`);
    if (q.late === "true") where.push("j.completed_at is null and j.due_date < current_date");
    if (q.late === "false") where.push("(j.completed_at is not null or j.due_date >= current_date)");
    if (q.lotId) where.push(`j.lot_id = ${param(q.lotId)}`);
    if (q.orderId) where.push(`j.order_id = ${param(q.orderId)}`);
    if (q.q) where.push(`(j.code = ${param(normalizeCode(q.q))} or l.number ilike ${param(containsPattern(q.q))})`);
    const rows = await sequelize.query<LotJobRow & { lot_number: string; order_id: string; order_number: number; hold_reason: string | null; shipment_id: string | null; total: string }>(
      `select j.id, j.code, j.lot_id, j.layer, j.role, j.method, j.quantity, j.current_step, j.step_index, j.step_started_at, j.completed_at,
         to_char(j.due_date, 'YYYY-MM-DD') as due_date, l.number as lot_number, j.order_id, o.number as order_number, l.hold_reason, l.shipment_id,
         count(*) over () as total
       from jobs j join lots l on l.id = j.lot_id join orders o on o.id = j.order_id
       ${where.length ? `where ${where.join(" and ")}` : ""}
       order by ${JOB_SORTS[q.sort]} ${q.dir === "asc" ? "asc" : "desc"}, j.seq ${q.dir === "asc" ? "asc" : "desc"}
       limit ${param(q.pageSize)} offset ${param((q.page - 1) * q.pageSize)}`,
      { bind, type: QueryTypes.SELECT },
    );
    const page: Page<JobSummaryJson> = {
      items: rows.map((r) => presentJobSummary(r, { id: r.lot_id, number: r.lot_number, order_id: r.order_id, order_number: r.order_number, hold_reason: r.hold_reason, shipment_id: r.shipment_id })),
      total: rows.length ? Number(rows[0].total) : 0,
      page: q.page,
      pageSize: q.pageSize,
    };
    res.json(page);
  });

  // The scan station's lookup: the code as printed in the job's barcode (case and spaces forgiven).
  router.get("/jobs/by-code/:code", requireUser, async (req, res) => {
    const view = await viewJob({ code: normalizeCode(String(req.params.code)) }, req.user!);
    res.json(presentJob(view, req.user!, await materialNames()));
  });

  router.get("/jobs/:id", requireUser, async (req, res) => {
    const view = await viewJob({ id: recordId(req.params.id, "job") }, req.user!);
    res.json(presentJob(view, req.user!, await materialNames()));
  });

  router.put("/jobs/:id/routing", requireUser, async (req, res) => {
    const id = recordId(req.params.id, "job");
    const before = await viewJob({ id }, req.user!);
    authorize(req.user!, "editRouting", jobPolicy, { organizationId: before.organization_id });
    const input = parseInput(routingUpdateSchema, req.body);
    await sequelize.transaction(async (transaction) => {
      const job = await Job.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!job) throw NotFoundError("job");
      await routingEditor({ actor: req.user!, job, input, sequelize, ip: ip(req), transaction });
    });
    res.json(presentJob((await loadJobView(sequelize, { id }))!, req.user!, await materialNames()));
  });

  router.get("/jobs/:id/traveler.pdf", requireUser, async (req, res) => {
    const view = await viewJob({ id: recordId(req.params.id, "job") }, req.user!);
    authorize(req.user!, "print", jobPolicy, { organizationId: view.organization_id });
    const paper = await paperFor(req);
    const { filename, content } = await travelerDocument(sequelize, [view.id], paper);
    await sequelize.transaction((transaction) =>
      recordEvent({ actor: req.user!, action: "job.traveler-printed", subject: { type: "job", id: view.id }, data: { code: view.code, paper }, ip: ip(req) }, transaction),
    );
    res.attachment(filename).type("application/pdf").set("Cache-Control", "private, no-store").send(content);
  });

  // --- lots ---

  async function viewLot(id: unknown, actor: Actor) {
    const view = await loadLotView(sequelize, recordId(id, "lot"));
    if (!view) throw NotFoundError("lot");
    authorize(actor, "read", lotPolicy, { organizationId: view.organization_id });
    return view;
  }

  async function respondWithLot(res: import("express").Response, id: string, actor: Actor) {
    const [view, jobs, heats, names] = await Promise.all([loadLotView(sequelize, id), lotJobs(sequelize, id), lotHeats(sequelize, id), materialNames()]);
    res.json(presentLot(view!, jobs, heats, actor, names));
  }

  router.get("/lots", requireUser, async (req, res) => {
    requireRole(req.user!, "operator", "qa", "admin");
    const q = parseInput(lotListQuerySchema, req.query);
    const { rows, total } = await listLotViews(sequelize, { ...q, limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
    res.json({ items: rows.map((r) => presentLotSummary(r)), total, page: q.page, pageSize: q.pageSize });
  });

  router.get("/lots/:id", requireUser, async (req, res) => {
    const view = await viewLot(req.params.id, req.user!);
    await respondWithLot(res, view.id, req.user!);
  });

  router.post("/lots/:id/hold", requireUser, async (req, res) => {
    const view = await viewLot(req.params.id, req.user!);
    authorize(req.user!, "hold", lotPolicy, { organizationId: view.organization_id });
    const input = parseInput(lotHoldSchema, req.body);
    await sequelize.transaction(async (transaction) => {
      const lot = (await Lot.findByPk(view.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
      await lotHolder({ actor: req.user!, lot, input, ip: ip(req), transaction });
    });
    await respondWithLot(res, view.id, req.user!);
  });

  router.post("/lots/:id/hold-release", requireUser, async (req, res) => {
    const view = await viewLot(req.params.id, req.user!);
    authorize(req.user!, "releaseHold", lotPolicy, { organizationId: view.organization_id });
    const input = parseInput(lotHoldReleaseSchema, req.body);
    await sequelize.transaction(async (transaction) => {
      const lot = (await Lot.findByPk(view.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
      await lotHoldReleaser({ actor: req.user!, lot, input, sequelize, ip: ip(req), transaction });
    });
    await respondWithLot(res, view.id, req.user!);
  });

  router.get("/lots/:id/label.pdf", requireUser, async (req, res) => {
    const view = await viewLot(req.params.id, req.user!);
    authorize(req.user!, "label", lotPolicy, { organizationId: view.organization_id });
    const paper = await paperFor(req);
    const { filename, content } = await lotLabelDocument(sequelize, view.id, paper);
    await sequelize.transaction((transaction) =>
      recordEvent({ actor: req.user!, action: "lot.label-printed", subject: { type: "lot", id: view.id }, data: { number: view.number, paper }, ip: ip(req) }, transaction),
    );
    res.attachment(filename).type("application/pdf").set("Cache-Control", "private, no-store").send(content);
  });

  // Every traveler of a lot in one file, for the planner printing a released order's paperwork.
  router.get("/lots/:id/travelers.pdf", requireUser, async (req, res) => {
    const view = await viewLot(req.params.id, req.user!);
    authorize(req.user!, "label", lotPolicy, { organizationId: view.organization_id });
    const paper = await paperFor(req);
    const jobs = await Job.findAll({ where: { lotId: view.id }, attributes: ["id", "code"], order: [["seq", "ASC"]] });
    const { content } = await travelerDocument(sequelize, jobs.map((j) => j.id), paper);
    await sequelize.transaction(async (transaction) => {
      for (const j of jobs) await recordEvent({ actor: req.user!, action: "job.traveler-printed", subject: { type: "job", id: j.id }, data: { code: j.code, paper, lot: view.number }, ip: ip(req) }, transaction);
    });
    res.attachment(`travelers-${view.number}.pdf`).type("application/pdf").set("Cache-Control", "private, no-store").send(content);
  });

  return router;
}
