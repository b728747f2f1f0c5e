/**
 * POST /api/scans: a step's start or completion at a station. `step` is a step key or the step's
 * own barcode from the traveler (J-1042-FORM). An idempotency key (body field or the
 * `Idempotency-Key` header) makes a replayed offline scan an exact repeat: 200 with the event
 * first recorded. Without a key, a scan of what is already recorded is a repeat too.
 */
import { z } from "zod";
import { parseStepBarcode } from "../shop-floor/codes";
import { MAX_DRAW_STAGES, stepKeys, type ScanAction, type StepKey } from "../shop-floor/routing";
import type { JobJson } from "./jobs";
import type { PersonRef } from "./list";

export const IDEMPOTENCY_KEY = /^[A-Za-z0-9._:-]{8,100}$/;
/** how far back an offline scan's own time is believed (older ones are recorded at their arrival) */
export const MAX_OFFLINE_AGE_DAYS = 14;

export const weldInspectionSchema = z.object({
  result: z.enum(["pass", "fail"], { error: 'the weld inspection result is "pass" or "fail"' }),
  method: z.enum(["visual", "dye-penetrant", "leak-test"], { error: 'method is "visual", "dye-penetrant" or "leak-test"' }).default("visual"),
});

export const scanRequestSchema = z.object({
  code: z.string({ error: "Scan or type the job's code." }).trim().min(1, { error: "Scan or type the job's code." }).max(40, { error: "That is not a job code." }),
  step: z
    .string({ error: "Choose the step." })
    .trim()
    .min(1, { error: "Choose the step." })
    .max(40)
    .refine((s) => (stepKeys as readonly string[]).includes(s.toLowerCase()) || parseStepBarcode(s) !== null, {
      error: `the step must be one of ${stepKeys.join(", ")} or a step barcode from the traveler`,
    }),
  action: z.enum(["start", "complete"], { error: 'action must be "start" or "complete"' }),
  station: z.string({ error: "Name the station (the device or machine)." }).trim().min(1, { error: "Name the station (the device or machine)." }).max(60, { error: "Keep the station name under 60 characters." }),
  idempotencyKey: z.string().regex(IDEMPOTENCY_KEY, { error: "the idempotency key is 8–100 letters, digits or . _ : -" }).optional(),
  /** when the scan was made, for scans queued on a device while offline */
  scannedAt: z.iso.datetime({ offset: true, error: "scannedAt must be an ISO date-time" }).optional(),
  /** material issue: the heat number on the sheet */
  heatNumber: z.string({ error: "the heat number must be text" }).trim().min(1, { error: "give the heat number from the sheet" }).max(40).optional(),
  /** form: draws done on the press */
  drawStagesDone: z.number({ error: "draw stages done must be a whole number" }).int({ error: "draw stages done must be a whole number" }).min(0).max(MAX_DRAW_STAGES + 4).optional(),
  processAnnealsDone: z.number({ error: "process anneals done must be a whole number" }).int().min(0).max(MAX_DRAW_STAGES).optional(),
  /** weld: the inspection of the seams and corners */
  weldInspection: weldInspectionSchema.optional(),
  note: z.string({ error: "the note must be text" }).trim().max(500, { error: "keep the note under 500 characters" }).optional(),
});
export type ScanRequest = z.input<typeof scanRequestSchema>;
export type ScanInput = z.output<typeof scanRequestSchema>;

/** The step data a scan carried, as recorded. */
export interface ScanData {
  heatNumber?: string;
  heatId?: string;
  drawStagesDone?: number;
  processAnnealsDone?: number;
  weldInspection?: { result: "pass" | "fail"; method: string };
  furnaceRunId?: string;
  note?: string;
}

/** One recorded scan event. */
export interface ScanEventJson {
  id: string;
  jobId: string;
  code: string;
  step: StepKey;
  action: ScanAction;
  station: string;
  operator: PersonRef | null;
  /** when it happened at the station */
  scannedAt: string;
  /** when the server recorded it */
  recordedAt: string;
  idempotencyKey: string | null;
  data: ScanData;
}

/** The answer of POST /api/scans: the event (new, or the one already recorded) and the job as it now stands. */
export interface ScanJson {
  /** true when nothing new was recorded (status 200) */
  repeat: boolean;
  event: ScanEventJson;
  job: JobJson;
}
