import { Router } from "express";
import { priceEstimateRequestSchema, type PriceEstimateJson } from "../../shared/schemas/price-estimate";
import type { AppDeps } from "../deps";
import { parseInput } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { materialCatalog } from "../services/materialCatalog";
import { priceEstimator } from "../services/priceEstimator";
import { currentShopRates } from "../services/shopRatesUpdater";

/**
 * The configurator's price: any signed-in user, priced with the current list. It writes nothing,
 * so it needs no transaction; a quote (later) stores the version it was priced with.
 */
export function priceEstimatesRouter(_deps: AppDeps): Router {
  const router = Router();
  router.post("/price-estimates", requireUser, async (req, res) => {
    const input = parseInput(priceEstimateRequestSchema, req.body);
    const current = await currentShopRates();
    await materialCatalog(); // loaded, so the resolver reads the materials table
    const estimate = priceEstimator({ configuration: input.configuration, quantity: input.quantity, priceList: current.data });
    const answer: PriceEstimateJson = { ...estimate, priceListVersion: current.version };
    res.json(answer);
  });
  return router;
}
