import { documentNumber } from "../../shared/schemas/documents";
import type { JobJson, JobStatus, JobStepJson, ScanRef } from "../../shared/schemas/jobs";
import type { ScanEventJson } from "../../shared/schemas/scans";
import { stepBarcode } from "../../shared/shop-floor/codes";
import { isoDay } from "../../shared/shop-floor/due-dates";
import { nextScan, roleLabels, stepLabels, stepStatuses } from "../../shared/shop-floor/routing";
import { abilities, type Actor } from "../policies/utils";
import { jobPolicy } from "../policies/shop-floor";
import type { JobView } from "../services/jobViews";

const methodWords = { drawn: "deep drawn", rolled: "rolled", bent: "bent" } as const;

/** "Layer 2 box lid, bent" */
export const partDescription = (p: { layer: number; role: keyof typeof roleLabels; method: keyof typeof methodWords }) =>
  `Layer ${p.layer + 1} ${roleLabels[p.role]}, ${methodWords[p.method]}`;

export function jobStatusOf(j: { completed_at: Date | string | null; step_index: number; step_started_at: Date | string | null; hold_reason: string | null; shipment_id: string | null }): JobStatus {
  if (j.shipment_id) return "shipped";
  if (j.hold_reason && !j.completed_at) return "on_hold";
  if (j.completed_at) return "completed";
  return j.step_index > 0 || j.step_started_at ? "in_progress" : "released";
}

export const isLate = (dueDate: string, completed: boolean, now = new Date()) => !completed && dueDate < isoDay(now);

export function presentJob(v: JobView, actor: Actor, materialName: (id: string) => string, now = new Date()): JobJson {
  const progress = { routing: v.routing, stepIndex: v.step_index, started: v.step_started_at !== null };
  const statuses = stepStatuses(progress);
  const ref = (stepIndex: number, action: "start" | "complete"): ScanRef | null => {
    const s = v.scans.find((x) => x.stepIndex === stepIndex && x.action === action);
    return s ? { at: new Date(s.at).toISOString(), by: s.operatorId ? { id: s.operatorId, name: s.operatorName ?? "" } : null, station: s.station } : null;
  };
  const steps: JobStepJson[] = v.routing.map((step, i) => ({
    key: step.key,
    label: stepLabels[step.key],
    status: statuses[i],
    barcode: stepBarcode(v.code, step.key),
    ...(step.drawStages !== undefined ? { drawStages: step.drawStages } : {}),
    ...(step.processAnneals !== undefined ? { processAnneals: step.processAnneals } : {}),
    ...(step.note ? { note: step.note } : {}),
    started: ref(i, "start"),
    completed: ref(i, "complete"),
  }));
  const owned = { organizationId: v.organization_id };
  const can = abilities(actor, jobPolicy, owned);
  const status = jobStatusOf(v);
  return {
    id: v.id,
    code: v.code,
    status,
    steps,
    lotId: v.lot_id,
    lot: { id: v.lot_id, number: v.lot_number, onHold: v.hold_reason !== null, holdReason: v.hold_reason, furnaceRunId: v.lot_furnace_run_id },
    order: { id: v.order_id, number: documentNumber("order", v.order_number), organization: { id: v.organization_id, name: v.organization_name } },
    part: {
      layer: v.layer + 1,
      role: v.role,
      description: partDescription(v),
      method: v.method,
      materialId: v.material_id,
      materialName: materialName(v.material_id),
      thickness_mm: v.thickness_mm,
      quantity: v.quantity,
      blank: v.blank,
      area_mm2: v.area_mm2,
      mass_kg: v.mass_kg,
      drawStages: v.draw_stages,
      processAnneals: v.process_anneals,
      weldLength_mm: v.weld_length_mm,
    },
    assemblyJob: v.assembly_job_id ? { id: v.assembly_job_id, code: v.assembly_code ?? "" } : null,
    components: v.components.map((c) => ({ id: c.id, code: c.code, status: c.completed ? "completed" : c.started ? "in_progress" : "released" })),
    heat: v.heat_id ? { id: v.heat_id, heatNumber: v.heat_number ?? "" } : null,
    furnaceRun: v.furnace_run_id ? { id: v.furnace_run_id, number: v.furnace_run_number ?? "" } : null,
    dueDate: v.due_date,
    late: isLate(v.due_date, v.completed_at !== null, now),
    next: status === "completed" || status === "shipped" ? null : nextScan(progress),
    completedAt: v.completed_at ? new Date(v.completed_at).toISOString() : null,
    abilities: {
      scan: can.scan && v.completed_at === null && v.hold_reason === null,
      editRouting: can.editRouting && v.step_index === 0 && v.step_started_at === null,
      print: can.print,
    },
  };
}

export interface ScanRow {
  id: string | number;
  job_id: string;
  step: string;
  action: string;
  station: string;
  operator_id: string | null;
  operator_name: string | null;
  idempotency_key: string | null;
  data: Record<string, unknown>;
  scanned_at: Date | string;
  created_at: Date | string;
}

export function presentScanEvent(s: ScanRow, code: string): ScanEventJson {
  return {
    id: String(s.id),
    jobId: s.job_id,
    code,
    step: s.step as ScanEventJson["step"],
    action: s.action as ScanEventJson["action"],
    station: s.station,
    operator: s.operator_id ? { id: s.operator_id, name: s.operator_name ?? "" } : null,
    scannedAt: new Date(s.scanned_at).toISOString(),
    recordedAt: new Date(s.created_at).toISOString(),
    idempotencyKey: s.idempotency_key,
    data: s.data as ScanEventJson["data"],
  };
}
