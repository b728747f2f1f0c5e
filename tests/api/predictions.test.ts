import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { seedMaterials } from "../../server/db/seed";
import { contractPredictionExample } from "../../shared/schemas/contract-examples";
import { buildTestApp, buildUser, signIn } from "../support/app";

const app = buildTestApp({ RATE_LIMIT_PUBLIC: "0" });
beforeAll(async () => {
  await seedMaterials();
});

// The contract's example body.
const example = structuredClone(contractPredictionExample);
type Body = typeof example & Record<string, unknown>;
const withBody = (change: (b: Body) => void) => {
  const b = structuredClone(example) as Body;
  change(b);
  return b;
};
const post = (body: unknown) => request(app).post("/api/predictions").send(body as object);

describe("POST /api/predictions", () => {
  it("answers the contract example with its fields", async () => {
    const res = await post(example);
    expect(res.status).toBe(200);
    const b = res.body;
    expect(b.shieldingFactor).toBeGreaterThanOrEqual(1);
    expect(b.attenuation_db).toBeCloseTo(20 * Math.log10(b.shieldingFactor), 6);
    expect(b.layers).toHaveLength(2);
    for (const l of b.layers) {
      expect(l).toHaveProperty("wallFluxDensity_T");
      expect(l).toHaveProperty("saturation_T");
      expect(l).toHaveProperty("saturationMargin");
      expect(l.mu_r).toBeGreaterThanOrEqual(1);
    }
    expect(b.layers[0].material).toBe("ni80");
    expect(b.layers[0].muSource).toBe("initial");
    expect(Array.isArray(b.warnings)).toBe(true);
    expect(typeof b.method).toBe("string");
    expect(b.band.low_db).toBeLessThan(b.band.high_db);
    expect(b.estimate).toBe(true);
    // the as-built headline and the exact seamless shell beside it
    expect(b.ideal.attenuation_db).toBeCloseTo(20 * Math.log10(b.ideal.shieldingFactor), 6);
    expect(b.attenuation_db).toBeLessThanOrEqual(b.ideal.attenuation_db);
    expect(b.asBuilt).toMatchObject({ construction: "closed-can", method: "drawn", layers: 2 });
    expect(typeof b.asBuilt.summary).toBe("string");
    expect(b.calibration).toBeUndefined(); // no measured lots calibrate it yet
  });

  it("takes the construction method: a rolled can is its own construction, a bent cylinder is refused at `method`", async () => {
    const rolled = await post(withBody((b) => ((b as Record<string, unknown>).method = "rolled")));
    expect(rolled.status).toBe(200);
    expect(rolled.body.asBuilt.method).toBe("rolled");
    const { method: _m, ...noMethod } = structuredClone(example) as Body;
    const drawn = await post(noMethod);
    expect(drawn.body.asBuilt.method).toBe("drawn");
    const bent = await post(withBody((b) => ((b as Record<string, unknown>).method = "bent")));
    expect(bent.status).toBe(400);
    expect(bent.body.error.fields).toHaveProperty("method");
  });

  it("makes no database query per request once the reference data is loaded", async () => {
    const { sequelize } = app.locals.deps;
    await post(example); // loads the materials and the construction settings
    let queries = 0;
    const count = () => void queries++;
    sequelize.addHook("beforeQuery", "count-predictions", count);
    try {
      for (const f of [1, 7, 60, 600]) expect((await post(withBody((b) => (b.field.frequency_hz = f)))).status).toBe(200);
      expect((await request(app).post("/api/predictions/sweep").send({ ...example, points: 20 })).status).toBe(200);
    } finally {
      sequelize.removeHook("beforeQuery", "count-predictions");
    }
    expect(queries).toBe(0);
  });

  it("every number is finite, and figures beyond the report limit are stated as 300 dB and flagged", async () => {
    const layers = [0, 1, 2, 3, 4, 5].map(() => ({ mu_r: 1_000_000, resistivity_ohm_m: 1e-9, thickness_mm: 20, gap_mm: 5 }));
    const res = await post({ ...example, dimensions_mm: { diameter: 500, length: 1000 }, layers, field: { frequency_hz: 100_000, amplitude_uT: 100, orientation: "transverse" } });
    expect(res.status).toBe(200);
    expect(res.text).not.toMatch(/Infinity|NaN/);
    const numbers: unknown[] = [];
    JSON.parse(res.text, (_k, v) => (typeof v === "number" && numbers.push(v), v));
    expect(numbers.every((x) => Number.isFinite(x))).toBe(true);
    expect(res.body.ideal).toMatchObject({ attenuation_db: 300, beyondLimit: true });
    expect(res.body.attenuation_db).toBeLessThanOrEqual(300);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain("BEYOND_REPORT_LIMIT");
  });

  it("an explicit mu_r is used as given, in either state", async () => {
    for (const state of ["annealed", "as-formed"]) {
      const res = await post(withBody((b) => (b.state = state)));
      expect(res.status).toBe(200);
      expect(res.body.layers[1].mu_r).toBe(20000);
      expect(res.body.layers[1].muSource).toBe("explicit");
    }
    // a much stronger field changes the library layer's μ, not the explicit one
    const strong = await post(withBody((b) => (b.field.amplitude_uT = 20000)));
    expect(strong.body.layers[1].mu_r).toBe(20000);
  });

  it("frequency 0 is a static field", async () => {
    const res = await post(withBody((b) => (b.field.frequency_hz = 0)));
    expect(res.status).toBe(200);
    expect(res.body.attenuation_db).toBeGreaterThan(0);
    expect(res.body.layers[0].skinDepth_mm).toBeNull();
    const ac = await post(example);
    expect(ac.body.attenuation_db).toBeGreaterThan(res.body.attenuation_db);
  });

  it("the other shapes and directions answer too", async () => {
    const box = await post({ ...example, shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 } });
    expect(box.status).toBe(200);
    expect(box.body.warnings.map((w: { code: string }) => w.code)).toContain("BOX_ESTIMATE");
    expect(box.body.fieldDirection).toMatch(/weakest/);
    const sphere = await post({ ...example, shape: "sphere", dimensions_mm: { diameter: 80 } });
    expect(sphere.status).toBe(200);
    const axial = await post(withBody((b) => (b.field.orientation = "axial")));
    expect(axial.status).toBe(200);
    expect(axial.body.method).toMatch(/axial/);
  });

  const bad: Array<[string, unknown, string]> = [
    ["zero diameter", withBody((b) => (b.dimensions_mm.diameter = 0)), "dimensions_mm.diameter"],
    ["negative length", withBody((b) => (b.dimensions_mm.length = -5)), "dimensions_mm.length"],
    ["zero thickness", withBody((b) => (b.layers[0].thickness_mm = 0)), "layers.0.thickness_mm"],
    ["negative thickness", withBody((b) => (b.layers[1].thickness_mm = -1)), "layers.1.thickness_mm"],
    ["thickness not smaller than the radius", withBody((b) => (b.layers[0].thickness_mm = 25)), "layers.0.thickness_mm"],
    ["empty layers", withBody((b) => (b.layers = [])), "layers"],
    ["unknown material", withBody((b) => (b.layers[0].material = "unobtainium")), "layers.0.material"],
    ["negative frequency", withBody((b) => (b.field.frequency_hz = -60)), "field.frequency_hz"],
    ["absurd frequency", withBody((b) => (b.field.frequency_hz = 1e9)), "field.frequency_hz"],
    ["NaN (JSON null)", JSON.parse(JSON.stringify(withBody((b) => (b.layers[0].thickness_mm = Number.NaN)))), "layers.0.thickness_mm"],
    ["a string for a number", withBody((b) => ((b.layers[0] as Record<string, unknown>).thickness_mm = "1 mm")), "layers.0.thickness_mm"],
    ["a numeric string", withBody((b) => ((b.field as Record<string, unknown>).amplitude_uT = "100")), "field.amplitude_uT"],
    ["zero amplitude", withBody((b) => (b.field.amplitude_uT = 0)), "field.amplitude_uT"],
    ["unknown shape", withBody((b) => (b.shape = "torus")), "shape"],
    ["zero hole diameter", { ...example, holes: [{ diameter_mm: 0, collarLength_mm: 10 }] }, "holes.0.diameter_mm"],
    ["negative collar", { ...example, holes: [{ diameter_mm: 8, collarLength_mm: 10 }, { diameter_mm: 8, collarLength_mm: -1 }] }, "holes.1.collarLength_mm"],
    ["hole wider than the can", { ...example, holes: [{ diameter_mm: 60 }] }, "holes.0.diameter_mm"],
    ["a box drawn", { ...example, shape: "box", dimensions_mm: { width: 80, depth: 60, height: 40 } }, "method"],
  ];
  it.each(bad)("400 naming the field: %s", async (_name, body, field) => {
    const res = await post(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("VALIDATION_FAILED");
    expect(res.body.error.fields).toHaveProperty([field]);
    expect(typeof res.body.error.fields[field]).toBe("string");
  });

  it("reports each cable hole's collar and warns, in words, when one is short", async () => {
    const res = await post({ ...example, holes: [{ diameter_mm: 10, collarLength_mm: 5 }, { diameter_mm: 8 }] });
    expect(res.status).toBe(200);
    const b = res.body;
    expect(b.holes).toHaveLength(2);
    expect(b.holes[0]).toMatchObject({ index: 0, diameter_mm: 10, collarLength_mm: 5 });
    expect(b.holes[1]).toMatchObject({ index: 1, diameter_mm: 8, collarLength_mm: 0, collarAttenuation_db: 0 });
    expect(b.holes[0].neededCollarLength_mm).toBeGreaterThan(5);
    expect(b.attenuation_db).toBeLessThan(b.wallAttenuation_db);
    const short = b.warnings.filter((w: { code: string }) => w.code === "SHORT_COLLAR");
    expect(short.map((w: { message: string }) => w.message.slice(0, 7))).toEqual(["Hole 1 ", "Hole 2 "]);
    expect(b.warnings.map((w: { code: string }) => w.code)).toContain("HOLE_LIMITED");
    const none = await post(example);
    expect(none.body.holes).toEqual([]);
    expect(none.body.wallAttenuation_db).toBe(none.body.attenuation_db);
  });

  const beyond: Array<[string, unknown, string, RegExp]> = [
    ["resistivity 5e-324", withBody((b) => (b.layers[1].resistivity_ohm_m = 5e-324)), "layers.1.resistivity_ohm_m", /too small/],
    ["resistivity 1e-300", withBody((b) => (b.layers[1].resistivity_ohm_m = 1e-300)), "layers.1.resistivity_ohm_m", /too small/],
    ["resistivity 10", withBody((b) => (b.layers[1].resistivity_ohm_m = 10)), "layers.1.resistivity_ohm_m", /too large/],
    ["μr 1e9", withBody((b) => (b.layers[1].mu_r = 1e9)), "layers.1.mu_r", /too large/],
    ["a 1 nm wall", withBody((b) => (b.layers[0].thickness_mm = 1e-6)), "layers.0.thickness_mm", /too small/],
    ["a 100 km can", withBody((b) => (b.dimensions_mm.length = 1e8)), "dimensions_mm.length", /too large/],
    ["1 GHz", withBody((b) => (b.field.frequency_hz = 1e9)), "field.frequency_hz", /too large/],
    ["1e-12 µT", withBody((b) => (b.field.amplitude_uT = 1e-12)), "field.amplitude_uT", /too small/],
  ];
  it.each(beyond)("400 saying too small or too large: %s", async (_name, body, field, word) => {
    const res = await post(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toMatch(word);
  });

  it("states the model's frequency range when refusing one", async () => {
    const res = await post(withBody((b) => (b.field.frequency_hz = 200_000)));
    expect(res.body.error.fields["field.frequency_hz"]).toMatch(/100000 Hz/);
  });

  it("a bare NaN token is malformed JSON: 400, never a 500", async () => {
    const res = await request(app).post("/api/predictions").set("Content-Type", "application/json").send(JSON.stringify(example).replace('"thickness_mm":1', '"thickness_mm":NaN'));
    expect(res.status).toBe(400);
  });

  it("a signed-in customer posts without a CSRF token (public computation)", async () => {
    const { agent } = await signIn(app, await buildUser({ role: "customer" }));
    const res = await agent.post("/api/predictions").send(example);
    expect(res.status).toBe(200);
    expect(res.body.attenuation_db).toBeGreaterThan(0);
  });

  it("creates no session for an anonymous visitor", async () => {
    const res = await post(example);
    expect(res.headers["set-cookie"]).toBeUndefined();
  });
});

describe("POST /api/predictions/sweep", () => {
  it("gives both figures at log-spaced frequencies from 1 Hz to 10 kHz", async () => {
    const res = await request(app).post("/api/predictions/sweep").send({ ...example, points: 50 });
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(50);
    expect(res.body[0].frequency_hz).toBeCloseTo(1, 9);
    expect(res.body[49].frequency_hz).toBeCloseTo(10_000, 6);
    expect(res.body[49].attenuation_db).toBeGreaterThan(res.body[0].attenuation_db);
    for (const p of res.body) expect(p.attenuation_db).toBeLessThanOrEqual(p.ideal_db);
  });

  it("over the range asked for", async () => {
    const res = await request(app).post("/api/predictions/sweep").send({ ...example, points: 11, from_hz: 10, to_hz: 100_000 });
    expect(res.status).toBe(200);
    expect(res.body[0].frequency_hz).toBeCloseTo(10, 9);
    expect(res.body[10].frequency_hz).toBeCloseTo(100_000, 6);
    const bad = await request(app).post("/api/predictions/sweep").send({ ...example, from_hz: 500, to_hz: 400 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("to_hz");
    const low = await request(app).post("/api/predictions/sweep").send({ ...example, from_hz: 0 });
    expect(low.body.error.fields.from_hz).toMatch(/too small/);
  });

  it("400 for bad points and bad designs", async () => {
    let res = await request(app).post("/api/predictions/sweep").send({ ...example, points: 1000 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("points");
    res = await request(app).post("/api/predictions/sweep").send(withBody((b) => (b.layers = [])));
    expect(res.body.error.fields).toHaveProperty("layers");
  });
});

describe("GET /api/materials", () => {
  it("lists the library with the contract's fields and the source of each value", async () => {
    const res = await request(app).get("/api/materials");
    expect(res.status).toBe(200);
    const ids = res.body.map((m: { id: string }) => m.id);
    for (const id of ["ni80", "ni50", "steel-lc", "copper", "aluminium"]) expect(ids).toContain(id);
    const ni80 = res.body.find((m: { id: string }) => m.id === "ni80");
    expect(Object.keys(ni80)).toEqual(expect.arrayContaining(["id", "name", "relativePermeability", "saturation_T", "resistivity_ohm_m", "density_kg_m3", "source"]));
    expect(ni80.relativePermeability.initial).toBeLessThan(ni80.relativePermeability.maximum);
    expect(ni80.density_kg_m3).toBe(8740);
    expect(ni80.sourceTags.density_kg_m3).toMatch(/\[pub\] ASTM A753/);
    expect(ni80.sourceTags.relativePermeability).toMatch(/\[practice\]\/\[memory\]/);
    const copper = res.body.find((m: { id: string }) => m.id === "copper");
    expect(copper.saturation_T).toBeNull();
    expect(copper.relativePermeability).toEqual({ initial: 1, maximum: 1 });
  });
});

describe("public computation routes keep no state", () => {
  it("answer without setting a cookie or storing a session row", async () => {
    const { sequelize } = app.locals.deps;
    const count = async () => ((await sequelize.query(`select count(*)::int as n from "session"`)) as [[{ n: number }], unknown])[0][0].n;
    const before = await count();
    const res = await post(example);
    expect(res.status).toBe(200);
    expect(res.headers["set-cookie"]).toBeUndefined();
    const blank = await request(app).post("/api/blanks").send({ shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1, bendRadius_mm: 1.5, kFactor: 0.44 });
    expect(blank.status).toBe(200);
    expect(blank.headers["set-cookie"]).toBeUndefined();
    expect(await count()).toBeLessThanOrEqual(before);
  });

  it("are rate limited per address (429 in the error shape)", async () => {
    const limited = buildTestApp({ RATE_LIMIT_PUBLIC: "3" });
    const codes: number[] = [];
    for (let i = 0; i < 4; i++) codes.push((await request(limited).post("/api/predictions").send(example)).status);
    expect(codes).toEqual([200, 200, 200, 429]);
    const res = await request(limited).get("/api/materials");
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe("RATE_LIMITED");
  });
});
