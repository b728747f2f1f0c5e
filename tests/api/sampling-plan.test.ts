import request from "supertest";
import { describe, expect, it } from "vitest";
import { contractPredictionExample } from "../../shared/schemas/contract-examples";
import { buildTestApp, buildUser, signIn } from "../support/app";

const app = buildTestApp({ RATE_LIMIT_PUBLIC: "0" });
const get = (query: string) => request(app).get(`/api/sampling-plan${query}`);

// Values: ISO 2859-1 / ANSI/ASQ Z1.4 Tables I and II-A, normal inspection, level II [pub]
describe("GET /api/sampling-plan", () => {
  it("200: the contract's fields for lot 500 at AQL 1.0 (H, 50, Ac 1, Re 2)", async () => {
    const res = await get("?lotSize=500&aql=1.0");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ codeLetter: "H", sampleSize: 50, accept: 1, reject: 2 });
    expect(res.body.standard).toMatch(/ISO 2859-1/);
    expect(res.body.standard).toMatch(/normal inspection/);
    expect(res.body.standard).toMatch(/level II/);
  });

  it("codeLetter from the lot size; sample, Ac and Re from the plan the arrow leads to", async () => {
    // G (151–280) at AQL 1.0 is ↓: H's plan, 50 parts
    expect((await get("?lotSize=200&aql=1.0")).body).toMatchObject({ codeLetter: "G", sampleSize: 50, accept: 1, reject: 2, planCodeLetter: "H" });
    // F (91–150) at AQL 1.0 is ↑: E's plan, 13 parts
    expect((await get("?lotSize=120&aql=1")).body).toMatchObject({ codeLetter: "F", sampleSize: 13, accept: 0, reject: 1, planCodeLetter: "E" });
    // K at AQL 0.65: 125, 2/3; Q at 0.010: 1250, 0/1
    expect((await get("?lotSize=3000&aql=0.65")).body).toMatchObject({ codeLetter: "K", sampleSize: 125, accept: 2, reject: 3 });
    expect((await get("?lotSize=1000000&aql=0.010")).body).toMatchObject({ codeLetter: "Q", sampleSize: 1250, accept: 0, reject: 1 });
    // a nonconformities-per-100 column
    expect((await get("?lotSize=60&aql=1000")).body).toMatchObject({ codeLetter: "E", sampleSize: 3, accept: 44, reject: 45 });
  });

  it("sampleSize is the lot size when the plan's sample would reach it (every part tested)", async () => {
    const res = await get("?lotSize=5&aql=1.0");
    expect(res.body).toMatchObject({ codeLetter: "A", sampleSize: 5, accept: 0, reject: 1, everyPart: true, tableSampleSize: 13 });
    expect((await get("?lotSize=40&aql=0.25")).body).toMatchObject({ codeLetter: "D", sampleSize: 40, everyPart: true });
    expect((await get("?lotSize=1&aql=2.5")).body).toMatchObject({ codeLetter: "A", sampleSize: 1 });
    expect((await get("?lotSize=8&aql=6.5")).body).toMatchObject({ codeLetter: "A", sampleSize: 2, everyPart: false });
  });

  it.each([
    ["", "lotSize"],
    ["?aql=1.0", "lotSize"],
    ["?lotSize=500", "aql"],
    ["?lotSize=0&aql=1.0", "lotSize"],
    ["?lotSize=-5&aql=1.0", "lotSize"],
    ["?lotSize=12.5&aql=1.0", "lotSize"],
    ["?lotSize=abc&aql=1.0", "lotSize"],
    ["?lotSize=500&aql=2.0", "aql"],
    ["?lotSize=500&aql=abc", "aql"],
    ["?lotSize=500&aql=-1", "aql"],
    ["?lotSize=500&aql=1.0&aql=2.5", "aql"],
  ])("400 naming the field for %s", async (query, field) => {
    const res = await get(query);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("VALIDATION_FAILED");
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it("an AQL that is not a column says which columns there are", async () => {
    const res = await get("?lotSize=500&aql=2.0");
    expect(res.body.error.fields.aql).toMatch(/0\.010.*1000/);
  });

  it("public: no sign-in, no cookie, no session row; the same for a signed-in user", async () => {
    const { sequelize } = app.locals.deps;
    const count = async () => ((await sequelize.query(`select count(*)::int as n from "session"`)) as [[{ n: number }], unknown])[0][0].n;
    const before = await count();
    const res = await get("?lotSize=500&aql=1.0");
    expect(res.status).toBe(200);
    expect(res.headers["set-cookie"]).toBeUndefined();
    expect(await count()).toBeLessThanOrEqual(before);
    const { agent } = await signIn(app, await buildUser({ role: "qa" }));
    expect((await agent.get("/api/sampling-plan?lotSize=500&aql=1.0")).body).toMatchObject({ codeLetter: "H", sampleSize: 50 });
  });

  it("the public reads (a prediction, the plan, the certificate check, their 400 and 404) carry the same page-security headers as every other answer", async () => {
    const general = await request(app).get("/api/materials");
    const answers = [
      await request(app).post("/api/predictions").send(contractPredictionExample),
      await request(app).post("/api/predictions").set("content-type", "application/json").send("{not json"),
      await get("?lotSize=500&aql=1.0"), await get("?lotSize=0&aql=1.0"),
      await request(app).get(`/api/verify/${"0".repeat(64)}`), await request(app).get("/api/verify/not-a-digest"),
    ];
    expect(answers.map((a) => a.status)).toEqual([200, 400, 200, 400, 404, 400]);
    for (const name of ["content-security-policy", "x-content-type-options", "x-frame-options", "referrer-policy", "cross-origin-opener-policy", "cross-origin-resource-policy", "strict-transport-security"]) {
      for (const answer of answers) expect(answer.headers[name], name).toBe(general.headers[name]);
    }
    expect(general.headers["content-security-policy"]).toMatch(/default-src 'self'/);
    for (const answer of answers) expect(answer.headers["x-powered-by"]).toBeUndefined();
  });

  it("rate limited per address (429 in the error shape)", async () => {
    const limited = buildTestApp({ RATE_LIMIT_PUBLIC: "2" });
    const codes: number[] = [];
    for (let i = 0; i < 3; i++) codes.push((await request(limited).get("/api/sampling-plan?lotSize=500&aql=1.0")).status);
    expect(codes).toEqual([200, 200, 429]);
  });
});
