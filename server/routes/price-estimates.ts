import { Router } from "express";
import { priceEstimateRequestSchema } from "../../shared/schemas/price-estimate";
import type { AppDeps } from "../deps";
import { parseInput } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { presentPriceEstimate } from "../presenters/price-estimate";
import { materialCatalog } from "../services/materialCatalog";
import { priceEstimator } from "../services/priceEstimator";
import { currentShopRates } from "../services/shopRatesUpdater";

/**
 * The configurator's price: any signed-in user, priced with the current list. It writes nothing,
 * so it needs no transaction; a quote (later) stores the version it was priced with. A customer's
 * answer carries no margin and no internal rate (presentPriceEstimate).
 */
export function priceEstimatesRouter(_deps: AppDeps): Router {
  const router = Router();
  router.post("/price-estimates", requireUser, async (req, res) => {
    const input = parseInput(priceEstimateRequestSchema, req.body);
    const current = await currentShopRates();
    await materialCatalog(); // loaded, so the resolver reads the materials table
    const estimate = priceEstimator({ configuration: input.configuration, quantity: input.quantity, priceList: current.data });
    res.json(presentPriceEstimate(estimate, current.version, req.user!));
  });
  return router;
}
