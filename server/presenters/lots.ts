import { documentNumber } from "../../shared/schemas/documents";
import type { JobSummaryJson, LotJson, LotSummaryJson } from "../../shared/schemas/jobs";
import type { StepKey } from "../../shared/shop-floor/routing";
import { lotPolicy } from "../policies/shop-floor";
import { abilities, type Actor } from "../policies/utils";
import type { LotHeatRow, LotJobRow, LotView } from "../services/lotViews";
import { isLate, jobStatusOf, partDescription } from "./jobs";

type LotContext = { number: string; id: string; order_id: string; order_number: number; hold_reason: string | null; shipment_id: string | null };

export function presentJobSummary(j: LotJobRow, lot: LotContext, now = new Date()): JobSummaryJson {
  return {
    id: j.id,
    code: j.code,
    status: jobStatusOf({ ...j, hold_reason: lot.hold_reason, shipment_id: lot.shipment_id }),
    lotId: lot.id,
    lotNumber: lot.number,
    orderId: lot.order_id,
    orderNumber: documentNumber("order", lot.order_number),
    description: partDescription(j as Parameters<typeof partDescription>[0]),
    quantity: j.quantity,
    step: j.current_step as StepKey | null,
    stepStarted: j.step_started_at !== null,
    dueDate: j.due_date,
    late: isLate(j.due_date, j.completed_at !== null, now),
  };
}

export function presentLot(v: LotView, jobs: LotJobRow[], heats: LotHeatRow[], actor: Actor, materialName: (id: string) => string, now = new Date()): LotJson {
  const can = abilities(actor, lotPolicy, { organizationId: v.organization_id });
  const finished = v.status === "finished" || v.status === "shipped";
  return {
    id: v.id,
    number: v.number,
    status: v.status,
    order: { id: v.order_id, number: documentNumber("order", v.order_number), organization: { id: v.organization_id, name: v.organization_name } },
    material: { id: v.material_id, name: materialName(v.material_id) },
    pieces: v.pieces,
    mass_kg: v.mass_kg,
    dueDate: v.due_date,
    late: isLate(v.due_date, finished, now),
    hold: v.hold_reason ? { reason: v.hold_reason, at: new Date(v.held_at!).toISOString(), by: v.held_by_id ? { id: v.held_by_id, name: v.held_by_name ?? "" } : null } : null,
    readyForAnneal: v.status === "ready_for_anneal",
    furnaceRun: v.furnace_run_id ? { id: v.furnace_run_id, number: v.furnace_run_number ?? "", withinWindow: !!v.furnace_run_within } : null,
    heats: heats.map((h) => ({ id: h.id, heatNumber: h.heat_number, supplier: h.supplier, thickness_mm: h.thickness_mm, millCertificate: h.mill_certificate_file_id !== null })),
    jobs: jobs.map((j) => presentJobSummary(j, v, now)),
    shipment: v.shipment_id ? { id: v.shipment_id, carrier: v.carrier ?? "", trackingNumber: v.tracking_number ?? "", shippedAt: new Date(v.shipped_at!).toISOString() } : null,
    createdAt: new Date(v.created_at).toISOString(),
    abilities: {
      hold: can.hold && !v.hold_reason && !v.shipment_id,
      releaseHold: can.releaseHold && !!v.hold_reason,
      label: can.label,
    },
  };
}

export function presentLotSummary(v: LotView, now = new Date()): LotSummaryJson {
  return {
    id: v.id,
    number: v.number,
    status: v.status,
    orderId: v.order_id,
    orderNumber: documentNumber("order", v.order_number),
    organizationName: v.organization_name,
    materialId: v.material_id,
    pieces: v.pieces,
    mass_kg: v.mass_kg,
    dueDate: v.due_date,
    late: isLate(v.due_date, v.status === "finished" || v.status === "shipped", now),
    holdReason: v.hold_reason,
    createdAt: new Date(v.created_at).toISOString(),
  };
}
