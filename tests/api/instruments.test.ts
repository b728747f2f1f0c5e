import { createHash, randomUUID } from "node:crypto";
import request from "supertest";
import { describe, expect, it } from "vitest";
import { instrumentUsableOn, utcDay } from "../../shared/quality/instruments";
import { Instrument, InstrumentCalibration } from "../../server/models";
import { instrumentDueReminder } from "../../server/services/instrumentDueReminder";
import { buildOrganization, buildTestApp, buildUser, inbox, signIn } from "../support/app";
import { binary } from "../support/ordering";

const app = buildTestApp();
const DAY = 86_400_000;
const day = (offset: number) => utcDay(new Date(Date.now() + offset * DAY));
const pdf = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");
const png = Buffer.from("89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6300010000050001", "hex");
const exe = Buffer.concat([Buffer.from("MZ"), Buffer.alloc(58), Buffer.from([0x80, 0, 0, 0]), Buffer.alloc(64), Buffer.from("PE\0\0"), Buffer.alloc(200)]);

async function staff(role: "admin" | "qa" | "operator") {
  const shop = await buildOrganization({ kind: "shop" });
  const user = await buildUser({ role, organizationId: shop.id });
  return { user, ...(await signIn(app, user)) };
}
const unique = (name: string) => `${name} ${randomUUID().slice(0, 6)}`;

async function create(agent: request.Agent, csrf: string, body: Record<string, unknown>) {
  return agent.post("/api/instruments").set("X-CSRF-Token", csrf).send({ kind: "fluxgate-probe", calibrationDue: day(100), ...body });
}

describe("GET /api/instruments", () => {
  it("401; 403 for a customer and an operator; 200 for QA and the planner with the contract's fields", async () => {
    expect((await request(app).get("/api/instruments")).status).toBe(401);
    expect((await (await signIn(app, await buildUser({ role: "customer" }))).agent.get("/api/instruments")).status).toBe(403);
    expect((await (await staff("operator")).agent.get("/api/instruments")).status).toBe(403);
    const { agent, csrf } = await staff("qa");
    const made = await create(agent, csrf, { name: unique("Probe list") });
    expect(made.status).toBe(201);
    for (const who of [agent, (await staff("admin")).agent]) {
      const res = await who.get("/api/instruments");
      expect(res.status).toBe(200);
      expect(Array.isArray(res.body)).toBe(true);
      const row = res.body.find((i: { id: string }) => i.id === made.body.id);
      expect(row).toMatchObject({ id: made.body.id, name: made.body.name, kind: "fluxgate-probe", calibrationDue: day(100), status: "in-service", overdue: false, usable: true });
    }
    expect((await agent.get("/api/instruments?kind=nonsense")).status).toBe(400);
  });

  it("shows an overdue instrument and one out for calibration as not usable; ?usable=true leaves them out", async () => {
    const { agent, csrf } = await staff("qa");
    const overdue = (await create(agent, csrf, { name: unique("Overdue coil"), kind: "search-coil", turns: 100, area_mm2: 50, calibrationDue: day(-1) })).body;
    expect(overdue).toMatchObject({ overdue: true, usable: false, daysUntilDue: -1 });
    const out = (await create(agent, csrf, { name: unique("Out probe") })).body;
    const sent = await agent.post(`/api/instruments/${out.id}/send-to-calibration`).set("X-CSRF-Token", csrf).send({ laboratory: "Test lab" });
    expect(sent.body).toMatchObject({ status: "in-calibration", usable: false, calibrationLaboratory: "Test lab", calibrationSentOn: day(0) });
    const usable = (await agent.get("/api/instruments?usable=true")).body.map((i: { id: string }) => i.id);
    expect(usable).not.toContain(overdue.id);
    expect(usable).not.toContain(out.id);
    const unusable = (await agent.get("/api/instruments?usable=false")).body.map((i: { id: string }) => i.id);
    expect(unusable).toEqual(expect.arrayContaining([overdue.id, out.id]));
  });
});

describe("the shared predicate: usable on a day [derived]", () => {
  it("in service and not past due; the due date itself is the last usable day", () => {
    expect(instrumentUsableOn({ status: "in-service", calibrationDue: "2030-05-10" }, "2030-05-10")).toBe(true);
    expect(instrumentUsableOn({ status: "in-service", calibrationDue: "2030-05-10" }, "2030-05-11")).toBe(false);
    expect(instrumentUsableOn({ status: "in-calibration", calibrationDue: "2030-05-10" }, "2030-05-01")).toBe(false);
  });
});

describe("POST /api/instruments and PATCH /api/instruments/:id", () => {
  it("401; 403 for an operator; 403 without the CSRF token; 400 naming the fields; 201; 409 for a name in use", async () => {
    expect((await request(app).post("/api/instruments").send({})).status).toBe(401);
    const operator = await staff("operator");
    expect((await create(operator.agent, operator.csrf, { name: "x" })).status).toBe(403);
    const { agent, csrf } = await staff("admin");
    expect((await agent.post("/api/instruments").send({ name: "no token", kind: "fluxgate-probe", calibrationDue: day(10) })).status).toBe(403);
    let res = await agent.post("/api/instruments").set("X-CSRF-Token", csrf).send({ name: "", kind: "teapot" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["calibrationDue", "kind", "name"]);
    res = await create(agent, csrf, { name: unique("Coil"), kind: "search-coil", turns: 0 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["area_mm2", "turns"]);
    res = await create(agent, csrf, { name: unique("Pair"), kind: "helmholtz-coil", turns: 100 });
    expect(Object.keys(res.body.error.fields)).toEqual(["radius_mm"]);
    const name = unique("Helmholtz set");
    res = await create(agent, csrf, { name, kind: "helmholtz-coil", turns: 100, radius_mm: 250, serialNumber: "HS-1" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name, kind: "helmholtz-coil", turns: 100, radius_mm: 250, serialNumber: "HS-1", certificate: null });
    expect((await create(agent, csrf, { name: name.toUpperCase() })).status).toBe(409);
  });

  it("edits details and the due date; 400 naming the field; 404 for an unknown id; the change is in the history", async () => {
    const { agent, csrf } = await staff("qa");
    const made = (await create(agent, csrf, { name: unique("Edit me"), kind: "search-coil", turns: 20, area_mm2: 10 })).body;
    const url = `/api/instruments/${made.id}`;
    expect((await request(app).patch(url).send({ notes: "x" })).status).toBe(401);
    expect((await agent.patch(url).set("X-CSRF-Token", csrf).send({})).status).toBe(400);
    let res = await agent.patch(url).set("X-CSRF-Token", csrf).send({ turns: 1.5 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(["turns"]);
    res = await agent.patch(url).set("X-CSRF-Token", csrf).send({ area_mm2: null });
    expect(res.status).toBe(400); // a search coil needs its area
    expect(Object.keys(res.body.error.fields)).toEqual(["area_mm2"]);
    res = await agent.patch(url).set("X-CSRF-Token", csrf).send({ turns: 40, notes: "rewound", calibrationDue: day(30) });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ turns: 40, notes: "rewound", calibrationDue: day(30) });
    expect((await agent.patch(`/api/instruments/${randomUUID()}`).set("X-CSRF-Token", csrf).send({ notes: "x" })).status).toBe(404);
    expect((await agent.get("/api/instruments/not-an-id")).status).toBe(404);
    const detail = await agent.get(url);
    expect(detail.body.history.map((h: { label: string }) => h.label)).toEqual(["Details changed", "Added to the register"]);
    expect(detail.body.history[0].detail).toMatch(/turns/);
  });
});

describe("calibration: send out, back with a certificate, record in place", () => {
  it("send 401/403/409; return 403/400/409; the certificate is kept with its SHA-256 and downloads to quality staff", async () => {
    const { agent, csrf, user } = await staff("qa");
    const made = (await create(agent, csrf, { name: unique("Cal probe"), calibrationDue: day(5), lastCalibratedOn: day(-360) })).body;
    const base = `/api/instruments/${made.id}`;
    expect((await request(app).post(`${base}/send-to-calibration`).send({})).status).toBe(401);
    const operator = await staff("operator");
    expect((await operator.agent.post(`${base}/send-to-calibration`).set("X-CSRF-Token", operator.csrf).send({})).status).toBe(403);
    expect((await agent.post(`${base}/send-to-calibration`).set("X-CSRF-Token", csrf).send({ sentOn: "yesterday" })).body.error.fields).toHaveProperty("sentOn");
    // nothing to return yet
    const early = await agent.post(`${base}/return-from-calibration`).set("X-CSRF-Token", csrf).field("calibratedOn", day(0)).field("calibrationDue", day(365)).attach("file", pdf, "cert.pdf");
    expect(early.status).toBe(409);
    expect((await agent.post(`${base}/send-to-calibration`).set("X-CSRF-Token", csrf).send({ laboratory: "Lab A" })).status).toBe(200);
    expect((await agent.post(`${base}/send-to-calibration`).set("X-CSRF-Token", csrf).send({})).status).toBe(409);

    const back = (fields: Record<string, string>, file?: { data: Buffer; name: string }) => {
      let req = agent.post(`${base}/return-from-calibration`).set("X-CSRF-Token", csrf);
      for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
      if (file) req = req.attach("file", file.data, file.name);
      return req;
    };
    expect((await operator.agent.post(`${base}/return-from-calibration`).set("X-CSRF-Token", operator.csrf).attach("file", pdf, "c.pdf")).status).toBe(403);
    let res = await back({ calibratedOn: day(0) }, { data: pdf, name: "cert.pdf" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(["calibrationDue"]);
    res = await back({ calibratedOn: day(0), calibrationDue: day(-3) }, { data: pdf, name: "cert.pdf" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(["calibrationDue"]);
    res = await back({ calibratedOn: day(0), calibrationDue: day(365) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/choose/);
    res = await back({ calibratedOn: day(0), calibrationDue: day(365) }, { data: exe, name: "cert.pdf" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/program/);
    res = await back({ calibratedOn: day(0), calibrationDue: day(365) }, { data: png, name: "cert.pdf" });
    expect(res.body.error.fields.file).toMatch(/name it \.png/);
    expect(await InstrumentCalibration.count({ where: { instrumentId: made.id } })).toBe(0);

    res = await back({ calibratedOn: day(0), calibrationDue: day(365), certificateNumber: "C-77", laboratory: "Lab A" }, { data: pdf, name: "calibration C-77.pdf" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: "in-service", calibrationDue: day(365), lastCalibratedOn: day(0), usable: true, calibrationSentOn: null });
    expect(res.body.certificate.filename).toBe("calibration C-77.pdf");

    const detail = (await agent.get(base)).body;
    expect(detail.calibrations).toHaveLength(1);
    expect(detail.calibrations[0]).toMatchObject({ calibratedOn: day(0), calibrationDue: day(365), certificateNumber: "C-77", laboratory: "Lab A", recordedBy: { id: user.id } });
    expect(detail.calibrations[0].certificate.sha256).toBe(createHash("sha256").update(pdf).digest("hex"));
    expect(detail.history.map((h: { action: string }) => h.action)).toEqual(["instrument.returned-from-calibration", "instrument.sent-to-calibration", "instrument.created"]);

    const download = await agent.get(res.body.certificate.url).buffer(true).parse(binary);
    expect(download.status).toBe(200);
    expect(download.headers["content-type"]).toBe("application/pdf");
    expect(download.headers["content-disposition"]).toMatch(/attachment/);
    expect(Buffer.compare(download.body as Buffer, pdf)).toBe(0);
    const customer = await signIn(app, await buildUser({ role: "customer" }));
    expect((await customer.agent.get(res.body.certificate.url)).status).toBe(403);
    expect((await agent.get(`${base}/certificates/${randomUUID()}`)).status).toBe(404);

    // calibrated in place, with an image certificate; an older date than the last is refused
    const older = await agent.post(`${base}/calibrations`).set("X-CSRF-Token", csrf).field("calibratedOn", day(-400)).field("calibrationDue", day(300)).attach("file", png, "scan.png");
    expect(older.status).toBe(400);
    expect(Object.keys(older.body.error.fields)).toEqual(["calibratedOn"]);
    const inPlace = await agent.post(`${base}/calibrations`).set("X-CSRF-Token", csrf).field("calibratedOn", day(0)).field("calibrationDue", day(180)).attach("file", png, "scan.png");
    expect(inPlace.status).toBe(201);
    expect(inPlace.body).toMatchObject({ calibrationDue: day(180), certificate: { filename: "scan.png" } });
    expect(await InstrumentCalibration.count({ where: { instrumentId: made.id } })).toBe(2);
  });
});

describe("the calibration reminder, 14 days before the due date (queued mail)", () => {
  it("mails the quality inspectors once per instrument and due date, however often it runs; a new due date is a new reminder", async () => {
    const { user } = await staff("qa");
    const { sequelize, mailer, config } = app.locals.deps;
    const run = (now = new Date()) => sequelize.transaction((transaction) => instrumentDueReminder({ mailer, appUrl: config.appUrl, transaction, now }));
    const name = unique("Reminder probe");
    const far = await Instrument.create({ name: `${name} far`, kind: "fluxgate-probe", serialNumber: null, make: null, range: null, turns: null, area_mm2: null, radius_mm: null, notes: null, calibrationDue: day(40), lastCalibratedOn: null, createdById: null });
    const soon = await Instrument.create({ name, kind: "fluxgate-probe", serialNumber: "RP-1", make: null, range: null, turns: null, area_mm2: null, radius_mm: null, notes: null, calibrationDue: day(14), lastCalibratedOn: null, createdById: null });
    await run();
    await run();
    const mails = (await inbox(app, user.email)).filter((m) => m.subject.includes(name));
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe(`Calibration of ${name} is due on ${new Date(`${day(14)}T00:00:00Z`).toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" })}`);
    expect(mails[0].text).toMatch(/in 14 days/);
    expect(mails[0].text).toContain(`/instruments/${soon.id}`);
    expect((await soon.reload()).reminderSentFor).toBe(day(14));
    expect((await far.reload()).reminderSentFor).toBeNull();
    // a new due date (as a calibration or an edit sets it) is reminded again when it comes near
    await soon.update({ calibrationDue: day(3), reminderSentFor: null });
    await run();
    expect((await inbox(app, user.email)).filter((m) => m.subject.includes(name))).toHaveLength(2);
    // the far one is reminded when its day comes
    await run(new Date(Date.now() + 27 * DAY));
    expect((await inbox(app, user.email)).filter((m) => m.subject.includes(`${name} far`))).toHaveLength(1);
  });
});

describe("every instrument route refuses the signed-out (401) and other roles (403)", () => {
  it("GET one, PATCH, send, return, record, certificate download", async () => {
    const { agent, csrf } = await staff("qa");
    const made = (await create(agent, csrf, { name: unique("Guarded") })).body;
    const base = `/api/instruments/${made.id}`;
    const routes: Array<["get" | "patch" | "post", string]> = [
      ["get", base], ["patch", base], ["post", `${base}/send-to-calibration`], ["post", `${base}/return-from-calibration`], ["post", `${base}/calibrations`], ["get", `${base}/certificates/${randomUUID()}`],
    ];
    const operator = await staff("operator");
    const customer = await signIn(app, await buildUser({ role: "customer" }));
    for (const [method, url] of routes) {
      expect((await request(app)[method](url).send({})).status, `${method} ${url} signed out`).toBe(401);
      for (const who of [operator, customer]) expect((await who.agent[method](url).set("X-CSRF-Token", who.csrf).send({})).status, `${method} ${url}`).toBe(403);
    }
    expect((await agent.get(base)).status).toBe(200);
  });
});
