import cluster from "node:cluster";
import type { RequestHandler } from "express";
import { ClusterMemoryStoreWorker } from "@express-rate-limit/cluster-memory-store";
import { doubleCsrf } from "csrf-csrf";
import rateLimit, { type Store } from "express-rate-limit";
import { AppError, AuthenticationError } from "../errors";

const MUTATING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

export function createCsrf(opts: { secret: string; secure: boolean }) {
  const { generateCsrfToken, doubleCsrfProtection } = doubleCsrf({
    getSecret: () => opts.secret,
    getSessionIdentifier: (req) => req.session?.id ?? "",
    // The __Host- prefix needs https; on plain loopback http the browser would never send it back.
    cookieName: opts.secure ? "__Host-fw.csrf" : "fw.csrf",
    cookieOptions: { sameSite: "lax", secure: opts.secure, httpOnly: true, path: "/" },
    getCsrfTokenFromRequest: (req) => req.get("x-csrf-token"),
  });

  /**
   * Signed-in users' state changes need the token (contract). Anonymous posts (sign-in, registration,
   * public computations) carry no session worth forging; for those a cross-site Origin is refused.
   */
  const protect: RequestHandler = (req, res, next) => {
    if (!MUTATING.has(req.method)) return next();
    if (req.user) return doubleCsrfProtection(req, res, next);
    const origin = req.get("origin");
    if (origin && origin !== `${req.protocol}://${req.get("host")}`) {
      return next(new AppError(403, "CSRF_INVALID", "Cross-site requests are refused."));
    }
    next();
  };
  return { generateCsrfToken, protect };
}

const limitHandler = (code: string, message: string): RequestHandler => (_req, _res, next) => next(new AppError(429, code, message));

/**
 * Where a limit keeps its counts: in a cluster worker, with the primary (server/cluster.ts), so the
 * workers count together; otherwise in this process's memory. `name` is the limit's own, the same
 * in every worker.
 */
const counts = (name: string): Store | undefined => (cluster.isWorker ? new ClusterMemoryStoreWorker({ prefix: name }) : undefined);

/** Per-address limit for public routes; `perMinute` 0 turns it off (benchmarks). */
export function publicRateLimit(perMinute: number): RequestHandler {
  if (perMinute === 0) return (_req, _res, next) => next();
  return rateLimit({ windowMs: 60_000, limit: perMinute, standardHeaders: "draft-7", legacyHeaders: false, store: counts("public"), handler: limitHandler("RATE_LIMITED", "Too many requests; wait a minute and try again.") });
}

/** Sign-in (and the routes that check a password, each under its own `name`): per address and per account, whatever the public limit says. Successful sign-ins do not count. */
export function signInRateLimits(name: string, perQuarterHour: number): RequestHandler[] {
  const common = { windowMs: 15 * 60_000, standardHeaders: "draft-7" as const, legacyHeaders: false, skipSuccessfulRequests: true };
  const message = "Too many sign-in attempts; wait a few minutes and try again.";
  return [
    rateLimit({ ...common, limit: perQuarterHour * 3, store: counts(`${name}:address`), handler: limitHandler("RATE_LIMITED", message) }),
    rateLimit({
      ...common,
      limit: perQuarterHour,
      store: counts(`${name}:account`),
      keyGenerator: (req) => `account:${String((req.body as { email?: unknown })?.email ?? "").trim().toLowerCase()}`,
      handler: limitHandler("RATE_LIMITED", message),
    }),
  ];
}

/** Mail-sending routes (reset, invitation), each under its own `name`, are limited per address so the inbox cannot be flooded. */
export function mailRateLimit(name: string, perHour: number): RequestHandler {
  return rateLimit({ windowMs: 60 * 60_000, limit: perHour, standardHeaders: "draft-7", legacyHeaders: false, store: counts(name), handler: limitHandler("RATE_LIMITED", "Too many requests; try again later.") });
}

/**
 * Heavy computations for signed-in users (the design advisor), counted per user so one person
 * cannot hold the machine. Refused requests (a 4xx, which cost nothing to answer) do not count.
 */
export function perUserRateLimit(name: string, perMinute: number, message: string): RequestHandler {
  return rateLimit({
    windowMs: 60_000,
    store: counts(name),
    limit: perMinute,
    standardHeaders: "draft-7",
    legacyHeaders: false,
    skipFailedRequests: true,
    // after requireUser: every request here has a user
    keyGenerator: (req) => `user:${req.user!.id}`,
    handler: limitHandler("RATE_LIMITED", message),
  });
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(AuthenticationError());
  next();
};
