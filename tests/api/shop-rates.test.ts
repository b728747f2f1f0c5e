import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { seedShopRates } from "../../server/db/seed";
import { Event, PriceListVersion } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, signIn } from "../support/app";

const app = buildTestApp();
beforeAll(async () => {
  await seedShopRates();
});

async function planner() {
  const shop = await buildOrganization({ kind: "shop" });
  const user = await buildUser({ role: "admin", organizationId: shop.id, name: "Pat Planner" });
  return { user, ...(await signIn(app, user)) };
}

describe("shop rates", () => {
  it("401 signed out on every route", async () => {
    expect((await request(app).get("/api/shop-rates")).status).toBe(401);
    expect((await request(app).get("/api/shop-rates/history")).status).toBe(401);
    expect((await request(app).put("/api/shop-rates/price-list").send({})).status).toBe(401);
    expect((await request(app).put("/api/shop-rates/stock-sheets").send({})).status).toBe(401);
    expect((await request(app).put("/api/shop-rates/forming-limits").send({})).status).toBe(401);
  });

  it("403 for a customer and for shop staff who are not the planner", async () => {
    for (const role of ["customer", "qa"] as const) {
      const { agent, csrf } = await signIn(app, await buildUser({ role }));
      expect((await agent.get("/api/shop-rates")).status).toBe(403);
      expect((await agent.get("/api/shop-rates/history")).status).toBe(403);
      const { agent: a2, csrf: c2 } = { agent, csrf };
      expect((await a2.put("/api/shop-rates/stock-sheets").set("X-CSRF-Token", c2).send({ stockSheets: [] })).status).toBe(403);
    }
  });

  it("403 without the CSRF token", async () => {
    const { agent } = await planner();
    const current = (await agent.get("/api/shop-rates")).body;
    expect((await agent.put("/api/shop-rates/price-list").send(current.priceList)).status).toBe(403);
  });

  it("400 naming the field", async () => {
    const { agent, csrf } = await planner();
    const { priceList } = (await agent.get("/api/shop-rates")).body;
    const put = (path: string, body: unknown) => agent.put(`/api/shop-rates/${path}`).set("X-CSRF-Token", csrf).send(body as object);
    // (other test files price with the current list at the same time: edits here stay harmless)
    const badPrice = structuredClone(priceList);
    badPrice.materials[2].pricePerKg_cents = -5;
    badPrice.marginPercent = 150;
    let res = await put("price-list", badPrice);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("materials.2.pricePerKg_cents");
    expect(res.body.error.fields).toHaveProperty("marginPercent");
    res = await put("price-list", { ...priceList, currency: "euro", materials: [priceList.materials[0], priceList.materials[0]] });
    expect(res.body.error.fields).toHaveProperty("currency");
    expect(res.body.error.fields).toHaveProperty("materials.1.materialId");
    res = await put("stock-sheets", { stockSheets: [{ materialId: "ni80", thickness_mm: 1, width_mm: 0, length_mm: 1000 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("stockSheets.0.width_mm");
    res = await put("forming-limits", { formingLimits: [{ materialId: "ni80", firstDrawRatio: 3, redrawRatio: 1.3, processAnnealBetweenDraws: true }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("formingLimits.0.firstDrawRatio");
  });

  it("each edit makes a new version with who and when, and an event with the before/after difference", async () => {
    const { user, agent, csrf } = await planner();
    const before = (await agent.get("/api/shop-rates")).body;
    expect(before.version).toBeGreaterThanOrEqual(1);
    expect(before.stockSheets.length).toBeGreaterThan(0);
    expect(before.formingLimits.length).toBeGreaterThan(0);

    const edited = structuredClone(before.priceList);
    edited.materials[0].pricePerKg_cents += 1;
    const res = await agent.put("/api/shop-rates/price-list").set("X-CSRF-Token", csrf).send(edited);
    expect(res.status).toBe(200);
    expect(res.body.version).toBeGreaterThan(before.version);
    expect(res.body.createdBy).toEqual({ id: user.id, name: "Pat Planner" });
    expect(res.body.priceList.materials[0].pricePerKg_cents).toBe(edited.materials[0].pricePerKg_cents);
    // the other parts carry over unchanged
    expect(res.body.stockSheets).toEqual(before.stockSheets);

    const event = await Event.findOne({ where: { action: "shop-rates.price-list.updated", subjectId: String(res.body.version) } });
    expect(event).not.toBeNull();
    expect(event!.actorId).toBe(user.id);
    expect(event!.data).toMatchObject({ toVersion: res.body.version, changes: [{ path: "materials.0.pricePerKg_cents", after: edited.materials[0].pricePerKg_cents }] });

    const sheets = [...res.body.stockSheets, { materialId: "copper", thickness_mm: 0.8, width_mm: 500, length_mm: 1000 + Math.floor(Math.random() * 1000) }];
    const s = await agent.put("/api/shop-rates/stock-sheets").set("X-CSRF-Token", csrf).send({ stockSheets: sheets });
    expect(s.status).toBe(200);
    expect(s.body.version).toBeGreaterThan(res.body.version);
    expect(s.body.stockSheets).toHaveLength(sheets.length);

    const limits = structuredClone(s.body.formingLimits);
    limits[0].redrawRatio = 1.25;
    const f = await agent.put("/api/shop-rates/forming-limits").set("X-CSRF-Token", csrf).send({ formingLimits: limits });
    expect(f.status).toBe(200);
    expect(f.body.formingLimits[0].redrawRatio).toBe(1.25);

    const history = await agent.get("/api/shop-rates/history");
    expect(history.status).toBe(200);
    const mine = history.body.items.filter((v: { createdBy: { id: string } | null }) => v.createdBy?.id === user.id);
    expect(mine.map((v: { part: string }) => v.part)).toEqual(["forming-limits", "stock-sheets", "price-list"]);
    expect(mine.map((v: { version: number }) => v.version)).toEqual([f.body.version, s.body.version, res.body.version]);
    // newest first, each version once
    const versions = history.body.items.map((v: { version: number }) => v.version);
    expect(versions).toEqual([...versions].sort((a, b) => b - a));
    expect(new Set(versions).size).toBe(versions.length);
    for (const v of history.body.items) expect(Number.isNaN(Date.parse(v.createdAt))).toBe(false);
  });

  it("three saves at the same moment each land as their own version, none lost", async () => {
    const { user, agent, csrf } = await planner();
    const current = (await agent.get("/api/shop-rates")).body;
    const limits = structuredClone(current.formingLimits);
    const sheets = [...current.stockSheets, { materialId: "ni50", thickness_mm: 1.5, width_mm: 600, length_mm: 1200 + Math.floor(Math.random() * 500) }];
    const prices = structuredClone(current.priceList);
    prices.marginPercent = (prices.marginPercent + 1) % 60;
    limits[0].redrawRatio = 1.2;
    const saves = await Promise.all([
      agent.put("/api/shop-rates/price-list").set("X-CSRF-Token", csrf).send(prices),
      agent.put("/api/shop-rates/stock-sheets").set("X-CSRF-Token", csrf).send({ stockSheets: sheets }),
      agent.put("/api/shop-rates/forming-limits").set("X-CSRF-Token", csrf).send({ formingLimits: limits }),
    ]);
    expect(saves.map((r) => [r.status, r.body.error?.code])).toEqual([[200, undefined], [200, undefined], [200, undefined]]);
    const versions = saves.map((r) => r.body.version as number);
    expect(new Set(versions).size).toBe(3);
    // none overwrote another: the last of the three holds all three changes
    const last = (await PriceListVersion.findOne({ where: { version: Math.max(...versions) } }))!.data;
    expect(last.marginPercent).toBe(prices.marginPercent);
    expect(last.stockSheets).toEqual(sheets);
    expect(last.formingLimits[0].redrawRatio).toBe(1.2);
    // and each event names the version it came from, which is the one before it
    const events = await Event.findAll({ where: { actorId: user.id }, order: [["id", "ASC"]] });
    const steps = events.filter((e) => e.action.startsWith("shop-rates.")).map((e) => e.data as { fromVersion: number; toVersion: number });
    expect(steps).toHaveLength(3);
    for (const step of steps) expect(step.toVersion).toBe(step.fromVersion + 1);
  });

  it("the database refuses to change an old version", async () => {
    const first = await PriceListVersion.findOne({ order: [["version", "ASC"]] });
    await expect(PriceListVersion.update({ part: "price-list" }, { where: { id: first!.id } })).rejects.toThrow(/append-only/);
  });
});
