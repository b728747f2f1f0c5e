import request from "supertest";
import { describe, expect, it } from "vitest";
import { buildOrganization, buildTestApp, buildUser, inbox, signIn } from "../support/app";

const app = buildTestApp();

async function admin() {
  const shop = await buildOrganization({ kind: "shop" });
  return buildUser({ role: "admin", organizationId: shop.id });
}

describe("POST /api/invitations", () => {
  it("401 signed out", async () => {
    expect((await request(app).post("/api/invitations").send({ email: "x@y.test", role: "qa" })).status).toBe(401);
  });
  it("403 for a customer", async () => {
    const { agent, csrf } = await signIn(app, await buildUser());
    const res = await agent.post("/api/invitations").set("X-CSRF-Token", csrf).send({ email: "x@y.test", role: "qa" });
    expect(res.status).toBe(403);
  });
  it("400 naming the field", async () => {
    const { agent, csrf } = await signIn(app, await admin());
    const res = await agent.post("/api/invitations").set("X-CSRF-Token", csrf).send({ email: "not-an-email", role: "wizard" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("email");
    expect(res.body.error.fields).toHaveProperty("role");
    const noOrg = await agent.post("/api/invitations").set("X-CSRF-Token", csrf).send({ email: "c@y.test", role: "customer" });
    expect(noOrg.status).toBe(400);
    expect(noOrg.body.error.fields).toHaveProperty("organizationId");
  });
  it("mails an invitation that the invited person accepts once", async () => {
    const planner = await admin();
    const customerOrg = await buildOrganization();
    const { agent, csrf } = await signIn(app, planner);
    const email = `invitee-${Date.now()}@example.test`;
    const res = await agent.post("/api/invitations").set("X-CSRF-Token", csrf).send({ email, role: "customer", organizationId: customerOrg.id });
    expect(res.status).toBe(201);
    const [mail] = await inbox(app, email);
    expect(mail.subject).toMatch(/invited/);
    const token = mail.text.match(/invitation\/([\w-]+)/)![1];

    const info = await request(app).get(`/api/auth/invitations/${token}`);
    expect(info.status).toBe(200);
    expect(info.body).toEqual({ email, role: "customer", organizationName: customerOrg.name, expiresAt: expect.any(String) });

    // the planner's list names the organisation the person joins, as the invitation answered
    const list = await agent.get("/api/invitations");
    expect(list.status).toBe(200);
    const listed = list.body.items.find((i: { email: string }) => i.email === email);
    expect(listed).toEqual({
      id: res.body.id, email, role: "customer", organizationId: customerOrg.id, organizationName: customerOrg.name,
      expiresAt: res.body.expiresAt, createdAt: expect.any(String),
    });
    expect(res.body.organizationName).toBe(customerOrg.name);

    const invitee = request.agent(app);
    const accept = await invitee.post("/api/auth/invitations/accept").send({ token, name: "Invited Person", password: "a-long-password" });
    expect(accept.status).toBe(200);
    expect(accept.body.user).toMatchObject({ email, role: "customer", organizationId: customerOrg.id });
    expect((await invitee.get("/api/auth/me")).status).toBe(200);

    const twice = await request(app).post("/api/auth/invitations/accept").send({ token, name: "Again", password: "a-long-password" });
    expect(twice.status).toBe(410);
    expect((await request(app).get(`/api/auth/invitations/${token}`)).status).toBe(404);
  });
});

describe("GET /api/invitations", () => {
  it("lists a staff invitation without naming the shop", async () => {
    const { agent, csrf } = await signIn(app, await admin());
    const email = `staff-${Date.now()}@example.test`;
    expect((await agent.post("/api/invitations").set("X-CSRF-Token", csrf).send({ email, role: "qa" })).status).toBe(201);
    const listed = (await agent.get("/api/invitations")).body.items.find((i: { email: string }) => i.email === email);
    expect(listed).toMatchObject({ email, role: "qa", organizationName: null });
    expect(typeof listed.organizationId).toBe("string");
  });
});

describe("GET /api/users", () => {
  it("401, 403 for staff who are not planners, then a page of users", async () => {
    expect((await request(app).get("/api/users")).status).toBe(401);
    const { agent: qaAgent } = await signIn(app, await buildUser({ role: "qa" }));
    expect((await qaAgent.get("/api/users")).status).toBe(403);
    const { agent } = await signIn(app, await admin());
    const res = await agent.get("/api/users?page=1&pageSize=2");
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBeLessThanOrEqual(2);
    expect(res.body.total).toBeGreaterThan(0);
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash/);
    const bad = await agent.get("/api/users?pageSize=1000");
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("pageSize");
  });
});
