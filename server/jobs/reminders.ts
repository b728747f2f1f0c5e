import type { Logger } from "pino";
import type { Sequelize } from "sequelize";
import type { Config } from "../config";
import { quoteExpiryReminder } from "../services/quoteExpiryReminder";
import type { Mailer } from "./mailer";
import type { JobQueue, QueueDefinition } from "./queue";

export const QUOTE_REMINDER_QUEUE = "quote-expiry-reminders";
export const quoteReminderQueueDefinition: QueueDefinition = { name: QUOTE_REMINDER_QUEUE, options: { retryLimit: 3, retryDelay: 60, expireInSeconds: 300 } };

/**
 * Every hour (pg-boss's cron, one process sends it) the quotes that expire within three days get
 * their reminder mail; each quote once, however often the job runs.
 */
export async function startQuoteReminders(props: { queue: JobQueue; sequelize: Sequelize; mailer: Mailer; config: Config; logger: Logger }): Promise<void> {
  const { queue, sequelize, mailer, config, logger } = props;
  await queue.work(QUOTE_REMINDER_QUEUE, { pollingIntervalSeconds: 30 }, async () => {
    const sent = await sequelize.transaction((transaction) => quoteExpiryReminder({ mailer, appUrl: config.appUrl, transaction }));
    if (sent) logger.info({ sent }, "quote expiry reminders queued");
  });
  if (config.schedules) await queue.boss.schedule(queue.name(QUOTE_REMINDER_QUEUE), "17 * * * *", {}, { tz: "UTC" });
}
