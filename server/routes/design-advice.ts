import { Router } from "express";
import { designAdviceRequestSchema } from "../../shared/schemas/design-advice";
import type { AppDeps } from "../deps";
import { parseInput } from "../middleware/validate";
import { perUserRateLimit, requireUser } from "../middleware/security";
import { designAdviser } from "../services/designAdviser";

/** A search takes up to a second or two of a core: plenty for a person comparing requirements, not for a loop. */
const SEARCHES_PER_MINUTE = 60;

/**
 * The design advisor: any signed-in user (customers and staff). It writes nothing, so it needs
 * no transaction; the answer names the shop-rates version its prices come from.
 */
export function designAdviceRouter(_deps: AppDeps): Router {
  const router = Router();
  const limit = perUserRateLimit("design-advice", SEARCHES_PER_MINUTE, "Too many design searches; wait a minute and try again.");
  router.post("/design-advice", requireUser, limit, async (req, res) => {
    const request = parseInput(designAdviceRequestSchema, req.body);
    // the asker may leave (a new search replaces this one): stop working for nobody
    const gone = { value: false };
    res.on("close", () => {
      if (!res.writableEnded) gone.value = true;
    });
    const answer = await designAdviser({ request, gone });
    if (answer) res.json(answer);
  });
  return router;
}
