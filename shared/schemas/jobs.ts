/** Jobs and lots on the shop floor: request bodies and the answers about them. */
import { z } from "zod";
import { MAX_DRAW_STAGES, stepKeys, type PartRole, type ScanAction, type StepKey, type StepStatus } from "../shop-floor/routing";
import { listQuerySchema, type PersonRef } from "./list";

// --- jobs ---

export const jobStatuses = ["released", "in_progress", "on_hold", "completed", "shipped"] as const;
export type JobStatus = (typeof jobStatuses)[number];
export const jobStatusLabels: Record<JobStatus, string> = {
  released: "Not started",
  in_progress: "In work",
  on_hold: "On hold",
  completed: "Finished",
  shipped: "Shipped",
};

const stepKey = z.enum(stepKeys, { error: `the step must be one of ${stepKeys.join(", ")}` });

export const routingUpdateSchema = z.object({
  steps: z
    .array(
      z.object({
        key: stepKey,
        drawStages: z.number({ error: "draw stages must be a whole number" }).int({ error: "draw stages must be a whole number" }).min(1, { error: "at least one draw" }).max(MAX_DRAW_STAGES, { error: `at most ${MAX_DRAW_STAGES} draws` }).optional(),
        processAnneals: z.number({ error: "process anneals must be a whole number" }).int({ error: "process anneals must be a whole number" }).min(0, { error: "cannot be negative" }).max(MAX_DRAW_STAGES - 1).optional(),
        note: z.string({ error: "the note must be text" }).trim().max(300, { error: "keep the note under 300 characters" }).optional(),
      }),
      { error: "steps must be a list" },
    )
    .min(1, { error: "a routing needs its steps" })
    .max(stepKeys.length, { error: `at most ${stepKeys.length} steps` }),
});
export type RoutingUpdateInput = z.input<typeof routingUpdateSchema>;

export const jobListQuerySchema = listQuerySchema(["dueDate", "code", "createdAt"] as const, "dueDate").extend({
  step: stepKey.optional(),
  status: z.enum(jobStatuses, { error: `status must be one of ${jobStatuses.join(", ")}` }).optional(),
  late: z.enum(["true", "false"], { error: 'late must be "true" or "false"' }).optional(),
  lotId: z.uuid({ error: "lotId must be a lot's id" }).optional(),
  orderId: z.uuid({ error: "orderId must be an order's id" }).optional(),
});
export type JobListQuery = z.input<typeof jobListQuerySchema>;

/** Who recorded a step's start or completion, where and when. */
export interface ScanRef {
  at: string;
  by: PersonRef | null;
  station: string;
}

export interface JobStepJson {
  key: StepKey;
  label: string;
  status: StepStatus;
  /** the value of the step's own barcode on the traveler */
  barcode: string;
  drawStages?: number;
  processAnneals?: number;
  note?: string;
  started: ScanRef | null;
  completed: ScanRef | null;
}

export interface JobPartJson {
  /** 1 = innermost layer */
  layer: number;
  role: PartRole;
  /** "Layer 2 box lid, bent" */
  description: string;
  method: "drawn" | "rolled" | "bent";
  materialId: string;
  materialName: string;
  thickness_mm: number;
  /** pieces this job makes */
  quantity: number;
  blank: { kind: "disc"; diameter_mm: number } | { kind: "rectangle" | "cross"; length_mm: number; width_mm: number };
  area_mm2: number;
  /** per piece, when the alloy's density is known */
  mass_kg: number | null;
  drawStages: number;
  processAnneals: number;
  weldLength_mm: number;
}

export interface JobJson {
  id: string;
  /** the value printed in the job's barcode */
  code: string;
  status: JobStatus;
  steps: JobStepJson[];
  lotId: string;
  lot: { id: string; number: string; onHold: boolean; holdReason: string | null; furnaceRunId: string | null };
  order: { id: string; number: string; organization: { id: string; name: string } };
  part: JobPartJson;
  /** the piece an end cap or collar is welded to */
  assemblyJob: { id: string; code: string } | null;
  /** end caps and collars welded to this piece */
  components: Array<{ id: string; code: string; status: JobStatus }>;
  heat: { id: string; heatNumber: string } | null;
  furnaceRun: { id: string; number: string } | null;
  dueDate: string;
  late: boolean;
  /** the scan that moves the job on, or null when finished */
  next: { step: StepKey; action: ScanAction } | null;
  completedAt: string | null;
  abilities: { scan: boolean; editRouting: boolean; print: boolean };
}

export interface JobSummaryJson {
  id: string;
  code: string;
  status: JobStatus;
  lotId: string;
  lotNumber: string;
  orderId: string;
  orderNumber: string;
  description: string;
  quantity: number;
  /** the step it is at (null when finished) and whether that step has started */
  step: StepKey | null;
  stepStarted: boolean;
  dueDate: string;
  late: boolean;
}

// --- lots ---

export const lotStatuses = ["in_work", "ready_for_anneal", "annealed", "on_hold", "finished", "shipped"] as const;
export type LotStatus = (typeof lotStatuses)[number];
export const lotStatusLabels: Record<LotStatus, string> = {
  in_work: "In work",
  ready_for_anneal: "Waiting for a furnace load",
  annealed: "Annealed",
  on_hold: "On hold",
  finished: "Packed, ready to ship",
  shipped: "Shipped",
};

const reason = z
  .string({ error: "Give the reason." })
  .trim()
  .min(3, { error: "Give the reason (a few words at least)." })
  .max(1000, { error: "Keep the reason under 1000 characters." });

export const lotHoldSchema = z.object({ reason });
export const lotHoldReleaseSchema = z.object({
  reason,
  /** send the lot back to wait for another furnace load (the out-of-window run stays on record) */
  reanneal: z.boolean({ error: "reanneal must be true or false" }).default(false),
});
export type LotHoldInput = z.input<typeof lotHoldSchema>;
export type LotHoldReleaseInput = z.input<typeof lotHoldReleaseSchema>;

export const lotListQuerySchema = listQuerySchema(["createdAt", "number", "dueDate"] as const, "createdAt").extend({
  status: z.enum(lotStatuses, { error: `status must be one of ${lotStatuses.join(", ")}` }).optional(),
  orderId: z.uuid({ error: "orderId must be an order's id" }).optional(),
});
export type LotListQuery = z.input<typeof lotListQuerySchema>;

export interface HoldJson {
  reason: string;
  at: string;
  by: PersonRef | null;
}

export interface LotHeatJson {
  id: string;
  heatNumber: string;
  supplier: string;
  thickness_mm: number;
  millCertificate: boolean;
}

export interface LotJson {
  id: string;
  number: string;
  status: LotStatus;
  order: { id: string; number: string; organization: { id: string; name: string } };
  material: { id: string; name: string };
  /** finished pieces (end caps and collars are counted with the piece they are welded to) */
  pieces: number;
  /** the furnace load, kg */
  mass_kg: number;
  dueDate: string;
  late: boolean;
  hold: HoldJson | null;
  readyForAnneal: boolean;
  furnaceRun: { id: string; number: string; withinWindow: boolean } | null;
  /** every material heat in the lot */
  heats: LotHeatJson[];
  jobs: JobSummaryJson[];
  shipment: { id: string; carrier: string; trackingNumber: string; shippedAt: string } | null;
  createdAt: string;
  abilities: { hold: boolean; releaseHold: boolean; label: boolean };
}

export interface LotSummaryJson {
  id: string;
  number: string;
  status: LotStatus;
  orderId: string;
  orderNumber: string;
  organizationName: string;
  materialId: string;
  pieces: number;
  mass_kg: number;
  dueDate: string;
  late: boolean;
  holdReason: string | null;
  createdAt: string;
}

/** Paper size of a traveler or label download (`?paper=`); the default is the signed-in person's organisation's. */
export const paperQuerySchema = z.object({
  paper: z.enum(["A4", "LETTER"], { error: 'paper must be "A4" or "LETTER"' }).optional(),
});
