import { Router } from "express";
import { Op, fn, col, where as sqlWhere, type WhereOptions } from "sequelize";
import { designCompareSchema, designCreateSchema, designDuplicateSchema, designListQuerySchema, designUpdateSchema, type DesignComparisonJson } from "../../shared/schemas/design";
import type { AppDeps } from "../deps";
import { NotFoundError } from "../errors";
import { containsPattern, parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Design, User } from "../models";
import { designPolicy } from "../policies/design";
import { authorize, isAdmin, requireRole } from "../policies/utils";
import { presentDesign } from "../presenters/design";
import { designDeleter, designDuplicator, designSaver } from "../services/designSaver";
import { materialCatalog } from "../services/materialCatalog";
import { priceAndPredict } from "../services/quoteBuilder";
import { currentPriceList } from "../services/shopRatesUpdater";

const withCreator = { include: [{ model: User, as: "createdBy" }] };
const sortColumns = { updatedAt: "updatedAt", createdAt: "createdAt", name: "name" } as const;

/** Saved designs: a customer's named configurations (the planner may read them). */
export function designsRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  async function load(id: unknown, lock?: import("sequelize").Transaction) {
    const design = await Design.findByPk(recordId(id, "design"), { ...withCreator, transaction: lock, lock: lock ? { level: lock.LOCK.UPDATE, of: Design } : undefined });
    if (!design) throw NotFoundError("design");
    return design;
  }

  router.get("/designs", requireUser, async (req, res) => {
    const actor = req.user!;
    requireRole(actor, "customer", "admin");
    const query = parseInput(designListQuerySchema, req.query);
    const conditions: WhereOptions[] = [];
    if (!isAdmin(actor)) conditions.push({ organizationId: actor.organizationId });
    if (query.q) conditions.push(sqlWhere(fn("lower", col("Design.name")), { [Op.like]: containsPattern(query.q.toLowerCase()) }));
    const { rows, count } = await Design.findAndCountAll({
      where: { [Op.and]: conditions },
      ...withCreator,
      order: [[sortColumns[query.sort], query.dir.toUpperCase()], ["id", "ASC"]],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    res.json({ items: rows.map((d) => presentDesign(d, actor)), total: count, page: query.page, pageSize: query.pageSize });
  });

  router.post("/designs", requireUser, async (req, res) => {
    requireRole(req.user!, "customer");
    const input = parseInput(designCreateSchema, req.body);
    const design = await sequelize.transaction((transaction) => designSaver({ actor: req.user!, input, ip: req.ip ?? null, transaction }));
    design.createdBy = req.user!;
    res.status(201).json(presentDesign(design, req.user!));
  });

  // Side by side at today's rates: figures, mass and price of up to three saved designs.
  router.post("/designs/compare", requireUser, async (req, res) => {
    const actor = req.user!;
    requireRole(actor, "customer", "admin");
    const input = parseInput(designCompareSchema, req.body);
    const designs = await Design.findAll({ where: { id: input.ids }, ...withCreator });
    const byId = new Map(designs.map((d) => [d.id, d]));
    const ordered = input.ids.map((id) => {
      const d = byId.get(id);
      if (!d) throw NotFoundError("design");
      authorize(actor, "read", designPolicy, d);
      return d;
    });
    const rates = await currentPriceList();
    const priceList = rates.data;
    const catalog = await materialCatalog();
    const body: DesignComparisonJson = {
      priceListVersion: rates.version,
      items: ordered.map((design) => {
        const priced = priceAndPredict({ configuration: design.configuration, quantity: input.quantity, priceList, catalog });
        return {
          design: presentDesign(design, actor),
          prediction: priced.prediction,
          mass_kg: priced.mass_kg,
          unitPrice_cents: priced.price.unitPrice_cents,
          total_cents: priced.price.total_cents,
          currency: priced.price.currency,
          quantity: input.quantity,
        };
      }),
    };
    res.json(body);
  });

  router.get("/designs/:id", requireUser, async (req, res) => {
    const design = await load(req.params.id);
    authorize(req.user!, "read", designPolicy, design);
    res.json(presentDesign(design, req.user!));
  });

  router.patch("/designs/:id", requireUser, async (req, res) => {
    const input = parseInput(designUpdateSchema, req.body);
    const design = await sequelize.transaction(async (transaction) => {
      const design = await load(req.params.id, transaction);
      authorize(req.user!, "update", designPolicy, design);
      return designSaver({ actor: req.user!, design, input, ip: req.ip ?? null, transaction });
    });
    res.json(presentDesign(design, req.user!));
  });

  router.post("/designs/:id/duplicate", requireUser, async (req, res) => {
    const input = parseInput(designDuplicateSchema, req.body);
    const copy = await sequelize.transaction(async (transaction) => {
      const design = await load(req.params.id, transaction);
      authorize(req.user!, "update", designPolicy, design);
      return designDuplicator({ actor: req.user!, design, name: input.name, ip: req.ip ?? null, transaction });
    });
    copy.createdBy = req.user!;
    res.status(201).json(presentDesign(copy, req.user!));
  });

  router.delete("/designs/:id", requireUser, async (req, res) => {
    await sequelize.transaction(async (transaction) => {
      const design = await load(req.params.id, transaction);
      authorize(req.user!, "delete", designPolicy, design);
      await designDeleter({ actor: req.user!, design, ip: req.ip ?? null, transaction });
    });
    res.status(204).end();
  });

  return router;
}
