import { daysUntilDue, instrumentUsableOn, isOverdue, utcDay } from "../../shared/quality/instruments";
import {
  instrumentEventLabels, type CalibrationRecordJson, type InstrumentDetailJson, type InstrumentHistoryEntry, type InstrumentJson,
} from "../../shared/schemas/instrument";
import type { Event, Instrument, InstrumentCalibration, StoredFile, User } from "../models";
import { instrumentPolicy, instrumentStatusAllows } from "../policies/instrument";
import { abilities, type Actor } from "../policies/utils";

const certificateUrl = (instrumentId: string, fileId: string) => `/api/instruments/${instrumentId}/certificates/${fileId}`;

/** The register's row: the contract's id, name, kind and calibrationDue, then the rest. `today` is YYYY-MM-DD (UTC). */
export function presentInstrument(i: Instrument, actor: Actor, today = utcDay(new Date())): InstrumentJson {
  const can = abilities(actor, instrumentPolicy, i);
  const file = i.currentCertificate;
  return {
    id: i.id,
    name: i.name,
    kind: i.kind,
    calibrationDue: i.calibrationDue,
    status: i.status,
    overdue: isOverdue(i, today),
    usable: instrumentUsableOn(i, today),
    daysUntilDue: daysUntilDue(i, today),
    serialNumber: i.serialNumber,
    make: i.make,
    range: i.range,
    turns: i.turns,
    area_mm2: i.area_mm2,
    radius_mm: i.radius_mm,
    notes: i.notes,
    lastCalibratedOn: i.lastCalibratedOn,
    calibrationSentOn: i.calibrationSentOn,
    calibrationLaboratory: i.calibrationLaboratory,
    certificate: file ? { id: file.id, filename: file.filename, url: certificateUrl(i.id, file.id) } : null,
    updatedAt: i.updatedAt.toISOString(),
    abilities: {
      update: can.update,
      sendToCalibration: can.sendToCalibration && instrumentStatusAllows.sendToCalibration(i),
      returnFromCalibration: can.returnFromCalibration && instrumentStatusAllows.returnFromCalibration(i),
      recordCalibration: can.recordCalibration && instrumentStatusAllows.recordCalibration(i),
    },
  };
}

export function presentCalibration(c: InstrumentCalibration, people: Map<string, User>): CalibrationRecordJson {
  const file: StoredFile | null | undefined = c.file;
  const by = c.recordedById ? people.get(c.recordedById) : undefined;
  return {
    id: c.id,
    calibratedOn: c.calibratedOn,
    calibrationDue: c.calibrationDue,
    laboratory: c.laboratory,
    certificateNumber: c.certificateNumber,
    certificate: file ? { id: file.id, filename: file.filename, contentType: file.contentType, sizeBytes: file.sizeBytes, sha256: file.sha256, url: certificateUrl(c.instrumentId, file.id) } : null,
    recordedBy: by ? { id: by.id, name: by.name } : null,
    recordedAt: c.createdAt.toISOString(),
  };
}

// the fields of a correction as the instrument's page names them
const fieldWords: Record<string, string> = {
  name: "name", serialNumber: "serial number", make: "make and model", range: "range", turns: "turns", area_mm2: "area of one turn", radius_mm: "coil radius", notes: "notes",
};

function historyDetail(e: Event): string | null {
  const d = e.data as Record<string, unknown>;
  switch (e.action) {
    case "instrument.sent-to-calibration":
      return [d.sentOn, d.laboratory].filter((x) => typeof x === "string" && x).join(", ") || null;
    case "instrument.returned-from-calibration":
    case "instrument.calibration-recorded":
      return typeof d.calibrationDue === "string" ? `calibrated ${String(d.calibratedOn)}, next due ${d.calibrationDue}` : null;
    case "instrument.updated":
      return Array.isArray(d.fields) ? d.fields.map((f) => (f === "calibrationDue" && typeof d.calibrationDue === "string" ? `calibration due date, now ${d.calibrationDue}` : (fieldWords[String(f)] ?? String(f)))).join(", ") : null;
    case "instrument.reminder-sent":
      return typeof d.calibrationDue === "string" ? `due ${d.calibrationDue}` : null;
    default:
      return null;
  }
}

export function presentInstrumentDetail(i: Instrument, parts: { calibrations: InstrumentCalibration[]; events: Event[]; people: Map<string, User> }, actor: Actor, today?: string): InstrumentDetailJson {
  const history: InstrumentHistoryEntry[] = parts.events
    .filter((e) => e.action in instrumentEventLabels)
    .map((e) => {
      const who = e.actorId ? parts.people.get(e.actorId) : undefined;
      return { at: e.createdAt.toISOString(), action: e.action, label: instrumentEventLabels[e.action], actor: who ? { id: who.id, name: who.name } : null, detail: historyDetail(e) };
    });
  return { ...presentInstrument(i, actor, today), calibrations: parts.calibrations.map((c) => presentCalibration(c, parts.people)), history };
}
