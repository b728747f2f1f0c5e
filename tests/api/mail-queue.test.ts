import { randomUUID } from "node:crypto";
import { createServer, type Server } from "node:net";
import { beforeAll, describe, expect, it } from "vitest";
import { startMailStandIn } from "../../fake-services/mail/server";
import { JOB_SCHEMA } from "../../server/jobs/queue";
import { Quote } from "../../server/models";
import { quoteExpiryReminder } from "../../server/services/quoteExpiryReminder";
import { buildTestApp, buildUser, inbox, signIn } from "../support/app";
import { buildOrder, buildQuote, ensureReferenceData, waitFor } from "../support/ordering";

const freePort = () =>
  new Promise<number>((resolve) => {
    const s = createServer().listen(0, "127.0.0.1", () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

const app = buildTestApp();
beforeAll(ensureReferenceData);

async function jobsFor(queue: string, to: string): Promise<Array<{ state: string }>> {
  const [rows] = await app.locals.deps.sequelize.query(`select state from ${JOB_SCHEMA}.job where name = $1 and data->>'to' = $2`, { bind: [queue, to] });
  return rows as Array<{ state: string }>;
}

describe("mail through the job queue", () => {
  it("a mail job exists only when its transaction commits", async () => {
    const { mailer, sequelize, jobs } = app.locals.deps;
    const to = `rollback-${randomUUID().slice(0, 8)}@example.test`;
    await expect(
      sequelize.transaction(async (transaction) => {
        await mailer.enqueue({ to, subject: "never", text: "rolled back" }, transaction);
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await jobsFor(jobs.name("mail"), to)).toEqual([]);
    await sequelize.transaction((transaction) => mailer.enqueue({ to, subject: "kept", text: "committed" }, transaction));
    expect(await jobsFor(jobs.name("mail"), to)).toHaveLength(1);
    const mails = await inbox(app, to);
    expect(mails.map((m) => m.subject)).toEqual(["kept"]);
  });

  it("a stopped mail relay never fails the request; the mail goes out once it is back", async () => {
    const smtpPort = await freePort();
    const webPort = await freePort();
    // an app of its own: its own queue, pointed at a relay that is not there yet
    const offline = buildTestApp({ SMTP_PORT: String(smtpPort), JOB_QUEUE_PREFIX: `t${randomUUID().slice(0, 8)}-` });
    const user = await buildUser({ role: "customer" });
    const quote = await buildQuote(offline, user);
    const { agent, csrf } = await signIn(offline, user);
    const res = await agent.post("/api/orders").set("X-CSRF-Token", csrf).send({ quoteId: quote.id });
    expect(res.status).toBe(201);
    const queue = offline.locals.deps.jobs.name("mail");
    // the worker tried, failed, and will try again
    await waitFor(async () => (await jobsFor(queue, user.email)).some((j) => j.state === "retry"), 10_000, "a failed try");
    const relay = await startMailStandIn({ smtpPort, webPort });
    try {
      await waitFor(async () => (await jobsFor(queue, user.email)).every((j) => j.state === "completed"), 15_000, "the mail to go out");
      expect(relay.messages.map((m) => m.subject)).toEqual([`Order ${res.body.number} received`]);
    } finally {
      await relay.close();
    }
  });

  it("a relay that accepts the connection and then hangs does not hold the request", async () => {
    const hung: Server = createServer(() => {}); // never greets
    const port = await new Promise<number>((resolve) => hung.listen(0, "127.0.0.1", () => resolve((hung.address() as { port: number }).port)));
    let connections = 0;
    hung.on("connection", () => connections++);
    const slow = buildTestApp({ SMTP_PORT: String(port), JOB_QUEUE_PREFIX: `s${randomUUID().slice(0, 8)}-` });
    try {
      const user = await buildUser({ role: "customer" });
      const quote = await buildQuote(slow, user);
      const { agent, csrf } = await signIn(slow, user);
      const res = await agent.post("/api/orders").set("X-CSRF-Token", csrf).send({ quoteId: quote.id });
      expect(res.status).toBe(201);
      // the worker is stuck talking to the relay while the request has long been answered
      await waitFor(async () => connections > 0, 10_000, "the worker to connect");
      expect((await jobsFor(slow.locals.deps.jobs.name("mail"), user.email))[0].state).toBe("active");
    } finally {
      hung.close();
    }
  });
});

describe("quote expiry reminders", () => {
  it("are scheduled hourly on the job queue when the process runs the schedules", async () => {
    const scheduled = buildTestApp({ JOB_SCHEDULES: "1", JOB_QUEUE_PREFIX: `r${randomUUID().slice(0, 8)}-` });
    const name = scheduled.locals.deps.jobs.name("quote-expiry-reminders");
    const rows = await waitFor(async () => {
      const [r] = await app.locals.deps.sequelize.query(`select cron from ${JOB_SCHEMA}.schedule where name = $1`, { bind: [name] });
      return (r as Array<{ cron: string }>).length ? (r as Array<{ cron: string }>) : null;
    }, 10_000, "the schedule");
    expect(rows[0].cron).toBe("17 * * * *");
  });

  it("quotes expiring within three days get one reminder each; ordered and later ones none", async () => {
    const { mailer, config, sequelize } = app.locals.deps;
    const day = 86_400_000;
    const user = await buildUser({ role: "customer", name: "Rhea Reminded" });
    const soon = await buildQuote(app, user, { now: new Date(Date.now() - 28 * day) }); // expires in 2 days
    const later = await buildQuote(app, user, { now: new Date(Date.now() - 20 * day) }); // in 10 days
    const orderedSoon = await buildOrder(app, user); // ordered: no reminder
    await Quote.update({ createdAt: new Date(Date.now() - 28 * day), expiresAt: new Date(Date.now() + 2 * day) }, { where: { id: orderedSoon.quoteId } });
    const run = () => sequelize.transaction((transaction) => quoteExpiryReminder({ mailer, appUrl: config.appUrl, transaction }));
    await run();
    await run(); // a second run (another process, the next hour) sends nothing again
    const reminders = (await inbox(app, user.email)).filter((m) => m.subject.startsWith("Quote "));
    expect(reminders.map((m) => m.subject)).toEqual([expect.stringMatching(new RegExp(`^Quote Q-${soon.number} expires on `))]);
    expect(reminders[0].text).toContain(`/quotes/${soon.id}`);
    expect((await Quote.findByPk(later.id))!.expiryReminderSentAt).toBeNull();
    expect((await Quote.findByPk(orderedSoon.quoteId))!.expiryReminderSentAt).not.toBeNull();
  });
});
