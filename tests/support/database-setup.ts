// vitest global setup for the "api" and "browser" projects: migrate the test database once
// (scripts/test.sh made it empty) and start the mail and payment stand-ins on free loopback ports.
// The payment stand-in has no fixed webhook target: an app under test that wants events
// registers its own endpoint (tests/support/payments.ts).
import type { TestProject } from "vitest/node";
import { startMailStandIn, type MailStandIn } from "../../fake-services/mail/server";
import { startPaymentsStandIn, type PaymentsStandIn } from "../../fake-services/payments/server";
import { createMigrator } from "../../server/db/migrator";
import { closeSequelize, getSequelize } from "../../server/db/sequelize";

const shared = globalThis as unknown as { __fwSetup?: Promise<{ mail: MailStandIn; payments: PaymentsStandIn }>; __fwUsers?: number };

export default async function setup(project: TestProject) {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL is not set: run the tests with `npm test`.");
  shared.__fwSetup ??= (async () => {
    await createMigrator(getSequelize(process.env.DATABASE_URL)).up();
    await closeSequelize();
    const mail = await startMailStandIn({ smtpPort: 0, webPort: 0 });
    const payments = await startPaymentsStandIn({ port: 0, webhookUrl: null, retryDelayMs: 200, maxRetryDelayMs: 2000 });
    return { mail, payments };
  })();
  const { mail, payments } = await shared.__fwSetup;
  shared.__fwUsers = (shared.__fwUsers ?? 0) + 1;
  project.provide("smtpPort", mail.smtpPort);
  project.provide("mailWebPort", mail.webPort);
  project.provide("paymentsPort", payments.port);
  return async () => {
    shared.__fwUsers = (shared.__fwUsers ?? 1) - 1;
    if (shared.__fwUsers === 0) await Promise.all([mail.close(), payments.close()]);
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    smtpPort: number;
    mailWebPort: number;
    paymentsPort: number;
  }
}
