// The server's processes (the primary and every worker) killed with SIGKILL in the middle of a burst of scans, then started again:
// every scan it answered 201 or 200 is in the database, and the scans it never answered, sent
// again with the same idempotency keys, are recorded exactly once. A real process (the compiled
// server, as deployed), a real kill.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Scan } from "../../server/models";
import { TEST_PASSWORD, buildTestApp } from "../support/app";
import { groupAlive, startCompiledServer, type CompiledServer } from "../support/compiled-server";
import { ensureReferenceData } from "../support/ordering";
import { buildHeat, buildReleasedOrder, completeData, staff } from "../support/shop-floor";
import type { Job } from "../../server/models";

const app = buildTestApp();
const start = (port?: number) =>
  // a job queue of its own: a process killed mid-mail must not leave another test file's mail in flight
  startCompiledServer({ JOB_SCHEDULES: "0", JOB_QUEUE_PREFIX: "crash-test." }, port);

/** Signs in over HTTP; the session lives in PostgreSQL, so it outlives the process. */
async function session(base: string, email: string): Promise<{ cookie: string; csrf: string }> {
  const cookies = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair.indexOf("=");
      cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
  };
  const header = () => [...cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  const login = await fetch(`${base}/api/auth/login`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email, password: TEST_PASSWORD }) });
  if (!login.ok) throw new Error(`sign-in failed: ${login.status}`);
  keep(login);
  const csrf = await fetch(`${base}/api/auth/csrf`, { headers: { cookie: header() } });
  keep(csrf);
  return { cookie: header(), csrf: ((await csrf.json()) as { csrfToken: string }).csrfToken };
}

interface Planned {
  key: string;
  body: Record<string, unknown>;
}

describe("a scan burst through a SIGKILL", () => {
  let server: CompiledServer | undefined;
  beforeAll(ensureReferenceData);
  afterAll(() => {
    server?.killAll();
  });

  it("every scan answered 201 or 200 is stored; the unanswered ones, sent again, are recorded once", { timeout: 120_000 }, async () => {
    const heat = await buildHeat();
    const jobs: Job[] = [];
    for (let i = 0; i < 6; i++) jobs.push(...(await buildReleasedOrder(app)).jobs);
    const operator = await staff(app, "operator");

    // each worker walks its own jobs through their routings, one scan at a time, each with its own key
    const lanes: Planned[][] = Array.from({ length: 6 }, () => []);
    jobs.forEach((job, n) => {
      for (const step of job.routing.slice(0, 3)) {
        for (const action of ["start", "complete"] as const) {
          lanes[n % lanes.length].push({
            key: `crash-${job.code}-${step.key}-${action}`,
            body: { code: job.code, step: step.key, action, station: "crash bench", ...(action === "complete" ? completeData(job, step.key, heat.heatNumber) : {}) },
          });
        }
      }
    });

    server = await start();
    const { base, port } = server;
    const auth = await session(base, operator.user.email);
    const post = (p: Planned) =>
      fetch(`${base}/api/scans`, {
        method: "POST",
        headers: { "content-type": "application/json", cookie: auth.cookie, "x-csrf-token": auth.csrf, "idempotency-key": p.key },
        body: JSON.stringify(p.body),
      });

    const answered = new Map<string, { status: number; eventId: string }>();
    let killed = false;
    const killAfter = Math.floor(lanes.flat().length / 3);
    const runLane = async (lane: Planned[]) => {
      for (const p of lane) {
        if (killed) return;
        try {
          const res = await post(p);
          const body = (await res.json()) as { event?: { id: string }; error?: unknown };
          if (res.status !== 201 && res.status !== 200) throw new Error(`${p.key}: ${res.status} ${JSON.stringify(body)}`);
          answered.set(p.key, { status: res.status, eventId: body.event!.id });
          if (answered.size >= killAfter && !killed) {
            killed = true;
            server!.killAll();
          }
        } catch (err) {
          if (!killed) throw err;
          return; // the connection died with the process: this scan was never answered
        }
      }
    };
    await Promise.all(lanes.map(runLane));
    expect(killed).toBe(true);
    expect(await server.exited()).toBe("SIGKILL");
    // no worker lives on to answer what is sent next
    for (let i = 0; i < 50 && groupAlive(server); i++) await new Promise((r) => setTimeout(r, 100));
    expect(groupAlive(server)).toBe(false);

    // every answered scan is in the database, under its key
    expect(answered.size).toBeGreaterThanOrEqual(killAfter);
    for (const [key, a] of answered) {
      const row = await Scan.findOne({ where: { idempotencyKey: key } });
      expect(row, key).not.toBeNull();
      expect(String(row!.id)).toBe(a.eventId);
    }

    // started again, the whole plan is sent once more: answered scans are repeats, the rest land once
    server = await start(port);
    for (const lane of lanes) {
      for (const p of lane) {
        const res = await post(p);
        expect([200, 201], `${p.key} ${res.status}`).toContain(res.status);
        if (answered.has(p.key)) expect(res.status).toBe(200);
      }
    }
    const all = lanes.flat();
    const rows = await Scan.findAll({ where: { jobId: jobs.map((j) => j.id) } });
    expect(rows).toHaveLength(all.length);
    expect(new Set(rows.map((r) => `${r.jobId}:${r.stepIndex}:${r.action}`)).size).toBe(all.length);
    server.child.kill("SIGTERM");
  });
});
