import { parse as parseCsv } from "csv-parse/sync";
import { Router, type Request } from "express";
import { readFile } from "node:fs/promises";
import { QueryTypes, type Sequelize } from "sequelize";
import { DIGEST_PATTERN } from "../../shared/quality/digest";
import {
  certificateRevisionSchema, csvColumns, csvRowToMeasurement, MAX_CSV_BYTES, MAX_CSV_ROWS, measurementSchema, nonconformanceDecisionSchema, qualityQueueQuerySchema,
  type CsvUploadAnswerJson, type LotQualityJson, type MeasurementAnswerJson, type MeasurementParsed, type QualityQueueRowJson,
} from "../../shared/schemas/quality";
import { documentNumber } from "../../shared/schemas/documents";
import type { AppDeps } from "../deps";
import { certificateFile } from "../documents";
import { AppError, NotFoundError, ValidationError } from "../errors";
import { createReceiver, discardUploads } from "../files/receive";
import { badFilename } from "../files/sniff";
import { parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Certificate, Instrument, Nonconformance } from "../models";
import { certificatePolicy, qualityPolicy } from "../policies/quality";
import { abilities, authorize, requireRole, type Actor } from "../policies/utils";
import { presentCertificateSummary, presentMeasurement, presentNonconformance, presentVerification, type CertificateRow, type MeasurementRow, type NonconformanceRow, type VerificationRow } from "../presenters/quality";
import { queueCalibrationRefit } from "../jobs/calibration-refit";
import { certificateIssuer, certificateRefusal, certificateReviser } from "../services/certificateIssuer";
import { loadLotInspection, lotProgress, lotSamplingPlan, notAnnealedReason, type LotInspectionRow } from "../services/lotInspection";
import { materialCatalog } from "../services/materialCatalog";
import { measurementRecorder } from "../services/measurementRecorder";
import { nonconformanceDecider } from "../services/nonconformanceDecider";
import { referenceDataChanged } from "../services/referenceData";
import { cachedVerification, rememberVerification } from "../services/verificationCache";

const MEASUREMENTS = `
select m.id, m.serial, m.round, m.frequency_hz, m.applied_field_ut, m.inside_field_ut, m.orientation, m.probe_position, m.instrument_id, i.name as instrument_name, i.kind as instrument_kind,
  to_char(m.instrument_calibration_due, 'YYYY-MM-DD') as instrument_calibration_due, m.derivation, m.shielding_factor, m.attenuation_db, m.required_db, m.predicted_db, m.pass, m.source, m.created_at, u.name as measured_by
from measurements m join instruments i on i.id = m.instrument_id left join users u on u.id = m.measured_by_id`;

const CERTIFICATES = `
select c.id, c.number, c.revision, c.digest, c.issued_at, c.revision_reason, c.lot_id, l.number as lot_number, c.order_id, o.number as order_number,
  n.id as superseded_by_id, n.revision as superseded_by_revision
from certificates c join lots l on l.id = c.lot_id join orders o on o.id = c.order_id left join certificates n on n.supersedes_id = c.id`;

const VERIFY = `
select c.digest, c.number, c.revision, c.issued_at, c.content, n.number as newer_number, n.revision as newer_revision, n.digest as newer_digest, n.issued_at as newer_issued_at
from certificates c left join certificates n on n.supersedes_id = c.id`;

/** A lot seen by quality staff (404 for an unknown id; others are refused by role first). */
async function inspectLot(sequelize: Sequelize, id: unknown, actor: Actor): Promise<LotInspectionRow> {
  const lot = await loadLotInspection(sequelize, recordId(id, "lot"));
  if (!lot) throw NotFoundError("lot");
  authorize(actor, "read", qualityPolicy, { organizationId: lot.organization_id });
  return lot;
}

/** Verification of issued certificates: public, read-only, before the session (no session row). */
export function verifyPublicRouter({ sequelize, publicLimit }: AppDeps): Router {
  const router = Router();
  /** The answer's JSON: kept per digest (see verificationCache.ts), read from the database once. */
  const answer = async (column: "digest" | "pdf_sha256", value: string): Promise<Buffer> => {
    if (!DIGEST_PATTERN.test(value)) throw ValidationError({ digest: "a digest is 64 hexadecimal digits (SHA-256)" });
    const key = `${column}:${value}`;
    const kept = cachedVerification(key);
    if (kept !== undefined) return kept;
    const [row] = await sequelize.query<VerificationRow>(`${VERIFY} where c.${column} = $1`, { bind: [value], type: QueryTypes.SELECT });
    if (!row) throw new AppError(404, "NOT_FOUND", "No certificate issued here has this digest: it is not one of ours, or it has been altered.");
    const json = Buffer.from(JSON.stringify(presentVerification(row)));
    rememberVerification(key, json);
    return json;
  };
  router.get("/verify/file/:sha256", publicLimit, async (req, res) => {
    res.set("Cache-Control", "no-store").type("application/json").send(await answer("pdf_sha256", String(req.params.sha256).toLowerCase()));
  });
  router.get("/verify/:digest", publicLimit, async (req, res) => {
    res.set("Cache-Control", "no-store").type("application/json").send(await answer("digest", String(req.params.digest).toLowerCase()));
  });
  return router;
}

/** Lot inspection: sampling plans, measurements, dispositions and nonconformances, certificates. */
export function qualityRouter(deps: AppDeps): Router {
  const { sequelize, files: store, config, mailer, jobs } = deps;
  const router = Router();
  const ip = (req: Request) => req.ip ?? null;
  const receiveCsv = createReceiver({ store, field: "file", maxBytes: MAX_CSV_BYTES, maxFiles: 1, what: "CSV file of readings" });

  async function measurementsOf(lot: LotInspectionRow, ids?: string[]) {
    const rows = await sequelize.query<MeasurementRow>(
      `${MEASUREMENTS} where m.lot_id = $1 ${ids ? "and m.id = any($2::uuid[])" : ""} order by m.round desc, m.created_at, m.serial`,
      { bind: ids ? [lot.id, ids] : [lot.id], type: QueryTypes.SELECT },
    );
    return rows.map(presentMeasurement);
  }

  router.get("/lots/:id/sampling-plan", requireUser, async (req, res) => {
    const lot = await inspectLot(sequelize, req.params.id, req.user!);
    const { plan, switching } = await lotSamplingPlan(sequelize, lot);
    if (!plan) throw new AppError(409, "ACCEPTANCE_DISCONTINUED", `Acceptance is discontinued for this alloy and route: ${switching.reason}`);
    res.json({ ...plan, switching });
  });

  router.get("/lots/:id/quality", requireUser, async (req, res) => {
    const lot = await inspectLot(sequelize, req.params.id, req.user!);
    const { plan, switching } = await lotSamplingPlan(sequelize, lot);
    const [progress, measurements, ncs, certs, catalog, trail, refusal] = await Promise.all([
      lotProgress(sequelize, lot, plan),
      measurementsOf(lot),
      sequelize.query<NonconformanceRow>(`select id, number, round, description, cause, disposition, customer_consent, status, created_at, closed_at from nonconformances where lot_id = $1 order by created_at desc`, { bind: [lot.id], type: QueryTypes.SELECT }),
      sequelize.query<CertificateRow>(`${CERTIFICATES} where c.lot_id = $1 order by c.revision desc`, { bind: [lot.id], type: QueryTypes.SELECT }),
      materialCatalog(),
      sequelize.query<{ subject_id: string; action: string; created_at: Date; by: string | null; data: Record<string, unknown> }>(
        `select e.subject_id, e.action, e.created_at, u.name as by, e.data from events e left join users u on u.id = e.actor_id
         where e.subject_type = 'nonconformance' and e.subject_id in (select id::text from nonconformances where lot_id = $1) order by e.created_at`,
        { bind: [lot.id], type: QueryTypes.SELECT },
      ),
      sequelize.transaction((transaction) => certificateRefusal(lot, transaction)),
    ]);
    const field = lot.configuration.field ?? {};
    const can = abilities(req.user!, qualityPolicy, { organizationId: lot.organization_id });
    const notAnnealed = notAnnealedReason(lot);
    const body: LotQualityJson = {
      lot: {
        id: lot.id, number: lot.number,
        status: lot.shipment_id ? "shipped" : lot.hold_reason ? "on_hold" : progress.decision ?? (notAnnealed ? "not_annealed" : "to_measure"),
        pieces: lot.pieces, material: catalog.byId.get(lot.material_id)?.name ?? lot.material_id, method: lot.method,
        order: { id: lot.order_id, number: documentNumber("order", lot.order_number), aql: lot.aql, requiredAttenuation_db: lot.required_db },
        customer: lot.organization_name, predicted_db: lot.predicted_db,
        frequency_hz: field.frequency_hz ?? 0, appliedField_uT: field.amplitude_uT ?? 0, orientation: field.orientation ?? "transverse",
        annealed: !notAnnealed, notAnnealedReason: notAnnealed, furnaceRun: null, holdReason: lot.hold_reason, throughVerify: lot.before_verify === 0,
      },
      plan, switching, progress, measurements: measurements.filter((m) => m.round === lot.inspection_round).concat(measurements.filter((m) => m.round !== lot.inspection_round)),
      nonconformances: ncs.map((n) => presentNonconformance(n, trail.filter((e) => e.subject_id === String(n.id)).map((e) => ({ at: new Date(e.created_at).toISOString(), action: e.action, by: e.by, note: String(e.data.cause ?? e.data.description ?? "") })))),
      certificates: certs.map(presentCertificateSummary),
      certifiable: refusal === null && certs.length === 0,
      abilities: { measure: can.measure, decide: can.decide, certify: can.certify },
    };
    res.json(body);
  });

  router.post("/lots/:id/measurements", requireUser, async (req, res) => {
    const lot = await inspectLot(sequelize, req.params.id, req.user!);
    authorize(req.user!, "measure", qualityPolicy, { organizationId: lot.organization_id });
    const input = parseInput(measurementSchema, req.body);
    const out = await sequelize.transaction((transaction) => measurementRecorder({ actor: req.user!, lotId: lot.id, inputs: [input], source: "entry", sequelize, ip: ip(req), transaction }));
    const [measurement] = await measurementsOf(lot, out.measurements.map((m) => m.id));
    const body: MeasurementAnswerJson = { shieldingFactor: measurement.shieldingFactor, attenuation_db: measurement.attenuation_db, pass: measurement.pass, measurement, progress: out.progress };
    res.status(201).json(body);
  });

  // Many readings at once: a CSV (multipart field "file"), checked row by row; one bad row stores nothing.
  router.post("/lots/:id/measurements/csv", requireUser, async (req, res) => {
    const lot = await inspectLot(sequelize, req.params.id, req.user!);
    authorize(req.user!, "measure", qualityPolicy, { organizationId: lot.organization_id });
    const { files } = await receiveCsv(req, res);
    try {
      const file = files[0];
      if (!file) throw ValidationError({ file: "attach the CSV file of readings" });
      const badName = badFilename(file.originalname);
      if (badName) throw ValidationError({ file: badName });
      if (!/\.(csv|txt)$/i.test(file.originalname)) throw ValidationError({ file: "send a .csv file (comma-separated, header row first)" });
      const text = (await readFile(file.path)).toString("utf8");
      if (text.includes("\u0000")) throw ValidationError({ file: "this is not a text file: send a CSV of readings" });
      let records: Record<string, string>[];
      try {
        records = parseCsv(text.replace(/^\uFEFF/, ""), { columns: (header: string[]) => header.map((h) => h.trim()), skip_empty_lines: true, trim: true, relax_column_count: false, bom: true });
      } catch (err) {
        throw ValidationError({ file: `the file is not readable CSV: ${(err as Error).message}` });
      }
      if (!records.length) throw ValidationError({ file: "the file has a header but no readings" });
      if (records.length > MAX_CSV_ROWS) throw ValidationError({ file: `at most ${MAX_CSV_ROWS} readings per file` });
      const header = Object.keys(records[0]);
      const missing = csvColumns.slice(0, 5).filter((c) => !header.includes(c));
      if (missing.length) throw ValidationError({ file: `the header lacks ${missing.join(", ")}; the columns are ${csvColumns.join(", ")}` });
      const instruments = await Instrument.findAll({ attributes: ["id", "name", "serialNumber"] });
      const byName = (name: string) => instruments.find((i) => i.id === name || i.name.toLowerCase() === name.toLowerCase() || (i.serialNumber && i.serialNumber === name))?.id ?? null;
      const problems: Record<string, string> = {};
      const inputs: MeasurementParsed[] = [];
      const rows: number[] = [];
      records.forEach((record, i) => {
        const row = i + 2; // the header is line 1
        const mapped = csvRowToMeasurement(record, byName);
        if (!mapped.ok) {
          for (const [k, v] of Object.entries(mapped.problems)) problems[`rows.${row}.${k}`] = v;
          return;
        }
        const parsed = measurementSchema.safeParse(mapped.input);
        if (!parsed.success) {
          for (const issue of parsed.error.issues) problems[`rows.${row}.${issue.path.join(".") || "row"}`] = issue.message;
          return;
        }
        inputs.push(parsed.data);
        rows.push(row);
      });
      if (Object.keys(problems).length) throw ValidationError(problems, `${new Set(Object.keys(problems).map((k) => k.split(".")[1])).size} of ${records.length} rows need attention; nothing was stored.`);
      const out = await sequelize.transaction((transaction) => measurementRecorder({ actor: req.user!, lotId: lot.id, inputs, source: "csv", rowOf: (i) => rows[i], sequelize, ip: ip(req), transaction }));
      const body: CsvUploadAnswerJson = { stored: out.measurements.length, measurements: await measurementsOf(lot, out.measurements.map((m) => m.id)), progress: out.progress };
      res.status(201).json(body);
    } finally {
      await discardUploads(files);
    }
  });

  router.post("/nonconformances/:id/disposition", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const input = parseInput(nonconformanceDecisionSchema, req.body);
    const nc = await sequelize.transaction(async (transaction) => {
      const nc = await Nonconformance.findByPk(recordId(req.params.id, "nonconformance"), { transaction, lock: transaction.LOCK.UPDATE });
      if (!nc) throw NotFoundError("nonconformance");
      return nonconformanceDecider({ actor: req.user!, nonconformance: nc, input, sequelize, ip: ip(req), transaction });
    });
    res.json({ id: nc.id, number: nc.number, status: nc.status, disposition: nc.disposition, lotId: nc.lotId });
  });

  router.post("/lots/:id/certificate", requireUser, async (req, res) => {
    const lot = await inspectLot(sequelize, req.params.id, req.user!);
    authorize(req.user!, "certify", qualityPolicy, { organizationId: lot.organization_id });
    const certificate = await sequelize.transaction(async (transaction) => {
      const issued = await certificateIssuer({ actor: req.user!, lotId: lot.id, sequelize, appUrl: config.appUrl, mailer, ip: ip(req), transaction });
      // every certified lot is a measurement of how this shop's shields really perform: refit after commit
      await queueCalibrationRefit({ jobs, sequelize }, { actorId: req.user!.id, reason: `certificate ${issued.number} issued for lot ${lot.number}` }, transaction);
      return issued;
    });
    res.status(201).json({ id: certificate.id, digest: certificate.digest, number: certificate.number, revision: certificate.revision, pdfUrl: `/api/certificates/${certificate.id}.pdf`, verifyUrl: `/verify/${certificate.digest}` });
  });

  router.post("/certificates/:id/revisions", requireUser, async (req, res) => {
    requireRole(req.user!, "qa");
    const input = parseInput(certificateRevisionSchema, req.body);
    const certificate = await sequelize.transaction(async (transaction) => {
      const current = await Certificate.findByPk(recordId(req.params.id, "certificate"), { transaction, lock: transaction.LOCK.UPDATE, attributes: { exclude: ["pdf"] } });
      if (!current) throw NotFoundError("certificate");
      return certificateReviser({ actor: req.user!, certificate: current, reason: input.reason, sequelize, appUrl: config.appUrl, mailer, ip: ip(req), transaction });
    });
    // the revision it supersedes is no longer current: every process's public answers forget it
    await referenceDataChanged(sequelize, "certificates");
    res.status(201).json({ id: certificate.id, digest: certificate.digest, number: certificate.number, revision: certificate.revision, pdfUrl: `/api/certificates/${certificate.id}.pdf`, verifyUrl: `/verify/${certificate.digest}` });
  });

  // Certificates the signed-in person may see: the staff all of them, a customer their organisation's.
  router.get("/certificates", requireUser, async (req, res) => {
    const actor = req.user!;
    const orderId = typeof req.query.orderId === "string" ? recordId(req.query.orderId, "order") : undefined;
    const where: string[] = [];
    const bind: unknown[] = [];
    if (actor.role === "customer") where.push(`c.organization_id = $${bind.push(actor.organizationId)}`);
    if (orderId) where.push(`c.order_id = $${bind.push(orderId)}`);
    const rows = await sequelize.query<CertificateRow>(`${CERTIFICATES} ${where.length ? `where ${where.join(" and ")}` : ""} order by c.issued_at desc, c.revision desc limit 200`, { bind, type: QueryTypes.SELECT });
    res.json(rows.map(presentCertificateSummary));
  });

  router.get("/certificates/:file", requireUser, async (req, res) => {
    const m = /^(.+)\.pdf$/.exec(String(req.params.file));
    if (!m) throw NotFoundError("certificate");
    const certificate = await Certificate.findByPk(recordId(m[1], "certificate"));
    if (!certificate) throw NotFoundError("certificate");
    authorize(req.user!, "download", certificatePolicy, certificate);
    const { filename, content } = certificateFile(certificate);
    res.attachment(filename).type("application/pdf").set("Cache-Control", "private, no-store").send(content);
  });

  router.get("/quality/lots", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const q = parseInput(qualityQueueQuerySchema, req.query);
    const stageSql: Record<string, string> = {
      "to-measure": "v.decision is null and v.shipment_id is null and v.furnace_run_id is not null and not exists (select 1 from jobs j where j.lot_id = v.id and j.anneal_index is not null and j.step_index <= j.anneal_index)",
      decided: "v.decision = 'accepted' and v.certificate_id is null",
      rejected: "v.decision = 'rejected'",
      certified: "v.certificate_id is not null",
      all: "true",
    };
    const bind: unknown[] = [];
    const search = q.q ? `and (v.number ilike $${bind.push(`%${q.q}%`)} or v.customer ilike $${bind.length})` : "";
    const base = `
      with v as (
        select l.id, l.seq, l.number, l.pieces, l.material_id, l.inspection_round as round, l.shipment_id, l.furnace_run_id, l.hold_reason, o.id as order_id, o.number as order_number, org.name as customer,
          d.decision, (select count(*)::int from measurements m where m.lot_id = l.id and m.round = l.inspection_round) as measured,
          (select count(*)::int from measurements m where m.lot_id = l.id and m.round = l.inspection_round and not m.pass) as failures,
          (select number from nonconformances n where n.lot_id = l.id and n.status = 'open' limit 1) as open_nc,
          c.id as certificate_id, c.number as certificate_number, c.revision as certificate_revision
        from lots l join orders o on o.id = l.order_id join organizations org on org.id = o.organization_id
        left join lot_dispositions d on d.lot_id = l.id and d.round = l.inspection_round
        left join lateral (select id, number, revision from certificates c where c.lot_id = l.id order by revision desc limit 1) c on true)
      select *, count(*) over () as total from v where ${stageSql[q.stage!]} ${search} order by v.seq desc limit ${q.pageSize} offset ${((q.page ?? 1) - 1) * (q.pageSize ?? 25)}`;
    const rows = await sequelize.query<{ id: string; number: string; pieces: number; material_id: string; round: number; shipment_id: string | null; hold_reason: string | null; order_id: string; order_number: number; customer: string; decision: "accepted" | "rejected" | null; measured: number; failures: number; open_nc: string | null; certificate_id: string | null; certificate_number: string | null; certificate_revision: number | null; total: string; furnace_run_id: string | null }>(base, { bind, type: QueryTypes.SELECT });
    const catalog = await materialCatalog();
    const items: QualityQueueRowJson[] = rows.map((r) => ({
      id: r.id, number: r.number, customer: r.customer, order: { id: r.order_id, number: documentNumber("order", r.order_number) }, material: catalog.byId.get(r.material_id)?.name ?? r.material_id,
      pieces: r.pieces, status: r.shipment_id ? "shipped" : r.hold_reason ? "on_hold" : r.decision ?? "to_measure", round: r.round, measured: r.measured, failures: r.failures, decision: r.decision,
      openNonconformance: r.open_nc, certificate: r.certificate_id ? { id: r.certificate_id, number: r.certificate_number!, revision: r.certificate_revision! } : null,
    }));
    res.json({ items, total: rows.length ? Number(rows[0].total) : 0, page: q.page, pageSize: q.pageSize });
  });

  return router;
}
