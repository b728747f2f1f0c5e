import { Router } from "express";
import type { AppDeps } from "../deps";

/** 200 with the database up, 503 while it is down; the pool reconnects by itself when it is back. */
export function healthRouter({ sequelize }: AppDeps): Router {
  const router = Router();
  router.get("/health", async (_req, res) => {
    try {
      await Promise.race([
        sequelize.query("select 1"),
        new Promise((_, reject) => setTimeout(() => reject(new Error("timeout")), 2000)),
      ]);
      res.set("Cache-Control", "no-store").json({ status: "ok", database: "up" });
    } catch {
      res.status(503).set("Cache-Control", "no-store").json({ status: "degraded", database: "down" });
    }
  });
  return router;
}
