import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { predictShield } from "../../shared/physics";
import { contractPredictionExample } from "../../shared/schemas/contract-examples";
import { Event, PriceListVersion, Quote } from "../../server/models";
import { materialCatalog } from "../../server/services/materialCatalog";
import { priceAndPredict } from "../../server/services/quoteBuilder";
import { constructionSettingsOf } from "../../shared/schemas/pricing";
import { quoteConfigurationSchema } from "../../shared/schemas/quote";
import { buildOrganization, buildTestApp, buildUser, signIn } from "../support/app";
import { binary, buildQuote, configuration, ensureReferenceData, pdfPageSize, pdfText } from "../support/ordering";

const app = buildTestApp();
beforeAll(ensureReferenceData);

async function customer() {
  const user = await buildUser({ role: "customer", name: "Ada Quotewell" });
  return { user, ...(await signIn(app, user)) };
}

describe("POST /api/quotes", () => {
  it("401 signed out", async () => {
    expect((await request(app).post("/api/quotes").send({ configuration: configuration(), quantity: 1 })).status).toBe(401);
  });

  it("403 without the CSRF token, and for shop staff", async () => {
    const { agent } = await customer();
    expect((await agent.post("/api/quotes").send({ configuration: configuration(), quantity: 1 })).status).toBe(403);
    const staff = await signIn(app, await buildUser({ role: "operator" }));
    const res = await staff.agent.post("/api/quotes").set("X-CSRF-Token", staff.csrf).send({ configuration: configuration(), quantity: 1 });
    expect(res.status).toBe(403);
  });

  it("400 naming the field, with the configuration prefix", async () => {
    const { agent, csrf } = await customer();
    const post = (body: unknown) => agent.post("/api/quotes").set("X-CSRF-Token", csrf).send(body as object);
    let res = await post({ configuration: configuration({ requiredAttenuation_db: undefined }), quantity: 0 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("configuration.requiredAttenuation_db");
    expect(res.body.error.fields).toHaveProperty("quantity");
    res = await post({ configuration: configuration({ shape: "sphere", dimensions_mm: { diameter: 50 } }), quantity: 1 });
    expect(res.body.error.fields["configuration.shape"]).toMatch(/cylinder|box/);
    res = await post({ configuration: configuration({ layers: [{ material: "unobtainium", thickness_mm: 1 }] }), quantity: 1 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain("configuration.layers.0.material");
    res = await post({ configuration: configuration({ field: { frequency_hz: -1, amplitude_uT: 100 } }), quantity: 1 });
    expect(res.body.error.fields).toHaveProperty("configuration.field.frequency_hz");
    res = await post({ configuration: configuration({ method: "bent" }), quantity: 1 });
    expect(res.body.error.fields).toHaveProperty("configuration.method");
    res = await agent.post("/api/quotes").set("X-CSRF-Token", csrf).set("content-type", "application/json").send("{not json");
    expect(res.status).toBe(400);
    res = await post({ configuration: configuration(), quantity: 1, designId: "7d0b2a8e-6f7e-4c1c-9f65-1a7f8c7d1e11" });
    expect(res.body.error.fields).toHaveProperty("designId");
  });

  it("201: freezes the prediction, the blanks and the whole price with its price-list version; number from the sequence", async () => {
    const { user, agent, csrf } = await customer();
    const res = await agent.post("/api/quotes").set("X-CSRF-Token", csrf).send({ configuration: configuration({ junk: "dropped" }), quantity: 3 });
    expect(res.status).toBe(201);
    const q = res.body;
    // the contract's fields
    for (const key of ["id", "unitPrice_cents", "total_cents", "currency", "prediction", "blank", "expiresAt"]) expect(q).toHaveProperty(key);
    expect(q.total_cents).toBe(q.unitPrice_cents * 3);
    expect(q.currency).toBe("EUR");
    expect(q.number).toMatch(/^Q-\d+$/);
    expect(q.status).toBe("open");
    // the prediction is exactly what the engine answers for the same body, frozen
    const catalog = await materialCatalog();
    const fresh = predictShield(configuration() as never, (id) => catalog.byId.get(id));
    expect(q.prediction.attenuation_db).toBeCloseTo(fresh.attenuation_db, 9);
    expect(q.blank.kind).toBe("disc");
    expect(q.blank.parts.length).toBe(2);
    // lead time and validity from the shop rates (defaults 20 working days, 30 days)
    expect(q.leadTime_workingDays).toBe(20);
    expect(q.validity_days).toBe(30);
    const days = (Date.parse(q.expiresAt) - Date.parse(q.createdAt)) / 86_400_000;
    expect(days).toBeCloseTo(30, 5);
    expect(q.configuration).not.toHaveProperty("junk");
    // a customer sees selling lines that add up, never the shop's rates or margin
    expect(q.price.internal).toBeUndefined();
    expect(JSON.stringify(q.price)).not.toMatch(/margin|unit_cents/);
    const sum = q.price.lines.reduce((s: number, l: { total_cents: number }) => s + l.total_cents, 0);
    expect(sum).toBe(q.price.linesTotal_cents);
    expect(q.price.linesTotal_cents - q.price.discount_cents + q.price.rounding_cents).toBe(q.total_cents);
    // stored as frozen, with the version id, and an event in the trail
    const row = await Quote.findByPk(q.id);
    expect(row!.priceListVersion).toBe(q.priceListVersion);
    expect(row!.priceListId).toMatch(/^[0-9a-f-]{36}$/);
    expect(row!.price.margin_cents).toBeGreaterThan(0);
    expect(await Event.count({ where: { action: "quote.created", subjectId: q.id, actorId: user.id } })).toBe(1);
    const second = await agent.post("/api/quotes").set("X-CSRF-Token", csrf).send({ configuration: configuration(), quantity: 1 });
    expect(Number(second.body.number.slice(2))).toBeGreaterThan(Number(q.number.slice(2)));
  });

  it("201 for the contract's prediction body (a library layer and one given by its μr) with a method and the attenuation needed; the frozen prediction is POST /api/predictions' answer", async () => {
    const { agent, csrf } = await customer();
    const body = { ...structuredClone(contractPredictionExample), method: "drawn", requiredAttenuation_db: 40 };
    const res = await agent.post("/api/quotes").set("X-CSRF-Token", csrf).send({ configuration: body, quantity: 1 });
    expect(res.status).toBe(201);
    const predicted = await request(app).post("/api/predictions").send(contractPredictionExample);
    expect(res.body.prediction.attenuation_db).toBe(predicted.body.attenuation_db);
    expect(res.body.configuration.layers[1]).toMatchObject({ mu_r: 20000, pricedAs: "ni80" });
    expect(res.body.blank.parts).toHaveLength(2);
  });

  it("a price list saved by another process a moment ago is the one the quote uses (the insert checks, then prices again)", async () => {
    const { agent, csrf } = await customer();
    const first = await agent.post("/api/quotes").set("X-CSRF-Token", csrf).send({ configuration: configuration(), quantity: 1 });
    // as another app process would save it: not through this process, so its remembered head is stale
    const head = (await PriceListVersion.findOne({ order: [["version", "DESC"]] }))!;
    const next = await PriceListVersion.create({ version: head.version + 1, part: "price-list", data: head.data, createdById: null });
    const second = await agent.post("/api/quotes").set("X-CSRF-Token", csrf).send({ configuration: configuration(), quantity: 1 });
    expect(second.status).toBe(201);
    expect(second.body.priceListVersion).toBeGreaterThanOrEqual(next.version);
    expect(second.body.priceListVersion).toBeGreaterThan(first.body.priceListVersion);
  });
});

describe("reading quotes", () => {
  it("GET /api/quotes/:id: 401, 404 across organisations and for a bad id, 200 for the owner and staff; the planner sees the margin", async () => {
    const { user, agent } = await customer();
    const quote = await buildQuote(app, user);
    expect((await request(app).get(`/api/quotes/${quote.id}`)).status).toBe(401);
    const stranger = await signIn(app, await buildUser({ role: "customer" }));
    expect((await stranger.agent.get(`/api/quotes/${quote.id}`)).status).toBe(404);
    expect((await agent.get(`/api/quotes/not-an-id`)).status).toBe(404);
    const own = await agent.get(`/api/quotes/${quote.id}`);
    expect(own.status).toBe(200);
    expect(own.body.organization.id).toBe(user.organizationId);
    expect(own.body.abilities).toEqual({ order: true, requote: true, download: true });
    const shop = await buildOrganization({ kind: "shop" });
    const planner = await signIn(app, await buildUser({ role: "admin", organizationId: shop.id }));
    const staffView = await planner.agent.get(`/api/quotes/${quote.id}`);
    expect(staffView.status).toBe(200);
    expect(staffView.body.price.internal.margin_cents).toBeGreaterThan(0);
    expect(staffView.body.price.internal.lines[0].unit_cents).toBeGreaterThan(0);
    expect(staffView.body.abilities.order).toBe(false);
  });

  it("GET /api/quotes lists the organisation's quotes with search, status filter and pagination", async () => {
    const { user, agent } = await customer();
    const open = await buildQuote(app, user);
    const expired = await buildQuote(app, user, { now: new Date(Date.now() - 40 * 86_400_000) });
    const other = await buildQuote(app, await buildUser({ role: "customer" }));
    expect((await request(app).get("/api/quotes")).status).toBe(401);
    let res = await agent.get("/api/quotes");
    expect(res.status).toBe(200);
    const ids = res.body.items.map((q: { id: string }) => q.id);
    expect(ids).toEqual(expect.arrayContaining([open.id, expired.id]));
    expect(ids).not.toContain(other.id);
    expect(res.body.items.find((q: { id: string }) => q.id === open.id).attenuation_db).toBeCloseTo(open.prediction.attenuation_db, 6);
    res = await agent.get("/api/quotes?status=expired");
    expect(res.body.items.map((q: { id: string }) => q.id)).toEqual([expired.id]);
    expect(res.body.items[0].status).toBe("expired");
    res = await agent.get(`/api/quotes?q=Q-${open.number}`);
    expect(res.body.items.map((q: { id: string }) => q.id)).toEqual([open.id]);
    res = await agent.get("/api/quotes?pageSize=1&page=2&sort=number&dir=asc");
    expect(res.body).toMatchObject({ total: 2, page: 2, pageSize: 1 });
    expect(res.body.items[0].id).toBe(expired.id);
    res = await agent.get("/api/quotes?status=lost&pageSize=1000");
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(["status", "pageSize"]));
  });
});

describe("the quote PDF", () => {
  it("401, 404 across organisations; the customer's PDF has the shop, design, prediction with band and caution, every selling line, validity, terms and no margin", async () => {
    const { user, agent } = await customer();
    const quote = await buildQuote(app, user, { quantity: 12 });
    expect((await request(app).get(`/api/quotes/${quote.id}/quote.pdf`)).status).toBe(401);
    const stranger = await signIn(app, await buildUser({ role: "customer" }));
    expect((await stranger.agent.get(`/api/quotes/${quote.id}/quote.pdf`)).status).toBe(404);
    const res = await agent.get(`/api/quotes/${quote.id}/quote.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    expect(res.headers["content-disposition"]).toMatch(/^attachment; filename="?quote-Q-\d+\.pdf"?$/);
    const text = pdfText(res.body as Buffer);
    expect(text).toContain(`Quote Q-${quote.number}`);
    // (the shop's details printed at the top: tests/api/settings.test.ts, which changes them)
    expect(text).toContain("Predicted attenuation");
    expect(text).toContain(`${quote.prediction.attenuation_db.toFixed(1)} dB`);
    expect(text).toMatch(/Expected band: [\d.]+ to [\d.]+ dB/);
    expect(text).toMatch(/engineering estimate/);
    expect(text).toMatch(/Blanking/);
    expect(text).toMatch(/Hydrogen anneal/);
    expect(text).toMatch(/Quantity discount \(3 %\)/); // 12 pieces: the 10-piece break
    expect(text).toMatch(/Valid until/);
    expect(text).toMatch(/Terms/);
    expect(text).toContain("Section across the axis");
    expect(text).not.toMatch(/[Mm]argin/);
    // the total as printed equals the quote's total
    const euros = (quote.totalCents / 100).toLocaleString("en-GB", { minimumFractionDigits: 2 });
    expect(text).toContain(`€${euros}`);
    expect(pdfPageSize(res.body as Buffer)).toMatchObject({ width: 595.28, height: 841.89 });
  });
});

describe("POST /api/quotes/:id/requote", () => {
  it("401, 404 across organisations, 403 for an operator; 201 a new quote at today's rates, linked to the expired one", async () => {
    const { user, agent, csrf } = await customer();
    const old = await buildQuote(app, user, { now: new Date(Date.now() - 45 * 86_400_000) });
    expect((await request(app).post(`/api/quotes/${old.id}/requote`)).status).toBe(401);
    const stranger = await signIn(app, await buildUser({ role: "customer" }));
    expect((await stranger.agent.post(`/api/quotes/${old.id}/requote`).set("X-CSRF-Token", stranger.csrf)).status).toBe(404);
    const operator = await signIn(app, await buildUser({ role: "operator" }));
    expect((await operator.agent.post(`/api/quotes/${old.id}/requote`).set("X-CSRF-Token", operator.csrf)).status).toBe(403);
    const before = await agent.get(`/api/quotes/${old.id}`);
    expect(before.body.status).toBe("expired");
    expect(before.body.abilities.order).toBe(false);
    const res = await agent.post(`/api/quotes/${old.id}/requote`).set("X-CSRF-Token", csrf);
    expect(res.status).toBe(201);
    expect(res.body.requotedFromId).toBe(old.id);
    expect(res.body.status).toBe("open");
    expect(res.body.quantity).toBe(old.quantity);
    expect(res.body.configuration).toEqual(old.configuration);
    expect(Date.parse(res.body.expiresAt)).toBeGreaterThan(Date.now() + 29 * 86_400_000);
  });
});

describe("the quote's prediction", () => {
  it("uses the as-built settings of the price-list version it is priced with, as /api/predictions does with the current one", async () => {
    await ensureReferenceData();
    const current = await PriceListVersion.current();
    const catalog = await materialCatalog();
    const config = quoteConfigurationSchema.parse(configuration());
    const asIs = priceAndPredict({ configuration: config, quantity: 1, priceList: current!.data, catalog });
    const live = await request(app).post("/api/predictions").send(config);
    expect(asIs.prediction.attenuation_db).toBeCloseTo(live.body.attenuation_db, 9);
    // a price list whose closed-can ceiling is 10 dB lower: the frozen figure follows it [derived: 1/S = 1/S_ideal + 1/S_ceiling]
    const settings = structuredClone(constructionSettingsOf(current!.data));
    settings.ceilings["closed-can"].firstLayer_db -= 10;
    const lowered = priceAndPredict({ configuration: config, quantity: 1, priceList: { ...current!.data, construction: settings }, catalog });
    expect(lowered.prediction.asBuilt.ceiling_db).toBe(asIs.prediction.asBuilt.ceiling_db - 10);
    expect(lowered.prediction.attenuation_db).toBeLessThan(asIs.prediction.attenuation_db);
  });
});
