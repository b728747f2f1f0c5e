import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { seedMaterials, seedShopRates } from "../../server/db/seed";
import { DEFAULT_DESIGN_SEARCH_SETTINGS } from "../../shared/schemas/pricing";
import { buildTestApp, buildUser, signIn } from "../support/app";

const app = buildTestApp({ RATE_LIMIT_PUBLIC: "0" });
beforeAll(async () => {
  await seedShopRates();
  await seedMaterials();
});

/** The issue's own example: 60 dB at 60 Hz, 100 µT across a 50 mm × 120 mm can. */
const can = (over: Record<string, unknown> = {}) => ({
  requiredAttenuation_db: 60,
  field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" },
  shape: "cylinder",
  dimensions_mm: { diameter: 50, length: 120 },
  constraints: { maxLayers: 2, materials: ["ni80", "ni50"], gauges_mm: [0.5, 1] },
  quantity: 25,
  ...over,
});

async function customer() {
  return signIn(app, await buildUser({ role: "customer" }));
}

type Candidate = {
  configuration: Record<string, unknown>;
  attenuation_db: number;
  band: { low_db: number; high_db: number };
  unitPrice_cents: number;
  currency: string;
  mass_kg: number;
  front: boolean;
  keepsMargin: boolean;
};

describe("POST /api/design-advice", { timeout: 30_000 }, () => {
  it("401 signed out", async () => {
    const res = await request(app).post("/api/design-advice").send(can());
    expect(res.status).toBe(401);
  });

  it("403 without the CSRF token", async () => {
    const { agent } = await customer();
    expect((await agent.post("/api/design-advice").send(can())).status).toBe(403);
  });

  it("400 naming the field", async () => {
    const { agent, csrf } = await customer();
    const constraints = (c: Record<string, unknown>) => can({ constraints: { maxLayers: 2, ...c } });
    const cases: Array<[unknown, string]> = [
      [{ ...can(), requiredAttenuation_db: undefined }, "requiredAttenuation_db"],
      [can({ requiredAttenuation_db: -3 }), "requiredAttenuation_db"],
      [can({ shape: "sphere", dimensions_mm: { diameter: 50 } }), "shape"],
      [can({ dimensions_mm: { diameter: 0, length: 120 } }), "dimensions_mm.diameter"],
      [can({ dimensions_mm: { width: 50, depth: 50, height: 50 } }), "dimensions_mm.diameter"],
      [can({ field: { frequency_hz: -1, amplitude_uT: 100 } }), "field.frequency_hz"],
      [can({ field: { frequency_hz: 60, amplitude_uT: "100" } }), "field.amplitude_uT"],
      [can({ quantity: 0 }), "quantity"],
      [can({ quantity: 1.5 }), "quantity"],
      [constraints({ maxLayers: 5 }), "constraints.maxLayers"],
      [constraints({ materials: [] }), "constraints.materials"],
      [constraints({ materials: ["ni80", "unobtainium"] }), "constraints.materials.1"],
      [constraints({ methods: ["bent"] }), "constraints.methods.0"],
      [constraints({ gauges_mm: [0.5, 0.7] }), "constraints.gauges_mm.1"],
      [constraints({ maxOutside_mm: { diameter: 40 } }), "constraints.maxOutside_mm.diameter"],
      [constraints({ maxOutside_mm: { width: 90 } }), "constraints.maxOutside_mm"],
      [constraints({ maxMass_kg: 0 }), "constraints.maxMass_kg"],
    ];
    for (const [body, field] of cases) {
      const res = await agent.post("/api/design-advice").set("X-CSRF-Token", csrf).send(body as object);
      expect(res.status, field).toBe(400);
      expect(res.body.error.code, field).toBe("VALIDATION_FAILED");
      expect(res.body.error.fields, field).toHaveProperty(field);
    }
    const malformed = await agent.post("/api/design-advice").set("X-CSRF-Token", csrf).set("Content-Type", "application/json").send("{nope");
    expect(malformed.status).toBe(400);
  });

  it("refuses a search larger than the limit with the count it would take", async () => {
    const { agent, csrf } = await customer();
    // 3 alloys × 4 gauges = 12 choices a layer, 4 gap steps, up to 4 layers, 2 methods:
    // 2 · (12 + 12² · 4 + 12³ · 4 + 12⁴ · 4) = 180 888 designs
    const res = await agent
      .post("/api/design-advice")
      .set("X-CSRF-Token", csrf)
      .send(can({ constraints: { maxLayers: 4, materials: ["ni80", "ni50", "steel-lc"], gauges_mm: [0.5, 1, 1.5, 2] } }));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("SEARCH_TOO_LARGE");
    expect(res.body.error.message).toMatch(/180888 designs/);
    expect(res.body.error.fields.constraints).toMatch(/180888/);
  });

  it("every candidate meets the requirement at its band's low end; the same configuration gives the same figure and price through the prediction, the price estimate and a quote", async () => {
    const { agent, csrf } = await customer();
    for (const body of [can(), can({ shape: "box", requiredAttenuation_db: 50, dimensions_mm: { width: 80, depth: 60, height: 40 }, quantity: 7 })]) {
      // the shop's rates may move under another test file's edit: ask again until both answers use one version
      for (let attempt = 0; ; attempt++) {
        const res = await agent.post("/api/design-advice").set("X-CSRF-Token", csrf).send(body);
        expect(res.status).toBe(200);
        const answer = res.body as { evaluated: number; candidates: Candidate[]; recommended: number | null; reason: string; priceListVersion: number };
        expect(answer.candidates.length).toBeGreaterThan(0);
        expect(answer.evaluated).toBeGreaterThanOrEqual(answer.candidates.length);
        expect(answer.candidates.some((c) => c.front)).toBe(true);
        let sameVersion = true;
        for (const c of answer.candidates) {
          expect(c.band.low_db).toBeGreaterThanOrEqual(body.requiredAttenuation_db as number);
          expect(c.configuration.requiredAttenuation_db).toBe(body.requiredAttenuation_db);
          const predicted = await request(app).post("/api/predictions").send(c.configuration);
          expect(predicted.status).toBe(200);
          expect(predicted.body.attenuation_db).toBe(c.attenuation_db);
          expect(predicted.body.band.low_db).toBe(c.band.low_db);
          const estimate = await agent.post("/api/price-estimates").set("X-CSRF-Token", csrf).send({ configuration: c.configuration, quantity: body.quantity });
          expect(estimate.status).toBe(200);
          if (estimate.body.priceListVersion !== answer.priceListVersion) {
            sameVersion = false;
            break;
          }
          expect(estimate.body.price.unitPrice_cents).toBe(c.unitPrice_cents);
          expect(estimate.body.currency).toBe(c.currency);
          const mass = estimate.body.parts.reduce((s: number, p: { mass_kg: number; quantityPerAssembly: number }) => s + p.mass_kg * p.quantityPerAssembly, 0);
          expect(mass).toBeCloseTo(c.mass_kg, 9);
        }
        // the recommendation quoted unchanged: the quote's price is the candidate's
        const rec = answer.candidates[answer.recommended!];
        const quote = await agent.post("/api/quotes").set("X-CSRF-Token", csrf).send({ configuration: rec.configuration, quantity: body.quantity });
        expect(quote.status).toBe(201);
        if (quote.body.priceListVersion !== answer.priceListVersion) sameVersion = false;
        else expect(quote.body.unitPrice_cents).toBe(rec.unitPrice_cents);
        if (sameVersion || attempt >= 3) {
          expect(sameVersion).toBe(true);
          expect(rec.band.low_db).toBeGreaterThanOrEqual(body.requiredAttenuation_db as number);
          expect(rec.keepsMargin).toBe(true);
          expect(answer.reason.length).toBeGreaterThan(20);
          break;
        }
      }
    }
  });

  it("the demo's defaults: the shop's magnetic alloys at its advisor gauges and gap steps, drawn and rolled (here up to two layers)", async () => {
    const { agent, csrf } = await customer();
    // the issue's own requirement with no constraints but the layer count (the full default search, three layers, is timed by `npm run bench`)
    const res = await agent
      .post("/api/design-advice")
      .set("X-CSRF-Token", csrf)
      .send({ requiredAttenuation_db: 60, field: { frequency_hz: 60, amplitude_uT: 100 }, shape: "cylinder", dimensions_mm: { diameter: 50, length: 120 }, constraints: { maxLayers: 2 }, quantity: 10 });
    expect(res.status).toBe(200);
    const { evaluated, candidates, recommended, search, estimate, gauges_mm, gapSteps_mm } = res.body;
    expect(gauges_mm).toEqual([0.5, 1, 1.5, 2]);
    expect(gapSteps_mm).toHaveLength(4);
    // 3 alloys × 4 gauges a layer, 4 gap steps, 2 methods
    expect(evaluated).toBe(2 * (12 + 12 ** 2 * 4));
    expect(search.designs).toBe(evaluated);
    expect(estimate).toBe(true);
    expect(recommended).not.toBeNull();
    expect(candidates[recommended].front).toBe(true);
    expect(candidates[recommended].band.low_db).toBeGreaterThanOrEqual(60);
    const materials = new Set(candidates.flatMap((c: Candidate) => (c.configuration.layers as { material: string }[]).map((l) => l.material)));
    expect([...materials].every((m) => ["ni80", "ni50", "steel-lc"].includes(m as string))).toBe(true);
    expect(new Set(candidates.map((c: Candidate) => c.configuration.method))).toEqual(new Set(["drawn", "rolled"]));
  });

  it("staff may search too", async () => {
    for (const role of ["operator", "qa", "admin"] as const) {
      const { agent, csrf } = await signIn(app, await buildUser({ role }));
      const res = await agent.post("/api/design-advice").set("X-CSRF-Token", csrf).send(can({ constraints: { maxLayers: 1, materials: ["ni80"], gauges_mm: [1] } }));
      expect(res.status, role).toBe(200);
    }
  });

  it("nothing meets it: no candidates, no recommendation, and the closest design with what it lacks", async () => {
    const { agent, csrf } = await customer();
    const res = await agent.post("/api/design-advice").set("X-CSRF-Token", csrf).send(can({ requiredAttenuation_db: 150 }));
    expect(res.status).toBe(200);
    expect(res.body.candidates).toEqual([]);
    expect(res.body.recommended).toBeNull();
    expect(res.body.closest.lacks).toMatch(/dB short/);
    expect(res.body.closest.shortfall.db).toBeGreaterThan(0);
    const small = await agent.post("/api/design-advice").set("X-CSRF-Token", csrf).send(can({ constraints: { maxLayers: 2, materials: ["ni80"], gauges_mm: [1], maxOutside_mm: { diameter: 51 } } }));
    expect(small.body.closest.lacks).toMatch(/too big/);
  });
});

describe("the design search settings in the shop rates", () => {
  it("defaults until saved; the planner saves gap steps and the margin as a version of their own; the advisor searches with them", async () => {
    const planner = await signIn(app, await buildUser({ role: "admin" }));
    const put = (body: unknown) => planner.agent.put("/api/shop-rates/design-search").set("X-CSRF-Token", planner.csrf).send(body as object);
    const before = (await planner.agent.get("/api/shop-rates")).body;
    expect(before.designSearch.gapSteps_mm.length).toBeGreaterThan(0);

    const bad = await put({ designSearch: { gapSteps_mm: [5, 5], gauges_mm: [], minSaturationMargin: 0.5 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("designSearch.gapSteps_mm");
    expect(bad.body.error.fields).toHaveProperty("designSearch.gauges_mm");
    expect(bad.body.error.fields).toHaveProperty("designSearch.minSaturationMargin");

    const { agent, csrf } = await customer();
    expect((await agent.put("/api/shop-rates/design-search").set("X-CSRF-Token", csrf).send({ designSearch: DEFAULT_DESIGN_SEARCH_SETTINGS })).status).toBe(403);
    expect((await request(app).put("/api/shop-rates/design-search").send({ designSearch: DEFAULT_DESIGN_SEARCH_SETTINGS })).status).toBe(401);

    const mine = { gapSteps_mm: [8], gauges_mm: [1, 1.5], minSaturationMargin: 4 };
    const saved = await put({ designSearch: mine });
    expect(saved.status).toBe(200);
    expect(saved.body.part).toBe("design-search");
    expect(saved.body.version).toBeGreaterThan(before.version);
    expect(saved.body.designSearch).toEqual(mine);
    const advice = await agent.post("/api/design-advice").set("X-CSRF-Token", csrf).send(can());
    expect(advice.body.gapSteps_mm).toEqual([8]);
    expect(advice.body.minSaturationMargin).toBe(4);
    // one gap step: 2 methods · (4 + 4² · 1) designs
    expect(advice.body.evaluated).toBe(40);
    // the shop's advisor gauges unless the requirement names its own
    const { constraints: _c, ...unconstrained } = can();
    const byShop = await agent.post("/api/design-advice").set("X-CSRF-Token", csrf).send({ ...unconstrained, constraints: { maxLayers: 1, materials: ["ni80"] } });
    expect(byShop.body.gauges_mm).toEqual([1, 1.5]);
    for (const c of advice.body.candidates as Candidate[]) {
      const layers = c.configuration.layers as { gap_mm?: number }[];
      for (const l of layers.slice(0, -1)) expect(l.gap_mm).toBe(8);
    }

    // saving the rates keeps them; then back to what it was
    const rates = await planner.agent.put("/api/shop-rates/price-list").set("X-CSRF-Token", planner.csrf).send(saved.body.priceList);
    expect(rates.body.designSearch).toEqual(mine);
    const back = await put({ designSearch: before.designSearch });
    expect(back.status).toBe(200);
    expect(back.body.designSearch).toEqual(before.designSearch);
  });
});
