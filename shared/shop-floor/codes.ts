/**
 * The values printed in barcodes and on labels. Capital letters, digits and hyphens only: every
 * keyboard-wedge scanner types them the same on any keyboard layout, and Code 128 carries them.
 *   job            J-1042          (job number sequence)
 *   a job's step   J-1042-FORM     (printed beside the step on the traveler)
 *   lot            L26-1007        (two-digit year of release, lot number sequence)
 *   furnace run    FR-1003
 */
import { stepKeys, type StepKey } from "./routing";

export const jobCode = (n: number) => `J-${n}`;
export const lotNumber = (n: number, releasedAt: Date) => `L${String(releasedAt.getUTCFullYear() % 100).padStart(2, "0")}-${n}`;
export const furnaceRunNumber = (n: number) => `FR-${n}`;
export const stepBarcode = (code: string, step: StepKey) => `${code}-${step.toUpperCase()}`;

const JOB = /^J-\d{1,9}$/;
const STEP = new RegExp(`^(J-\\d{1,9})-(${stepKeys.map((k) => k.toUpperCase()).join("|")})$`);

/** A code as a scanner or a person typed it: trimmed, upper case (scanners may send lower case). */
export const normalizeCode = (text: string) => text.trim().toUpperCase();

export const isJobCode = (text: string) => JOB.test(normalizeCode(text));

/** A step barcode's job code and step, or null. */
export function parseStepBarcode(text: string): { code: string; step: StepKey } | null {
  const m = STEP.exec(normalizeCode(text));
  return m ? { code: m[1], step: m[2].toLowerCase() as StepKey } : null;
}
