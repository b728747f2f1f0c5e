// The compiled server as one primary and its worker processes (server/cluster.ts): each new
// connection goes to the next worker, so these tests open a connection per request (no keep-alive)
// to reach both workers in turn.
import http from "node:http";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { groupAlive, startCompiledServer, type CompiledServer } from "../support/compiled-server";

/** One request on a connection of its own; its status. */
function call(base: string, path: string, body?: unknown): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = http.request(`${base}${path}`, { method: body === undefined ? "GET" : "POST", agent: false, headers: { "content-type": "application/json" } }, (res) => {
      res.resume();
      res.on("end", () => resolve(res.statusCode!));
    });
    req.on("error", reject);
    req.end(body === undefined ? undefined : JSON.stringify(body));
  });
}

const until = async (what: () => boolean, ms = 15_000) => {
  for (const t0 = Date.now(); Date.now() - t0 < ms; ) {
    if (what()) return true;
    await new Promise((r) => setTimeout(r, 100));
  }
  return what();
};

describe("the server's worker processes", () => {
  let server: CompiledServer;

  beforeAll(async () => {
    // two failed sign-ins per account per quarter hour, so the third is refused; queues of a new name
    // and the schedules on, as in production, so both workers set the same queues up at once (without
    // the lock in server/jobs/queue.ts, one start in four here ended in a deadlock)
    server = await startCompiledServer({ WEB_CONCURRENCY: "2", RATE_LIMIT_SIGN_IN: "2", JOB_QUEUE_PREFIX: `workers-${Date.now()}.` });
  });

  afterAll(() => server?.killAll());

  it("serves from as many workers as WEB_CONCURRENCY says", async () => {
    expect(await until(() => server.workers().length === 2)).toBe(true);
  });

  it("counts a sign-in limit across the workers together", async () => {
    const attempt = () => call(server.base, "/api/auth/login", { email: "nobody-here@workers.test", password: "not the password" });
    // connections alternate between the two workers: counted apart, each would have seen at most two
    expect(await attempt()).toBe(401);
    expect(await attempt()).toBe(401);
    expect(await attempt()).toBe(429);
    expect(await attempt()).toBe(429);
  });

  it("starts another worker in place of one that dies, and keeps answering", async () => {
    const [victim] = server.workers();
    process.kill(victim, "SIGKILL");
    expect(await until(() => server.workers().length === 2 && !server.workers().includes(victim))).toBe(true);
    for (let i = 0; i < 4; i++) expect(await call(server.base, "/api/health")).toBe(200);
    expect(server.output()).toMatch(/a server worker stopped; starting another in its place/);
  });

  it("starts the job queue in every worker without a clash (they create the same queues at once)", async () => {
    // each worker logs "the job queue could not start" when its setup fails; pg-boss's queue creation deadlocked when two ran together
    await new Promise((r) => setTimeout(r, 1500));
    expect(server.output()).not.toMatch(/could not start|deadlock/);
  });

  it("stops every worker, then itself, on SIGTERM", async () => {
    server.child.kill("SIGTERM");
    expect(await server.exited()).toBe(0);
    expect(await until(() => !groupAlive(server), 5_000)).toBe(true);
  });
});
