import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { seedShopRates } from "../../server/db/seed";
import { buildTestApp, buildUser, signIn } from "../support/app";

const app = buildTestApp({ RATE_LIMIT_PUBLIC: "0" });
beforeAll(async () => {
  await seedShopRates();
});

// The contract's three example bodies.
const box = { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1.0, bendRadius_mm: 1.5, kFactor: 0.44 };
const drawn = { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, thickness_mm: 1.0, cornerRadius_mm: 3, trim_mm: 0 };
const rolled = { shape: "cylinder", method: "rolled", dimensions_mm: { diameter: 50, length: 60 }, thickness_mm: 1.0, seamOverlap_mm: 6 };

const post = (body: unknown) => request(app).post("/api/blanks").send(body as object);

describe("POST /api/blanks", () => {
  it("bent box: cross 160.095 × 140.095, bend allowance 3.047, the flat pattern", async () => {
    const res = await post(box);
    expect(res.status).toBe(200);
    expect(res.body.blank.kind).toBe("cross");
    expect(res.body.blank.length_mm).toBeCloseTo(160.095, 3);
    expect(res.body.blank.width_mm).toBeCloseTo(140.095, 3);
    expect(res.body.bendAllowance_mm).toBeCloseTo(3.047, 3);
    expect(res.body.area_mm2).toBeGreaterThan(0);
    expect(res.body.mass_kg).toBeUndefined();
    expect(res.body.warnings).toEqual([]);
    expect(res.body.geometry.bendLines).toHaveLength(4);
    const xs = res.body.geometry.outline.map((p: number[]) => p[0]);
    expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(res.body.blank.length_mm, 6);
  });

  it("drawn cup: disc ≈ 120.95 with draw stages; a material adds the mass", async () => {
    const res = await post({ ...drawn, material: "ni80" });
    expect(res.status).toBe(200);
    expect(res.body.blank).toMatchObject({ kind: "disc" });
    expect(res.body.blank.diameter_mm).toBeCloseTo(120.95, 1);
    expect(Array.isArray(res.body.drawStages)).toBe(true);
    expect(res.body.drawStages.length).toBeGreaterThanOrEqual(1);
    expect(res.body.mass_kg).toBeCloseTo(res.body.area_mm2 * 1.0 * 8740e-9, 9);
    expect(res.body.material).toMatchObject({ id: "ni80", density_kg_m3: 8740 });
  });

  it("rolled can: wall rectangle with the lap overlap and two end caps", async () => {
    const res = await post(rolled);
    expect(res.status).toBe(200);
    expect(res.body.blank.kind).toBe("rectangle");
    expect(res.body.blank.width_mm).toBeCloseTo(60, 6);
    expect(res.body.blank.length_mm).toBeGreaterThan(Math.PI * 51);
    expect(res.body.endCaps).toHaveLength(2);
    expect(res.body.seam).toBe("lap");
  });

  const bad: Array<[string, unknown, string]> = [
    ["a zero dimension", { ...box, dimensions_mm: { width: 0, depth: 60, height: 40 } }, "dimensions_mm.width"],
    ["a negative dimension", { ...drawn, dimensions_mm: { diameter: -50, length: 60 } }, "dimensions_mm.diameter"],
    ["a negative thickness", { ...rolled, thickness_mm: -1 }, "thickness_mm"],
    ["a bend radius below zero", { ...box, bendRadius_mm: -0.5 }, "bendRadius_mm"],
    ["a K-factor above 0.5", { ...box, kFactor: 0.6 }, "kFactor"],
    ["a K-factor below 0", { ...box, kFactor: -0.1 }, "kFactor"],
    ["a method that does not fit the shape", { ...box, method: "drawn" }, "method"],
    ["a corner radius over half the diameter", { ...drawn, cornerRadius_mm: 26 }, "cornerRadius_mm"],
    ["a thickness larger than the part", { ...box, thickness_mm: 45 }, "thickness_mm"],
    ["an unknown material", { ...box, material: "unobtainium" }, "material"],
    ["a string for a number", { ...box, thickness_mm: "1" }, "thickness_mm"],
  ];
  for (const [what, body, field] of bad) {
    it(`400 naming ${field} for ${what}`, async () => {
      const res = await post(body);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe("VALIDATION_FAILED");
      expect(res.body.error.fields).toHaveProperty(field);
    });
  }

  it("400 for malformed JSON, never a 500", async () => {
    const res = await request(app).post("/api/blanks").set("Content-Type", "application/json").send("{not json");
    expect(res.status).toBe(400);
  });
});

describe("POST /api/blanks/dxf", () => {
  it("answers a DXF attachment named after the part, with the outline and dashed bend layer", async () => {
    const res = await request(app).post("/api/blanks/dxf").send(box).buffer(true).parse((r, cb) => {
      let s = "";
      r.on("data", (c: Buffer) => (s += c.toString()));
      r.on("end", () => cb(null, s));
    });
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/^application\/dxf/);
    // the file name says the part, its material and its thickness
    expect(res.headers["content-disposition"]).toMatch(/^attachment; filename="?blank-box-bent-80x60x40-1mm\.dxf"?$/);
    const dxf = res.body as string;
    expect(dxf).toMatch(/SECTION/);
    expect(dxf).toMatch(/LWPOLYLINE|POLYLINE/);
    expect(dxf).toMatch(/DASHED/);
    expect(dxf.trimEnd().endsWith("EOF")).toBe(true);
  });
  it("names a drawn cup's file by method and size", async () => {
    const res = await request(app).post("/api/blanks/dxf").send(drawn);
    expect(res.headers["content-disposition"]).toContain("blank-can-drawn-d50x60-1mm.dxf");
  });
  it("400 naming the field", async () => {
    const res = await request(app).post("/api/blanks/dxf").send({ ...box, kFactor: 0.9 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("kFactor");
  });
});

describe("POST /api/price-estimates", () => {
  const configuration = {
    shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, bendRadius_mm: 1.5, kFactor: 0.44,
    layers: [{ material: "ni80", thickness_mm: 1.0, gap_mm: 5 }, { material: "ni80", thickness_mm: 1.0 }],
  };

  it("401 signed out", async () => {
    const res = await request(app).post("/api/price-estimates").send({ configuration, quantity: 10 });
    expect(res.status).toBe(401);
  });

  it("403 without the CSRF token", async () => {
    const { agent } = await signIn(app, await buildUser());
    const res = await agent.post("/api/price-estimates").send({ configuration, quantity: 10 });
    expect(res.status).toBe(403);
  });

  it("400 naming the field", async () => {
    const { agent, csrf } = await signIn(app, await buildUser());
    const cases: Array<[unknown, string]> = [
      [{ configuration, quantity: 0 }, "quantity"],
      [{ configuration, quantity: 2.5 }, "quantity"],
      [{ configuration: { ...configuration, method: "drawn" }, quantity: 1 }, "configuration.method"],
      [{ configuration: { ...configuration, kFactor: 0.7 }, quantity: 1 }, "configuration.kFactor"],
      [{ configuration: { ...configuration, bendRadius_mm: -1 }, quantity: 1 }, "configuration.bendRadius_mm"],
      [{ configuration: { ...configuration, dimensions_mm: { width: 80, depth: 0, height: 40 } }, quantity: 1 }, "configuration.dimensions_mm.depth"],
      [{ configuration: { ...configuration, layers: [{ material: "nope", thickness_mm: 1 }] }, quantity: 1 }, "configuration.layers.0.material"],
      [{ configuration: { ...configuration, layers: [{ material: "ni80", thickness_mm: 70 }] }, quantity: 1 }, "configuration.layers.0.thickness_mm"],
      [{ configuration: { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, cornerRadius_mm: 30, layers: [{ material: "ni80", thickness_mm: 1 }] }, quantity: 1 }, "configuration.cornerRadius_mm"],
    ];
    for (const [body, field] of cases) {
      const res = await agent.post("/api/price-estimates").set("X-CSRF-Token", csrf).send(body as object);
      expect(res.status, field).toBe(400);
      expect(res.body.error.fields, field).toHaveProperty(field);
    }
  });

  it("prices every part and line from the current list, and nests on a stock sheet", async () => {
    const { agent, csrf } = await signIn(app, await buildUser());
    const res = await agent.post("/api/price-estimates").set("X-CSRF-Token", csrf).send({ configuration, quantity: 10 });
    expect(res.status).toBe(200);
    const { parts, nesting, price, currency, priceListVersion } = res.body;
    expect(priceListVersion).toBeGreaterThanOrEqual(1);
    expect(currency).toMatch(/^[A-Z]{3}$/);
    // two layers, each a body and a lid
    expect(parts.map((p: { role: string }) => p.role)).toEqual(["body", "lid", "body", "lid"]);
    expect(parts[0].blank.length_mm).toBeCloseTo(160.095, 3);
    expect(parts[0].mass_kg).toBeGreaterThan(0);
    const lineSum = price.lines.reduce((s: number, l: { total_cents: number }) => s + l.total_cents, 0);
    expect(price.subtotal_cents).toBe(lineSum);
    for (const l of price.lines) expect(Number.isInteger(l.total_cents)).toBe(true);
    expect(price.total_cents).toBe(price.unitPrice_cents * 10);
    expect(price.discountPercent).toBeGreaterThan(0); // the demo list breaks at 10
    expect(nesting).toHaveLength(1);
    expect(nesting[0]).toMatchObject({ materialId: "ni80", thickness_mm: 1 });
    expect(nesting[0].sheet.width_mm).toBeGreaterThan(0);
    // 10 boxes with lids, two layers: 40 blanks
    expect(nesting[0].sheets).toBe(Math.ceil(40 / nesting[0].partsPerSheet));
    expect(nesting[0].placements).toHaveLength(nesting[0].partsPerSheet);
    expect(nesting[0].utilisation).toBeGreaterThan(0);
    expect(nesting[0].utilisation).toBeLessThan(1);
  });

  it("a drawn and a rolled cylinder price as well", async () => {
    const { agent, csrf } = await signIn(app, await buildUser({ role: "operator" }));
    for (const method of ["drawn", "rolled"]) {
      const res = await agent.post("/api/price-estimates").set("X-CSRF-Token", csrf).send({
        configuration: { shape: "cylinder", method, dimensions_mm: { diameter: 50, length: 60 }, cornerRadius_mm: 3, seamOverlap_mm: 6, layers: [{ material: "ni50", thickness_mm: 1 }], holes: [{ diameter_mm: 8, collarLength_mm: 10 }] },
        quantity: 3,
      });
      expect(res.status, method).toBe(200);
      expect(res.body.price.lines.find((l: { key: string }) => l.key === (method === "drawn" ? "forming-draw" : "welding")).quantity).toBeGreaterThan(0);
    }
  });
});

describe("a price as its viewer may see it", () => {
  const configuration = { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, cornerRadius_mm: 3, layers: [{ material: "ni80", thickness_mm: 1 }] };
  const price = async (role: "customer" | "admin") => {
    const { agent, csrf } = await signIn(app, await buildUser({ role }));
    const res = await agent.post("/api/price-estimates").set("X-CSRF-Token", csrf).send({ configuration, quantity: 10 });
    expect(res.status).toBe(200);
    return res;
  };

  it("a customer is never sent the margin or an internal rate; the planner is", async () => {
    const customer = await price("customer");
    const planner = await price("admin");
    const c = customer.body.price, p = planner.body.price;
    expect(c.view).toBe("customer");
    expect(p.view).toBe("shop");
    // not hidden by the page: not in the answer at all
    expect(customer.text).not.toMatch(/"margin|"unit_cents"|pricePerKg|Percent":18/);
    for (const line of c.lines) expect(Object.keys(line).sort()).toEqual(["key", "label", "quantity", "total_cents"]);
    expect(p).toHaveProperty("marginPercent");
    expect(p).toHaveProperty("margin_cents");
    expect(p.lines[0]).toHaveProperty("unit_cents");
    // the same price for both, the customer's lines carrying the margin and still adding up
    expect(c.total_cents).toBe(p.total_cents);
    expect(c.unitPrice_cents).toBe(p.unitPrice_cents);
    expect(c.subtotal_cents).toBe(p.subtotal_cents + p.margin_cents);
    expect(c.lines.reduce((s: number, l: { total_cents: number }) => s + l.total_cents, 0)).toBe(c.subtotal_cents);
  });
});

describe("the blank against the shop's stock and forming limits", () => {
  it("warns when a blank is larger than every stock sheet of its alloy and gauge", async () => {
    const res = await post({ ...drawn, dimensions_mm: { diameter: 500, length: 400 }, cornerRadius_mm: 5, material: "ni80" });
    expect(res.status).toBe(200);
    const w = res.body.warnings.find((x: { code: string }) => x.code === "LARGER_THAN_STOCK");
    expect(w.message).toMatch(/larger than any stock sheet of ni80 1 mm/);
    expect((await post({ ...drawn, material: "ni80" })).body.warnings.map((x: { code: string }) => x.code)).not.toContain("LARGER_THAN_STOCK");
  });
  it("warns beyond the forming limits: too many draws, nickel-iron too thick", async () => {
    const deep = await post({ ...drawn, dimensions_mm: { diameter: 30, length: 200 }, material: "ni80" });
    expect(deep.body.warnings.map((x: { code: string }) => x.code)).toContain("DRAW_STAGES_EXCESSIVE");
    expect(deep.body.warnings.find((x: { code: string }) => x.code === "DRAW_STAGES_EXCESSIVE").message).toMatch(/beyond the forming limits/);
    const thick = await post({ ...box, thickness_mm: 4, bendRadius_mm: 4, material: "ni80" });
    expect(thick.body.warnings.map((x: { code: string }) => x.code)).toContain("BEYOND_FORMING_LIMIT");
  });
  it("says what is wrong in plain words, naming the field: 'Seam overlap must be at least 0 mm.'", async () => {
    const res = await post({ ...rolled, seamOverlap_mm: -2, dimensions_mm: { diameter: "fifty", length: 60 } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ seamOverlap_mm: "Seam overlap must be at least 0 mm.", "dimensions_mm.diameter": "Inside diameter must be a number in mm." });
  });
  it("the DXF carries the part, material and thickness as text, and its name says them", async () => {
    const res = await request(app).post("/api/blanks/dxf").send({ ...box, material: "ni80" }).buffer(true).parse((r, cb) => {
      let s = "";
      r.on("data", (c: Buffer) => (s += c.toString()));
      r.on("end", () => cb(null, s));
    });
    expect(res.headers["content-disposition"]).toContain("blank-box-bent-80x60x40-ni80-1mm.dxf");
    const dxf = res.body as string;
    expect(dxf).toContain("FW-PART-NOTE");
    expect(dxf).toContain("Part: box, bent, inside 80 x 60 x 40 mm");
    expect(dxf).toContain("Material: ni80");
    expect(dxf).toContain("Thickness: 1 mm");
  });
});
