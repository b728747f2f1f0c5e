import { documentNumber } from "../../shared/schemas/documents";
import type { CertificateContent, CertificateSummaryJson, CertificateVerificationJson, MeasurementJson, NonconformanceJson, Orientation } from "../../shared/schemas/quality";

export interface MeasurementRow {
  id: string;
  serial: string;
  round: number;
  frequency_hz: number;
  applied_field_ut: number;
  inside_field_ut: number;
  orientation: Orientation;
  probe_position: string;
  instrument_id: string;
  instrument_name: string;
  instrument_kind: string;
  instrument_calibration_due: string;
  derivation: Record<string, unknown>;
  shielding_factor: number;
  attenuation_db: number;
  required_db: number;
  predicted_db: number | null;
  pass: boolean;
  source: "entry" | "csv";
  created_at: Date;
  measured_by: string | null;
}

export function presentMeasurement(m: MeasurementRow): MeasurementJson {
  return {
    id: m.id,
    serial: m.serial,
    round: m.round,
    frequency_hz: m.frequency_hz,
    appliedField_uT: m.applied_field_ut,
    insideField_uT: m.inside_field_ut,
    orientation: m.orientation,
    probePosition: m.probe_position,
    instrument: { id: m.instrument_id, name: m.instrument_name, kind: m.instrument_kind, calibrationDue: m.instrument_calibration_due },
    derivation: m.derivation,
    shieldingFactor: m.shielding_factor,
    attenuation_db: m.attenuation_db,
    required_db: m.required_db,
    predicted_db: m.predicted_db,
    pass: m.pass,
    source: m.source,
    measuredAt: new Date(m.created_at).toISOString(),
    measuredBy: m.measured_by,
  };
}

export interface NonconformanceRow {
  id: string;
  number: string;
  round: number;
  description: string;
  cause: string | null;
  disposition: NonconformanceJson["disposition"];
  customer_consent: string | null;
  status: "open" | "closed";
  created_at: Date;
  closed_at: Date | null;
}

export function presentNonconformance(n: NonconformanceRow, trail: NonconformanceJson["trail"]): NonconformanceJson {
  return {
    id: n.id, number: n.number, round: n.round, description: n.description, cause: n.cause, disposition: n.disposition, customerConsent: n.customer_consent, status: n.status,
    createdAt: new Date(n.created_at).toISOString(), closedAt: n.closed_at ? new Date(n.closed_at).toISOString() : null, trail,
  };
}

export interface CertificateRow {
  id: string;
  number: string;
  revision: number;
  digest: string;
  issued_at: Date;
  revision_reason: string | null;
  lot_id: string;
  lot_number: string;
  order_id: string;
  order_number: number;
  superseded_by_id: string | null;
  superseded_by_revision: number | null;
}

export function presentCertificateSummary(c: CertificateRow): CertificateSummaryJson {
  return {
    id: c.id,
    number: c.number,
    revision: c.revision,
    digest: c.digest,
    issuedAt: new Date(c.issued_at).toISOString(),
    current: !c.superseded_by_id,
    supersededBy: c.superseded_by_id ? { id: c.superseded_by_id, revision: c.superseded_by_revision! } : null,
    revisionReason: c.revision_reason,
    lot: { id: c.lot_id, number: c.lot_number },
    order: { id: c.order_id, number: documentNumber("order", c.order_number) },
    pdfUrl: `/api/certificates/${c.id}.pdf`,
    verifyUrl: `/verify/${c.digest}`,
  };
}

export interface VerificationRow {
  digest: string;
  number: string;
  revision: number;
  issued_at: Date;
  content: CertificateContent;
  newer_number: string | null;
  newer_revision: number | null;
  newer_digest: string | null;
  newer_issued_at: Date | null;
}

export function presentVerification(v: VerificationRow): CertificateVerificationJson {
  return {
    valid: true,
    digest: v.digest,
    number: v.number,
    revision: v.revision,
    current: !v.newer_digest,
    supersededBy: v.newer_digest ? { number: v.newer_number!, revision: v.newer_revision!, digest: v.newer_digest, issuedAt: new Date(v.newer_issued_at!).toISOString() } : null,
    lot: v.content.lot,
    issuedAt: new Date(v.issued_at).toISOString(),
    content: v.content,
  };
}
