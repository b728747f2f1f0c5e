import type { RequestHandler } from "express";
import type { Logger } from "pino";
import type { Sequelize } from "sequelize";
import type { Config } from "./config";
import type { Mailer } from "./jobs/mailer";

/** What routers need from the app; passed explicitly so tests build apps with their own. */
export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  mailer: Mailer;
  logger: Logger;
  /** the per-address limit every public route takes (RATE_LIMIT_PUBLIC; 0 turns it off) */
  publicLimit: RequestHandler;
}
