import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ShopSettings } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, inbox, signIn } from "../support/app";
import { binary, buildQuote, ensureReferenceData, pdfPageSize, pdfText } from "../support/ordering";

const app = buildTestApp();
let original: Record<string, unknown>;
beforeAll(async () => {
  await ensureReferenceData();
  original = (await ShopSettings.current()).get({ plain: true });
});
// other test files read the shop's details: leave them as found
afterAll(async () => {
  await ShopSettings.update(original, { where: { id: 1 } });
});

async function planner() {
  const shop = await buildOrganization({ kind: "shop" });
  return signIn(app, await buildUser({ role: "admin", organizationId: shop.id }));
}

describe("shop settings", () => {
  it("401, 403 for a customer, 400 naming the field; the planner's details print on quotes and the sender address signs the mails", async () => {
    expect((await request(app).get("/api/shop-settings")).status).toBe(401);
    const customer = await signIn(app, await buildUser({ role: "customer" }));
    expect((await customer.agent.get("/api/shop-settings")).status).toBe(403);
    expect((await customer.agent.put("/api/shop-settings").set("X-CSRF-Token", customer.csrf).send({})).status).toBe(403);
    const { agent, csrf } = await planner();
    const current = (await agent.get("/api/shop-settings")).body;
    let res = await agent.put("/api/shop-settings").set("X-CSRF-Token", csrf).send({ ...current, name: "", mailFrom: "not an address" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["mailFrom", "name"]);
    res = await agent
      .put("/api/shop-settings")
      .set("X-CSRF-Token", csrf)
      .send({ ...current, name: "Tallow Mill Shields (test)", address: "1 Mill Row", mailFrom: "Tallow Mill <orders@tallow.example>" });
    expect(res.status).toBe(200);
    expect(res.body.mailFrom).toBe("Tallow Mill <orders@tallow.example>");

    const to = `sender-${Date.now()}@example.test`;
    app.locals.deps.mailer.send({ to, subject: "hello", text: "x" });
    expect((await inbox(app, to))[0].from).toBe("orders@tallow.example");
    const user = await buildUser({ role: "customer" });
    const quote = await buildQuote(app, user);
    const own = await signIn(app, user);
    const pdf = await own.agent.get(`/api/quotes/${quote.id}/quote.pdf`).buffer(true).parse(binary);
    expect(pdfText(pdf.body as Buffer)).toContain("Tallow Mill Shields (test)");
  });
});

describe("an organisation's paper size", () => {
  it("401, 404 for another organisation, 400 naming the field; US Letter quotes after the change", async () => {
    const user = await buildUser({ role: "customer" });
    const { agent, csrf } = await signIn(app, user);
    const url = `/api/organizations/${user.organizationId}/settings`;
    expect((await request(app).get(url)).status).toBe(401);
    const stranger = await signIn(app, await buildUser({ role: "customer" }));
    expect((await stranger.agent.get(url)).status).toBe(404);
    expect((await stranger.agent.patch(url).set("X-CSRF-Token", stranger.csrf).send({ paperSize: "LETTER" })).status).toBe(404);
    expect((await agent.get(url)).body).toMatchObject({ id: user.organizationId, paperSize: "A4" });
    const bad = await agent.patch(url).set("X-CSRF-Token", csrf).send({ paperSize: "A3" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("paperSize");
    const res = await agent.patch(url).set("X-CSRF-Token", csrf).send({ paperSize: "LETTER" });
    expect(res.status).toBe(200);
    expect(res.body.paperSize).toBe("LETTER");
    const quote = await buildQuote(app, user);
    const pdf = await agent.get(`/api/quotes/${quote.id}/quote.pdf`).buffer(true).parse(binary);
    expect(pdfPageSize(pdf.body as Buffer)).toMatchObject({ width: 612, height: 792 });
    const operator = await signIn(app, await buildUser({ role: "operator" }));
    expect((await operator.agent.patch(url).set("X-CSRF-Token", operator.csrf).send({ paperSize: "A4" })).status).toBe(403);
  });
});

describe("furnaces and anneal windows in the shop settings", { timeout: 30_000 }, () => {
  it("the planner adds a furnace and a window (other files read the first furnace and the 80 % Ni window: those stay, and this file runs its tests one after another); 400 naming the field; omitted, they stay as they are", async () => {
    const shop = await buildOrganization({ kind: "shop" });
    const planner = await signIn(app, await buildUser({ role: "admin", organizationId: shop.id }));
    const put = (body: object) => planner.agent.put("/api/shop-settings").set("X-CSRF-Token", planner.csrf).send(body);
    const current = (await planner.agent.get("/api/shop-settings")).body;
    expect(current.furnaces.length).toBeGreaterThanOrEqual(1);
    expect(current.annealWindows.map((w: { materialId: string }) => w.materialId)).toEqual(expect.arrayContaining(["ni80", "ni50"]));
    const { updatedAt: _u, ...body } = current;
    let res = await put({ ...body, furnaces: [...current.furnaces, { id: "bell 2", name: "", maxLoad_kg: 0 }] });
    expect(res.status).toBe(400);
    const n = current.furnaces.length;
    expect(Object.keys(res.body.error.fields).sort()).toEqual([`furnaces.${n}.id`, `furnaces.${n}.maxLoad_kg`, `furnaces.${n}.name`]);
    res = await put({ ...body, annealWindows: [...current.annealWindows, { ...current.annealWindows[0], peak_c: { min: 1200, max: 1100 } }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(`annealWindows.${current.annealWindows.length}.peak_c.max`);
    res = await put({ ...body, annealWindows: [...current.annealWindows, { ...current.annealWindows[0], materialId: "unobtainium" }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(`annealWindows.${current.annealWindows.length}.materialId`);

    const steel = { materialId: "steel-lc", peak_c: { min: 780, max: 850 }, soak_min: { min: 60, max: 240 }, dewPointMax_c: -40, coolingRate_c_per_h: { min: 50, max: 300 }, source: "test window" };
    const extra = { id: "BELL-9", name: "Small bell furnace (test)", maxLoad_kg: 40 };
    try {
      res = await put({ ...body, furnaces: [...current.furnaces.filter((f: { id: string }) => f.id !== extra.id), extra], annealWindows: [...current.annealWindows.filter((w: { materialId: string }) => w.materialId !== "steel-lc"), steel] });
      expect(res.status).toBe(200);
      expect(res.body.furnaces.at(-1)).toEqual(extra);
      expect(res.body.annealWindows.at(-1)).toEqual(steel);
      const floor = await (await signIn(app, await buildUser({ role: "operator", organizationId: shop.id }))).agent.get("/api/furnaces");
      expect(floor.body.furnaces.map((f: { id: string }) => f.id)).toContain("BELL-9");
      // a save without them leaves them alone
      const { furnaces: _f, annealWindows: _w, ...details } = body;
      res = await put({ ...details, phone: "+44 1632 960 999" });
      expect(res.status).toBe(200);
      expect(res.body.furnaces.at(-1)).toEqual(extra);
    } finally {
      await ShopSettings.update({ furnaces: current.furnaces, annealWindows: current.annealWindows, phone: current.phone }, { where: { id: 1 } });
    }
    const stranger = await signIn(app, await buildUser({ role: "customer" }));
    expect((await stranger.agent.put("/api/shop-settings").set("X-CSRF-Token", stranger.csrf).send(body)).status).toBe(403);
  });
});
