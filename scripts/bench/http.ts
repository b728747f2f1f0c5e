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

export async function serve(kind: "app" | "bare"): Promise<{ url: string; child: ChildProcess }> {
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
 * Each app route against the bare Express route, alternating bare/app for `rounds` rounds and
 * keeping the median ratio: on a 2-core machine one pair of runs swings by a third.
 */
export async function benchHttp(cases: HttpCase[], seconds = 3, rounds = 3): Promise<BenchRow[]> {
  const app = await serve("app");
  const bare = await serve("bare");
  const rows: BenchRow[] = [];
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  try {
    for (const c of cases) {
      await rps(`${app.url}${c.path}`, c, 1); // warm-up
      await rps(`${bare.url}/bare`, { method: c.method, body: c.body }, 1);
      const bareRuns: number[] = [];
      const appRuns: number[] = [];
      const ratios: number[] = [];
      for (let i = 0; i < rounds; i++) {
        bareRuns.push(await rps(`${bare.url}/bare`, { method: c.method, body: c.body }, seconds));
        appRuns.push(await rps(`${app.url}${c.path}`, c, seconds));
        ratios.push(appRuns[i] / bareRuns[i]);
      }
      const ratio = median(ratios);
      rows.push({ name: `${c.method ?? "GET"} ${c.path} (bare Express ${Math.round(median(bareRuns))} req/s)`, value: Math.round(median(appRuns)), unit: "req/s" });
      if (c.minRatio !== undefined) rows.push({ name: `  median ratio to bare Express (${rounds} rounds)`, value: Number(ratio.toFixed(2)), unit: "×", target: `>= ${c.minRatio}`, pass: ratio >= c.minRatio });
    }
  } finally {
    app.child.kill("SIGTERM");
    bare.child.kill("SIGTERM");
  }
  return rows;
}
