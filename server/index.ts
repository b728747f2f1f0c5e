import cluster from "node:cluster";
import pino from "pino";
import { superviseWorkers } from "./cluster";
import { loadConfig, type Config } from "./config";
import { defaultPoolMax } from "./db/sequelize";

const config = loadConfig();

if (cluster.isPrimary && config.workers > 1) {
  // Each worker's share of the database connections unless DB_POOL_MAX says, and the scheduled jobs
  // in the first worker only (pg-boss hands each queued job to one worker of any process anyway).
  superviseWorkers({
    workers: config.workers,
    logger: pino({ level: config.LOG_LEVEL ?? "info" }),
    url: `http://${config.HOST}:${config.PORT}`,
    env: (index) => ({
      DB_POOL_MAX: String(config.DB_POOL_MAX ?? defaultPoolMax(config.workers)),
      ...(index > 1 ? { JOB_SCHEDULES: "0" } : {}),
    }),
  });
} else {
  await serve(config);
}

/** The whole app in this process (a worker, or the only process when WEB_CONCURRENCY is 1). */
async function serve(config: Config) {
  const { createApp } = await import("./app");
  const { closeSequelize } = await import("./db/sequelize");
  const { createHttpServer } = await import("./http-server");
  const app = createApp({ config });
  const { logger } = app.locals.deps;

  const server = createHttpServer(app).listen(config.PORT, config.HOST, () => {
    if (cluster.isPrimary) logger.info(`Fluxwright listening on http://${config.HOST}:${config.PORT}`);
  });
  server.on("error", (err) => {
    logger.fatal({ err }, `cannot listen on ${config.HOST}:${config.PORT}`);
    process.exit(1);
  });

  let stopping = false;
  async function shutdown(signal: string) {
    // npm start's Ctrl-C reaches this process more than once (from the terminal, the script's trap, the primary)
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, "shutting down");
    server.close();
    await app.locals.close();
    await closeSequelize();
    process.exit(0);
  }
  process.on("SIGTERM", () => void shutdown("SIGTERM"));
  // A worker stops when its primary says (SIGTERM), not on the terminal's Ctrl-C, which reaches the
  // whole process group: the primary, seeing a worker gone before its own signal, would start another.
  process.on("SIGINT", () => {
    if (!cluster.isWorker) void shutdown("SIGINT");
  });
}
