import nodemailer from "nodemailer";
import type { Logger } from "pino";

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  attachments?: { filename: string; content: Buffer | string; contentType: string }[];
}

export interface Mailer {
  /** Queue a message to go out after the caller's transaction has committed; failures are logged, never thrown. */
  send(message: MailMessage): void;
  /** Resolves when every queued message has been handed to SMTP (tests and shutdown use it). */
  idle(): Promise<void>;
}

export function createMailer(opts: { host: string; port: number; from: string; logger: Logger }): Mailer {
  // The local stand-in offers no TLS; a production relay sets its own transport options.
  const transport = nodemailer.createTransport({ host: opts.host, port: opts.port, secure: false, ignoreTLS: true, pool: false });
  const pending = new Set<Promise<void>>();
  return {
    send(message) {
      const p = transport
        .sendMail({ from: opts.from, ...message })
        .then(() => opts.logger.info({ to: message.to, subject: message.subject }, "mail sent"))
        .catch((err: unknown) => opts.logger.error({ err, to: message.to, subject: message.subject }, "mail failed"))
        .finally(() => pending.delete(p));
      pending.add(p);
    },
    async idle() {
      await Promise.all([...pending]);
    },
  };
}
