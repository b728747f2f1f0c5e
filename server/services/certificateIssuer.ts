import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { certificateDigest, type CanonicalValue } from "../../shared/quality/digest";
import { documentNumber } from "../../shared/schemas/documents";
import { certificateStatement, type CertificateContent } from "../../shared/schemas/quality";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import { roleLabels, stepLabels, type StepKey } from "../../shared/shop-floor/routing";
import { renderCertificatePdf } from "../documents/certificate-pdf";
import { ConflictError } from "../errors";
import type { Mailer } from "../jobs/mailer";
import { Certificate, FurnaceRun, Lot, LotDisposition, Organization, ShopSettings, User, recordEvent } from "../models";
import type { Actor } from "../policies/utils";
import { createHash } from "node:crypto";
import { loadLotInspection, type LotInspectionRow } from "./lotInspection";
import { materialCatalog } from "./materialCatalog";

const roleWords: Record<string, string> = { qa: "Quality inspector", admin: "Planner" };
const methodWords: Record<string, string> = { drawn: "deep drawn", rolled: "rolled and welded", bent: "bent and welded" };

export const verifyUrl = (appUrl: string, digest: string) => `${appUrl.replace(/\/$/, "")}/verify/${digest}`;

/** The lot's disposition this round when it allows a certificate (accepted, or rejected and used as is by consent). */
async function certifiableDisposition(lot: LotInspectionRow, transaction: Transaction): Promise<LotDisposition | null> {
  const d = await LotDisposition.findOne({ where: { lotId: lot.id, round: lot.inspection_round }, transaction });
  return d && (d.decision === "accepted" || d.concession) ? d : null;
}

/** Why a lot cannot be certified now, or null. */
export async function certificateRefusal(lot: LotInspectionRow, transaction: Transaction): Promise<string | null> {
  if (!(await certifiableDisposition(lot, transaction))) return `Lot ${lot.number} is not accepted under its sampling plan yet: measure its sample first.`;
  if (lot.before_verify > 0) return `Lot ${lot.number} has jobs that have not completed their steps through verify.`;
  return null;
}

/** Everything the certificate certifies, read from the records as they stand. */
async function certifiedContent(props: {
  sequelize: Sequelize; lot: LotInspectionRow; disposition: LotDisposition; signer: Actor & { name: string }; issuedAt: Date;
  number: string; revision: number; supersedes: Certificate | null; reason: string | null; transaction: Transaction;
}): Promise<CertificateContent> {
  const { sequelize, lot, disposition, transaction } = props;
  const bind = { bind: [lot.id, lot.inspection_round] as unknown[], type: QueryTypes.SELECT as QueryTypes.SELECT, transaction };
  // one after another: they share the transaction's connection (pg queues concurrent queries on one client, deprecated)
  const fromRecords = async () => {
    const parts = await sequelize.query<{ layer: number; role: keyof typeof roleLabels; method: string; quantity: number; routing: Array<{ key: StepKey }> }>(
      `select layer, role, method, quantity, routing from jobs where lot_id = $1 and finished_piece order by layer, seq`, { ...bind, bind: [lot.id] });
    const heats = await sequelize.query<{ heat_number: string; supplier: string; file: string | null }>(
      `select distinct h.heat_number, h.supplier, coalesce(f.filename, 'not on file') as file from jobs j join material_heats h on h.id = j.heat_id left join stored_files f on f.id = h.mill_certificate_file_id where j.lot_id = $1 order by h.heat_number`,
      { ...bind, bind: [lot.id] });
    const measurements = await sequelize.query<{ serial: string; applied_field_ut: number; inside_field_ut: number; frequency_hz: number; orientation: string; probe_position: string; shielding_factor: number; attenuation_db: number; pass: boolean }>(
      `select serial, applied_field_ut, inside_field_ut, frequency_hz, orientation, probe_position, shielding_factor, attenuation_db, pass from measurements where lot_id = $1 and round = $2 order by created_at, serial`, bind);
    const instruments = await sequelize.query<{ name: string; kind: string; serial_number: string | null; calibration_due: string; last_calibrated_on: string | null }>(
      `select distinct i.name, i.kind, i.serial_number, to_char(m.instrument_calibration_due, 'YYYY-MM-DD') as calibration_due, to_char(i.last_calibrated_on, 'YYYY-MM-DD') as last_calibrated_on
       from measurements m join instruments i on i.id = m.instrument_id or i.id::text = m.derivation -> 'applied' ->> 'helmholtzId'
       where m.lot_id = $1 and m.round = $2 order by i.name`, bind);
    const furnace = await Lot.findByPk(lot.id, { transaction, attributes: ["furnaceRunId"] });
    const run = furnace?.furnaceRunId ? await FurnaceRun.findByPk(furnace.furnaceRunId, { transaction }) : null;
    return { parts, heats, measurements, instruments, run };
  };
  const [shop, catalog, { parts, heats, measurements, instruments, run }] = await Promise.all([ShopSettings.current(), materialCatalog(), fromRecords()]);
  const alloy = catalog.byId.get(lot.material_id)?.name ?? lot.material_id;
  const route = parts[0]?.routing.map((s) => stepLabels[s.key]) ?? [];
  const plan = disposition.plan;
  return {
    issuer: { name: shop.name, address: shop.address },
    certificate: { number: props.number, revision: props.revision, supersedes: props.supersedes ? { revision: props.supersedes.revision, digest: props.supersedes.digest } : null, revisionReason: props.reason },
    customer: { organization: lot.organization_name },
    order: { number: documentNumber("order", lot.order_number), purchaseOrder: lot.purchase_order, requiredAttenuation_db: lot.required_db, aql: lot.aql },
    part: {
      description: parts.map((p) => `layer ${p.layer + 1} ${roleLabels[p.role]} (${methodWords[p.method] ?? p.method}) x ${p.quantity}`).join("; ") || "shield",
      drawingRevision: `design as quoted in ${documentNumber("quote", lot.quote_number)}`,
    },
    lot: { number: lot.number, quantity: lot.pieces },
    material: { alloy, heats: heats.map((h) => ({ heatNumber: h.heat_number, supplier: h.supplier, millCertificate: h.file ?? "not on file" })) },
    formingRoute: route,
    furnaceRun: run ? { number: run.number, peakTemperature_c: run.peakTemperatureC, soak_min: run.soakMin, dewPoint_c: run.dewPointC, coolingRate_c_per_h: run.coolingRateCPerH, ranAt: new Date(run.ranAt).toISOString() } : null,
    samplingPlan: { standard: plan.standard, inspection: plan.inspection, codeLetter: plan.codeLetter, sampleSize: plan.sampleSize, accept: plan.accept, reject: plan.reject, aql: plan.aql },
    measurements: measurements.map((m) => ({
      serial: m.serial, appliedField_uT: m.applied_field_ut, insideField_uT: m.inside_field_ut, frequency_hz: m.frequency_hz, orientation: m.orientation, probePosition: m.probe_position,
      shieldingFactor: m.shielding_factor, attenuation_db: m.attenuation_db, pass: m.pass,
    })),
    predicted_db: lot.predicted_db,
    instruments: instruments.map((i) => ({ name: i.name, kind: i.kind, serialNumber: i.serial_number ?? "", calibrationDue: i.calibration_due, lastCalibratedOn: i.last_calibrated_on ?? "" })),
    result: { measured: disposition.measured, failures: disposition.failures, decision: disposition.decision, concession: disposition.concession },
    statement: certificateStatement,
    signer: { name: props.signer.name, role: roleWords[props.signer.role] ?? props.signer.role },
    issuedAt: props.issuedAt.toISOString(),
  };
}

async function issue(props: {
  actor: Actor & { name: string }; lot: LotInspectionRow; number: string; revision: number; supersedes: Certificate | null; reason: string | null;
  sequelize: Sequelize; appUrl: string; mailer: Mailer; ip: string | null; transaction: Transaction; now?: Date;
}): Promise<Certificate> {
  const { actor, lot, sequelize, transaction } = props;
  const refusal = await certificateRefusal(lot, transaction);
  if (refusal) throw ConflictError("LOT_NOT_CERTIFIABLE", refusal);
  const disposition = (await certifiableDisposition(lot, transaction))!;
  // to the millisecond the canonical form keeps; the PDF and the content say the same instant
  const issuedAt = new Date(Math.floor((props.now ?? new Date()).getTime() / 1000) * 1000);
  const content = await certifiedContent({ sequelize, lot, disposition, signer: actor, issuedAt, number: props.number, revision: props.revision, supersedes: props.supersedes, reason: props.reason, transaction });
  const digest = certificateDigest(content as unknown as CanonicalValue);
  const org = await Organization.findByPk(lot.organization_id, { transaction, attributes: ["paperSize"] });
  const pdf = await renderCertificatePdf({ content, digest, verifyUrl: verifyUrl(props.appUrl, digest), paperSize: ((org?.paperSize as PaperSize | undefined) ?? "A4") });
  const certificate = await Certificate.create(
    {
      number: props.number, revision: props.revision, lotId: lot.id, orderId: lot.order_id, organizationId: lot.organization_id, supersedesId: props.supersedes?.id ?? null,
      revisionReason: props.reason, content, digest, pdf, pdfSha256: createHash("sha256").update(pdf).digest("hex"), issuedById: actor.id, issuedAt,
    },
    { transaction },
  );
  await recordEvent(
    { actor, action: props.supersedes ? "certificate.revised" : "certificate.issued", subject: { type: "lot", id: lot.id }, data: { certificateId: certificate.id, number: props.number, revision: props.revision, digest, reason: props.reason }, ip: props.ip, at: issuedAt },
    transaction,
  );
  const buyers = await User.findAll({ where: { organizationId: lot.organization_id, role: "customer", disabledAt: null }, attributes: ["email", "name"], transaction });
  for (const buyer of buyers) {
    await props.mailer.enqueue(
      {
        to: buyer.email,
        subject: `Certificate of conformance ${props.number}${props.revision > 1 ? ` revision ${props.revision}` : ""} for lot ${lot.number}`,
        text: [
          `Hello ${buyer.name},`,
          ``,
          props.supersedes
            ? `Lot ${lot.number} of order ${documentNumber("order", lot.order_number)} has a corrected certificate: ${props.number} revision ${props.revision}, which supersedes revision ${props.supersedes.revision}. Reason: ${props.reason}`
            : `Lot ${lot.number} of order ${documentNumber("order", lot.order_number)} passed its inspection. Its certificate of conformance ${props.number} is attached.`,
          ``,
          `Anyone can check it at:`,
          verifyUrl(props.appUrl, digest),
          ``,
          `SHA-256 digest of the certified content: ${digest}`,
        ].join("\n"),
        attachments: [{ document: "certificate", id: certificate.id }],
      },
      transaction,
    );
  }
  return certificate;
}

/** The first certificate of an accepted lot whose jobs are through verify; a second is refused (a correction is a revision). */
export async function certificateIssuer(props: { actor: Actor & { name: string }; lotId: string; sequelize: Sequelize; appUrl: string; mailer: Mailer; ip: string | null; transaction: Transaction; now?: Date }): Promise<Certificate> {
  const { sequelize, transaction } = props;
  await Lot.findByPk(props.lotId, { transaction, lock: transaction.LOCK.UPDATE, attributes: ["id"] });
  const lot = (await loadLotInspection(sequelize, props.lotId, transaction))!;
  const existing = await Certificate.findOne({ where: { lotId: lot.id }, attributes: ["number"], transaction });
  if (existing) throw ConflictError("CERTIFICATE_EXISTS", `Lot ${lot.number} already has certificate ${existing.number}; a correction is issued as a new revision of it.`);
  const [{ n }] = await sequelize.query<{ n: string }>(`select nextval('certificate_number_seq')::text as n`, { type: QueryTypes.SELECT, transaction });
  return issue({ ...props, lot, number: `C-${n}`, revision: 1, supersedes: null, reason: null });
}

/** A corrected revision of the current certificate (locked by the caller), from the records as they now stand. */
export async function certificateReviser(props: { actor: Actor & { name: string }; certificate: Certificate; reason: string; sequelize: Sequelize; appUrl: string; mailer: Mailer; ip: string | null; transaction: Transaction; now?: Date }): Promise<Certificate> {
  const { certificate, sequelize, transaction } = props;
  const newer = await Certificate.findOne({ where: { supersedesId: certificate.id }, attributes: ["revision"], transaction });
  if (newer) throw ConflictError("CERTIFICATE_SUPERSEDED", `${certificate.number} revision ${certificate.revision} is already superseded by revision ${newer.revision}; revise the current one.`);
  await Lot.findByPk(certificate.lotId, { transaction, lock: transaction.LOCK.UPDATE, attributes: ["id"] });
  const lot = (await loadLotInspection(sequelize, certificate.lotId, transaction))!;
  return issue({ ...props, lot, number: certificate.number, revision: certificate.revision + 1, supersedes: certificate, reason: props.reason.trim() });
}
