import express from "express";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHttpServer } from "../../server/http-server";

// Requests and responses are built on the app's own prototypes, so Express's per-request
// Object.setPrototypeOf has nothing to change (see server/http-server.ts for why that matters).
describe("the app's HTTP server", () => {
  const app = express();
  app.use(express.json());
  app.post("/echo", (req, res) => res.status(201).json({ got: req.body, host: req.get("host")?.startsWith("127.0.0.1") }));
  const server = createHttpServer(app);
  const seen: Array<{ request: boolean; response: boolean }> = [];
  // before Express's own listener, which would give them the prototypes itself
  server.prependListener("request", (req, res) => seen.push({ request: Object.getPrototypeOf(req) === app.request, response: Object.getPrototypeOf(res) === app.response }));
  let base = "";

  beforeAll(async () => {
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  it("builds each request and response with the app's prototypes from the start", async () => {
    for (let i = 0; i < 3; i++) await fetch(`${base}/echo`, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" });
    expect(seen).toHaveLength(3);
    expect(seen.every((s) => s.request && s.response)).toBe(true);
  });

  it("serves the app as Express would: body parsing, request helpers, status and JSON", async () => {
    const res = await fetch(`${base}/echo`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ code: "J-1" }) });
    expect(res.status).toBe(201);
    expect(await res.json()).toEqual({ got: { code: "J-1" }, host: true });
  });
});
