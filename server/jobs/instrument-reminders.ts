import type { Logger } from "pino";
import type { Sequelize } from "sequelize";
import type { Config } from "../config";
import { instrumentDueReminder } from "../services/instrumentDueReminder";
import type { Mailer } from "./mailer";
import type { JobQueue, QueueDefinition } from "./queue";

export const INSTRUMENT_REMINDER_QUEUE = "instrument-calibration-reminders";
export const instrumentReminderQueueDefinition: QueueDefinition = { name: INSTRUMENT_REMINDER_QUEUE, options: { retryLimit: 3, retryDelay: 60, expireInSeconds: 300 } };

/**
 * Every hour (pg-boss's cron, one process sends it) and at start the instruments whose calibration falls due
 * within 14 days get their reminder mail, once per due date however often the job runs.
 */
export async function startInstrumentReminders(props: { queue: JobQueue; sequelize: Sequelize; mailer: Mailer; config: Config; logger: Logger }): Promise<void> {
  const { queue, sequelize, mailer, config, logger } = props;
  await queue.work(INSTRUMENT_REMINDER_QUEUE, { pollingIntervalSeconds: 30 }, async () => {
    const reminded = await sequelize.transaction((transaction) => instrumentDueReminder({ mailer, appUrl: config.appUrl, transaction }));
    if (reminded) logger.info({ reminded }, "calibration reminders queued");
  });
  if (config.schedules) {
    await queue.boss.schedule(queue.name(INSTRUMENT_REMINDER_QUEUE), "23 * * * *", {}, { tz: "UTC" });
    // and once now: a shop that was closed over a due date hears of it when the app starts
    await queue.send(INSTRUMENT_REMINDER_QUEUE, {});
  }
}
