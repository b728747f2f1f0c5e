import { createHash, randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Certificate, Job, Lot, Measurement, Nonconformance, Order } from "../../server/models";
import { canonicalize, certificateDigest, type CanonicalValue } from "../../shared/quality/digest";
import { helmholtzCentreField, searchCoilField } from "../../shared/quality/measurement";
import { utcDay } from "../../shared/quality/instruments";
import { buildTestApp, inbox } from "../support/app";
import { binary, ensureReferenceData, pdfText } from "../support/ordering";
import { buildInstrument, buildLotAtVerify } from "../support/quality";
import { buildReleasedOrder, customer, staff, type Agent } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);
const DAY = 86_400_000;

const post = (who: Agent, path: string, body: Record<string, unknown> = {}) => who.agent.post(path).set("X-CSRF-Token", who.csrf).send(body);
/** A reading: 100 µT applied; the inside field set so the part shows `db` decibels. */
const reading = (serial: string, instrumentId: string, db: number) => ({ serial, frequency_hz: 60, appliedField_uT: 100, insideField_uT: 100 / Math.pow(10, db / 20), instrumentId });

async function measureAll(qa: Agent, lotId: string, instrumentId: string, n: number, db = 45, prefix = "S") {
  let last: request.Response | undefined;
  for (let i = 1; i <= n; i++) {
    last = await post(qa, `/api/lots/${lotId}/measurements`, reading(`${prefix}-${i}`, instrumentId, db));
    if (last.status !== 201) throw new Error(`measurement ${i}: ${last.status} ${JSON.stringify(last.body)}`);
  }
  return last!;
}

describe("GET /api/lots/:id/sampling-plan", () => {
  it("401, 403 for an operator and the ordering customer, 404 for an unknown lot; the plan of /api/sampling-plan for the lot's size and its order's AQL", async () => {
    const { lot, buyer } = await buildLotAtVerify(app);
    expect((await request(app).get(`/api/lots/${lot.id}/sampling-plan`)).status).toBe(401);
    expect((await (await staff(app, "operator")).agent.get(`/api/lots/${lot.id}/sampling-plan`)).status).toBe(403);
    const owner = await customer(app, buyer.organizationId);
    expect((await owner.agent.get(`/api/lots/${lot.id}/sampling-plan`)).status).toBe(403);
    expect((await (await customer(app)).agent.get(`/api/lots/${lot.id}/sampling-plan`)).status).toBe(404);
    const qa = await staff(app, "qa");
    expect((await qa.agent.get(`/api/lots/${randomUUID()}/sampling-plan`)).status).toBe(404);
    const order = (await Order.findByPk(lot.orderId))!;
    const res = await qa.agent.get(`/api/lots/${lot.id}/sampling-plan`);
    expect(res.status).toBe(200);
    const pub = await request(app).get(`/api/sampling-plan?lotSize=${lot.pieces}&aql=${order.aql}`);
    for (const k of ["codeLetter", "sampleSize", "accept", "reject", "standard"]) expect(res.body[k]).toEqual(pub.body[k]);
    expect(res.body.switching).toMatchObject({ state: expect.any(String), reason: expect.any(String) });
    expect((await (await staff(app, "admin")).agent.get(`/api/lots/${lot.id}/sampling-plan`)).status).toBe(200);
  });
});

describe("POST /api/lots/:id/measurements", () => {
  it("refuses a lot that has not completed its anneal (409), an overdue instrument (409), one out for calibration, a reading of zero or below (400 naming the field), an operator (403)", async () => {
    const qa = await staff(app, "qa");
    const probe = await buildInstrument();
    const raw = await buildReleasedOrder(app, { quantity: 5 });
    const early = await post(qa, `/api/lots/${raw.lots[0].id}/measurements`, reading("A-1", probe.id, 45));
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe("LOT_NOT_ANNEALED");

    const { lot } = await buildLotAtVerify(app, { quantity: 5 });
    const overdue = await buildInstrument({ calibrationDue: utcDay(new Date(Date.now() - DAY)) });
    const res = await post(qa, `/api/lots/${lot.id}/measurements`, reading("A-1", overdue.id, 45));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/calibration was due/);
    const away = await buildInstrument({ status: "in-calibration" });
    expect((await post(qa, `/api/lots/${lot.id}/measurements`, reading("A-1", away.id, 45))).status).toBe(409);
    for (const bad of [0, -3]) {
      const zero = await post(qa, `/api/lots/${lot.id}/measurements`, { ...reading("A-1", probe.id, 45), insideField_uT: bad });
      expect(zero.status).toBe(400);
      expect(zero.body.error.fields.insideField_uT).toMatch(/above 0/);
    }
    const noSerial = await post(qa, `/api/lots/${lot.id}/measurements`, { ...reading("", probe.id, 45) });
    expect(noSerial.body.error.fields.serial).toBeTruthy();
    expect((await post(await staff(app, "operator"), `/api/lots/${lot.id}/measurements`, reading("A-1", probe.id, 45))).status).toBe(403);
    expect(await Measurement.count({ where: { lotId: lot.id } })).toBe(0);
  });

  it("computes S, dB and pass against the order's attenuation; the applied field from a Helmholtz set and the inside field from a search coil; a serial once per round", async () => {
    const qa = await staff(app, "qa");
    const { lot } = await buildLotAtVerify(app, { quantity: 50 });
    const order = (await Order.findByPk(lot.orderId))!;
    const probe = await buildInstrument();
    const ok = await post(qa, `/api/lots/${lot.id}/measurements`, { serial: "P-1", frequency_hz: 60, appliedField_uT: 100, insideField_uT: 0.5, instrumentId: probe.id });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    // S = 100 / 0.5 = 200; 20·log10(200) = 46.0206 dB [derived]
    expect(ok.body.shieldingFactor).toBeCloseTo(200, 9);
    expect(ok.body.attenuation_db).toBeCloseTo(46.0206, 4);
    expect(ok.body.pass).toBe(46.0206 >= order.requiredAttenuationDb);
    expect((await post(qa, `/api/lots/${lot.id}/measurements`, { serial: "P-1", frequency_hz: 60, appliedField_uT: 100, insideField_uT: 0.5, instrumentId: probe.id })).status).toBe(409);

    const helmholtz = await buildInstrument({ kind: "helmholtz-coil", turns: 50, radius_mm: 250 });
    const coil = await buildInstrument({ kind: "search-coil", turns: 200, area_mm2: 100 });
    const derived = await post(qa, `/api/lots/${lot.id}/measurements`, { serial: "P-2", frequency_hz: 50, helmholtz: { instrumentId: helmholtz.id, current_A: 2 }, searchCoil: { voltage_mV: 0.05 }, instrumentId: coil.id });
    expect(derived.status, JSON.stringify(derived.body)).toBe(201);
    // B = (4/5)^{3/2}·μ0·n·I/R [pub]: 50 turns, 2 A, 0.25 m → about 359.6 µT
    const applied = helmholtzCentreField({ turnsPerCoil: 50, current_A: 2, radius_m: 0.25 }) * 1e6;
    expect(applied).toBeCloseTo((Math.pow(0.8, 1.5) * 4e-7 * Math.PI * 50 * 2 / 0.25) * 1e6, 3);
    // V = 2π·f·N·A·B [pub, Faraday]: B = 0.05 mV / (2π·50·200·1e-4) → µT
    const inside = searchCoilField({ frequency_hz: 50, turns: 200, area_m2: 1e-4, voltage_V: 5e-5 }) * 1e6;
    expect(derived.body.measurement.appliedField_uT).toBeCloseTo(applied, 6);
    expect(derived.body.measurement.insideField_uT).toBeCloseTo(inside, 9);
    expect(derived.body.shieldingFactor).toBeCloseTo(applied / inside, 6);
  });
});

describe("CSV upload of readings", () => {
  it("stores nothing when one row is bad and lists the bad rows; a good file is stored whole", async () => {
    const qa = await staff(app, "qa");
    const { lot } = await buildLotAtVerify(app, { quantity: 50 });
    const probe = await buildInstrument();
    const bad = `serial,frequency_hz,appliedField,insideField,instrument\nC-1,60,100 uT,0.5 uT,${probe.name}\nC-2,60,0.1 mT,0,${probe.name}\nC-3,60,1 G,5 mG,${probe.name}\nC-4,60,100,0.4,No such probe\n`;
    const refused = await qa.agent.post(`/api/lots/${lot.id}/measurements/csv`).set("X-CSRF-Token", qa.csrf).attach("file", Buffer.from(bad), "readings.csv");
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toEqual(expect.arrayContaining(["rows.3.insideField_uT", "rows.5.instrument"]));
    expect(refused.body.error.message).toMatch(/nothing was stored/);
    expect(await Measurement.count({ where: { lotId: lot.id } })).toBe(0);

    const good = `serial,frequency_hz,appliedField,insideField,instrument,orientation\nC-1,60,100 uT,0.5 uT,${probe.name},axial\nC-2,60,0.1 mT,0.4 µT,${probe.name},\nC-3,60,1 G,5 mG,${probe.name},\n`;
    const stored = await qa.agent.post(`/api/lots/${lot.id}/measurements/csv`).set("X-CSRF-Token", qa.csrf).attach("file", Buffer.from(good), "readings.csv");
    expect(stored.status).toBe(201);
    expect(stored.body.stored).toBe(3);
    const c3 = stored.body.measurements.find((m: { serial: string }) => m.serial === "C-3");
    // 1 G = 100 µT, 5 mG = 0.5 µT [pub: 1 G = 1e-4 T]
    expect(c3.appliedField_uT).toBeCloseTo(100, 9);
    expect(c3.insideField_uT).toBeCloseTo(0.5, 9);
    expect(stored.body.measurements.find((m: { serial: string }) => m.serial === "C-1").orientation).toBe("axial");
  });
});

describe("dispositions, certificates and verification", () => {
  it("accepts a lot when its sample is measured, completes verify on its jobs, issues the certificate once, mails it, and anyone verifies it", async () => {
    const qa = await staff(app, "qa");
    const { lot, jobs, buyer } = await buildLotAtVerify(app, { quantity: 20 });
    const probe = await buildInstrument();
    const plan = (await qa.agent.get(`/api/lots/${lot.id}/sampling-plan`)).body;
    expect((await post(qa, `/api/lots/${lot.id}/certificate`)).status).toBe(409);
    const last = await measureAll(qa, lot.id, probe.id, plan.sampleSize);
    expect(last.body.progress).toMatchObject({ measured: plan.sampleSize, failures: 0, decision: "accepted" });
    for (const job of jobs.filter((j) => j.routing.some((s) => s.key === "verify"))) {
      const view = (await qa.agent.get(`/api/jobs/${job.id}`)).body;
      expect(view.steps.find((s: { key: string }) => s.key === "verify").status).toBe("completed");
    }
    expect((await post(qa, `/api/lots/${lot.id}/measurements`, reading("EXTRA", probe.id, 45))).status).toBe(409);

    expect((await post(await staff(app, "operator"), `/api/lots/${lot.id}/certificate`)).status).toBe(403);
    expect((await post(await customer(app, buyer.organizationId), `/api/lots/${lot.id}/certificate`)).status).toBe(403);
    const issued = await post(qa, `/api/lots/${lot.id}/certificate`);
    expect(issued.status, JSON.stringify(issued.body)).toBe(201);
    expect(issued.body.digest).toMatch(/^[0-9a-f]{64}$/);
    expect((await post(qa, `/api/lots/${lot.id}/certificate`)).status).toBe(409);

    // the calibration reads the lot's measured parts, each with its design and no test field, and the
    // certificate asked for a refit, kept with who asked (a refit waiting already answers it too)
    const db = Certificate.sequelize!;
    const parts = await db.query<{ design: Record<string, unknown>; disposition: string }>("select design, disposition from calibration_measured_parts where lot_id = $1", { bind: [lot.id], type: QueryTypes.SELECT });
    expect(parts.length).toBe(plan.sampleSize);
    expect(parts[0].disposition).toBe("accepted");
    expect(parts[0].design).toHaveProperty("method");
    expect(parts[0].design).toHaveProperty("layers");
    expect(parts[0].design).not.toHaveProperty("field");
    const asks = await db.query<{ requested_by_id: string }>("select requested_by_id from calibration_refit_requests where reason = $1", { bind: [`certificate ${issued.body.number} issued for lot ${lot.number}`], type: QueryTypes.SELECT });
    expect(asks.map((a) => a.requested_by_id)).toEqual([qa.user.id]);

    // the owner downloads it; another organisation gets 404
    const owner = await customer(app, buyer.organizationId);
    const pdf = await owner.agent.get(`/api/certificates/${issued.body.id}.pdf`).buffer(true).parse(binary);
    expect(pdf.status).toBe(200);
    expect(pdf.headers["content-type"]).toMatch(/application\/pdf/);
    expect((await (await customer(app)).agent.get(`/api/certificates/${issued.body.id}.pdf`)).status).toBe(404);
    expect((await owner.agent.get("/api/certificates")).body.map((c: { id: string }) => c.id)).toContain(issued.body.id);
    // the PDF's text, read back by poppler's pdftotext (independent of pdfkit)
    const text = pdfText(pdf.body as Buffer, "raw");
    expect(text).toContain(lot.number);
    expect(text).toContain(issued.body.digest);
    expect(text).toContain("Certificate of conformance");

    // public verification: no session needed; the digest is SHA-256 of the canonical content (node's crypto)
    const verified = await request(app).get(`/api/verify/${issued.body.digest}`);
    expect(verified.status).toBe(200);
    expect(verified.headers["set-cookie"]).toBeUndefined();
    expect(verified.body).toMatchObject({ valid: true, current: true, lot: { number: lot.number }, issuedAt: expect.any(String) });
    expect(createHash("sha256").update(canonicalize(verified.body.content as CanonicalValue), "utf8").digest("hex")).toBe(issued.body.digest);
    expect(certificateDigest(verified.body.content)).toBe(issued.body.digest);
    expect(verified.body.content.measurements).toHaveLength(plan.sampleSize);
    // the file itself, by its own SHA-256 (what the verification page does with a dropped PDF)
    const fileHash = createHash("sha256").update(pdf.body as Buffer).digest("hex");
    expect((await request(app).get(`/api/verify/file/${fileHash}`)).body.digest).toBe(issued.body.digest);
    expect((await request(app).get(`/api/verify/${"0".repeat(64)}`)).status).toBe(404);
    expect((await request(app).get(`/api/verify/not-a-digest`)).status).toBe(400);

    // the database refuses to change an issued certificate
    await expect(Certificate.sequelize!.query(`update certificates set revision = 9 where id = $1`, { bind: [issued.body.id] })).rejects.toThrow(/never change/);
    await expect(Certificate.sequelize!.query(`delete from certificates where id = $1`, { bind: [issued.body.id] })).rejects.toThrow(/never change/);

    // mailed to the ordering organisation with the PDF
    const mails = await inbox(app, buyer.email);
    const mail = mails.find((m) => m.subject.includes(lot.number));
    expect(mail?.attachments[0]).toMatchObject({ contentType: "application/pdf" });

    // a revision supersedes the first; both verify, the first as superseded
    expect((await post(qa, `/api/certificates/${issued.body.id}/revisions`, { reason: "" })).status).toBe(400);
    const revised = await post(qa, `/api/certificates/${issued.body.id}/revisions`, { reason: "Customer's purchase order number added" });
    expect(revised.status).toBe(201);
    expect(revised.body.revision).toBe(2);
    const old = (await request(app).get(`/api/verify/${issued.body.digest}`)).body;
    expect(old).toMatchObject({ current: false, supersededBy: { revision: 2, digest: revised.body.digest } });
    expect((await request(app).get(`/api/verify/${revised.body.digest}`)).body).toMatchObject({ current: true, revision: 2 });
    expect((await post(qa, `/api/certificates/${issued.body.id}/revisions`, { reason: "again" })).status).toBe(409);
  }, 30_000);

  it("rejects a lot whose failures reach Re: on hold with a nonconformance; a re-anneal sends its jobs back through clean, anneal and verify for a new round", async () => {
    const qa = await staff(app, "qa");
    const { lot, jobs } = await buildLotAtVerify(app, { quantity: 20 });
    const probe = await buildInstrument();
    const plan = (await qa.agent.get(`/api/lots/${lot.id}/sampling-plan`)).body;
    let res: request.Response | undefined;
    for (let i = 1; i <= plan.reject; i++) res = await post(qa, `/api/lots/${lot.id}/measurements`, reading(`F-${i}`, probe.id, 10));
    expect(res!.body.progress?.decision, JSON.stringify(res!.body)).toBe("rejected");
    const nc = (await Nonconformance.findOne({ where: { lotId: lot.id } }))!;
    expect(nc.status).toBe("open");
    expect((await Lot.findByPk(lot.id))!.holdReason).toContain(nc.number);
    expect((await post(qa, `/api/lots/${lot.id}/certificate`)).status).toBe(409);

    expect((await post(qa, `/api/nonconformances/${nc.id}/disposition`, { cause: "Dew point high", disposition: "use-as-is" })).body.error.fields.customerConsent).toBeTruthy();
    const decided = await post(qa, `/api/nonconformances/${nc.id}/disposition`, { cause: "Dew point drifted in the cooling zone", disposition: "reanneal-retest" });
    expect(decided.status).toBe(200);
    const after = (await Lot.findByPk(lot.id))!;
    expect(after).toMatchObject({ inspectionRound: 2, holdReason: null, furnaceRunId: null });
    const job = (await Job.findByPk(jobs.find((j) => j.routing.some((s) => s.key === "verify"))!.id))!;
    expect(job.routing.slice(job.stepIndex).map((s) => s.key)).toEqual(["clean", "anneal", "verify", "pack"]);
    const quality = (await qa.agent.get(`/api/lots/${lot.id}/quality`)).body;
    expect(quality.progress).toMatchObject({ round: 2, measured: 0, decision: null });
    expect(quality.nonconformances[0]).toMatchObject({ status: "closed", disposition: "reanneal-retest" });
    expect((await post(qa, `/api/lots/${lot.id}/measurements`, reading("R-1", probe.id, 45))).body.error.code).toBe("LOT_NOT_ANNEALED");
  });
});
