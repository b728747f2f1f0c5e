import { Router } from "express";
import { samplingPlan } from "../../shared/quality/sampling-plan";
import { samplingPlanQuerySchema } from "../../shared/schemas/sampling";
import type { AppDeps } from "../deps";
import { parseInput } from "../middleware/validate";
import { presentSamplingPlan } from "../presenters/sampling";

/**
 * GET /api/sampling-plan?lotSize=N&aql=1.0: public reference data (single sampling, normal
 * inspection, general inspection level II), computed from the tables in shared/quality.
 */
export function samplingPublicRouter({ publicLimit }: AppDeps): Router {
  const router = Router();
  router.get("/sampling-plan", publicLimit, (req, res) => {
    const { lotSize, aql } = parseInput(samplingPlanQuerySchema, req.query);
    res.json(presentSamplingPlan(samplingPlan(lotSize, aql, "normal")));
  });
  return router;
}
