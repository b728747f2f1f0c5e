import { CALIBRATION_REMINDER_DAYS } from "../../../shared/quality/instruments";
import type { InstrumentJson } from "../../api/instruments";

/**
 * Where an instrument stands with its calibration, in words first (the colour only repeats it):
 * out at the laboratory, past due (refused for measurements), due within the reminder window, or fine.
 */
export type DueState = "out" | "overdue" | "due-soon" | "in-date";

export interface DueWords {
  state: DueState;
  /** the short label of the state */
  label: string;
  /** what it means for today's work */
  detail: string;
}

const days = (n: number) => `${n} ${n === 1 ? "day" : "days"}`;

export function dueWords(i: Pick<InstrumentJson, "status" | "overdue" | "daysUntilDue" | "calibrationDue" | "calibrationSentOn" | "calibrationLaboratory">): DueWords {
  if (i.status === "in-calibration") {
    const where = [i.calibrationSentOn ? `since ${i.calibrationSentOn}` : null, i.calibrationLaboratory ? `at ${i.calibrationLaboratory}` : null].filter(Boolean).join(" ");
    return { state: "out", label: "Out for calibration", detail: `Not usable until it is back${where ? ` (out ${where})` : ""}.` };
  }
  if (i.overdue) {
    return { state: "overdue", label: "Overdue", detail: `Due ${i.calibrationDue}, ${days(-i.daysUntilDue)} ago: cannot be used in measurements until calibrated.` };
  }
  if (i.daysUntilDue <= CALIBRATION_REMINDER_DAYS) {
    return { state: "due-soon", label: i.daysUntilDue === 0 ? "Due today" : `Due in ${days(i.daysUntilDue)}`, detail: `Usable through ${i.calibrationDue}; book its calibration (a reminder mail goes to the quality inspectors).` };
  }
  return { state: "in-date", label: "In date", detail: `Usable through ${i.calibrationDue}.` };
}

/** The figures the measurement arithmetic takes from the register, in words: "200 turns, 314.2 mm² per turn". */
export function figuresWords(i: Pick<InstrumentJson, "kind" | "turns" | "area_mm2" | "radius_mm" | "range">): string {
  const n = (x: number) => String(+x.toPrecision(6));
  if (i.kind === "search-coil") return [i.turns !== null ? `${i.turns} turns` : null, i.area_mm2 !== null ? `${n(i.area_mm2)} mm² per turn` : null].filter(Boolean).join(", ") || "—";
  if (i.kind === "helmholtz-coil") return [i.turns !== null ? `${i.turns} turns per coil` : null, i.radius_mm !== null ? `radius ${n(i.radius_mm)} mm` : null].filter(Boolean).join(", ") || "—";
  return i.range ?? "—";
}
