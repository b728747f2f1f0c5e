// A server for the HTTP benchmarks, in its own process so the load generator does not share its CPU.
// `serve.ts app PORT` serves Fluxwright through its production entry (server/index.ts: one worker
// process per core, or WEB_CONCURRENCY); `serve.ts bare PORT` a bare Express JSON route for
// comparison, in as many worker processes, so a ratio compares like with like (`bare-like-app`: the
// same route served as the app is, see bareServer). Tells its parent "ready" once every worker listens.
import cluster from "node:cluster";
import express from "express";
import http from "node:http";
import { loadConfig } from "../../server/config";
import { createHttpServer } from "../../server/http-server";

const [kind, port] = process.argv.slice(2);
const { workers } = loadConfig();
const clustered = workers > 1;

if (cluster.isPrimary) {
  let listening = 0;
  const ready = () => ++listening === (clustered ? workers : 1) && process.send?.("ready");
  if (clustered) cluster.on("listening", ready);
  if (kind !== "app" && clustered) for (let i = 0; i < workers; i++) cluster.fork();
  if (kind !== "app" && !clustered) bareServer().listen(Number(port), "127.0.0.1", ready);
  if (kind === "app") {
    process.env.PORT = port;
    process.env.HOST = "127.0.0.1";
    // a single process (WEB_CONCURRENCY=1) says nothing when it listens: ask it
    if (!clustered) void untilAnswered(`http://127.0.0.1:${port}/api/health`).then(ready);
    await import("../../server/index");
  }
  // Exit cleanly on a signal, so `node --cpu-prof` can write its profile (the app's entry stops its own workers).
  if (kind !== "app") for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => process.exit(0));
} else if (kind !== "app") {
  bareServer().listen(Number(port), "127.0.0.1");
  for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => process.exit(0));
} else {
  await import("../../server/index");
}

// A bench that dies (or is stopped) does not leave its server behind: the IPC channel closing is the sign.
if (cluster.isPrimary) process.on("disconnect", () => process.kill(process.pid, "SIGTERM"));

/**
 * A bare Express app: `bare` as Express serves it (app.listen), the targets' baseline; `bare-like-app`
 * served as the app is (server/http-server.ts), to show the app's own work apart from that.
 */
function bareServer() {
  const app = express();
  app.get("/bare", (_req, res) => res.json({ status: "ok" }));
  app.post("/bare", express.json(), (_req, res) => res.json({ status: "ok" }));
  return kind === "bare-like-app" ? createHttpServer(app) : http.createServer(app);
}

async function untilAnswered(url: string) {
  for (;;) {
    if (await fetch(url).then((r) => r.ok, () => false)) return;
    await new Promise((r) => setTimeout(r, 100));
  }
}
