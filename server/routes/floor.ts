import { Router } from "express";
import type { AppDeps } from "../deps";
import { requireUser } from "../middleware/security";
import { requireRole } from "../policies/utils";
import { floorBoard } from "../services/floorBoard";

/** GET /api/floor: the floor board (planner and operators). */
export function floorRouter({ sequelize }: AppDeps): Router {
  const router = Router();
  router.get("/floor", requireUser, async (req, res) => {
    requireRole(req.user!, "operator", "admin");
    res.set("Cache-Control", "no-store").json(await floorBoard(sequelize));
  });
  return router;
}
