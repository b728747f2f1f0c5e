// The production shape `npm start` runs: the compiled server (build/, made by scripts/build-server.mjs
// before the tests) under plain node with NODE_ENV=production, serving the built client.
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
const entry = path.join(root, "build/server/index.js");

const freePort = () =>
  new Promise<number>((resolve) => {
    const s = createServer().listen(0, "127.0.0.1", () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

describe("the compiled server", () => {
  let child: ChildProcess;
  let base: string;
  let output = "";

  beforeAll(async () => {
    if (!existsSync(entry)) throw new Error("build/server/index.js is missing: run `npm run build` (npm test does).");
    const port = await freePort();
    base = `http://127.0.0.1:${port}`;
    // only what a deployment has: no tsx loader, nothing from the test runner's environment but the database
    child = spawn(process.execPath, [entry], {
      cwd: root,
      env: { PATH: process.env.PATH, NODE_ENV: "production", PORT: String(port), DATABASE_URL: process.env.DATABASE_URL, SMTP_PORT: String(inject("smtpPort")), LOG_LEVEL: "warn" },
      stdio: ["ignore", "pipe", "pipe"],
    });
    child.stdout!.on("data", (d) => (output += d));
    child.stderr!.on("data", (d) => (output += d));
    for (let i = 0; i < 100; i++) {
      if (child.exitCode !== null) throw new Error(`the compiled server exited with ${child.exitCode}:\n${output}`);
      const up = await fetch(`${base}/api/health`).then((r) => r.ok, () => false);
      if (up) return;
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`the compiled server did not answer:\n${output}`);
  });

  afterAll(() => {
    if (child && child.exitCode === null) child.kill("SIGKILL");
  });

  it("runs without the TypeScript loader and reports the database up", async () => {
    expect(child.spawnargs.join(" ")).not.toMatch(/tsx/);
    const res = await fetch(`${base}/api/health`);
    expect(await res.json()).toEqual({ status: "ok", database: "up" });
  });

  it("serves the built client's page and its API from one address", async () => {
    const page = await fetch(`${base}/design-check`);
    expect(page.status).toBe(200);
    expect(await page.text()).toMatch(/<div id="root">/);
    const materials = await fetch(`${base}/api/materials`);
    expect(materials.status).toBe(200);
    expect(Array.isArray(await materials.json())).toBe(true);
  });

  it("stops cleanly on SIGTERM", async () => {
    const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
    child.kill("SIGTERM");
    expect(await exited).toBe(0);
  });
});
