import cluster, { type Worker } from "node:cluster";
import { ClusterMemoryStorePrimary } from "@express-rate-limit/cluster-memory-store";
import type { Logger } from "pino";

// The server as one process per core: Node runs JavaScript on one thread, so a single process
// leaves the other cores to PostgreSQL alone and, while it is busy, every request waits for it.
// The primary only supervises: it shares the listening socket with its workers (node:cluster hands
// each new connection to the next worker), keeps the rate limits' counts for all of them (so a
// limit means the same with one worker or eight), starts a worker again when one dies, and stops
// them all on SIGINT or SIGTERM. Each worker is the whole app (server/index.ts).

/** Environment of the worker with this index (1-based), added to the primary's own. */
export type WorkerEnv = (index: number) => Record<string, string>;

/** A worker that dies this soon after its start counts towards a crash loop. */
const QUICK_DEATH_MS = 10_000;
/** Quick deaths in a row that stop the server (a taken port, a bad setting: a new worker would die too). */
const CRASH_LOOP = 3;
/** Time the workers get to finish their requests and close their connections on a stop. */
const STOP_GRACE_MS = 15_000;

/**
 * Each worker's young generation: 32 MB semi-spaces instead of V8's 16. Under the floor's load a
 * young-generation collection pauses a worker for several milliseconds (it copies what is still in
 * flight into old-space pages, which a virtual machine faults in one by one); with twice the room it
 * comes half as often, so fewer than one job lookup in a hundred meets one (lookup p99 7, 7, 7 and
 * 6 ms against 10, 10, 7 and 6 ms in alternating runs on this machine). Costs up to 32 MB more per
 * worker. A flag given to node itself (or in NODE_OPTIONS) wins.
 */
export const YOUNG_GENERATION_FLAG = "--max-semi-space-size=32";

/** The node flags a worker starts with: the primary's own, and the young generation's size unless set. */
export function workerExecArgv(execArgv: readonly string[], nodeOptions = ""): string[] {
  const given = [...execArgv, ...nodeOptions.split(/\s+/)].some((flag) => /^--max[-_]semi[-_]space[-_]size\b/.test(flag));
  return given ? [...execArgv] : [...execArgv, YOUNG_GENERATION_FLAG];
}

export function superviseWorkers(opts: { workers: number; env: WorkerEnv; logger: Logger; url: string }): void {
  const { workers, env, logger, url } = opts;
  new ClusterMemoryStorePrimary().init();
  cluster.setupPrimary({ execArgv: workerExecArgv(process.execArgv, process.env.NODE_OPTIONS) });
  const running = new Map<Worker, { index: number; startedAt: number }>();
  /** the primary's exit code once it is stopping */
  let stopping: number | null = null;
  let quickDeaths = 0;
  let listening = 0;

  const fork = (index: number) => running.set(cluster.fork(env(index)), { index, startedAt: Date.now() });

  const stop = (code: number) => {
    if (stopping !== null) return;
    stopping = code;
    if (!running.size) process.exit(code);
    for (const worker of running.keys()) worker.process.kill("SIGTERM");
    setTimeout(() => {
      for (const worker of running.keys()) worker.process.kill("SIGKILL");
      process.exit(code);
    }, STOP_GRACE_MS).unref();
  };

  cluster.on("listening", () => {
    if (++listening === workers) logger.info(`Fluxwright listening on ${url} (${workers} worker processes)`);
  });
  cluster.on("exit", (worker, code, signal) => {
    const started = running.get(worker);
    running.delete(worker);
    if (stopping !== null) {
      if (!running.size) process.exit(stopping);
      return;
    }
    if (!started) return;
    quickDeaths = Date.now() - started.startedAt < QUICK_DEATH_MS ? quickDeaths + 1 : 0;
    if (quickDeaths >= CRASH_LOOP) {
      logger.fatal({ worker: started.index, code, signal }, `${CRASH_LOOP} server workers in a row stopped within ${QUICK_DEATH_MS / 1000} s of their start; stopping (see the messages above)`);
      return stop(1);
    }
    logger.error({ worker: started.index, code, signal }, "a server worker stopped; starting another in its place");
    fork(started.index);
  });

  for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => stop(0));
  for (let index = 1; index <= workers; index++) fork(index);
}
