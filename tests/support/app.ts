// Builds the app for API tests against the real test database and the mail stand-in.
import { randomUUID } from "node:crypto";
import { tmpdir } from "node:os";
import path from "node:path";
import request from "supertest";
import { afterAll, inject } from "vitest";
import { createApp, type FluxwrightApp } from "../../server/app";
import { hashPassword } from "../../server/auth/passwords";
import { loadConfig } from "../../server/config";
import { closeSequelize } from "../../server/db/sequelize";
import { Organization, User } from "../../server/models";
import type { Role } from "../../shared/schemas/auth";

export const TEST_PASSWORD = "correct-horse-battery";

export function testConfig(overrides: Record<string, string> = {}) {
  return loadConfig({
    ...process.env,
    NODE_ENV: "test",
    SMTP_PORT: String(inject("smtpPort")),
    APP_URL: "http://127.0.0.1:4100",
    RATE_LIMIT_SIGN_IN: "1000",
    PAYMENTS_PORT: String(inject("paymentsPort")),
    UPLOAD_DIR: path.join(tmpdir(), "fluxwright-test-uploads", randomUUID().slice(0, 8)),
    MAIL_RETRY_DELAY_SECONDS: "1",
    ...overrides,
  });
}

/** One app per test file; closed after the file's tests. */
export function buildTestApp(overrides: Record<string, string> = {}): FluxwrightApp {
  const app = createApp({ config: testConfig(overrides), serveClient: false });
  afterAll(async () => {
    await app.locals.close();
    await closeSequelize();
  });
  return app;
}

// Factories: each creates any missing parent, so each test owns its records.
export async function buildOrganization(overrides: Partial<{ name: string; kind: "shop" | "customer" }> = {}) {
  return Organization.create({ name: `Org ${randomUUID().slice(0, 8)}`, kind: "customer", ...overrides });
}

export async function buildUser(overrides: Partial<{ email: string; name: string; role: Role; organizationId: string; password: string }> = {}) {
  const role = overrides.role ?? "customer";
  const organizationId = overrides.organizationId ?? (await buildOrganization({ kind: role === "customer" ? "customer" : "shop" })).id;
  const user = await User.create({
    email: overrides.email ?? `user-${randomUUID().slice(0, 8)}@example.test`,
    name: overrides.name ?? "Test Person",
    role,
    organizationId,
    passwordHash: await hashPassword(overrides.password ?? TEST_PASSWORD),
  });
  return user;
}

/** A supertest agent signed in as the user, with a fresh CSRF token for its session. */
export async function signIn(app: FluxwrightApp, user: { email: string }, password = TEST_PASSWORD) {
  const agent = request.agent(app);
  const login = await agent.post("/api/auth/login").send({ email: user.email, password });
  if (login.status !== 200) throw new Error(`sign-in failed: ${login.status} ${JSON.stringify(login.body)}`);
  const { body } = await agent.get("/api/auth/csrf");
  return { agent, csrf: body.csrfToken as string };
}

export interface InboxMessage { id: string; to: string[]; from: string; subject: string; text: string; attachments: { filename: string; contentType: string }[] }

/** Waits for the app's queued mail, then reads the stand-in's inbox for one address. */
export async function inbox(app: FluxwrightApp, to: string): Promise<InboxMessage[]> {
  await app.locals.deps.mailer.idle();
  const res = await fetch(`http://127.0.0.1:${inject("mailWebPort")}/api/messages?to=${encodeURIComponent(to)}`);
  return (await res.json()) as InboxMessage[];
}
