import { z } from "zod";

// Every setting the server reads, parsed once. Defaults suit a developer's machine;
// production sets DATABASE_URL, SESSION_SECRET and APP_URL.
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  PORT: z.coerce.number().int().min(1).max(65535).default(4100),
  HOST: z.string().default("127.0.0.1"),
  APP_URL: z.string().url().optional(),
  DATABASE_URL: z.string().default("postgres://postgres@127.0.0.1:54329/fluxwright"),
  SESSION_SECRET: z.string().min(16).default("fluxwright-development-secret-change-me"),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().default(4125),
  MAIL_FROM: z.string().default("Fluxwright <no-reply@fluxwright.test>"),
  RATE_LIMIT_PUBLIC: z.coerce.number().int().min(0).default(300),
  RATE_LIMIT_SIGN_IN: z.coerce.number().int().min(1).default(20),
  DEMO_PASSWORD: z.string().min(8).default("fluxwright-demo"),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).optional(),
});

export type Config = z.infer<typeof envSchema> & { appUrl: string; production: boolean };

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.parse(env);
  return {
    ...parsed,
    appUrl: parsed.APP_URL ?? `http://127.0.0.1:${parsed.PORT}`,
    production: parsed.NODE_ENV === "production",
  };
}
