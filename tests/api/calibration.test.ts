import { randomUUID } from "node:crypto";
import pg from "pg";
import { QueryTypes } from "sequelize";
import request from "supertest";
import { describe, expect, it } from "vitest";
import { libraryMuOf, type MeasuredLot } from "../../shared/calibration";
import { syntheticLots } from "../../shared/calibration/synthetic";
import { materialLibrary } from "../../shared/physics/materials";
import { CALIBRATION_REFIT_QUEUE, queueCalibrationRefit } from "../../server/jobs/calibration-refit";
import { calibrationRefitter } from "../../server/services/calibrationRefitter";
import { createMeasuredLotsReader } from "../../server/services/measuredLotsReader";
import { buildOrganization, buildTestApp, buildUser, signIn } from "../support/app";
import type { MeasuredDesign } from "../../shared/calibration";

// A class no other test predicts (rolled low-carbon steel cans), so this file's lots move no other figure.
const STEEL_ROLLED = { material: "steel-lc", method: "rolled", construction: "closed-can" } as const;
const STEEL_CANS: MeasuredDesign[] = [
  { shape: "cylinder", ends: "closed", method: "rolled", dimensions_mm: { diameter: 40, length: 80 }, layers: [{ material: "steel-lc", thickness_mm: 1.5 }] },
  { shape: "cylinder", ends: "closed", method: "rolled", dimensions_mm: { diameter: 80, length: 150 }, layers: [{ material: "steel-lc", thickness_mm: 2 }] },
];

const app = buildTestApp();
const { sequelize, jobs } = app.locals.deps;

async function staff(role: "admin" | "qa" | "operator") {
  const shop = await buildOrganization({ kind: "shop" });
  const user = await buildUser({ role, organizationId: shop.id });
  return { user, ...(await signIn(app, user)) };
}

/** Stores lots where the calibration reads them (the stand-in tables behind its view). */
async function storeLots(lots: MeasuredLot[]) {
  for (const lot of lots) {
    const [[row]] = (await sequelize.query(
      "insert into measured_lot_records (number, disposition, decided_at, required_attenuation_db, design) values ($1, $2, $3, $4, $5) returning lot_id",
      { bind: [lot.number, lot.disposition, lot.decidedAt, lot.requiredAttenuation_db, JSON.stringify(lot.parts[0].design)] },
    )) as [{ lot_id: string }[], unknown];
    for (const p of lot.parts)
      await sequelize.query("insert into measured_part_records (lot_id, serial, frequency_hz, applied_field_ut, orientation, attenuation_db) values ($1, $2, $3, $4, $5, $6)", {
        bind: [row.lot_id, p.serial, p.frequency_hz, p.appliedField_uT, p.orientation ?? "transverse", p.measured_db],
      });
  }
}

const lots = syntheticLots({
  key: STEEL_ROLLED, mu_effective: 0.6 * libraryMuOf(materialLibrary, "steel-lc")!, ceiling_db: 60, designs: STEEL_CANS, frequencies_hz: [10, 60, 400],
  lots: 12, partsPerLot: 4, partNoise_db: 0.5, lotNoise_db: 1, requiredAttenuation_db: 30, seed: 21, numberPrefix: `T${randomUUID().slice(0, 6)}`,
});

describe("GET /api/calibration", () => {
  it("401; 403 for a customer and an operator", async () => {
    expect((await request(app).get("/api/calibration")).status).toBe(401);
    expect((await (await signIn(app, await buildUser({ role: "customer" }))).agent.get("/api/calibration")).status).toBe(403);
    expect((await (await staff("operator")).agent.get("/api/calibration/overview")).status).toBe(403);
  });

  it("after a refit: the class's fit with the contract's fields, in use; a prediction of that class says it is calibrated and takes the cross-validated band", async () => {
    await storeLots(lots);
    const done = await calibrationRefitter({ sequelize, readLots: createMeasuredLotsReader(sequelize), actor: null, reason: "test", force: true });
    expect(done).not.toBeNull();
    for (const who of [(await staff("qa")).agent, (await staff("admin")).agent]) {
      const res = await who.get("/api/calibration");
      expect(res.status).toBe(200);
      const fit = res.body.find((f: { material: string; method: string; construction: string }) => f.material === "steel-lc" && f.method === "rolled" && f.construction === "closed-can");
      expect(Object.keys(fit).sort()).toEqual(["ceiling_db", "construction", "error_db", "fittedAt", "id", "inUse", "lots", "material", "method", "mu_effective"].sort());
      expect(fit.inUse).toBe(true);
      expect(fit.lots).toBeGreaterThanOrEqual(12);
      expect(fit.error_db.crossValidated).toBeLessThan(fit.error_db.library);
      expect(Number.isNaN(Date.parse(fit.fittedAt))).toBe(false);
    }
    const prediction = await request(app).post("/api/predictions").send({ ...STEEL_CANS[0], field: { frequency_hz: 60, amplitude_uT: 50, orientation: "transverse" } });
    expect(prediction.status).toBe(200);
    expect(prediction.body.calibration).toMatchObject({ source: "shop" });
    expect(prediction.body.calibration.lots).toBeGreaterThanOrEqual(12);
    expect(prediction.body.band.basis).toMatch(/cross-validation/);
    // another class (no lots of it) keeps the library and says nothing of calibration
    const other = await request(app).post("/api/predictions").send({ shape: "sphere", dimensions_mm: { diameter: 60 }, layers: [{ material: "steel-lc", thickness_mm: 1 }], field: { frequency_hz: 0, amplitude_uT: 50 } });
    expect(other.body.calibration).toBeUndefined();

    const overview = await (await staff("qa")).agent.get("/api/calibration/overview");
    expect(overview.status).toBe(200);
    const full = overview.body.fits.find((f: { material: string; method: string }) => f.material === "steel-lc" && f.method === "rolled");
    expect(full.points.length).toBeGreaterThanOrEqual(12);
    expect(full.uncertainty.mu_effective).toBeGreaterThan(0);
    expect(full.lotsUsed).toEqual(expect.arrayContaining([expect.any(String)]));
    const charts = await (await staff("qa")).agent.get("/api/calibration/control-charts");
    const steel = charts.body.find((c: { material: string; method: string }) => c.material === "steel-lc" && c.method === "rolled");
    expect(steel.chart.points.map((p: { number: string }) => p.number)).toEqual(expect.arrayContaining(lots.map((l) => l.number)));
    expect(steel.chart.constants).toEqual({ d2: 1.128, D3: 0, D4: 3.267 });
  });
});

describe("refits and the shop setting", () => {
  /** The run that answered this person's ask (null: answered without one, the lots unchanged), once answered. */
  async function answerTo(userId: string, reason: string) {
    const ask = async () => {
      const [row] = await sequelize.query<{ run_id: string | null; answered_at: Date | null }>(
        "select run_id, answered_at from calibration_refit_requests where requested_by_id = $1 and reason = $2",
        { bind: [userId, reason], type: QueryTypes.SELECT },
      );
      return row;
    };
    await expect.poll(async () => (await ask())?.answered_at, { timeout: 30_000, interval: 250 }).toBeTruthy();
    return (await ask()).run_id;
  }

  it("POST /api/calibration/refits queues a refit that the worker runs and keeps with who asked", async () => {
    const { agent, csrf, user } = await staff("qa");
    expect((await agent.post("/api/calibration/refits")).status).toBe(403); // no CSRF token
    const res = await agent.post("/api/calibration/refits").set("X-CSRF-Token", csrf);
    expect(res.status).toBe(202);
    const runId = await answerTo(user.id, "asked for by hand");
    expect(runId, "a refit by hand always fits").toBeTruthy();
    const run = ((await agent.get("/api/calibration/overview")).body.history as { id: string; fittedBy: { id: string } | null; reason: string }[]).find((h) => h.id === runId);
    // a refit waiting already (another file's) answers this ask too and names both
    expect(run?.reason).toContain("asked for by hand");
    expect(run?.fittedBy).not.toBeNull();
  });

  it("asks made while a refit waits are answered by that one refit, which names each; a forced ask among unforced ones still fits", async () => {
    const [a, b] = [await staff("qa"), await staff("qa")];
    const tag = randomUUID().slice(0, 8);
    await sequelize.transaction(async (transaction) => {
      // the second ask finds the first one's refit waiting: the queue adds no job for it
      await queueCalibrationRefit({ jobs, sequelize }, { actorId: a.user.id, reason: `certificate for ${tag}` }, transaction);
      await queueCalibrationRefit({ jobs, sequelize }, { actorId: b.user.id, reason: `by hand ${tag}`, force: true }, transaction);
    });
    const [first, second] = [await answerTo(a.user.id, `certificate for ${tag}`), await answerTo(b.user.id, `by hand ${tag}`)];
    expect(first, "forced by the second ask, so a run even when the lots did not change").toBeTruthy();
    expect(second).toBe(first);
    const [run] = await sequelize.query<{ reason: string; fitted_by_id: string }>("select reason, fitted_by_id from calibration_runs where id = $1", { bind: [first], type: QueryTypes.SELECT });
    // in the order asked (other files' asks may be answered by the same run)
    expect(run.reason.indexOf(`certificate for ${tag}`)).toBeGreaterThanOrEqual(0);
    expect(run.reason.indexOf(`by hand ${tag}`)).toBeGreaterThan(run.reason.indexOf(`certificate for ${tag}`));
    // kept as asked by the first who asked among the asks it answered
    const [earliest] = await sequelize.query<{ requested_by_id: string }>("select requested_by_id from calibration_refit_requests where run_id = $1 and requested_by_id is not null order by requested_at, id limit 1", { bind: [first], type: QueryTypes.SELECT });
    expect(run.fitted_by_id).toBe(earliest.requested_by_id);
  });

  it("the overview says a refit is pending while an ask waits; one refit runs at a time (the lock), and the ask is answered once it is free", async () => {
    const { agent, user } = await staff("qa");
    // hold the refit lock as a running refit in another process would
    const holder = new pg.Client({ connectionString: app.locals.deps.config.DATABASE_URL });
    await holder.connect();
    try {
      await holder.query("select pg_advisory_lock(hashtext('fluxwright.calibration-refit'))");
      await sequelize.transaction((transaction) => queueCalibrationRefit({ jobs, sequelize }, { actorId: user.id, reason: "while another refit runs", force: true }, transaction));
      await new Promise((r) => setTimeout(r, 1000)); // the worker has picked the job up and waits for the lock
      expect((await agent.get("/api/calibration/overview")).body.refitPending).toBe(true);
      const [ask] = await sequelize.query<{ answered_at: Date | null }>("select answered_at from calibration_refit_requests where requested_by_id = $1", { bind: [user.id], type: QueryTypes.SELECT });
      expect(ask.answered_at, "no refit while the lock is held").toBeNull();
    } finally {
      await holder.end();
    }
    expect(await answerTo(user.id, "while another refit runs")).toBeTruthy();
  });

  it("a refit left running by a process that died does not hold up the next: the ask is answered", async () => {
    const { user } = await staff("qa");
    const queue = jobs.name(CALIBRATION_REFIT_QUEUE);
    // the job row a killed process leaves: active, never completed, until it expires (15 minutes)
    const [[stale]] = (await sequelize.query(
      "insert into pgboss.job (name, data, state, started_on, policy) values ($1, '{}', 'active', now(), (select policy from pgboss.queue where name = $1)) returning id",
      { bind: [queue] },
    )) as [{ id: string }[], unknown];
    try {
      await sequelize.transaction((transaction) => queueCalibrationRefit({ jobs, sequelize }, { actorId: user.id, reason: "after a stale refit", force: true }, transaction));
      expect(await answerTo(user.id, "after a stale refit")).toBeTruthy();
    } finally {
      await sequelize.query("delete from pgboss.job where name = $1 and id = $2", { bind: [queue, stale.id] });
    }
  });

  it("PUT /api/calibration/settings: the planner only; 400 naming minLots", async () => {
    const qa = await staff("qa");
    expect((await qa.agent.put("/api/calibration/settings").set("X-CSRF-Token", qa.csrf).send({ minLots: 6 })).status).toBe(403);
    const admin = await staff("admin");
    const bad = await admin.agent.put("/api/calibration/settings").set("X-CSRF-Token", admin.csrf).send({ minLots: 1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.minLots).toMatch(/at least 2/);
    const ok = await admin.agent.put("/api/calibration/settings").set("X-CSRF-Token", admin.csrf).send({ minLots: 5 });
    expect(ok.status).toBe(200);
    expect((await admin.agent.get("/api/calibration/overview")).body.settings).toEqual({ minLots: 5 });
  });
});
