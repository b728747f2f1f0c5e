import type { Logger } from "pino";
import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { Config } from "../config";
import { calibrationRefitter, RUN_REASON_MAX } from "../services/calibrationRefitter";
import type { MeasuredLotsReader } from "../services/measuredLotsReader";
import { oneProcessAtATime, type JobQueue, type QueueDefinition } from "./queue";

export const CALIBRATION_REFIT_QUEUE = "calibration-refit";
// "short": at most one refit waiting, so a burst of certificates makes one refit. One runs at a time
// by an advisory lock, not by the queue's "stately" policy: a process that died during a refit left
// its job active, and a stately queue then ran nothing until the job expired (15 minutes)
export const calibrationRefitQueueDefinition: QueueDefinition = {
  name: CALIBRATION_REFIT_QUEUE,
  options: { policy: "short", retryLimit: 2, retryDelay: 30, expireInSeconds: 900 },
};

export interface RefitRequest {
  actorId?: string | null;
  reason: string;
  /** refit even when the lots have not changed (a changed setting, a request by hand) */
  force?: boolean;
}

/**
 * Keep the ask and queue a refit, both inside the caller's transaction: they exist exactly when the
 * change that asked (a certificate issued, a lot decided) commits. THE hook for the certificate's
 * issuer. When a refit is already waiting, the queue adds none and the waiting one answers this ask.
 */
export async function queueCalibrationRefit(deps: { jobs: JobQueue; sequelize: Sequelize }, request: RefitRequest, transaction: Transaction): Promise<void> {
  await deps.sequelize.query("insert into calibration_refit_requests (requested_by_id, reason, force) values ($1, $2, $3)", {
    bind: [request.actorId ?? null, request.reason.slice(0, 200), request.force ?? false],
    transaction,
  });
  await deps.jobs.sendInTransaction(CALIBRATION_REFIT_QUEUE, {}, transaction);
}

export interface OpenRefitRequest {
  id: string;
  requested_by_id: string | null;
  reason: string;
  force: boolean;
}

/** Asks answered by one refit: every reason once, in the order asked; forced if any was; asked by the first who asked. */
export function combineRefitRequests(open: OpenRefitRequest[]): RefitRequest & { answers: string[] } {
  const reasons = [...new Set(open.map((r) => r.reason))];
  let reason = "";
  let named = 0;
  for (const r of reasons) {
    const next = named ? `${reason}; ${r}` : r;
    if (next.length > RUN_REASON_MAX - 20) break; // room for "; and N more"
    reason = next;
    named++;
  }
  if (named < reasons.length) reason += `; and ${reasons.length - named} more`;
  return {
    actorId: open.find((r) => r.requested_by_id)?.requested_by_id ?? null,
    reason,
    force: open.some((r) => r.force),
    answers: open.map((r) => r.id),
  };
}

const OPEN = "from calibration_refit_requests where answered_at is null";

/** Asks not yet answered, oldest first. */
export async function openRefitRequests(sequelize: Sequelize, limit = 200): Promise<OpenRefitRequest[]> {
  return sequelize.query<OpenRefitRequest>(`select id, requested_by_id, reason, force ${OPEN} order by requested_at, id limit $1`, { bind: [limit], type: QueryTypes.SELECT });
}

/** How many asks wait for the refit that answers them (queued or running). */
export async function openRefitRequestCount(sequelize: Sequelize): Promise<number> {
  const [row] = await sequelize.query<{ open: number }>(`select count(*)::int as open ${OPEN}`, { type: QueryTypes.SELECT });
  return row.open;
}

/** The worker, and a check every ten minutes that refits when the measured lots changed by any other way. */
export async function startCalibrationRefits(props: { queue: JobQueue; sequelize: Sequelize; readLots: MeasuredLotsReader; config: Config; logger: Logger }): Promise<void> {
  const { queue, sequelize, readLots, config, logger } = props;
  const refit = async (ask: RefitRequest & { answers?: string[] }) => {
    const actor = ask.actorId ? { id: ask.actorId } : null;
    const done = await calibrationRefitter({ sequelize, readLots, actor, reason: ask.reason, force: ask.force, answers: ask.answers });
    if (done) logger.info({ run: done.runId, classes: done.calibration.fits.length, reason: ask.reason }, "calibration refitted");
  };
  await queue.work<Partial<RefitRequest>>(CALIBRATION_REFIT_QUEUE, { pollingIntervalSeconds: 5 }, async ([job]) => {
    // one refit at a time in every process; the lock's connection ends with its process
    await oneProcessAtATime(config.DATABASE_URL, "fluxwright.calibration-refit", async () => {
      // every open ask; then again for asks that committed while this one ran, whose own job may
      // have been folded into this one (a few rounds at most: a later job answers the rest)
      for (let round = 0; round < 3; round++) {
        const open = await openRefitRequests(sequelize);
        if (open.length) await refit(combineRefitRequests(open));
        else {
          // the scheduled check, the start (and a job queued before asks were kept) carry their own reason
          if (round === 0 && job?.data?.reason) await refit({ actorId: job.data.actorId, reason: job.data.reason, force: job.data.force });
          break;
        }
      }
    });
  });
  if (config.schedules) {
    await queue.boss.schedule(queue.name(CALIBRATION_REFIT_QUEUE), "*/10 * * * *", { reason: "scheduled check" }, { tz: "UTC" });
    await queue.send(CALIBRATION_REFIT_QUEUE, { reason: "the app started" });
  }
}
