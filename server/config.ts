import { availableParallelism } from "node:os";
import path from "node:path";
import { z } from "zod";
import { projectRoot } from "./project-root";

const flag = z.enum(["0", "1", "true", "false"]).transform((v) => v === "1" || v === "true");

// Every setting the server reads, parsed once. Defaults suit a developer's machine;
// production sets DATABASE_URL, SESSION_SECRET and APP_URL.
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  PORT: z.coerce.number().int().min(1).max(65535).default(4100),
  HOST: z.string().default("127.0.0.1"),
  APP_URL: z.string().url().optional(),
  DATABASE_URL: z.string().default("postgres://postgres@127.0.0.1:54329/fluxwright"),
  /** server processes (server/cluster.ts); default one per core, 1 serves from a single process */
  WEB_CONCURRENCY: z.coerce.number().int().min(1).max(64).optional(),
  /** each server process's database connections; default its share of twice the cores and one (server/db/sequelize.ts) */
  DB_POOL_MAX: z.coerce.number().int().min(2).max(200).optional(),
  SESSION_SECRET: z.string().min(16).default("fluxwright-development-secret-change-me"),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().default(4125),
  MAIL_FROM: z.string().default("Fluxwright <no-reply@fluxwright.test>"),
  RATE_LIMIT_PUBLIC: z.coerce.number().int().min(0).default(300),
  RATE_LIMIT_SIGN_IN: z.coerce.number().int().min(1).default(20),
  DEMO_PASSWORD: z.string().min(8).default("fluxwright-demo"),
  /** the payment service stand-in's port (fake-services/payments) */
  PAYMENTS_PORT: z.coerce.number().int().min(1).max(65535).default(4110),
  /** the payment service's API; default the stand-in on PAYMENTS_PORT (production: https://api.stripe.com) */
  PAYMENTS_URL: z.string().url().optional(),
  STRIPE_SECRET_KEY: z.string().min(8).default("sk_test_fluxwright_local"),
  STRIPE_WEBHOOK_SECRET: z.string().min(8).default("whsec_fluxwright_local"),
  /** uploaded drawings live here, outside the built client (the web root) */
  UPLOAD_DIR: z.string().default(path.join(projectRoot, ".data", "uploads")),
  /** first retry of a failed mail after this many seconds, doubling each time */
  MAIL_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).max(3600).default(10),
  /** prefix of the job queues' names (tests give an app a queue of its own) */
  JOB_QUEUE_PREFIX: z.string().regex(/^[\w.-]*$/).default(""),
  /** run the scheduled jobs (quote expiry reminders) in this process */
  JOB_SCHEDULES: flag.optional(),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).optional(),
});

export type Config = z.infer<typeof envSchema> & { appUrl: string; paymentsUrl: string; production: boolean; schedules: boolean; workers: number };

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.parse(env);
  return {
    ...parsed,
    appUrl: parsed.APP_URL ?? `http://127.0.0.1:${parsed.PORT}`,
    paymentsUrl: parsed.PAYMENTS_URL ?? `http://127.0.0.1:${parsed.PAYMENTS_PORT}`,
    schedules: parsed.JOB_SCHEDULES ?? parsed.NODE_ENV !== "test",
    production: parsed.NODE_ENV === "production",
    workers: parsed.WEB_CONCURRENCY ?? availableParallelism(),
  };
}
