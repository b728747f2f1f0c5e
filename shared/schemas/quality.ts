/** Quality records: measurements (one by one and CSV rows), nonconformance dispositions, certificates and their verification. */
import { z } from "zod";
import { fieldUnits, toMicrotesla } from "../units";
import type { SwitchingState } from "../quality/switching";
import type { SamplingPlanJson } from "./sampling";

export const orientations = ["transverse", "axial"] as const;
export type Orientation = (typeof orientations)[number];

const positive = (what: string) =>
  z.number({ error: `Give ${what} as a number.` }).refine((n) => Number.isFinite(n) && n > 0, { error: `${capital(what)} must be above 0.` });
function capital(s: string) {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/**
 * POST /api/lots/:id/measurements: one sampled part. The applied field is entered (µT) or computed
 * from a Helmholtz set's current; the inside field is entered (µT, read on the probe `instrumentId`)
 * or computed from the search coil `instrumentId`'s RMS voltage.
 */
export const measurementSchema = z
  .object({
    serial: z.string({ error: "Give the part's serial number." }).trim().min(1, { error: "Give the part's serial number." }).max(60, { error: "The serial number must be at most 60 characters." })
      .regex(/^[\x21-\x7e](?:[\x20-\x7e]*[\x21-\x7e])?$/, { error: "The serial number takes letters, digits and punctuation (no control characters)." }),
    frequency_hz: z.number({ error: "Give the field's frequency in Hz (0 for a static field)." }).min(0, { error: "The frequency must be 0 Hz (static) or above." }).max(1_000_000, { error: "The frequency must be at most 1 MHz." }),
    appliedField_uT: positive("the applied field").optional(),
    insideField_uT: positive("the field inside the shield").optional(),
    instrumentId: z.uuid({ error: "Choose the instrument that read the inside field." }),
    orientation: z.enum(orientations, { error: "The orientation is transverse or axial." }).optional(),
    probePosition: z.string().trim().min(1, { error: "Say where the probe was, e.g. centre." }).max(120, { error: "The probe position must be at most 120 characters." }).optional(),
    helmholtz: z
      .object({ instrumentId: z.uuid({ error: "Choose the Helmholtz coil set." }), current_A: positive("the coil current (A)") })
      .optional(),
    searchCoil: z.object({ voltage_mV: positive("the search coil's voltage (mV)") }).optional(),
  })
  .superRefine((m, ctx) => {
    if (m.appliedField_uT === undefined && !m.helmholtz) ctx.addIssue({ code: "custom", path: ["appliedField_uT"], message: "Give the applied field, or the Helmholtz set's current to compute it." });
    if (m.appliedField_uT !== undefined && m.helmholtz) ctx.addIssue({ code: "custom", path: ["helmholtz"], message: "Give the applied field or the Helmholtz current, not both." });
    if (m.insideField_uT === undefined && !m.searchCoil) ctx.addIssue({ code: "custom", path: ["insideField_uT"], message: "Give the field inside the shield, or the search coil's voltage to compute it." });
    if (m.insideField_uT !== undefined && m.searchCoil) ctx.addIssue({ code: "custom", path: ["searchCoil"], message: "Give the inside field or the search coil's voltage, not both." });
    if (m.searchCoil && m.frequency_hz === 0) ctx.addIssue({ code: "custom", path: ["frequency_hz"], message: "A search coil reads alternating fields only: give the frequency above 0 Hz." });
  });
export type MeasurementInput = z.input<typeof measurementSchema>;
export type MeasurementParsed = z.output<typeof measurementSchema>;

// --- CSV upload ---

/** The columns a CSV of readings has (header row; order free; the last three optional). */
export const csvColumns = ["serial", "frequency_hz", "appliedField", "insideField", "instrument", "orientation", "probePosition"] as const;
export const MAX_CSV_BYTES = 1024 * 1024;
export const MAX_CSV_ROWS = 2000;

/** A field as a person types it: "120", "120 uT", "0.12 mT", "1.2 G", "95.5 A/m" (a bare number is µT). */
export function readFieldText(text: string): number | null {
  const m = /^\s*([-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?)\s*([A-Za-zµμ/]*)\s*$/.exec(text);
  if (!m) return null;
  const value = Number(m[1]);
  const unitText = m[2].replace(/^[µμ]/, "u").toLowerCase();
  if (!unitText) return value;
  // no field unit differs from another by case alone (there is no mega-tesla or mega-gauss here)
  const unit = fieldUnits.find((u) => u.toLowerCase() === unitText);
  return unit ? toMicrotesla(value, unit) : null;
}

/** A CSV row as the measurement body (the instrument still named as in the file), or the reasons it is refused. */
export function csvRowToMeasurement(row: Record<string, string>, instrumentIdFor: (name: string) => string | null): { ok: true; input: MeasurementInput } | { ok: false; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const cell = (k: string) => (row[k] ?? "").trim();
  const frequency = cell("frequency_hz");
  const applied = readFieldText(cell("appliedField"));
  const inside = readFieldText(cell("insideField"));
  if (!cell("appliedField")) problems.appliedField = "is empty";
  else if (applied === null) problems.appliedField = `"${cell("appliedField")}" is not a field (e.g. 100 uT, 0.1 mT, 1 G)`;
  if (!cell("insideField")) problems.insideField = "is empty";
  else if (inside === null) problems.insideField = `"${cell("insideField")}" is not a field (e.g. 0.5 uT, 5 mG)`;
  const instrumentId = cell("instrument") ? instrumentIdFor(cell("instrument")) : null;
  if (!cell("instrument")) problems.instrument = "is empty";
  else if (!instrumentId) problems.instrument = `no instrument named "${cell("instrument")}" in the register`;
  if (Object.keys(problems).length) return { ok: false, problems };
  const input: MeasurementInput = {
    serial: cell("serial"),
    frequency_hz: frequency === "" ? Number.NaN : Number(frequency),
    appliedField_uT: applied!,
    insideField_uT: inside!,
    instrumentId: instrumentId!,
    ...(cell("orientation") ? { orientation: cell("orientation") as Orientation } : {}),
    ...(cell("probePosition") ? { probePosition: cell("probePosition") } : {}),
  };
  return { ok: true, input };
}

// --- nonconformance dispositions ---

export const nonconformanceDispositions = ["reanneal-retest", "rework", "scrap", "use-as-is"] as const;
export type NonconformanceDisposition = (typeof nonconformanceDispositions)[number];
export const dispositionLabels: Record<NonconformanceDisposition, string> = {
  "reanneal-retest": "Re-anneal and retest",
  rework: "Rework, re-anneal and retest",
  scrap: "Scrap",
  "use-as-is": "Use as is (customer's written consent)",
};

export const nonconformanceDecisionSchema = z
  .object({
    cause: z.string({ error: "Say what caused the failures." }).trim().min(3, { error: "Say what caused the failures." }).max(2000, { error: "The cause must be at most 2000 characters." }),
    disposition: z.enum(nonconformanceDispositions, { error: `The disposition is one of ${nonconformanceDispositions.join(", ")}.` }),
    customerConsent: z.string().trim().max(2000, { error: "The consent reference must be at most 2000 characters." }).optional(),
  })
  .superRefine((d, ctx) => {
    if (d.disposition === "use-as-is" && !d.customerConsent?.trim()) {
      ctx.addIssue({ code: "custom", path: ["customerConsent"], message: "Using a rejected lot as is needs the customer's written consent: give its reference (letter, mail, date)." });
    }
  });
export type NonconformanceDecisionInput = z.input<typeof nonconformanceDecisionSchema>;

export const certificateRevisionSchema = z.object({
  reason: z.string({ error: "Say what the revision corrects." }).trim().min(3, { error: "Say what the revision corrects." }).max(1000, { error: "The reason must be at most 1000 characters." }),
});
export type CertificateRevisionInput = z.input<typeof certificateRevisionSchema>;

export const qualityQueueQuerySchema = z.object({
  stage: z.enum(["to-measure", "decided", "rejected", "certified", "all"], { error: "The stage is one of to-measure, decided, rejected, certified, all." }).default("to-measure"),
  q: z.string().trim().max(60).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export type QualityQueueQuery = z.input<typeof qualityQueueQuerySchema>;

// --- answers ---

export interface MeasurementJson {
  id: string;
  serial: string;
  round: number;
  frequency_hz: number;
  appliedField_uT: number;
  insideField_uT: number;
  orientation: Orientation;
  probePosition: string;
  instrument: { id: string; name: string; kind: string; calibrationDue: string };
  derivation: Record<string, unknown>;
  shieldingFactor: number;
  attenuation_db: number;
  required_db: number;
  predicted_db: number | null;
  pass: boolean;
  source: "entry" | "csv";
  measuredAt: string;
  measuredBy: string | null;
}

export interface LotProgressJson {
  round: number;
  measured: number;
  failures: number;
  sampleSize: number;
  accept: number;
  reject: number;
  /** the decision reached under the plan (null until the sample is measured or the failures reach Re) */
  decision: "accepted" | "rejected" | null;
}

/** A new measurement: the contract's three figures first. */
export interface MeasurementAnswerJson {
  shieldingFactor: number;
  attenuation_db: number;
  pass: boolean;
  measurement: MeasurementJson;
  progress: LotProgressJson;
}

export interface CsvUploadAnswerJson {
  stored: number;
  measurements: MeasurementJson[];
  progress: LotProgressJson;
}

export interface NonconformanceJson {
  id: string;
  number: string;
  round: number;
  description: string;
  cause: string | null;
  disposition: NonconformanceDisposition | null;
  customerConsent: string | null;
  status: "open" | "closed";
  createdAt: string;
  closedAt: string | null;
  trail: Array<{ at: string; action: string; by: string | null; note: string }>;
}

export interface CertificateSummaryJson {
  id: string;
  number: string;
  revision: number;
  digest: string;
  issuedAt: string;
  current: boolean;
  supersededBy: { id: string; revision: number } | null;
  revisionReason: string | null;
  lot: { id: string; number: string };
  order: { id: string; number: string };
  pdfUrl: string;
  verifyUrl: string;
}

export interface SwitchingJson {
  state: SwitchingState;
  reason: string;
}

export interface LotQualityJson {
  lot: {
    id: string;
    number: string;
    status: string;
    pieces: number;
    material: string;
    method: string;
    order: { id: string; number: string; aql: number; requiredAttenuation_db: number };
    customer: string;
    predicted_db: number | null;
    frequency_hz: number;
    appliedField_uT: number;
    orientation: Orientation;
    annealed: boolean;
    notAnnealedReason: string | null;
    furnaceRun: string | null;
    holdReason: string | null;
    /** every job has completed its steps through verify */
    throughVerify: boolean;
  };
  plan: SamplingPlanJson | null;
  switching: SwitchingJson;
  progress: LotProgressJson;
  measurements: MeasurementJson[];
  nonconformances: NonconformanceJson[];
  certificates: CertificateSummaryJson[];
  /** accepted under its plan (or by concession) and through verify: a certificate may be issued */
  certifiable: boolean;
  abilities: { measure: boolean; decide: boolean; certify: boolean };
}

export interface QualityQueueRowJson {
  id: string;
  number: string;
  customer: string;
  order: { id: string; number: string };
  material: string;
  pieces: number;
  status: string;
  round: number;
  measured: number;
  failures: number;
  decision: "accepted" | "rejected" | null;
  openNonconformance: string | null;
  certificate: { id: string; number: string; revision: number } | null;
}

/** What a certificate certifies: the digest is taken of its canonical form (shared/quality/digest.ts). */
export interface CertificateContent {
  [key: string]: unknown;
  issuer: { name: string; address: string };
  certificate: { number: string; revision: number; supersedes: { revision: number; digest: string } | null; revisionReason: string | null };
  customer: { organization: string };
  order: { number: string; purchaseOrder: string | null; requiredAttenuation_db: number; aql: number };
  part: { description: string; drawingRevision: string };
  lot: { number: string; quantity: number };
  material: { alloy: string; heats: Array<{ heatNumber: string; supplier: string; millCertificate: string }> };
  formingRoute: string[];
  furnaceRun: { number: string; peakTemperature_c: number; soak_min: number; dewPoint_c: number; coolingRate_c_per_h: number; ranAt: string } | null;
  samplingPlan: { standard: string; inspection: string; codeLetter: string; sampleSize: number; accept: number; reject: number; aql: number };
  measurements: Array<{ serial: string; appliedField_uT: number; insideField_uT: number; frequency_hz: number; orientation: string; probePosition: string; shieldingFactor: number; attenuation_db: number; pass: boolean }>;
  predicted_db: number | null;
  instruments: Array<{ name: string; kind: string; serialNumber: string; calibrationDue: string; lastCalibratedOn: string }>;
  result: { measured: number; failures: number; decision: string; concession: string | null };
  statement: string;
  signer: { name: string; role: string };
  issuedAt: string;
}

export interface CertificateVerificationJson {
  valid: true;
  digest: string;
  number: string;
  revision: number;
  current: boolean;
  supersededBy: { number: string; revision: number; digest: string; issuedAt: string } | null;
  lot: { number: string; quantity: number };
  issuedAt: string;
  content: CertificateContent;
}

export const certificateStatement =
  "We certify that the parts of this lot were made and hydrogen annealed as recorded here, and that the sample measured as listed met the attenuation required by the order under the sampling plan shown. Measured values rule; the design prediction is an estimate shown for comparison.";
