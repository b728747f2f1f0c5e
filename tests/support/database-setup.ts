// vitest global setup for the "api" and "browser" projects: migrate the test database once
// (scripts/test.sh made it empty) and start the mail stand-in on free loopback ports.
import type { TestProject } from "vitest/node";
import { startMailStandIn, type MailStandIn } from "../../fake-services/mail/server";
import { createMigrator } from "../../server/db/migrator";
import { closeSequelize, getSequelize } from "../../server/db/sequelize";

const shared = globalThis as unknown as { __fwSetup?: Promise<MailStandIn>; __fwUsers?: number };

export default async function setup(project: TestProject) {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL is not set: run the tests with `npm test`.");
  shared.__fwSetup ??= (async () => {
    await createMigrator(getSequelize(process.env.DATABASE_URL)).up();
    await closeSequelize();
    return startMailStandIn({ smtpPort: 0, webPort: 0 });
  })();
  const mail = await shared.__fwSetup;
  shared.__fwUsers = (shared.__fwUsers ?? 0) + 1;
  project.provide("smtpPort", mail.smtpPort);
  project.provide("mailWebPort", mail.webPort);
  return async () => {
    shared.__fwUsers = (shared.__fwUsers ?? 1) - 1;
    if (shared.__fwUsers === 0) await mail.close();
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    smtpPort: number;
    mailWebPort: number;
  }
}
