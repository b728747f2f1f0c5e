import pg from "pg";
import PgBoss from "pg-boss";
import type { Logger } from "pino";
import type { Transaction } from "sequelize";
import type { Config } from "../config";

/** pg-boss's schema; migration 0016 installs it. */
export const JOB_SCHEMA = "pgboss";

export interface QueueDefinition {
  /** the name without the configured prefix */
  name: string;
  options?: Omit<PgBoss.Queue, "name">;
}

/**
 * The PostgreSQL-backed job queue (pg-boss). Jobs are inserted through the caller's transaction,
 * so a job exists exactly when the change that asked for it commits; workers in any app process
 * pick them up after the commit, with retries. Started in the background: calls wait for it.
 */
export interface JobQueue {
  boss: PgBoss;
  /** started, queues created */
  ready: Promise<void>;
  /** the queue's full name (with the configured prefix) */
  name(base: string): string;
  /** Insert a job inside `transaction` (its connection), woken up as soon as the transaction commits. */
  sendInTransaction(base: string, data: object, transaction: Transaction): Promise<string | null>;
  /** Insert a job now, outside any transaction. */
  send(base: string, data: object): Promise<string | null>;
  work<T>(base: string, options: PgBoss.WorkOptions, handler: PgBoss.WorkHandler<T>): Promise<string>;
  /** jobs of these queues not yet finished (created, retry or active) */
  pending(bases: string[]): Promise<number>;
  stop(): Promise<void>;
}

type PgClient = { query(text: string, values: unknown[]): Promise<{ rows: unknown[] }> };

export function createJobQueue(props: { config: Config; logger: Logger; queues: QueueDefinition[] }): JobQueue {
  const { config, logger } = props;
  const boss = new PgBoss({
    connectionString: config.DATABASE_URL,
    schema: JOB_SCHEMA,
    max: 4,
    application_name: "fluxwright-jobs",
    migrate: true,
    supervise: true,
    schedule: config.schedules,
  });
  boss.on("error", (err) => logger.warn({ err }, "job queue error"));
  const name = (base: string) => `${config.JOB_QUEUE_PREFIX}${base}`;
  const workers = new Map<string, string[]>();

  // Started in the background and retried while the database is away: requests that queue a job
  // need the database anyway, so they wait for `ready` like they would for their transaction.
  let stopped = false;
  let interruptWait = () => {};
  const ready = (async () => {
    for (let attempt = 0; ; attempt++) {
      if (stopped) throw new Error("the job queue was stopped before it started");
      try {
        await boss.start();
        await oneProcessAtATime(config.DATABASE_URL, "fluxwright.job-queue-setup", async () => {
          for (const q of props.queues) {
            // created once; updated so that a changed definition (its policy, retries) takes effect
            await boss.createQueue(name(q.name), { name: name(q.name), ...q.options });
            if (q.options) await boss.updateQueue(name(q.name), { name: name(q.name), ...q.options });
          }
        });
        return;
      } catch (err) {
        if (attempt === 0) logger.error({ err }, "the job queue could not start; retrying every 5 s");
        await boss.stop({ graceful: false, wait: true, timeout: 1000 }).catch(() => {});
        await new Promise<void>((r) => {
          const t = setTimeout(r, 5000);
          interruptWait = () => (clearTimeout(t), r());
        });
      }
    }
  })();
  ready.catch(() => {});

  const wake = (base: string) => {
    for (const id of workers.get(base) ?? []) boss.notifyWorker(id);
  };

  return {
    boss,
    ready,
    name,
    async sendInTransaction(base, data, transaction) {
      await ready;
      // pg-boss takes any { executeSql }: the transaction's own connection makes the insert part of it
      const client = (transaction as unknown as { connection: PgClient }).connection;
      const id = await boss.send(name(base), data, { db: { executeSql: (text, values) => client.query(text, values) as Promise<{ rows: unknown[] }> } });
      transaction.afterCommit(() => wake(base));
      return id;
    },
    async send(base, data) {
      await ready;
      const id = await boss.send(name(base), data);
      wake(base);
      return id;
    },
    async work(base, options, handler) {
      await ready;
      const id = await boss.work(name(base), options, handler);
      workers.set(base, [...(workers.get(base) ?? []), id]);
      return id;
    },
    async pending(bases) {
      await ready;
      const rows = (await boss.getDb().executeSql(
        `select count(*)::int as n from ${JOB_SCHEMA}.job where name = any($1) and state in ('created', 'retry', 'active')`,
        [bases.map(name)],
      )) as { rows: Array<{ n: number }> };
      return rows.rows[0]?.n ?? 0;
    },
    async stop() {
      if (stopped) return;
      stopped = true;
      interruptWait();
      if (!(await ready.then(() => true, () => false))) return;
      await boss.stop({ graceful: true, wait: true, timeout: 5000 }).catch((err) => logger.warn({ err }, "job queue stop"));
    },
  };
}

/**
 * Runs `work` while holding a PostgreSQL advisory lock of that name that every app process asks for
 * (waiting for it): pg-boss's createQueue deadlocks when two processes create the same queues at
 * once, as the server's workers do when they start together. The lock lives on a connection of its
 * own and ends with it, so a process that dies holding it lets go at once.
 */
export async function oneProcessAtATime<T>(databaseUrl: string, lock: string, work: () => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: databaseUrl, application_name: `fluxwright-lock ${lock}`.slice(0, 63) });
  await client.connect();
  try {
    await client.query("select pg_advisory_lock(hashtext($1))", [lock]);
    return await work();
  } finally {
    await client.end().catch(() => {});
  }
}
