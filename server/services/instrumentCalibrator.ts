import type { Transaction } from "sequelize";
import { utcDay } from "../../shared/quality/instruments";
import { certificateKinds, MAX_CERTIFICATE_BYTES, type CalibrationRecordInput, type InstrumentSendInput } from "../../shared/schemas/instrument";
import { AppError, ConflictError, ValidationError } from "../errors";
import type { Upload } from "../files/receive";
import { badFilename, sniffUpload } from "../files/sniff";
import { sha256File, type FileStore } from "../files/store";
import { Instrument, InstrumentCalibration, StoredFile, recordEvent } from "../models";
import { instrumentStatusAllows } from "../policies/instrument";
import type { Actor } from "../policies/utils";

/** Sends an in-service instrument out for calibration (locked by the caller): it may not be used until it is back. */
export async function instrumentSender(props: { actor: Actor; instrument: Instrument; input: InstrumentSendInput; ip: string | null; transaction: Transaction; now?: Date }): Promise<Instrument> {
  const { actor, instrument, input, transaction } = props;
  if (!instrumentStatusAllows.sendToCalibration(instrument)) throw ConflictError("INSTRUMENT_IN_CALIBRATION", `${instrument.name} is already out for calibration.`);
  const today = utcDay(props.now ?? new Date());
  const sentOn = input.sentOn ?? today;
  if (sentOn > today) throw ValidationError({ sentOn: "The day it went out cannot be in the future." });
  instrument.status = "in-calibration";
  instrument.calibrationSentOn = sentOn;
  instrument.calibrationLaboratory = input.laboratory || null;
  await instrument.save({ transaction });
  await recordEvent({ actor, action: "instrument.sent-to-calibration", subject: { type: "instrument", id: instrument.id }, data: { sentOn, laboratory: instrument.calibrationLaboratory, note: input.note || null }, ip: props.ip }, transaction);
  return instrument;
}

interface CheckedCertificate extends Upload {
  mime: string;
  sha256: string;
}

/** One calibration certificate, a PDF or an image by its content, at most 20 MB, with a plain name. */
export async function checkCertificate(uploads: Upload[]): Promise<CheckedCertificate> {
  if (uploads.length === 0) throw ValidationError({ file: "choose the calibration certificate (PDF or image)" });
  if (uploads.length > 1) throw ValidationError({ file: "send one certificate at a time" });
  const [u] = uploads;
  const nameProblem = badFilename(u.originalname);
  if (nameProblem) throw ValidationError({ file: nameProblem });
  if (u.size === 0) throw ValidationError({ file: `${u.originalname} is empty` });
  if (u.size > MAX_CERTIFICATE_BYTES) throw new AppError(413, "FILE_TOO_LARGE", `${u.originalname} is larger than 20 MB.`, { file: "is larger than 20 MB" });
  const sniffed = await sniffUpload(u.path, u.originalname, certificateKinds, "a PDF or image (PNG, JPEG, TIFF, WebP) certificate");
  if (!sniffed.ok) throw ValidationError({ file: `${u.originalname}: ${sniffed.reason}` }, "This file cannot be kept as a calibration certificate.");
  return { ...u, mime: sniffed.mime, sha256: await sha256File(u.path) };
}

/**
 * Records a calibration with its certificate (instrument locked by the caller): the certificate is
 * kept in the store, the record is added to the history, and the instrument takes the new due date
 * and is in service again. `returning`: it comes back from the laboratory (it must be out); else it
 * is calibrated in place (it must be in service). If the transaction fails the kept file is removed.
 */
export async function calibrationRecorder(props: {
  actor: Actor;
  instrument: Instrument;
  input: CalibrationRecordInput;
  certificate: CheckedCertificate;
  returning: boolean;
  store: FileStore;
  ip: string | null;
  transaction: Transaction;
  now?: Date;
}): Promise<Instrument> {
  const { actor, instrument, input, certificate, transaction } = props;
  if (props.returning && !instrumentStatusAllows.returnFromCalibration(instrument)) {
    throw ConflictError("INSTRUMENT_NOT_OUT", `${instrument.name} is not out for calibration; record the calibration instead.`);
  }
  if (!props.returning && !instrumentStatusAllows.recordCalibration(instrument)) {
    throw ConflictError("INSTRUMENT_IN_CALIBRATION", `${instrument.name} is out for calibration; record it as back from calibration.`);
  }
  const today = utcDay(props.now ?? new Date());
  if (input.calibratedOn > today) throw ValidationError({ calibratedOn: "The calibration date cannot be in the future." });
  if (instrument.lastCalibratedOn && input.calibratedOn < instrument.lastCalibratedOn) {
    throw ValidationError({ calibratedOn: `The last calibration on record is of ${instrument.lastCalibratedOn}; this one cannot be older.` });
  }
  if (input.calibrationDue < today) throw ValidationError({ calibrationDue: "The next due date has already passed: check the certificate's dates." });

  const key = await props.store.keep(certificate.path);
  try {
    const file = await StoredFile.create(
      { organizationId: null, uploadedById: actor.id, purpose: "calibration-certificate", filename: certificate.originalname, contentType: certificate.mime, sizeBytes: certificate.size, sha256: certificate.sha256, storageKey: key },
      { transaction },
    );
    await InstrumentCalibration.create(
      { instrumentId: instrument.id, calibratedOn: input.calibratedOn, calibrationDue: input.calibrationDue, laboratory: input.laboratory || instrument.calibrationLaboratory || null, certificateNumber: input.certificateNumber || null, storedFileId: file.id, recordedById: actor.id },
      { transaction },
    );
    instrument.status = "in-service";
    instrument.calibrationDue = input.calibrationDue;
    instrument.lastCalibratedOn = input.calibratedOn;
    instrument.calibrationSentOn = null;
    instrument.calibrationLaboratory = null;
    instrument.currentCertificateId = file.id;
    instrument.reminderSentFor = null;
    await instrument.save({ transaction });
    instrument.currentCertificate = file;
    await recordEvent(
      {
        actor,
        action: props.returning ? "instrument.returned-from-calibration" : "instrument.calibration-recorded",
        subject: { type: "instrument", id: instrument.id },
        data: { calibratedOn: input.calibratedOn, calibrationDue: input.calibrationDue, certificateNumber: input.certificateNumber || null, fileId: file.id, filename: file.filename, sha256: file.sha256 },
        ip: props.ip,
      },
      transaction,
    );
    return instrument;
  } catch (err) {
    await props.store.remove(key);
    throw err;
  }
}
