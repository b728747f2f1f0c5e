import { randomUUID } from "node:crypto";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Event, MaterialHeat } from "../../server/models";
import { buildTestApp } from "../support/app";
import { binary, ensureReferenceData } from "../support/ordering";
import { buildReleasedOrder, customer, scanThrough, staff, type Agent } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);

const receive = (who: Agent, body: Record<string, unknown>) => who.agent.post("/api/heats").set("X-CSRF-Token", who.csrf).send(body);
const delivery = (overrides: Record<string, unknown> = {}) => ({ heatNumber: `MH-${randomUUID().slice(0, 8)}`, materialId: "ni80", thickness_mm: 1, supplier: "Pellow Strip Mill (test)", quantity: 12, ...overrides });
const PDF = Buffer.from("%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n");
const PNG = Buffer.from("89504e470d0a1a0a0000000d4948445200000001000000010806000000 1f15c4890000000d49444154789c6360000000000500010d0a2db40000000049454e44ae426082".replace(/ /g, ""), "hex");

describe("POST /api/heats", { timeout: 30_000 }, () => {
  it("401, 403 for a customer and for quality, 400 naming the fields and an unknown alloy, 201 the record, 409 for the same heat, alloy and gauge again", async () => {
    expect((await request(app).post("/api/heats").send(delivery())).status).toBe(401);
    expect((await receive(await customer(app), delivery())).status).toBe(403);
    expect((await receive(await staff(app, "qa"), delivery())).status).toBe(403);
    const op = await staff(app, "operator");
    let res = await receive(op, { heatNumber: "", thickness_mm: -1, quantity: 0, unit: "rolls" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["heatNumber", "materialId", "quantity", "supplier", "thickness_mm", "unit"]);
    res = await receive(op, delivery({ materialId: "unobtainium" }));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.materialId).toMatch(/unknown alloy/);
    res = await receive(op, delivery({ receivedOn: "2999-01-01" }));
    expect(res.status).toBe(400);
    const body = delivery({ unit: "kg", quantity: 84.5, receivedOn: "2026-01-05", notes: "Two crates" });
    res = await receive(op, body);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ ...body, materialName: expect.stringMatching(/80/), receivedBy: { id: op.user.id }, millCertificate: null, jobCount: 0 });
    const again = await receive(op, body);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("HEAT_EXISTS");
    // the same heat in another gauge is its own record
    expect((await receive(op, { ...body, thickness_mm: 1.5 })).status).toBe(201);
    expect(await Event.count({ where: { action: "heat.received", subjectId: res.body.id } })).toBe(1);
  });
});

describe("mill certificates", { timeout: 30_000 }, () => {
  it("a PDF or an image is kept with its SHA-256 and downloaded as sent; a DXF or a program is refused naming the file; 404 for a bad id", async () => {
    const op = await staff(app, "operator");
    const heat = (await receive(op, delivery())).body;
    const url = `/api/heats/${heat.id}/mill-certificate`;
    expect((await request(app).post(url).attach("file", PDF, "cert.pdf")).status).toBe(401);
    expect((await (await customer(app)).agent.post(url).attach("file", PDF, "cert.pdf")).status).toBe(403);
    let res = await op.agent.post(url).set("X-CSRF-Token", op.csrf).attach("file", Buffer.from("0\nSECTION\n2\nENTITIES\n0\nENDSEC\n0\nEOF\n"), "cert.dxf");
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/not a PDF or an image/);
    res = await op.agent.post(url).set("X-CSRF-Token", op.csrf).attach("file", Buffer.from("MZ\x90\x00\x03\x00\x00\x00\x04\x00\x00\x00\xff\xff"), "cert.pdf");
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/Windows program/);
    res = await op.agent.post(url).set("X-CSRF-Token", op.csrf).attach("file", PNG, "cert.pdf");
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/PNG image but the name ends in \.pdf/);
    res = await op.agent.post(url).set("X-CSRF-Token", op.csrf).attach("file", PDF, "mill cert 4471.pdf");
    expect(res.status).toBe(201);
    expect(res.body.millCertificate).toMatchObject({ filename: "mill cert 4471.pdf", contentType: "application/pdf", sha256: expect.stringMatching(/^[0-9a-f]{64}$/), url });
    const download = await op.agent.get(url).buffer(true).parse(binary);
    expect(Buffer.compare(download.body as Buffer, PDF)).toBe(0);
    expect(download.headers["content-security-policy"]).toMatch(/sandbox/);
    // a scan of the certificate may replace it: the newest is the heat's
    res = await op.agent.post(url).set("X-CSRF-Token", op.csrf).attach("file", PNG, "cert.png");
    expect(res.body.millCertificate.contentType).toBe("image/png");
    expect((await op.agent.post(`/api/heats/${randomUUID()}/mill-certificate`).set("X-CSRF-Token", op.csrf).attach("file", PDF, "c.pdf")).status).toBe(404);
    expect((await op.agent.get(`/api/heats/nope/mill-certificate`)).status).toBe(404);
  });
});

describe("GET /api/heats", { timeout: 30_000 }, () => {
  it("lists by alloy and gauge with a search; a heat counts the jobs issued from it, and each lot lists its heats", async () => {
    const op = await staff(app, "operator");
    const supplier = `Brindle Strip ${randomUUID().slice(0, 6)}`;
    const a = (await receive(op, delivery({ supplier }))).body;
    const b = (await receive(op, delivery({ supplier, materialId: "ni50", thickness_mm: 1.5 }))).body;
    expect((await request(app).get("/api/heats")).status).toBe(401);
    expect((await (await customer(app)).agent.get("/api/heats")).status).toBe(403);
    let res = await op.agent.get(`/api/heats?q=${encodeURIComponent(supplier)}`);
    expect(res.body.items.map((h: { id: string }) => h.id).sort()).toEqual([a.id, b.id].sort());
    res = await op.agent.get(`/api/heats?q=${encodeURIComponent(supplier)}&materialId=ni50&thickness_mm=1.5`);
    expect(res.body.items.map((h: { id: string }) => h.id)).toEqual([b.id]);
    expect((await op.agent.get("/api/heats?thickness_mm=thin")).status).toBe(400);

    const { jobs, lots } = await buildReleasedOrder(app);
    await scanThrough(op, jobs[0], "material", a.heatNumber);
    await scanThrough(op, jobs[1], "material", a.heatNumber);
    expect((await op.agent.get(`/api/heats/${a.id}`)).body.jobCount).toBe(2);
    const lot = await op.agent.get(`/api/lots/${lots[0].id}`);
    expect(lot.body.heats).toEqual([{ id: a.id, heatNumber: a.heatNumber, supplier, thickness_mm: 1, millCertificate: false }]);
    expect(await MaterialHeat.count({ where: { supplier } })).toBe(2);
  });
});
