/** Test instruments: the register's request bodies and answers. */
import { z } from "zod";
import type { PersonRef } from "./list";
import type { InstrumentStatus } from "../quality/instruments";

export type { InstrumentStatus };

export const instrumentKinds = ["fluxgate-probe", "gaussmeter-probe", "search-coil", "helmholtz-coil", "signal-source"] as const;
export type InstrumentKind = (typeof instrumentKinds)[number];
export const instrumentKindLabels: Record<InstrumentKind, string> = {
  "fluxgate-probe": "Fluxgate probe",
  "gaussmeter-probe": "Gaussmeter probe",
  "search-coil": "Search coil",
  "helmholtz-coil": "Helmholtz coil set",
  "signal-source": "Signal source",
};
export const instrumentStatusLabels: Record<InstrumentStatus, string> = { "in-service": "In service", "in-calibration": "Out for calibration" };

const text = (what: string, max: number) => z.string({ error: `${what} must be text.` }).trim().max(max, { error: `Keep ${what.toLowerCase()} under ${max} characters.` });
const day = (what: string) => z.iso.date({ error: `Give ${what} as YYYY-MM-DD.` });
const positive = (what: string, max: number) =>
  z.number({ error: `Give ${what} as a number.` }).positive({ error: `${what[0].toUpperCase()}${what.slice(1)} must be more than 0.` }).max(max, { error: `${what[0].toUpperCase()}${what.slice(1)} must be at most ${max}.` });

const details = {
  name: text("The name", 120).min(1, { error: "Give the instrument a name." }),
  serialNumber: text("The serial number", 80).optional(),
  make: text("The make and model", 160).optional(),
  /** fluxgate and gaussmeter probes, signal sources: what it covers, in words */
  range: text("The range", 160).optional(),
  /** search coil: turns; Helmholtz set: turns on each coil */
  turns: z.number({ error: "Give the turns as a whole number." }).int({ error: "Give the turns as a whole number." }).min(1, { error: "Turns must be at least 1." }).max(1_000_000, { error: "Turns must be at most 1 000 000." }).optional(),
  /** search coil: the area of one turn, mm² */
  area_mm2: positive("the coil area", 1e7).optional(),
  /** Helmholtz set: coil radius (= spacing), mm */
  radius_mm: positive("the coil radius", 1e5).optional(),
  notes: text("The notes", 2000).optional(),
};

/** What each kind needs besides a name: the figures the measurement arithmetic uses. */
function kindFigures(v: { kind?: InstrumentKind; turns?: number; area_mm2?: number; radius_mm?: number }, ctx: z.RefinementCtx) {
  if (v.kind === "search-coil") {
    if (v.turns === undefined) ctx.addIssue({ code: "custom", path: ["turns"], message: "A search coil needs its number of turns." });
    if (v.area_mm2 === undefined) ctx.addIssue({ code: "custom", path: ["area_mm2"], message: "A search coil needs the area of one turn (mm²)." });
  }
  if (v.kind === "helmholtz-coil") {
    if (v.turns === undefined) ctx.addIssue({ code: "custom", path: ["turns"], message: "A Helmholtz coil set needs the turns on each coil." });
    if (v.radius_mm === undefined) ctx.addIssue({ code: "custom", path: ["radius_mm"], message: "A Helmholtz coil set needs its coil radius (mm)." });
  }
}

export const instrumentCreateSchema = z
  .object({
    kind: z.enum(instrumentKinds, { error: `The kind must be one of ${instrumentKinds.join(", ")}.` }),
    ...details,
    /** the last day the current calibration covers */
    calibrationDue: day("the calibration due date"),
    lastCalibratedOn: day("the date of the last calibration").optional(),
  })
  .superRefine(kindFigures);
export type InstrumentCreateInput = z.input<typeof instrumentCreateSchema>;

export const instrumentUpdateSchema = z
  .object({
    name: details.name.optional(),
    serialNumber: details.serialNumber.nullable(),
    make: details.make.nullable(),
    range: details.range.nullable(),
    turns: details.turns.nullable(),
    area_mm2: details.area_mm2.nullable(),
    radius_mm: details.radius_mm.nullable(),
    notes: details.notes.nullable(),
    /** a correction of the due date; a new calibration is recorded with its certificate instead */
    calibrationDue: day("the calibration due date").optional(),
  })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { error: "Send at least one field to change.", path: ["name"] });
export type InstrumentUpdateInput = z.input<typeof instrumentUpdateSchema>;

export const instrumentSendSchema = z.object({
  sentOn: day("the day it went out").optional(),
  laboratory: text("The laboratory", 160).optional(),
  note: text("The note", 1000).optional(),
});
export type InstrumentSendInput = z.input<typeof instrumentSendSchema>;

/** The form fields sent with a calibration certificate (multipart: every value is text). */
export const calibrationRecordSchema = z
  .object({
    calibratedOn: day("the calibration date"),
    calibrationDue: day("the next due date"),
    laboratory: text("The laboratory", 160).optional(),
    certificateNumber: text("The certificate number", 80).optional(),
  })
  .refine((v) => v.calibrationDue > v.calibratedOn, { error: "The next due date must be after the calibration date.", path: ["calibrationDue"] });
export type CalibrationRecordInput = z.input<typeof calibrationRecordSchema>;

export const instrumentListQuerySchema = z.object({
  kind: z.enum(instrumentKinds, { error: `kind must be one of ${instrumentKinds.join(", ")}` }).optional(),
  /** "usable": in service and not past due today */
  usable: z.enum(["true", "false"], { error: 'usable must be "true" or "false"' }).optional(),
});

// --- calibration certificates: a PDF or an image, decided by its content ---

export const MAX_CERTIFICATE_BYTES = 20 * 1024 * 1024;
export const certificateKinds = {
  pdf: { label: "PDF", mime: "application/pdf", extensions: ["pdf"] },
  png: { label: "PNG image", mime: "image/png", extensions: ["png"] },
  jpg: { label: "JPEG image", mime: "image/jpeg", extensions: ["jpg", "jpeg"] },
  tif: { label: "TIFF image", mime: "image/tiff", extensions: ["tif", "tiff"] },
  webp: { label: "WebP image", mime: "image/webp", extensions: ["webp"] },
} as const;
export const CERTIFICATE_ACCEPT = Object.values(certificateKinds).flatMap((k) => k.extensions.map((e) => `.${e}`)).join(",");

// --- answers ---

export interface InstrumentJson {
  id: string;
  name: string;
  kind: InstrumentKind;
  /** YYYY-MM-DD, the last day the calibration covers */
  calibrationDue: string;
  status: InstrumentStatus;
  /** past its due date today */
  overdue: boolean;
  /** may be used for a measurement today */
  usable: boolean;
  /** days from today to the due date (negative when overdue) */
  daysUntilDue: number;
  serialNumber: string | null;
  make: string | null;
  range: string | null;
  turns: number | null;
  area_mm2: number | null;
  radius_mm: number | null;
  notes: string | null;
  lastCalibratedOn: string | null;
  /** while out for calibration */
  calibrationSentOn: string | null;
  calibrationLaboratory: string | null;
  /** the current certificate, when one was uploaded */
  certificate: { id: string; filename: string; url: string } | null;
  updatedAt: string;
  abilities: { update: boolean; sendToCalibration: boolean; returnFromCalibration: boolean; recordCalibration: boolean };
}

export interface CalibrationRecordJson {
  id: string;
  calibratedOn: string;
  calibrationDue: string;
  laboratory: string | null;
  certificateNumber: string | null;
  certificate: { id: string; filename: string; contentType: string; sizeBytes: number; sha256: string; url: string } | null;
  recordedBy: PersonRef | null;
  recordedAt: string;
}

export interface InstrumentHistoryEntry {
  at: string;
  action: string;
  label: string;
  actor: PersonRef | null;
  detail: string | null;
}

export interface InstrumentDetailJson extends InstrumentJson {
  calibrations: CalibrationRecordJson[];
  history: InstrumentHistoryEntry[];
}

export const instrumentEventLabels: Record<string, string> = {
  "instrument.created": "Added to the register",
  "instrument.updated": "Details changed",
  "instrument.sent-to-calibration": "Sent out for calibration",
  "instrument.returned-from-calibration": "Back from calibration",
  "instrument.calibration-recorded": "Calibration recorded",
  "instrument.reminder-sent": "Calibration reminder mailed",
};
