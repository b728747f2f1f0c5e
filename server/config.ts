import { availableParallelism } from "node:os";
import { parse as parseConnectionString } from "pg-connection-string";
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
  /** server worker processes (server/cluster.ts); default in defaultWorkers below; 1 serves from a single process */
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

export type Config = z.infer<typeof envSchema> & {
  appUrl: string;
  paymentsUrl: string;
  production: boolean;
  schedules: boolean;
  /** worker processes serving requests */
  workers: number;
  /** a primary supervises the workers (restarts one that dies); only WEB_CONCURRENCY=1 serves from a single process */
  supervised: boolean;
};

/** PostgreSQL runs on this machine: the database URL names a loopback address or a socket folder (read as node-postgres reads it). */
export function databaseIsLocal(databaseUrl: string): boolean {
  const host = parseConnectionString(databaseUrl).host ?? "";
  return host === "" || host.startsWith("/") || host === "localhost" || host === "::1" || host.startsWith("127.");
}

/**
 * One worker per core, less one when PostgreSQL shares the machine: its backends need a core of
 * their own under write traffic. On two cores with the database beside the server, one worker
 * answered the scan, quote and payment-event benchmarks as fast as two or faster (quote p99 24 and
 * 37 ms against 45 and 53), because two workers left PostgreSQL waiting for the cores.
 */
export const defaultWorkers = (databaseUrl: string, cores = availableParallelism()) => (databaseIsLocal(databaseUrl) ? Math.max(1, cores - 1) : cores);

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.parse(env);
  return {
    ...parsed,
    appUrl: parsed.APP_URL ?? `http://127.0.0.1:${parsed.PORT}`,
    paymentsUrl: parsed.PAYMENTS_URL ?? `http://127.0.0.1:${parsed.PAYMENTS_PORT}`,
    schedules: parsed.JOB_SCHEDULES ?? parsed.NODE_ENV !== "test",
    production: parsed.NODE_ENV === "production",
    workers: parsed.WEB_CONCURRENCY ?? defaultWorkers(parsed.DATABASE_URL),
    supervised: parsed.WEB_CONCURRENCY !== 1,
  };
}
