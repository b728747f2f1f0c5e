import { Router } from "express";
import { z } from "zod";
import { materialCreateSchema, materialIdSchema, materialUpdateSchema } from "../../shared/schemas/material";
import type { AppDeps } from "../deps";
import { NotFoundError } from "../errors";
import { parseInput } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Event, Material, User } from "../models";
import { requireRole } from "../policies/utils";
import { presentMaterialChange, presentMaterialForAdmin } from "../presenters/material";
import { materialCatalog } from "../services/materialCatalog";
import { referenceDataChanged } from "../services/referenceData";
import { materialCreator, materialUpdater } from "../services/materialSaver";

/** GET /api/materials: public reference data, served from the in-process catalog. */
export function materialsPublicRouter({ publicLimit }: AppDeps): Router {
  const router = Router();
  router.get("/materials", publicLimit, async (_req, res) => {
    const catalog = await materialCatalog();
    res.type("application/json").send(catalog.json);
  });
  return router;
}

const historyQuery = z.object({ limit: z.coerce.number().int().min(1).max(200).default(50) });
const idParam = z.object({ id: materialIdSchema });

/** The admin's edits to the library: every change is validated and recorded with its before and after. */
export function materialsAdminRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  // every row, inactive ones too (the public list has only the active ones)
  router.get("/materials/all", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const rows = await Material.ordered();
    res.json({ items: rows.map(presentMaterialForAdmin) });
  });

  router.post("/materials", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const input = parseInput(materialCreateSchema, req.body);
    const material = await sequelize.transaction((transaction) => materialCreator({ actor: req.user!, input, ip: req.ip ?? null, transaction }));
    await referenceDataChanged(sequelize, "materials");
    res.status(201).json(presentMaterialForAdmin(material));
  });

  router.put("/materials/:id", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const { id } = parseInput(idParam, req.params);
    const input = parseInput(materialUpdateSchema, req.body);
    const material = await sequelize.transaction((transaction) => materialUpdater({ actor: req.user!, id, input, ip: req.ip ?? null, transaction }));
    await referenceDataChanged(sequelize, "materials");
    res.json(presentMaterialForAdmin(material));
  });

  router.get("/materials/:id/history", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const { id } = parseInput(idParam, req.params);
    const { limit } = parseInput(historyQuery, req.query);
    if (!(await Material.findByPk(id))) throw NotFoundError("material");
    const events = await Event.findAll({ where: { subjectType: "material", subjectId: id }, order: [["createdAt", "DESC"], ["id", "DESC"]], limit });
    const actorIds = [...new Set(events.map((e) => e.actorId).filter((x): x is string => !!x))];
    const actors = new Map((actorIds.length ? await User.findAll({ where: { id: actorIds } }) : []).map((u) => [u.id, u.name]));
    res.json({ items: events.map((e) => presentMaterialChange(e, e.actorId ? actors.get(e.actorId) : undefined)) });
  });

  return router;
}
