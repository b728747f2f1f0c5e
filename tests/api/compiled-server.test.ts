// The production shape `npm start` runs: the compiled server (build/, made by scripts/build-server.mjs
// before the tests) under plain node with NODE_ENV=production, serving the built client.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startCompiledServer, type CompiledServer } from "../support/compiled-server";

describe("the compiled server", () => {
  let server: CompiledServer;
  let base: string;

  beforeAll(async () => {
    server = await startCompiledServer();
    base = server.base;
  });

  afterAll(() => server?.killAll());

  it("runs without the TypeScript loader and reports the database up", async () => {
    expect(server.child.spawnargs.join(" ")).not.toMatch(/tsx/);
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
    server.child.kill("SIGTERM");
    expect(await server.exited()).toBe(0);
  });
});
