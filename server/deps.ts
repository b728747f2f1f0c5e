import type { RequestHandler } from "express";
import type { Logger } from "pino";
import type { Sequelize } from "sequelize";
import type Stripe from "stripe";
import type { Config } from "./config";
import type { FileStore } from "./files/store";
import type { Mailer } from "./jobs/mailer";
import type { JobQueue } from "./jobs/queue";

/** What routers need from the app; passed explicitly so tests build apps with their own. */
export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  mailer: Mailer;
  logger: Logger;
  /** the per-address limit every public route takes (RATE_LIMIT_PUBLIC; 0 turns it off) */
  publicLimit: RequestHandler;
  /** the payment service (the official SDK, pointed at the stand-in unless production says otherwise) */
  stripe: Stripe;
  /** uploaded drawings, outside the web root */
  files: FileStore;
  /** the PostgreSQL-backed job queue (mail, scheduled reminders) */
  jobs: JobQueue;
}
