import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Design, Event } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, signIn } from "../support/app";
import { configuration, ensureReferenceData } from "../support/ordering";

const app = buildTestApp();
beforeAll(ensureReferenceData);

async function customer(organizationId?: string) {
  const user = await buildUser({ role: "customer", name: "Dana Designer", ...(organizationId ? { organizationId } : {}) });
  return { user, ...(await signIn(app, user)) };
}
async function save(agent: ReturnType<typeof request.agent>, csrf: string, name: string, overrides: Record<string, unknown> = {}) {
  const res = await agent.post("/api/designs").set("X-CSRF-Token", csrf).send({ name, configuration: configuration(overrides) });
  expect(res.status).toBe(201);
  return res.body;
}

describe("POST /api/designs", () => {
  it("401, 403 without CSRF and for staff, 400 naming the field, 201 with the configuration as saved", async () => {
    const { user, agent, csrf } = await customer();
    expect((await request(app).post("/api/designs").send({ name: "x", configuration: configuration() })).status).toBe(401);
    expect((await agent.post("/api/designs").send({ name: "x", configuration: configuration() })).status).toBe(403);
    const shop = await buildOrganization({ kind: "shop" });
    const admin = await signIn(app, await buildUser({ role: "admin", organizationId: shop.id }));
    expect((await admin.agent.post("/api/designs").set("X-CSRF-Token", admin.csrf).send({ name: "x", configuration: configuration() })).status).toBe(403);
    const bad = await agent.post("/api/designs").set("X-CSRF-Token", csrf).send({ name: " ", configuration: configuration({ layers: [] }) });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("name");
    expect(bad.body.error.fields).toHaveProperty("configuration.layers");
    const created = await save(agent, csrf, "  Sensor can, two layers  ");
    expect(created).toMatchObject({ name: "Sensor can, two layers", organizationId: user.organizationId, createdBy: { id: user.id, name: "Dana Designer" }, abilities: { update: true, delete: true, quote: true } });
    expect(created.configuration.requiredAttenuation_db).toBe(40);
    expect(created.summary).toContain("2 layers");
    expect(await Event.count({ where: { action: "design.created", subjectId: created.id } })).toBe(1);
  });
});

describe("reading, renaming, duplicating and deleting designs", () => {
  it("401, 404 across organisations, 403 for an operator; colleagues share the organisation's designs", async () => {
    const { user, agent, csrf } = await customer();
    const design = await save(agent, csrf, "Shared can");
    expect((await request(app).get(`/api/designs/${design.id}`)).status).toBe(401);
    const stranger = await customer();
    for (const r of [
      stranger.agent.get(`/api/designs/${design.id}`),
      stranger.agent.patch(`/api/designs/${design.id}`).set("X-CSRF-Token", stranger.csrf).send({ name: "mine" }),
      stranger.agent.post(`/api/designs/${design.id}/duplicate`).set("X-CSRF-Token", stranger.csrf).send({}),
      stranger.agent.delete(`/api/designs/${design.id}`).set("X-CSRF-Token", stranger.csrf),
    ]) expect((await r).status).toBe(404);
    const operator = await signIn(app, await buildUser({ role: "operator" }));
    expect((await operator.agent.get("/api/designs")).status).toBe(403);
    const colleague = await customer(user.organizationId);
    expect((await colleague.agent.get(`/api/designs/${design.id}`)).body.name).toBe("Shared can");
  });

  it("rename, change, duplicate (a copy to vary), delete; the list searches, sorts and pages on the server", async () => {
    const { agent, csrf } = await customer();
    const a = await save(agent, csrf, "Alpha can");
    const b = await save(agent, csrf, "Beta box", { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, bendRadius_mm: 1.5, kFactor: 0.44, cornerRadius_mm: undefined });
    let res = await agent.patch(`/api/designs/${a.id}`).set("X-CSRF-Token", csrf).send({ name: "Alpha can, thicker" });
    expect(res.status).toBe(200);
    expect(res.body.name).toBe("Alpha can, thicker");
    res = await agent.patch(`/api/designs/${a.id}`).set("X-CSRF-Token", csrf).send({});
    expect(res.status).toBe(400);
    res = await agent.patch(`/api/designs/${a.id}`).set("X-CSRF-Token", csrf).send({ configuration: configuration({ requiredAttenuation_db: "lots" }) });
    expect(res.body.error.fields).toHaveProperty("configuration.requiredAttenuation_db");
    const copy = await agent.post(`/api/designs/${a.id}/duplicate`).set("X-CSRF-Token", csrf).send({});
    expect(copy.status).toBe(201);
    expect(copy.body.name).toBe("Alpha can, thicker (copy)");
    expect(copy.body.configuration).toEqual(res.body.configuration ?? copy.body.configuration);
    res = await agent.get("/api/designs?q=alpha&sort=name&dir=asc");
    expect(res.body.items.map((d: { name: string }) => d.name)).toEqual(["Alpha can, thicker", "Alpha can, thicker (copy)"]);
    res = await agent.get("/api/designs?sort=colour&pageSize=0");
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["pageSize", "sort"]);
    res = await agent.get("/api/designs?q=100%25");
    expect(res.body.items).toEqual([]);
    res = await agent.get("/api/designs?pageSize=2&page=2&sort=name&dir=asc");
    expect(res.body).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(res.body.items.map((d: { name: string }) => d.name)).toEqual(["Beta box"]);
    expect((await agent.delete(`/api/designs/${b.id}`).set("X-CSRF-Token", csrf)).status).toBe(204);
    expect(await Design.findByPk(b.id)).toBeNull();
    expect((await agent.get(`/api/designs/${b.id}`)).status).toBe(404);
  });
});

describe("POST /api/designs/compare", () => {
  it("401, 400 naming ids, 404 for another organisation's design; up to three side by side with figures, mass and price", async () => {
    const { agent, csrf } = await customer();
    const one = await save(agent, csrf, "One layer", { layers: [{ material: "ni80", thickness_mm: 1 }] });
    const two = await save(agent, csrf, "Two layers");
    expect((await request(app).post("/api/designs/compare").send({ ids: [one.id] })).status).toBe(401);
    let res = await agent.post("/api/designs/compare").set("X-CSRF-Token", csrf).send({ ids: [one.id, one.id, two.id, two.id] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("ids");
    const other = await customer();
    const foreign = await save(other.agent, other.csrf, "Not yours");
    res = await agent.post("/api/designs/compare").set("X-CSRF-Token", csrf).send({ ids: [one.id, foreign.id] });
    expect(res.status).toBe(404);
    const operator = await signIn(app, await buildUser({ role: "operator" }));
    expect((await operator.agent.post("/api/designs/compare").set("X-CSRF-Token", operator.csrf).send({ ids: [one.id] })).status).toBe(403);
    res = await agent.post("/api/designs/compare").set("X-CSRF-Token", csrf).send({ ids: [one.id, two.id], quantity: 5 });
    expect(res.status).toBe(200);
    const [a, b] = res.body.items;
    expect(a.design.id).toBe(one.id);
    expect(b.prediction.attenuation_db).toBeGreaterThan(a.prediction.attenuation_db); // a second layer adds attenuation
    expect(b.mass_kg).toBeGreaterThan(a.mass_kg);
    expect(b.unitPrice_cents).toBeGreaterThan(a.unitPrice_cents);
    expect(a.total_cents).toBe(a.unitPrice_cents * 5);
  });
});
