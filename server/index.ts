import { createApp } from "./app";
import { loadConfig } from "./config";
import { closeSequelize } from "./db/sequelize";

const config = loadConfig();
const app = createApp({ config });
const { logger } = app.locals.deps;

const server = app.listen(config.PORT, config.HOST, () => {
  logger.info(`Fluxwright listening on http://${config.HOST}:${config.PORT}`);
});

let stopping = false;
async function shutdown(signal: string) {
  // npm start's Ctrl-C reaches this process twice (from the terminal and from the script's trap)
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, "shutting down");
  server.close();
  await app.locals.close();
  await closeSequelize();
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
