import cookieParser from "cookie-parser";
import express, { type Express } from "express";
import session from "express-session";
import helmet from "helmet";
import { existsSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import pino, { type Logger } from "pino";
import { pinoHttp } from "pino-http";
import type { Sequelize } from "sequelize";
import { createPassport, signedInUser } from "./auth/passport";
import { createSessionStore } from "./auth/session-store";
import { projectRoot } from "./project-root";
import { loadConfig, type Config } from "./config";
import { getSequelize } from "./db/sequelize";
import type { AppDeps } from "./deps";
import { renderMailAttachment } from "./documents";
import { createFileStore } from "./files/store";
import { createMailer, mailQueueDefinition, type Mailer } from "./jobs/mailer";
import { createJobQueue } from "./jobs/queue";
import { quoteReminderQueueDefinition, startQuoteReminders } from "./jobs/reminders";
import { instrumentReminderQueueDefinition, startInstrumentReminders } from "./jobs/instrument-reminders";
import { calibrationRefitQueueDefinition, startCalibrationRefits } from "./jobs/calibration-refit";
import { calibrationRouter } from "./routes/calibration";
import { buildModelCatalog } from "./services/buildModelCatalog";
import { listenForReferenceChanges } from "./services/referenceData";
import { createMeasuredLotsReader } from "./services/measuredLotsReader";
import { ShopSettings } from "./models";
import { createStripe } from "./payments/stripe";
import { designsRouter } from "./routes/designs";
import { floorRouter } from "./routes/floor";
import { furnaceRunsRouter } from "./routes/furnace-runs";
import { heatsRouter } from "./routes/heats";
import { jobsRouter } from "./routes/jobs";
import { scansRouter } from "./routes/scans";
import { instrumentsRouter } from "./routes/instruments";
import { qualitySettingsRouter } from "./routes/quality-settings";
import { qualityRouter, verifyPublicRouter } from "./routes/quality";
import { samplingPublicRouter } from "./routes/sampling";
import { ordersRouter } from "./routes/orders";
import { quotesRouter } from "./routes/quotes";
import { settingsRouter } from "./routes/settings";
import { webhooksRouter } from "./routes/webhooks";
import { apiNotFound, onError } from "./middleware/on-error";
import { createCsrf, publicRateLimit } from "./middleware/security";
import { fixedHeaders, quietLog, sessionUser } from "./middleware/short-chain";
import { initModels } from "./models";
import { authRouter } from "./routes/auth";
import { blanksRouter } from "./routes/blanks";
import { designAdviceRouter } from "./routes/design-advice";
import { healthRouter } from "./routes/health";
import { materialsAdminRouter, materialsPublicRouter } from "./routes/materials";
import { predictionsRouter } from "./routes/predictions";
import { priceEstimatesRouter } from "./routes/price-estimates";
import { shopRatesRouter } from "./routes/shop-rates";
import { usersRouter } from "./routes/users";

const distDir = path.join(projectRoot, "dist");

export interface CreateAppOptions {
  config?: Config;
  sequelize?: Sequelize;
  mailer?: Mailer;
  logger?: Logger;
  /** serve the built client from dist/ (default: when it exists) */
  serveClient?: boolean;
}

export interface FluxwrightApp extends Express {
  locals: Express["locals"] & { deps: AppDeps; close(): Promise<void> };
}

/** Builds the Express app without listening: server/index.ts listens, supertest drives it directly. */
export function createApp(options: CreateAppOptions = {}): FluxwrightApp {
  const config = options.config ?? loadConfig();
  const logger = options.logger ?? pino({ level: config.LOG_LEVEL ?? (config.NODE_ENV === "test" ? "silent" : "info") });
  const sequelize = options.sequelize ?? getSequelize(config.DATABASE_URL, config.DB_POOL_MAX);
  initModels(sequelize);
  // Mail and scheduled work go through the job queue in PostgreSQL (started in the background).
  const jobs = createJobQueue({ config, logger, queues: [mailQueueDefinition(config.MAIL_RETRY_DELAY_SECONDS), quoteReminderQueueDefinition, instrumentReminderQueueDefinition, calibrationRefitQueueDefinition] });
  const mailer =
    options.mailer ??
    createMailer({
      host: config.SMTP_HOST,
      port: config.SMTP_PORT,
      queue: jobs,
      logger,
      // the shop's setting, read when the mail goes out
      sender: async () => (await ShopSettings.findByPk(1))?.mailFrom ?? config.MAIL_FROM,
      renderAttachment: renderMailAttachment,
    });
  const deps: AppDeps = {
    config, sequelize, mailer, logger, publicLimit: publicRateLimit(config.RATE_LIMIT_PUBLIC),
    stripe: createStripe(config), files: createFileStore(config.UPLOAD_DIR), jobs,
  };
  void startQuoteReminders({ queue: jobs, sequelize, mailer, config, logger }).catch((err) => logger.error({ err }, "quote reminders did not start"));
  void startInstrumentReminders({ queue: jobs, sequelize, mailer, config, logger }).catch((err) => logger.error({ err }, "calibration reminders did not start"));
  // measured lots for the calibration and its control charts (the seam: see measuredLotsReader.ts)
  const readLots = createMeasuredLotsReader(sequelize);
  void startCalibrationRefits({ queue: jobs, sequelize, readLots, config, logger }).catch((err) => logger.error({ err }, "calibration refits did not start"));
  // the as-built model with the calibration fits, loaded before the first quote needs it
  void Promise.resolve(buildModelCatalog()).catch((err) => logger.warn({ err }, "as-built model not loaded yet"));
  // another process's edit of that reference data (or a refit its job worker ran) reaches this one at once
  const referenceChanges = listenForReferenceChanges({ databaseUrl: config.DATABASE_URL, logger });
  const secure = config.appUrl.startsWith("https://");

  const app = express() as FluxwrightApp;
  app.disable("x-powered-by");
  app.set("trust proxy", "loopback");
  app.set("query parser", "simple");
  // No ETag on API answers: hashing every computed answer costs more than the rare 304 saves
  // (the built client's files keep theirs: express.static sets its own).
  app.set("etag", false);

  // Health first: probes poll it hard, and its tiny JSON answer needs no page-security headers,
  // request log, body parser or session.
  app.use("/api", healthRouter(deps));
  // The payment service's events, likewise: a machine's JSON, verified on its raw bytes (so before
  // any body parser), no session, no page-security headers; failures are still logged.
  app.use("/api", webhooksRouter(deps));

  const pageSecurity = helmet({
    contentSecurityPolicy: {
      directives: {
        "default-src": ["'self'"],
        "img-src": ["'self'", "data:", "blob:"],
        "style-src": ["'self'", "'unsafe-inline'"], // charts set inline style attributes
        "font-src": ["'self'", "data:"],
        "connect-src": ["'self'"],
        "upgrade-insecure-requests": secure ? [] : null,
      },
    },
    strictTransportSecurity: secure,
  });

  // Sessions live in PostgreSQL. Nothing is stored for a visitor until something needs it
  // (a CSRF token, a sign-in), so public read-only routes create no session rows.
  const sessionPool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 5 });
  sessionPool.on("error", (err) => logger.warn({ err }, "session pool error"));
  const store = createSessionStore(sessionPool);
  const sessionCookie = { httpOnly: true, sameSite: "lax" as const, secure, maxAge: 8 * 3600_000 };
  const sessionMiddleware = session({
    name: "fw.sid",
    secret: config.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: sessionCookie,
  });
  const passport = createPassport();
  const csrf = createCsrf({ secret: config.SESSION_SECRET, secure });

  // The calls made most often by signed-in users (a scan and the job looked up by its barcode from
  // the floor, a customer's new quote), before the general chain: the same headers, session, user,
  // CSRF and role checks with less work per request (middleware/short-chain.ts); every other
  // request on /api passes through untouched.
  const shortChain = [
    fixedHeaders(pageSecurity),
    quietLog(logger),
    express.json({ limit: "200kb" }),
    ...sessionUser({ store, secret: config.SESSION_SECRET, cookieName: "fw.sid", cookie: sessionCookie, loadUser: signedInUser }),
    csrf.protect,
  ];
  const frequent = express.Router();
  frequent.post("/scans", ...shortChain, scansRouter(deps));
  frequent.get("/jobs/by-code/:code", ...shortChain, jobsRouter(deps));
  frequent.post("/quotes", ...shortChain, quotesRouter(deps));
  app.use("/api", frequent);

  // Public computations and reference reads asked for all the time (the prediction at every pause
  // in typing, the sampling plan, the certificate check): the same page-security headers set from a
  // list computed once, no request line (pino-http's per-request child logger costs more than the
  // answer; on-error still logs their failures), no session; each route keeps `deps.publicLimit`.
  // Everything else passes through untouched.
  const publicReads = express.Router();
  publicReads.use(["/predictions", "/sampling-plan", "/verify"], fixedHeaders(pageSecurity), quietLog(logger));
  publicReads.use("/predictions", express.json({ limit: "200kb" }));
  publicReads.use(predictionsRouter(deps), samplingPublicRouter(deps), verifyPublicRouter(deps));
  app.use("/api", publicReads);

  app.use(pageSecurity);
  const requestLog = pinoHttp({
    logger,
    autoLogging: { ignore: (req) => !req.url?.startsWith("/api") },
    // A request line, not its headers: cookies and CSRF tokens never reach the log.
    serializers: {
      req: (req: { id: unknown; method: string; url: string; remoteAddress?: string }) => ({ id: req.id, method: req.method, url: req.url, remoteAddress: req.remoteAddress }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
  });
  app.use(requestLog);

  const api = express.Router();
  api.use(express.json({ limit: "200kb" }));

  // Public computations and reference data: they change nothing, so they run before the session
  // (no session row, no CSRF token); each of their routes takes `deps.publicLimit`. Add public routers here.
  api.use(blanksRouter(deps));
  api.use(materialsPublicRouter(deps));

  // Everything below knows the signed-in user; state changes by a signed-in user need the CSRF token.
  api.use(cookieParser(), sessionMiddleware, passport.initialize(), passport.session(), csrf.protect);
  api.use("/auth", authRouter({ ...deps, passport, generateCsrfToken: csrf.generateCsrfToken }));
  api.use(usersRouter(deps));
  api.use(materialsAdminRouter(deps));
  api.use(priceEstimatesRouter(deps));
  api.use(designAdviceRouter(deps));
  api.use(shopRatesRouter(deps));
  api.use(designsRouter(deps));
  api.use(quotesRouter(deps));
  api.use(ordersRouter(deps));
  api.use(settingsRouter(deps));
  api.use(jobsRouter(deps));
  api.use(heatsRouter(deps));
  api.use(furnaceRunsRouter(deps));
  api.use(floorRouter(deps));
  api.use(qualitySettingsRouter(deps));
  api.use(instrumentsRouter(deps));
  api.use(calibrationRouter(deps, { readLots }));
  api.use(qualityRouter(deps));
  api.use(apiNotFound);
  app.use("/api", api);

  const serveClient = options.serveClient ?? existsSync(path.join(distDir, "index.html"));
  if (serveClient) {
    app.use(express.static(distDir, { index: false, maxAge: "1h", setHeaders: (res, file) => { if (file.includes(`${path.sep}assets${path.sep}`)) res.set("Cache-Control", "public, max-age=31536000, immutable"); } }));
    // "/{*splat}" also matches "/" itself ("/*splat" needs at least one segment)
    app.get("/{*splat}", (_req, res) => res.sendFile(path.join(distDir, "index.html")));
  }
  app.use(onError);

  app.locals.deps = deps;
  app.locals.close = async () => {
    store.close();
    await sessionPool.end().catch(() => {});
    await mailer.idle(2_000);
    await jobs.stop();
    await referenceChanges.close();
  };
  return app;
}
