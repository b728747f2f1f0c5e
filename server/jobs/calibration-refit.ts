import type { Logger } from "pino";
import type { Sequelize, Transaction } from "sequelize";
import type { Config } from "../config";
import { calibrationRefitter } from "../services/calibrationRefitter";
import type { MeasuredLotsReader } from "../services/measuredLotsReader";
import type { JobQueue, QueueDefinition } from "./queue";

export const CALIBRATION_REFIT_QUEUE = "calibration-refit";
// "stately": at most one refit waiting and one running; a burst of certificates makes one refit
export const calibrationRefitQueueDefinition: QueueDefinition = {
  name: CALIBRATION_REFIT_QUEUE,
  options: { policy: "stately", retryLimit: 2, retryDelay: 30, expireInSeconds: 900 },
};

export interface RefitRequest {
  actorId?: string | null;
  reason: string;
  /** refit even when the lots have not changed (a changed setting, a request by hand) */
  force?: boolean;
}

/**
 * Queue a refit inside the caller's transaction: it exists exactly when the change that asked for
 * it (a certificate issued, a lot decided) commits. THE hook for the certificate's issuer.
 */
export function queueCalibrationRefit(jobs: JobQueue, request: RefitRequest, transaction?: Transaction): Promise<string | null> {
  return transaction ? jobs.sendInTransaction(CALIBRATION_REFIT_QUEUE, request, transaction) : jobs.send(CALIBRATION_REFIT_QUEUE, request);
}

/** The worker, and a check every ten minutes that refits when the measured lots changed by any other way. */
export async function startCalibrationRefits(props: { queue: JobQueue; sequelize: Sequelize; readLots: MeasuredLotsReader; config: Config; logger: Logger }): Promise<void> {
  const { queue, sequelize, readLots, config, logger } = props;
  await queue.work<RefitRequest>(CALIBRATION_REFIT_QUEUE, { pollingIntervalSeconds: 5 }, async ([job]) => {
    const data = job?.data ?? { reason: "scheduled check" };
    const actor = data.actorId ? { id: data.actorId } : null;
    const done = await calibrationRefitter({ sequelize, readLots, actor, reason: data.reason, force: data.force });
    if (done) logger.info({ run: done.runId, classes: done.calibration.fits.length, reason: data.reason }, "calibration refitted");
  });
  if (config.schedules) {
    await queue.boss.schedule(queue.name(CALIBRATION_REFIT_QUEUE), "*/10 * * * *", { reason: "scheduled check" }, { tz: "UTC" });
    await queue.send(CALIBRATION_REFIT_QUEUE, { reason: "the app started" });
  }
}
