import { randomUUID } from "node:crypto";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { seedMaterials } from "../../server/db/seed";
import { Event } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, signIn } from "../support/app";

const app = buildTestApp({ RATE_LIMIT_PUBLIC: "0" });
beforeAll(async () => {
  await seedMaterials();
});

async function admin() {
  const shop = await buildOrganization({ kind: "shop" });
  const user = await buildUser({ role: "admin", organizationId: shop.id, name: "Ada Admin" });
  return { user, ...(await signIn(app, user)) };
}

const tags = {
  relativePermeability: "[memory] test value",
  saturation_T: "[memory] test value",
  resistivity_ohm_m: "[memory] test value",
  density_kg_m3: "[pub] test handbook",
  muCurve: "[practice] test curve",
  asFormedFactor: "[practice] test",
};
// Other test files predict with the seeded rows at the same time, so edits here touch only rows made here.
const newMaterial = (id = `test-${randomUUID().slice(0, 8)}`) => ({
  id,
  name: "Test nickel-iron",
  relativePermeability: { initial: 20_000, maximum: 100_000 },
  saturation_T: 0.8,
  resistivity_ohm_m: 0.6e-6,
  density_kg_m3: 8700,
  muCurve: [{ B_T: 0.01, mu_r: 20_000 }, { B_T: 0.3, mu_r: 100_000 }, { B_T: 0.8, mu_r: 3_000 }],
  asFormedFactor: 0.1,
  source: "Invented for a test.",
  sourceTags: tags,
});
const { id: _omit, ...update } = newMaterial("x");

describe("material edits", () => {
  it("401 signed out", async () => {
    expect((await request(app).put("/api/materials/ni80").send(update)).status).toBe(401);
    expect((await request(app).post("/api/materials").send(newMaterial())).status).toBe(401);
    expect((await request(app).get("/api/materials/ni80/history")).status).toBe(401);
    expect((await request(app).get("/api/materials/all")).status).toBe(401);
  });

  it("403 for a customer and for shop staff other than the admin", async () => {
    for (const role of ["customer", "qa", "operator"] as const) {
      const { agent, csrf } = await signIn(app, await buildUser({ role }));
      expect((await agent.put("/api/materials/ni80").set("X-CSRF-Token", csrf).send(update)).status).toBe(403);
      expect((await agent.post("/api/materials").set("X-CSRF-Token", csrf).send(newMaterial())).status).toBe(403);
      expect((await agent.get("/api/materials/ni80/history")).status).toBe(403);
    }
  });

  it("403 without the CSRF token", async () => {
    const { agent } = await admin();
    expect((await agent.post("/api/materials").send(newMaterial())).status).toBe(403);
  });

  it("400 naming the fields", async () => {
    const { agent, csrf } = await admin();
    const bad = structuredClone(newMaterial());
    bad.relativePermeability.maximum = 10; // below initial
    bad.density_kg_m3 = -1;
    bad.muCurve[2].B_T = 0.2; // not rising
    (bad.sourceTags as Record<string, string>).density_kg_m3 = "a book";
    let res = await agent.post("/api/materials").set("X-CSRF-Token", csrf).send({ ...bad, id: "Not An Id" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(["id", "density_kg_m3", "sourceTags.density_kg_m3", "relativePermeability.maximum", "muCurve.2.B_T"]));
    res = await agent.put("/api/materials/ni80").set("X-CSRF-Token", csrf).send({ ...update, resistivity_ohm_m: "much" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("resistivity_ohm_m");
  });

  it("404 for an unknown id", async () => {
    const { agent, csrf } = await admin();
    expect((await agent.put("/api/materials/no-such-alloy").set("X-CSRF-Token", csrf).send(update)).status).toBe(404);
    expect((await agent.get("/api/materials/no-such-alloy/history")).status).toBe(404);
  });

  it("adds a material, edits it, records both with before and after, and predictions use the new values", async () => {
    const { user, agent, csrf } = await admin();
    const m = newMaterial();
    let res = await agent.post("/api/materials").set("X-CSRF-Token", csrf).send(m);
    expect(res.status).toBe(201);
    expect(res.body.id).toBe(m.id);
    expect((await agent.post("/api/materials").set("X-CSRF-Token", csrf).send(m)).status).toBe(409);

    const listed = await request(app).get("/api/materials");
    expect(listed.body.map((x: { id: string }) => x.id)).toContain(m.id);
    // at 1 kHz the wall's resistivity sets the eddy-current share of the shielding, so the edit below must show
    const acDesign = { shape: "sphere", dimensions_mm: { diameter: 60 }, layers: [{ material: m.id, thickness_mm: 1 }], field: { frequency_hz: 1000, amplitude_uT: 50 } };
    const predictedBefore = await request(app).post("/api/predictions").send(acDesign);
    expect(predictedBefore.status).toBe(200);

    const body = { relativePermeability: m.relativePermeability, saturation_T: m.saturation_T, muCurve: m.muCurve, asFormedFactor: m.asFormedFactor, source: m.source, sourceTags: m.sourceTags, name: "Test nickel-iron, thinner data", resistivity_ohm_m: 0.5e-6, density_kg_m3: 8650 };
    res = await agent.put(`/api/materials/${m.id}`).set("X-CSRF-Token", csrf).send(body);
    expect(res.status).toBe(200);
    expect(res.body.density_kg_m3).toBe(8650);

    const events = await Event.findAll({ where: { subjectType: "material", subjectId: m.id }, order: [["id", "ASC"]] });
    expect(events.map((e) => e.action)).toEqual(["material.created", "material.updated"]);
    expect(events[1].actorId).toBe(user.id);
    const data = events[1].data as { before: { density_kg_m3: number }; after: { density_kg_m3: number }; changes: { path: string }[] };
    expect(data.before.density_kg_m3).toBe(8700);
    expect(data.after.density_kg_m3).toBe(8650);
    expect(data.changes.map((c) => c.path)).toEqual(expect.arrayContaining(["density_kg_m3", "resistivity_ohm_m", "name"]));

    const history = await agent.get(`/api/materials/${m.id}/history`);
    expect(history.status).toBe(200);
    expect(history.body.items[0].action).toBe("material.updated");
    expect(history.body.items[0].actor.name).toBe("Ada Admin");

    // the public list and the prediction see the edit at once
    const after = (await request(app).get("/api/materials")).body.find((x: { id: string }) => x.id === m.id);
    expect(after.density_kg_m3).toBe(8650);
    const p = await request(app).post("/api/predictions").send(acDesign);
    expect(p.status).toBe(200);
    expect(p.body.layers[0].material).toBe(m.id);
    // lower resistivity (0.6 → 0.5 µΩ·m): a thinner skin depth, so the seamless shell shields more [derived]
    // (the as-built headline also carries the construction's joints and ceiling, so the exact shell is the check)
    expect(p.body.ideal.shieldingFactor).toBeGreaterThan(predictedBefore.body.ideal.shieldingFactor * 1.01);
    expect(p.body.attenuation_db).not.toBe(predictedBefore.body.attenuation_db);

    // deactivated: gone from the public list and refused by predictions, still in the admin's list
    res = await agent.put(`/api/materials/${m.id}`).set("X-CSRF-Token", csrf).send({ ...body, active: false });
    expect(res.status).toBe(200);
    expect((await request(app).get("/api/materials")).body.map((x: { id: string }) => x.id)).not.toContain(m.id);
    const refused = await request(app).post("/api/predictions").send({ shape: "sphere", dimensions_mm: { diameter: 60 }, layers: [{ material: m.id, thickness_mm: 1 }], field: { frequency_hz: 0, amplitude_uT: 50 } });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toHaveProperty("layers.0.material");
    const all = await agent.get("/api/materials/all");
    expect(all.body.items.find((x: { id: string }) => x.id === m.id).active).toBe(false);
  });

  it("another process's edit reaches this process's list at once, through the database's NOTIFY", async () => {
    const { agent, csrf } = await admin();
    const m = newMaterial();
    expect((await agent.post("/api/materials").set("X-CSRF-Token", csrf).send(m)).status).toBe(201);
    const nameOf = async () => (await request(app).get("/api/materials")).body.find((x: { id: string }) => x.id === m.id)?.name;
    expect(await nameOf()).toBe(m.name); // loaded into this process
    // what another server process does: its own transaction, then the signal (its process copy is its own)
    const { sequelize } = app.locals.deps;
    await sequelize.query("update materials set name = 'Renamed elsewhere' where id = $1", { bind: [m.id] });
    expect(await nameOf(), "held in this process until told").toBe(m.name);
    let seen: string | undefined;
    for (let i = 0; i < 50 && seen !== "Renamed elsewhere"; i++) {
      await sequelize.query("select pg_notify('fluxwright_reference_data', 'materials')");
      await new Promise((r) => setTimeout(r, 100));
      seen = await nameOf();
    }
    expect(seen).toBe("Renamed elsewhere");
  });

  it("seeding again changes nothing", async () => {
    expect(await seedMaterials()).toEqual([]);
  });
});
