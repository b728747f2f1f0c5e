import autocannon from "autocannon";
import { fork, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { BenchRow } from "./types";

const here = path.dirname(fileURLToPath(import.meta.url));

const freePort = () =>
  new Promise<number>((resolve) => {
    const s = createServer().listen(0, "127.0.0.1", () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

export async function serve(kind: "app" | "bare" | "bare-like-app"): Promise<{ url: string; child: ChildProcess }> {
  const port = await freePort();
  // BENCH_PROF=DIR writes the app server's CPU profile there when it stops (`node --cpu-prof`)
  const profile = kind === "app" && process.env.BENCH_PROF ? ["--cpu-prof", `--cpu-prof-dir=${process.env.BENCH_PROF}`] : [];
  const child = fork(path.join(here, "serve.ts"), [kind, String(port)], { execArgv: ["--import", "tsx", ...profile], stdio: "inherit" });
  await new Promise<void>((resolve, reject) => {
    child.once("message", () => resolve());
    child.once("exit", (code) => reject(new Error(`${kind} server exited with ${code}`)));
  });
  return { url: `http://127.0.0.1:${port}`, child };
}

/** The middle run of an odd number of runs (the benches' rounds). */
export const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export interface HttpCase {
  name: string;
  method?: "GET" | "POST";
  path: string;
  body?: unknown;
  /** minimum ratio of the app route's requests/s to the bare Express route's */
  minRatio?: number;
}

export async function rps(url: string, c: { method?: string; body?: unknown }, seconds: number): Promise<number> {
  const result = await autocannon({
    url,
    method: (c.method ?? "GET") as "GET" | "POST",
    body: c.body === undefined ? undefined : JSON.stringify(c.body),
    headers: c.body === undefined ? {} : { "content-type": "application/json" },
    connections: 10,
    duration: seconds,
  });
  if (result.non2xx > 0) throw new Error(`${url}: ${result.non2xx} answers were not 2xx`);
  return result.requests.average;
}

/**
 * The app's rate against the bare Express route's, alternating bare/app for `rounds` rounds and
 * keeping the median ratio: on a 2-core machine one pair of runs swings by a third. The same route
 * served as the app is (`bare-like-app`, server/http-server.ts) is measured in the same rounds, for
 * information: the ratio to it is the app's own work, apart from how its server builds requests.
 */
export async function versusBare(run: { app: () => Promise<number>; bare: () => Promise<number>; bareLikeApp: () => Promise<number> }, rounds: number) {
  const app: number[] = [], bare: number[] = [], bareLikeApp: number[] = [];
  for (let i = 0; i < rounds; i++) {
    bare.push(await run.bare());
    bareLikeApp.push(await run.bareLikeApp());
    app.push(await run.app());
  }
  return {
    app: median(app),
    bare: median(bare),
    bareLikeApp: median(bareLikeApp),
    ratio: median(app.map((a, i) => a / bare[i])),
    ratioLikeApp: median(app.map((a, i) => a / bareLikeApp[i])),
  };
}

/** Each app route against the bare Express route (versusBare). */
export async function benchHttp(cases: HttpCase[], seconds = 3, rounds = 3): Promise<BenchRow[]> {
  const app = await serve("app");
  const bare = await serve("bare");
  const bareLike = await serve("bare-like-app");
  const rows: BenchRow[] = [];
  try {
    for (const c of cases) {
      const bareRoute = { method: c.method, body: c.body };
      await rps(`${app.url}${c.path}`, c, 1); // warm-up
      await rps(`${bare.url}/bare`, bareRoute, 1);
      await rps(`${bareLike.url}/bare`, bareRoute, 1);
      const m = await versusBare({ app: () => rps(`${app.url}${c.path}`, c, seconds), bare: () => rps(`${bare.url}/bare`, bareRoute, seconds), bareLikeApp: () => rps(`${bareLike.url}/bare`, bareRoute, seconds) }, rounds);
      rows.push({ name: `${c.method ?? "GET"} ${c.path} (bare Express ${Math.round(m.bare)} req/s)`, value: Math.round(m.app), unit: "req/s" });
      if (c.minRatio !== undefined) rows.push({ name: `  median ratio to bare Express (${rounds} rounds)`, value: Number(m.ratio.toFixed(2)), unit: "×", target: `>= ${c.minRatio}`, pass: m.ratio >= c.minRatio });
      rows.push({ name: `  ratio to bare Express served as the app is (${Math.round(m.bareLikeApp)} req/s), for information`, value: Number(m.ratioLikeApp.toFixed(2)), unit: "×" });
    }
  } finally {
    app.child.kill("SIGTERM");
    bare.child.kill("SIGTERM");
    bareLike.child.kill("SIGTERM");
  }
  return rows;
}
