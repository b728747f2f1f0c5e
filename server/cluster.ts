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

export function superviseWorkers(opts: { workers: number; env: WorkerEnv; logger: Logger; url: string }): void {
  const { workers, env, logger, url } = opts;
  new ClusterMemoryStorePrimary().init();
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
