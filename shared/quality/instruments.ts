// When a test instrument may be used for a measurement: it is in service (not out for
// calibration) and its calibration is not past due. The due date is the last day it may be used.
// Days are calendar days written YYYY-MM-DD (UTC), compared as text.

/** A reminder mail goes out this many days before a due date; the register flags the same window. */
export const CALIBRATION_REMINDER_DAYS = 14;

export type InstrumentStatus = "in-service" | "in-calibration";

export interface InstrumentCalibrationState {
  status: InstrumentStatus;
  /** YYYY-MM-DD: the last day the calibration covers */
  calibrationDue: string;
}

export const utcDay = (d: Date) => d.toISOString().slice(0, 10);

export function isOverdue(instrument: InstrumentCalibrationState, day: string): boolean {
  return instrument.calibrationDue < day;
}

export function instrumentUsableOn(instrument: InstrumentCalibrationState, day: string): boolean {
  return instrument.status === "in-service" && !isOverdue(instrument, day);
}

/** Why an instrument may not be used on a day, in words; null when it may. */
export function instrumentUnusableReason(instrument: InstrumentCalibrationState & { name: string }, day: string): string | null {
  if (instrument.status === "in-calibration") return `${instrument.name} is out for calibration.`;
  if (isOverdue(instrument, day)) return `${instrument.name}'s calibration was due on ${instrument.calibrationDue}: calibrate it before measuring with it.`;
  return null;
}

/** Whole days from `day` to the due date (negative when overdue). */
export function daysUntilDue(instrument: Pick<InstrumentCalibrationState, "calibrationDue">, day: string): number {
  return Math.round((Date.parse(`${instrument.calibrationDue}T00:00:00Z`) - Date.parse(`${day}T00:00:00Z`)) / 86_400_000);
}
