import { randomUUID } from "node:crypto";
import request from "supertest";
import { describe, expect, it } from "vitest";
import { Event } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, inbox, signIn } from "../support/app";

const app = buildTestApp();

async function planner() {
  const shop = await buildOrganization({ kind: "shop" });
  const user = await buildUser({ role: "admin", organizationId: shop.id, name: "Pia Planner" });
  return { shop, user, ...(await signIn(app, user)) };
}

describe("PATCH /api/users/:id (role and access)", () => {
  it("401 signed out, 403 for a customer or an operator", async () => {
    const target = await buildUser({ role: "operator" });
    expect((await request(app).patch(`/api/users/${target.id}`).send({ role: "qa" })).status).toBe(401);
    for (const role of ["customer", "operator"] as const) {
      const { agent, csrf } = await signIn(app, await buildUser({ role }));
      expect((await agent.patch(`/api/users/${target.id}`).set("X-CSRF-Token", csrf).send({ role: "qa" })).status).toBe(403);
    }
  });

  it("400 naming the field for a bad role, an empty body or a malformed id; 404 for no such person", async () => {
    const { agent, csrf } = await planner();
    const target = await buildUser({ role: "operator" });
    const bad = await agent.patch(`/api/users/${target.id}`).set("X-CSRF-Token", csrf).send({ role: "wizard" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.role).toMatch(/role/i);
    expect((await agent.patch(`/api/users/${target.id}`).set("X-CSRF-Token", csrf).send({})).body.error.fields).toHaveProperty("role");
    expect((await agent.patch(`/api/users/${target.id}`).set("X-CSRF-Token", csrf).send({ active: "no" })).body.error.fields).toHaveProperty("active");
    expect((await agent.patch("/api/users/not-a-uuid").set("X-CSRF-Token", csrf).send({ role: "qa" })).status).toBe(400);
    expect((await agent.patch(`/api/users/${randomUUID()}`).set("X-CSRF-Token", csrf).send({ role: "qa" })).status).toBe(404);
  });

  it("changes a staff role, with the event in the person's trail", async () => {
    const { agent, csrf, user: me } = await planner();
    const target = await buildUser({ role: "operator" });
    const res = await agent.patch(`/api/users/${target.id}`).set("X-CSRF-Token", csrf).send({ role: "qa" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: target.id, role: "qa", active: true });
    const trail = await agent.get(`/api/users/${target.id}/events`);
    expect(trail.status).toBe(200);
    expect(trail.body.items[0]).toMatchObject({ action: "user.role_changed", actor: { id: me.id, name: "Pia Planner" }, data: { from: "operator", to: "qa" } });
  });

  it("a customer stays a customer and staff never become customers (400 naming role)", async () => {
    const { agent, csrf } = await planner();
    const customer = await buildUser({ role: "customer" });
    const toStaff = await agent.patch(`/api/users/${customer.id}`).set("X-CSRF-Token", csrf).send({ role: "operator" });
    expect(toStaff.status).toBe(400);
    expect(toStaff.body.error.fields.role).toMatch(/customer/);
    const staff = await buildUser({ role: "qa" });
    expect((await agent.patch(`/api/users/${staff.id}`).set("X-CSRF-Token", csrf).send({ role: "customer" })).status).toBe(400);
  });

  it("deactivates a person: signed out at once, cannot sign in, reactivated later; both in the trail", async () => {
    const { agent, csrf } = await planner();
    const target = await buildUser({ role: "operator" });
    const theirs = await signIn(app, target);
    expect((await theirs.agent.get("/api/auth/me")).status).toBe(200);
    const off = await agent.patch(`/api/users/${target.id}`).set("X-CSRF-Token", csrf).send({ active: false });
    expect(off.status).toBe(200);
    expect(off.body.active).toBe(false);
    expect((await theirs.agent.get("/api/auth/me")).status).toBe(401);
    expect((await request(app).post("/api/auth/login").send({ email: target.email, password: "correct-horse-battery" })).status).toBe(401);
    const on = await agent.patch(`/api/users/${target.id}`).set("X-CSRF-Token", csrf).send({ active: true });
    expect(on.body.active).toBe(true);
    expect((await request(app).post("/api/auth/login").send({ email: target.email, password: "correct-horse-battery" })).status).toBe(200);
    const actions = (await Event.findAll({ where: { subjectType: "user", subjectId: target.id } })).map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(["user.deactivated", "user.reactivated"]));
  });

  it("never the last planner: the last active planner can be neither demoted nor deactivated (409), and nobody deactivates themself", async () => {
    // a shop of its own, so its planner is its last (the demo shop's planner, in the same database, is not touched)
    const { agent, csrf, user: me } = await planner();
    const demote = await agent.patch(`/api/users/${me.id}`).set("X-CSRF-Token", csrf).send({ role: "qa" });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe("LAST_PLANNER");
    const self = await agent.patch(`/api/users/${me.id}`).set("X-CSRF-Token", csrf).send({ active: false });
    expect(self.status).toBe(400);
    expect(self.body.error.fields).toHaveProperty("active");
    // with a second planner, the first may step down
    const other = await buildUser({ role: "operator", organizationId: me.organizationId });
    expect((await agent.patch(`/api/users/${other.id}`).set("X-CSRF-Token", csrf).send({ role: "admin" })).status).toBe(200);
    expect((await agent.patch(`/api/users/${me.id}`).set("X-CSRF-Token", csrf).send({ role: "qa" })).status).toBe(200);
  });

  it("the events route: 401, 403, 404", async () => {
    const target = await buildUser();
    expect((await request(app).get(`/api/users/${target.id}/events`)).status).toBe(401);
    const { agent } = await signIn(app, await buildUser({ role: "qa" }));
    expect((await agent.get(`/api/users/${target.id}/events`)).status).toBe(403);
    const p = await planner();
    expect((await p.agent.get(`/api/users/${randomUUID()}/events`)).status).toBe(404);
  });
});

describe("invitations: send again, withdraw", () => {
  async function invite(agent: request.Agent, csrf: string) {
    const email = `inv-${randomUUID().slice(0, 8)}@example.test`;
    const res = await agent.post("/api/invitations").set("X-CSRF-Token", csrf).send({ email, role: "qa" });
    expect(res.status).toBe(201);
    return { id: res.body.id as string, email };
  }

  it("401 signed out, 403 for other roles, 404 for an unknown or spent one, 400 for a malformed id", async () => {
    const { agent, csrf } = await planner();
    const { id } = await invite(agent, csrf);
    expect((await request(app).post(`/api/invitations/${id}/resend`)).status).toBe(401);
    expect((await request(app).delete(`/api/invitations/${id}`)).status).toBe(401);
    const other = await signIn(app, await buildUser({ role: "operator" }));
    expect((await other.agent.post(`/api/invitations/${id}/resend`).set("X-CSRF-Token", other.csrf)).status).toBe(403);
    expect((await other.agent.delete(`/api/invitations/${id}`).set("X-CSRF-Token", other.csrf)).status).toBe(403);
    expect((await agent.post(`/api/invitations/${randomUUID()}/resend`).set("X-CSRF-Token", csrf)).status).toBe(404);
    expect((await agent.delete(`/api/invitations/${randomUUID()}`).set("X-CSRF-Token", csrf)).status).toBe(404);
    expect((await agent.delete("/api/invitations/nope").set("X-CSRF-Token", csrf)).status).toBe(400);
  });

  it("sends again with a fresh link: the old link stops working, the new one works, both mailed", async () => {
    const { agent, csrf } = await planner();
    const { id, email } = await invite(agent, csrf);
    const [first] = await inbox(app, email);
    const oldToken = first.text.match(/invitation\/([\w-]+)/)![1];
    const again = await agent.post(`/api/invitations/${id}/resend`).set("X-CSRF-Token", csrf);
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ email, role: "qa" });
    expect(again.body.id).not.toBe(id);
    const mails = await inbox(app, email);
    expect(mails).toHaveLength(2);
    const newToken = mails.map((m) => m.text.match(/invitation\/([\w-]+)/)![1]).find((t) => t !== oldToken)!;
    expect((await request(app).get(`/api/auth/invitations/${oldToken}`)).status).toBe(404);
    expect((await request(app).get(`/api/auth/invitations/${newToken}`)).status).toBe(200);
    expect((await agent.post(`/api/invitations/${id}/resend`).set("X-CSRF-Token", csrf)).status).toBe(404); // the old one is spent
    expect(await Event.count({ where: { action: "invitation.resent", subjectId: again.body.id } })).toBe(1);
  });

  it("withdraws: 204, the link stops working, gone from the list, recorded", async () => {
    const { agent, csrf } = await planner();
    const { id, email } = await invite(agent, csrf);
    const [mail] = await inbox(app, email);
    const token = mail.text.match(/invitation\/([\w-]+)/)![1];
    expect((await agent.delete(`/api/invitations/${id}`).set("X-CSRF-Token", csrf)).status).toBe(204);
    expect((await request(app).get(`/api/auth/invitations/${token}`)).status).toBe(404);
    expect((await agent.get("/api/invitations")).body.items.map((i: { id: string }) => i.id)).not.toContain(id);
    expect(await Event.count({ where: { action: "invitation.withdrawn", subjectId: id } })).toBe(1);
  });
});
