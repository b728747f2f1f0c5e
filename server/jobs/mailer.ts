import nodemailer from "nodemailer";
import type { Logger } from "pino";
import type { Transaction } from "sequelize";
import type { JobQueue, QueueDefinition } from "./queue";

/** A document rendered when the mail goes out (so the job holds a reference, not the file). */
export interface MailAttachmentRef {
  document: "invoice" | "certificate";
  id: string;
}

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  attachments?: MailAttachmentRef[];
}

export interface RenderedAttachment {
  filename: string;
  content: Buffer;
  contentType: string;
}

export interface Mailer {
  /** Queue inside the caller's transaction: the mail goes out if and only if the change commits. */
  enqueue(message: MailMessage, transaction: Transaction): Promise<void>;
  /** Queue now, for callers with no transaction to join (the change has already committed). */
  send(message: MailMessage): void;
  /** Resolves when every queued mail has been handed to SMTP, or after `timeoutMs` (tests, shutdown). */
  idle(timeoutMs?: number): Promise<void>;
}

export const MAIL_QUEUE = "mail";

export function mailQueueDefinition(retryDelaySeconds: number): QueueDefinition {
  // 12 tries with doubling delays: with a 10 s first delay the last try is about 11 hours later
  return { name: MAIL_QUEUE, options: { retryLimit: 12, retryDelay: retryDelaySeconds, retryBackoff: true, expireInSeconds: 120 } };
}

/**
 * Mail through the job queue: requests only insert a job, a worker hands it to SMTP after the
 * commit and retries with back-off when the relay is slow or down. The sender address is the
 * shop's setting, read when the mail goes out.
 */
export function createMailer(opts: {
  host: string;
  port: number;
  queue: JobQueue;
  logger: Logger;
  sender: () => Promise<string>;
  renderAttachment: (ref: MailAttachmentRef) => Promise<RenderedAttachment>;
}): Mailer {
  const { queue, logger } = opts;
  // The local stand-in offers no TLS; a production relay sets its own transport options.
  // Short timeouts: a hung relay fails the try (and the job is retried) instead of holding the worker.
  const transport = nodemailer.createTransport({
    host: opts.host, port: opts.port, secure: false, ignoreTLS: true, pool: false,
    connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000,
  });
  const inserting = new Set<Promise<unknown>>();

  void queue
    .work<MailMessage>(MAIL_QUEUE, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async ([job]) => {
      const m = job.data;
      const attachments = await Promise.all((m.attachments ?? []).map(opts.renderAttachment));
      await transport.sendMail({ from: await opts.sender(), to: m.to, subject: m.subject, text: m.text, attachments });
      logger.info({ to: m.to, subject: m.subject }, "mail sent");
    })
    .catch((err) => logger.error({ err }, "mail worker did not start"));

  return {
    async enqueue(message, transaction) {
      await queue.sendInTransaction(MAIL_QUEUE, message, transaction);
    },
    send(message) {
      const p = queue
        .send(MAIL_QUEUE, message)
        .catch((err: unknown) => logger.error({ err, to: message.to, subject: message.subject }, "mail not queued"))
        .finally(() => inserting.delete(p));
      inserting.add(p);
    },
    async idle(timeoutMs = 20_000) {
      await Promise.all([...inserting]);
      const until = Date.now() + timeoutMs;
      const busy = () => Promise.race([queue.pending([MAIL_QUEUE]), new Promise<number>((r) => setTimeout(() => r(1), Math.max(0, until - Date.now())))]).catch(() => 0);
      while (Date.now() < until && (await busy()) > 0) await new Promise((r) => setTimeout(r, 50));
    },
  };
}
