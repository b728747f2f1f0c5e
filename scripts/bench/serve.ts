// A server for the HTTP benchmarks, in its own process so the load generator does not share its CPU.
// `serve.ts app PORT` serves Fluxwright; `serve.ts bare PORT` a bare Express JSON route for comparison.
import express from "express";

const [kind, port] = process.argv.slice(2);
if (kind === "bare") {
  const app = express();
  app.get("/bare", (_req, res) => res.json({ status: "ok" }));
  app.post("/bare", express.json(), (_req, res) => res.json({ status: "ok" }));
  app.listen(Number(port), "127.0.0.1", () => process.send?.("ready"));
} else {
  const { createApp } = await import("../../server/app");
  const app = createApp();
  app.listen(Number(port), "127.0.0.1", () => process.send?.("ready"));
}

// Exit cleanly on a signal, so `node --cpu-prof` can write its profile.
for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => process.exit(0));
