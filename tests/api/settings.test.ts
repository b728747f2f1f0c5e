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
