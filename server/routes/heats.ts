import { Router, type Request } from "express";
import { Op, QueryTypes, type WhereOptions } from "sequelize";
import { heatCreateSchema, heatListQuerySchema, MAX_CERTIFICATE_BYTES, type HeatJson } from "../../shared/schemas/heats";
import type { AppDeps } from "../deps";
import { NotFoundError } from "../errors";
import { discardUploads, receiveUploads } from "../files/upload";
import { containsPattern, parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { MaterialHeat, StoredFile, User } from "../models";
import { furnaceRoles } from "../policies/shop-floor";
import { requireRole } from "../policies/utils";
import { presentStoredFile } from "../presenters/files";
import { heatReceiver, millCertificateAttacher } from "../services/heatReceiver";
import { materialNames } from "./jobs";

const SORTS = { receivedOn: "receivedOn", heatNumber: "heatNumber", createdAt: "createdAt" } as const;

/** Material heats: receiving records of nickel-iron sheet and their mill certificates. */
export function heatsRouter(deps: AppDeps): Router {
  const { sequelize, files: store } = deps;
  const router = Router();
  const ip = (req: Request) => req.ip ?? null;

  async function present(heats: MaterialHeat[]): Promise<HeatJson[]> {
    if (!heats.length) return [];
    const ids = heats.map((h) => h.id);
    const [counts, people, files, names] = await Promise.all([
      sequelize.query<{ heat_id: string; n: number }>(`select heat_id, count(*)::int as n from jobs where heat_id = any($1::uuid[]) group by heat_id`, { bind: [ids], type: QueryTypes.SELECT }),
      User.findAll({ where: { id: heats.map((h) => h.receivedById).filter((x): x is string => !!x) }, attributes: ["id", "name"] }),
      StoredFile.findAll({ where: { id: heats.map((h) => h.millCertificateFileId).filter((x): x is string => !!x) } }),
      materialNames(),
    ]);
    return heats.map((h) => {
      const by = people.find((p) => p.id === h.receivedById);
      const file = files.find((f) => f.id === h.millCertificateFileId);
      return {
        id: h.id,
        heatNumber: h.heatNumber,
        materialId: h.materialId,
        materialName: names(h.materialId),
        thickness_mm: h.thicknessMm,
        supplier: h.supplier,
        quantity: h.quantity,
        unit: h.unit,
        receivedOn: h.receivedOn,
        receivedBy: by ? { id: by.id, name: by.name } : null,
        notes: h.notes,
        millCertificate: file ? presentStoredFile(file, `/api/heats/${h.id}/mill-certificate`) : null,
        jobCount: counts.find((c) => c.heat_id === h.id)?.n ?? 0,
        createdAt: h.createdAt.toISOString(),
        abilities: { attach: true },
      };
    });
  }

  async function loadHeat(id: unknown): Promise<MaterialHeat> {
    const heat = await MaterialHeat.findByPk(recordId(id, "heat"));
    if (!heat) throw NotFoundError("heat");
    return heat;
  }

  router.get("/heats", requireUser, async (req, res) => {
    requireRole(req.user!, "operator", "qa", "admin");
    const q = parseInput(heatListQuerySchema, req.query);
    const where: WhereOptions[] = [];
    if (q.materialId) where.push({ materialId: q.materialId });
    if (q.thickness_mm !== undefined) where.push({ thicknessMm: { [Op.between]: [q.thickness_mm - 1e-6, q.thickness_mm + 1e-6] } });
    if (q.q) where.push({ [Op.or]: [{ heatNumber: { [Op.iLike]: containsPattern(q.q) } }, { supplier: { [Op.iLike]: containsPattern(q.q) } }] });
    const { rows, count } = await MaterialHeat.findAndCountAll({
      where: { [Op.and]: where },
      order: [[SORTS[q.sort], q.dir === "asc" ? "ASC" : "DESC"], ["createdAt", "DESC"]],
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    });
    res.json({ items: await present(rows), total: count, page: q.page, pageSize: q.pageSize });
  });

  router.post("/heats", requireUser, async (req, res) => {
    requireRole(req.user!, ...furnaceRoles);
    const input = parseInput(heatCreateSchema, req.body);
    const heat = await sequelize.transaction((transaction) => heatReceiver({ actor: req.user!, input, ip: ip(req), transaction }));
    res.status(201).json((await present([heat]))[0]);
  });

  router.get("/heats/:id", requireUser, async (req, res) => {
    requireRole(req.user!, "operator", "qa", "admin");
    res.json((await present([await loadHeat(req.params.id)]))[0]);
  });

  router.post("/heats/:id/mill-certificate", requireUser, async (req, res) => {
    requireRole(req.user!, ...furnaceRoles);
    await loadHeat(req.params.id);
    const uploads = await receiveUploads(req, res, { store, field: "file", maxBytes: MAX_CERTIFICATE_BYTES, maxFiles: 1, what: "a mill certificate" });
    try {
      const heat = await sequelize.transaction(async (transaction) => {
        const heat = await MaterialHeat.findByPk(String(req.params.id), { transaction, lock: transaction.LOCK.UPDATE });
        if (!heat) throw NotFoundError("heat");
        return millCertificateAttacher({ actor: req.user!, heat, uploads, store, ip: ip(req), transaction });
      });
      res.status(201).json((await present([heat]))[0]);
    } finally {
      await discardUploads(uploads);
    }
  });

  router.get("/heats/:id/mill-certificate", requireUser, async (req, res) => {
    requireRole(req.user!, "operator", "qa", "admin");
    const heat = await loadHeat(req.params.id);
    const file = heat.millCertificateFileId ? await StoredFile.findByPk(heat.millCertificateFileId) : null;
    if (!file) throw NotFoundError("mill certificate");
    sendStoredFile(res, file, store.pathOf(file.storageKey));
  });

  return router;
}

/** A kept file, always as a download, never rendered by the browser in the app's origin. */
export function sendStoredFile(res: import("express").Response, file: StoredFile, path: string): void {
  res.attachment(file.filename);
  res.type(file.contentType);
  res.set({ "Cache-Control": "private, no-store", "Content-Security-Policy": "default-src 'none'; sandbox" });
  res.sendFile(path, { dotfiles: "deny", headers: { "Content-Type": file.contentType } });
}
