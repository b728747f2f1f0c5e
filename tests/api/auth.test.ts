import request from "supertest";
import { describe, expect, it } from "vitest";
import { Event } from "../../server/models";
import { TEST_PASSWORD, buildTestApp, buildUser, inbox, signIn } from "../support/app";

const app = buildTestApp();

describe("GET /api/health", () => {
  it("reports the database up", async () => {
    const res = await request(app).get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: "ok", database: "up" });
  });
});

describe("POST /api/auth/login", () => {
  it("signs in and answers the user without secrets", async () => {
    const user = await buildUser({ role: "qa" });
    const res = await request(app).post("/api/auth/login").send({ email: user.email.toUpperCase(), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, email: user.email, role: "qa", organizationId: user.organizationId });
    expect(JSON.stringify(res.body)).not.toMatch(/hash/i);
    const cookie = String(res.headers["set-cookie"]);
    expect(cookie).toMatch(/fw\.sid=.*HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it("401 on a wrong pair, without saying which part was wrong", async () => {
    const user = await buildUser();
    const wrongPassword = await request(app).post("/api/auth/login").send({ email: user.email, password: "not-the-password" });
    const wrongEmail = await request(app).post("/api/auth/login").send({ email: "nobody@example.test", password: TEST_PASSWORD });
    expect(wrongPassword.status).toBe(401);
    expect(wrongEmail.status).toBe(401);
    expect(wrongPassword.body.error.message).toBe(wrongEmail.body.error.message);
  });

  it("400 naming the field for a missing e-mail", async () => {
    const res = await request(app).post("/api/auth/login").send({ password: "x" });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("VALIDATION_FAILED");
    expect(res.body.error.fields).toHaveProperty("email");
  });

  it("regenerates the session id at sign-in", async () => {
    const user = await buildUser();
    const agent = request.agent(app);
    const before = await agent.get("/api/auth/csrf");
    const sidBefore = String(before.headers["set-cookie"]).match(/fw\.sid=([^;]+)/)?.[1];
    const login = await agent.post("/api/auth/login").send({ email: user.email, password: TEST_PASSWORD });
    const sidAfter = String(login.headers["set-cookie"]).match(/fw\.sid=([^;]+)/)?.[1];
    expect(sidBefore).toBeTruthy();
    expect(sidAfter).toBeTruthy();
    expect(sidAfter).not.toBe(sidBefore);
  });
});

describe("sign-in rate limit", () => {
  it("limits attempts per account even when the address changes nothing", async () => {
    const limited = buildTestApp({ RATE_LIMIT_SIGN_IN: "3" });
    const user = await buildUser();
    const codes: number[] = [];
    for (let i = 0; i < 5; i++) codes.push((await request(limited).post("/api/auth/login").send({ email: user.email, password: "wrong-password-x" })).status);
    expect(codes.slice(0, 3)).toEqual([401, 401, 401]);
    expect(codes[4]).toBe(429);
  });
});

describe("GET /api/auth/me and logout", () => {
  it("401 when signed out, the user when signed in, 204 on logout", async () => {
    expect((await request(app).get("/api/auth/me")).status).toBe(401);
    const user = await buildUser({ role: "operator" });
    const { agent, csrf } = await signIn(app, user);
    const me = await agent.get("/api/auth/me");
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe("operator");
    const out = await agent.post("/api/auth/logout").set("X-CSRF-Token", csrf);
    expect(out.status).toBe(204);
    expect((await agent.get("/api/auth/me")).status).toBe(401);
  });
});

describe("CSRF", () => {
  it("403 for a signed-in state change without the token, and with a wrong one", async () => {
    const user = await buildUser();
    const { agent, csrf } = await signIn(app, user);
    expect((await agent.patch("/api/auth/me").send({ name: "New Name" })).status).toBe(403);
    expect((await agent.patch("/api/auth/me").set("X-CSRF-Token", "forged").send({ name: "New Name" })).status).toBe(403);
    const ok = await agent.patch("/api/auth/me").set("X-CSRF-Token", csrf).send({ name: "New Name" });
    expect(ok.status).toBe(200);
    expect(ok.body.user.name).toBe("New Name");
  });

  it("refuses an anonymous post from another site", async () => {
    const res = await request(app).post("/api/auth/login").set("Origin", "http://evil.example").send({ email: "a@b.test", password: "x" });
    expect(res.status).toBe(403);
  });
});

describe("bad input", () => {
  it("400 for malformed JSON, never a 500", async () => {
    const res = await request(app).post("/api/auth/login").set("Content-Type", "application/json").send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("MALFORMED_JSON");
  });
  it("413 for an oversized body", async () => {
    const res = await request(app).post("/api/auth/login").send({ email: "a@b.test", password: "x".repeat(300_000) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("PAYLOAD_TOO_LARGE");
  });
  it("400 for wrong types", async () => {
    const res = await request(app).post("/api/auth/register").send({ email: 42, password: true, name: [], organization: {} });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["email", "name", "organization", "password"]);
  });
  it("404 JSON for an unknown API route", async () => {
    const res = await request(app).get("/api/no-such-thing");
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("NOT_FOUND");
  });
});

describe("public read-only routes", () => {
  it("create no session row", async () => {
    const { sequelize } = app.locals.deps;
    const [[before]] = (await sequelize.query(`select count(*)::int as n from "session"`)) as [[{ n: number }], unknown];
    for (let i = 0; i < 3; i++) {
      const res = await request(app).get("/api/health");
      expect(res.headers["set-cookie"]).toBeUndefined();
    }
    const [[after]] = (await sequelize.query(`select count(*)::int as n from "session"`)) as [[{ n: number }], unknown];
    expect(after.n).toBeLessThanOrEqual(before.n);
  });
});

describe("POST /api/auth/register", () => {
  it("creates a customer organisation, signs in and sends a welcome mail", async () => {
    const email = `new-${Date.now()}@example.test`;
    const agent = request.agent(app);
    const res = await agent.post("/api/auth/register").send({ email, password: "a-long-password", name: "Ada Quill", organization: `Quill Optics ${Date.now()}` });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email, role: "customer" });
    expect((await agent.get("/api/auth/me")).status).toBe(200);
    const mails = await inbox(app, email);
    expect(mails.map((m) => m.subject)).toContain("Welcome to Fluxwright");
  });
  it("does not reveal that an address has an account: the same status and shape of answer and a session cookie, but nobody signed in, nothing made, and the owner told by mail", async () => {
    const owner = await buildUser();
    const { sequelize } = app.locals.deps;
    const count = async () => ((await sequelize.query(`select (select count(*) from users)::int as u, (select count(*) from organizations)::int as o`)) as [[{ u: number; o: number }], unknown])[0][0];
    const before = await count();
    const agent = request.agent(app);
    const taken = await agent.post("/api/auth/register").send({ email: owner.email, password: "another-long-password", name: "Mallory Probe", organization: `Probe Ltd ${Date.now()}` });
    const fresh = await request.agent(app).post("/api/auth/register").send({ email: `fresh-${Date.now()}@example.test`, password: "a-long-password", name: "Nia New", organization: `New Lab ${Date.now()}` });
    // an observer of the answer cannot tell the two apart
    expect(taken.status).toBe(201);
    expect(taken.status).toBe(fresh.status);
    expect(Object.keys(taken.body.user)).toEqual(Object.keys(fresh.body.user));
    expect(taken.body.user).toMatchObject({ email: owner.email, name: "Mallory Probe", role: "customer", active: true });
    expect(taken.body.user.id).not.toBe(owner.id);
    const sessionCookie = (res: request.Response) => ([] as string[]).concat(res.headers["set-cookie"] ?? []).some((c) => c.startsWith("fw.sid="));
    expect(sessionCookie(taken)).toBe(true);
    expect(sessionCookie(fresh)).toBe(true);
    // but nobody is signed in as the owner, and nothing was made besides the fresh registration's user and organisation
    expect((await agent.get("/api/auth/me")).status).toBe(401);
    expect(await count()).toEqual({ u: before.u + 1, o: before.o + 1 });
    expect((await request(app).post("/api/auth/login").send({ email: owner.email, password: "another-long-password" })).status).toBe(401);
    expect((await request(app).post("/api/auth/login").send({ email: owner.email, password: TEST_PASSWORD })).status).toBe(200);
    // the owner learns that someone tried; the trail keeps it
    const mails = await inbox(app, owner.email);
    expect(mails.map((m) => m.subject)).toContain("Someone tried to create a Fluxwright account with your address");
    expect(mails.map((m) => m.subject)).not.toContain("Welcome to Fluxwright");
    expect(await Event.count({ where: { action: "user.registration_repeated", subjectId: owner.id } })).toBe(1);
  });
  it("400 for a short password", async () => {
    const res = await request(app).post("/api/auth/register").send({ email: "short@example.test", password: "short", name: "X", organization: "Y" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("password");
  });
});

describe("password reset", () => {
  it("mails a single-use link that sets a new password", async () => {
    const user = await buildUser();
    const res = await request(app).post("/api/auth/password-reset/request").send({ email: user.email });
    expect(res.status).toBe(202);
    const [mail] = await inbox(app, user.email);
    const token = mail.text.match(/reset-password\/([\w-]+)/)![1];
    const confirm = await request(app).post("/api/auth/password-reset/confirm").send({ token, password: "brand-new-password" });
    expect(confirm.status).toBe(204);
    expect((await request(app).post("/api/auth/login").send({ email: user.email, password: "brand-new-password" })).status).toBe(200);
    const again = await request(app).post("/api/auth/password-reset/confirm").send({ token, password: "another-password" });
    expect(again.status).toBe(410);
    expect(again.body.error.fields).toHaveProperty("token");
  });
  it("a link is checked before the form: 200 while it works, 404 once used or unknown", async () => {
    const user = await buildUser();
    await request(app).post("/api/auth/password-reset/request").send({ email: user.email });
    const [mail] = await inbox(app, user.email);
    const token = mail.text.match(/reset-password\/([\w-]+)/)![1];
    const open = await request(app).get(`/api/auth/password-reset/${token}`);
    expect(open.status).toBe(200);
    expect(open.body).toEqual({ expiresAt: expect.any(String) });
    expect((await request(app).post("/api/auth/password-reset/confirm").send({ token, password: "brand-new-password" })).status).toBe(204);
    const used = await request(app).get(`/api/auth/password-reset/${token}`);
    expect(used.status).toBe(404);
    expect(used.body.error.code).toBe("RESET_LINK_INVALID");
    expect((await request(app).get("/api/auth/password-reset/not-a-real-token")).status).toBe(404);
  });
  it("answers the same for an unknown address and sends nothing", async () => {
    const res = await request(app).post("/api/auth/password-reset/request").send({ email: "ghost@example.test" });
    expect(res.status).toBe(202);
    expect(await inbox(app, "ghost@example.test")).toHaveLength(0);
  });
});

describe("password change", () => {
  it("400 naming currentPassword when it is wrong; 204 when right", async () => {
    const user = await buildUser();
    const { agent, csrf } = await signIn(app, user);
    const wrong = await agent.post("/api/auth/password").set("X-CSRF-Token", csrf).send({ currentPassword: "nope", newPassword: "a-new-long-password" });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty("currentPassword");
    const ok = await agent.post("/api/auth/password").set("X-CSRF-Token", csrf).send({ currentPassword: TEST_PASSWORD, newPassword: "a-new-long-password" });
    expect(ok.status).toBe(204);
  });
});
