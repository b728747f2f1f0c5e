import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { Mailer } from "../jobs/mailer";
import { Instrument, LotDisposition, Measurement, recordEvent, type User } from "../models";
import { certificateIssuer, certificateReviser } from "../services/certificateIssuer";
import { loadLotInspection, lotSamplingPlan } from "../services/lotInspection";
import { measurementRecorder } from "../services/measurementRecorder";

// The demo's quality records (invented readings): the shipped lot measured, accepted and certified,
// its certificate corrected by a second revision; the lot in verification measured and rejected,
// on hold with its nonconformance open for a disposition. A lot already measured is left as it is
// (a second run adds nothing).

/** The demo mails nothing for its history. */
const silent: Mailer = { enqueue: async () => {}, send: () => {}, idle: async () => {} };

/** Deterministic readings around a lot's predicted figure: 100 µT applied, the inside field for `db`. */
const insideFor = (db: number) => 100 / Math.pow(10, db / 20);

export async function seedQualityRecords(props: { sequelize: Sequelize; qa: User; appUrl: string; transaction: Transaction }): Promise<string[]> {
  const { sequelize, qa, transaction } = props;
  const created: string[] = [];
  const probe = await Instrument.findOne({ where: { name: "Fluxgate probe FX-3" }, transaction });
  if (!probe) return created;
  const [done] = await sequelize.query(`select 1 from measurements m join instruments i on i.id = m.instrument_id where i.name = 'Fluxgate probe FX-3' limit 1`, { type: QueryTypes.SELECT, transaction });
  if (done) return created;
  const lots = await sequelize.query<{ id: string; number: string; shipped: boolean }>(
    `select l.id, l.number, l.shipment_id is not null as shipped from lots l join orders o on o.id = l.order_id
     where o.organization_id in (select organization_id from users where email like '%@demo.test' and role = 'customer')
       and not exists (select 1 from measurements m where m.lot_id = l.id)
       and l.furnace_run_id is not null and exists (select 1 from furnace_runs r where r.id = l.furnace_run_id and r.within_window)
       and not exists (select 1 from jobs j where j.lot_id = l.id and j.anneal_index is not null and j.step_index <= j.anneal_index)
     order by l.seq`,
    { type: QueryTypes.SELECT, transaction },
  );
  const shipped = lots.find((l) => l.shipped);
  const verifying = lots.find((l) => !l.shipped);
  const actor = { id: qa.id, role: qa.role, organizationId: qa.organizationId, name: qa.name };

  if (shipped) {
    // measured before it shipped: the readings and the decision as they were recorded then
    const lot = (await loadLotInspection(sequelize, shipped.id, transaction))!;
    const { plan } = await lotSamplingPlan(sequelize, lot, transaction);
    if (plan) {
      const readings = Array.from({ length: plan.sampleSize }, (_, i) => {
        const db = (lot.predicted_db ?? lot.required_db + 10) - 4 - ((i * 7) % 5);
        const inside = insideFor(db);
        return {
          lotId: lot.id, round: 1, serial: `${lot.number}-${String(i + 1).padStart(2, "0")}`, frequencyHz: lot.configuration.field?.frequency_hz ?? 50, appliedFieldUt: 100, insideFieldUt: inside,
          orientation: lot.configuration.field?.orientation ?? "transverse", probePosition: "centre", instrumentId: probe.id, instrumentCalibrationDue: probe.calibrationDue,
          shieldingFactor: 100 / inside, attenuationDb: 20 * Math.log10(100 / inside), requiredDb: lot.required_db, predictedDb: lot.predicted_db,
          pass: 20 * Math.log10(100 / inside) >= lot.required_db, source: "csv" as const, measuredById: qa.id,
        };
      });
      await Measurement.bulkCreate(readings, { transaction });
      const failures = readings.filter((r) => !r.pass).length;
      await LotDisposition.create({ lotId: lot.id, round: 1, decision: failures <= plan.accept ? "accepted" : "rejected", plan, measured: readings.length, failures, concession: null, decidedById: qa.id }, { transaction });
      await recordEvent({ actor, action: "lot.accepted", subject: { type: "lot", id: lot.id }, data: { round: 1, measured: readings.length, failures }, ip: null }, transaction);
      const first = await certificateIssuer({ actor, lotId: lot.id, sequelize, appUrl: props.appUrl, mailer: silent, ip: null, transaction });
      const second = await certificateReviser({ actor, certificate: first, reason: "The customer's purchase order reference added to the order", sequelize, appUrl: props.appUrl, mailer: silent, ip: null, transaction, now: new Date(Date.now() + 1000) });
      created.push(`lot ${lot.number}: ${readings.length} readings, accepted, certificate ${first.number} revision 1 superseded by revision ${second.revision}`);
    }
  }

  if (verifying) {
    const lot = (await loadLotInspection(sequelize, verifying.id, transaction))!;
    const { plan } = await lotSamplingPlan(sequelize, lot, transaction);
    if (plan && !lot.hold_reason) {
      const readings = Array.from({ length: Math.min(plan.sampleSize, plan.reject + 2) }, (_, i) => ({
        serial: `${lot.number}-${String(i + 1).padStart(2, "0")}`,
        frequency_hz: lot.configuration.field?.frequency_hz ?? 50,
        appliedField_uT: 100,
        // the first parts read low: a dew point that drifted is the likely cause (the nonconformance asks)
        insideField_uT: insideFor(i < plan.reject ? lot.required_db - 6 : lot.required_db + 8),
        instrumentId: probe.id,
      }));
      let decided = false;
      for (const r of readings) {
        if (decided) break;
        const out = await measurementRecorder({ actor, lotId: lot.id, inputs: [r], source: "entry", sequelize, ip: null, transaction });
        decided = out.progress.decision !== null;
      }
      created.push(`lot ${lot.number}: rejected under its plan, on hold with a nonconformance`);
    }
  }
  return created;
}
