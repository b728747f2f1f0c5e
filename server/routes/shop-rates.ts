import { Router, type Request } from "express";
import { z } from "zod";
import { constructionUpdateSchema, designSearchUpdateSchema, formingLimitsUpdateSchema, priceRatesSchema, stockSheetsUpdateSchema } from "../../shared/schemas/shop-rates";
import type { AppDeps } from "../deps";
import { parseInput } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { PriceListVersion, User } from "../models";
import { requireRole } from "../policies/utils";
import { presentShopRates, presentShopRatesVersion } from "../presenters/shop-rates";
import { referenceDataChanged } from "../services/referenceData";
import { currentShopRates, shopRatesUpdater, type ShopRatesChange } from "../services/shopRatesUpdater";

const historyQuery = z.object({ limit: z.coerce.number().int().min(1).max(200).default(50) });
const withCreator = { include: [{ model: User, as: "createdBy" }] };

/** The planner's price list, stock sheets, forming limits, construction and design-search settings: every save is a new version. */
export function shopRatesRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  router.get("/shop-rates", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const current = await currentShopRates();
    await current.reload(withCreator);
    res.json(presentShopRates(current));
  });

  router.get("/shop-rates/history", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const { limit } = parseInput(historyQuery, req.query);
    const rows = await PriceListVersion.findAll({ ...withCreator, order: [["version", "DESC"]], limit });
    res.json({ items: rows.map(presentShopRatesVersion) });
  });

  const save = (part: ShopRatesChange["part"], schema: z.ZodType) => async (req: Request, res: import("express").Response) => {
    requireRole(req.user!, "admin");
    const input = parseInput(schema, req.body);
    const { version } = await sequelize.transaction((transaction) =>
      shopRatesUpdater({ actor: req.user!, change: { part, input } as ShopRatesChange, ip: req.ip ?? null, transaction }),
    );
    // predictions read the construction settings in process (every process): the new version from now on
    await referenceDataChanged(sequelize, "shop-rates");
    if (part === "construction") await referenceDataChanged(sequelize, "build-model");
    await version.reload(withCreator);
    res.json(presentShopRates(version));
  };
  router.put("/shop-rates/price-list", requireUser, save("price-list", priceRatesSchema));
  router.put("/shop-rates/stock-sheets", requireUser, save("stock-sheets", stockSheetsUpdateSchema));
  router.put("/shop-rates/forming-limits", requireUser, save("forming-limits", formingLimitsUpdateSchema));
  router.put("/shop-rates/construction", requireUser, save("construction", constructionUpdateSchema));
  router.put("/shop-rates/design-search", requireUser, save("design-search", designSearchUpdateSchema));

  return router;
}
