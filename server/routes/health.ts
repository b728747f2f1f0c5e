import { Router } from "express";
import type { Sequelize } from "sequelize";
import type { AppDeps } from "../deps";

const FRESH_MS = 1000;
const PROBE_TIMEOUT_MS = 2000;

/**
 * The database's state, probed at most once a second however often health is asked (monitors and
 * load balancers poll it hard); concurrent askers share one probe. The pool reconnects by itself,
 * so the answer turns back to "up" as soon as a probe gets through.
 */
function databaseProbe(sequelize: Sequelize) {
  let up = false;
  let checkedAt = 0;
  let inFlight: Promise<boolean> | undefined;
  const probe = () =>
    (inFlight ??= Promise.race([
      sequelize.query("select 1").then(() => true),
      new Promise<boolean>((resolve) => setTimeout(() => resolve(false), PROBE_TIMEOUT_MS).unref()),
    ])
      .catch(() => false)
      .then((result) => {
        up = result;
        checkedAt = Date.now();
        inFlight = undefined;
        return result;
      }));
  return async (): Promise<boolean> => (Date.now() - checkedAt < FRESH_MS ? up : probe());
}

/** 200 with the database up, 503 while it is down. */
export function healthRouter({ sequelize }: Pick<AppDeps, "sequelize">): Router {
  const router = Router();
  const databaseUp = databaseProbe(sequelize);
  router.get("/health", async (_req, res) => {
    const up = await databaseUp();
    res.status(up ? 200 : 503).set({ "Cache-Control": "no-store", "X-Content-Type-Options": "nosniff" }).json(up ? { status: "ok", database: "up" } : { status: "degraded", database: "down" });
  });
  return router;
}
