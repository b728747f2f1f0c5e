import type { Sequelize, Transaction } from "sequelize";
import { jsonRows, prepared } from "../db/prepared";
import type { JobPartJson } from "../../shared/schemas/jobs";
import type { PartRole, RoutingStep, ScanAction } from "../../shared/shop-floor/routing";

// What the job page, the scan station and the scan's answer show about one job, read in one
// statement: the job, its lot, order and customer, heat, furnace run, the piece it is welded to,
// its own end caps or collars, and who recorded each step where and when.

export interface JobView {
  id: string;
  code: string;
  order_id: string;
  lot_id: string;
  layer: number;
  role: PartRole;
  method: "drawn" | "rolled" | "bent";
  material_id: string;
  thickness_mm: number;
  quantity: number;
  finished_piece: boolean;
  blank: JobPartJson["blank"];
  area_mm2: number;
  mass_kg: number | null;
  draw_stages: number;
  process_anneals: number;
  weld_length_mm: number;
  routing: RoutingStep[];
  step_index: number;
  /** ISO text (the view is read as json rows) */
  step_started_at: string | null;
  due_date: string;
  completed_at: string | null;
  heat_id: string | null;
  heat_number: string | null;
  furnace_run_id: string | null;
  furnace_run_number: string | null;
  lot_number: string;
  hold_reason: string | null;
  lot_furnace_run_id: string | null;
  lot_furnace_run_number: string | null;
  shipment_id: string | null;
  order_number: number;
  organization_id: string;
  organization_name: string;
  assembly_job_id: string | null;
  assembly_code: string | null;
  components: Array<{ id: string; code: string; completed: boolean; started: boolean }>;
  scans: Array<{ stepIndex: number; action: ScanAction; at: string; station: string; operatorId: string | null; operatorName: string | null }>;
}

/** The view's statement; callers add columns, joins and the condition. */
export const jobViewSql = (p: { columns?: string; joins?: string; where: string }) => `
select${p.columns ? ` ${p.columns},` : ""} j.id, j.code, j.order_id, j.lot_id, j.layer, j.role, j.method, j.material_id, j.thickness_mm, j.quantity, j.finished_piece,
  j.blank, j.area_mm2, j.mass_kg, j.draw_stages, j.process_anneals, j.weld_length_mm, j.routing, j.step_index, j.step_started_at,
  to_char(j.due_date, 'YYYY-MM-DD') as due_date, j.completed_at, j.heat_id, h.heat_number, j.furnace_run_id, fr.number as furnace_run_number,
  l.number as lot_number, l.hold_reason, l.furnace_run_id as lot_furnace_run_id, lfr.number as lot_furnace_run_number, l.shipment_id,
  o.number as order_number, o.organization_id, org.name as organization_name,
  j.assembly_job_id, a.code as assembly_code,
  (select coalesce(json_agg(json_build_object('id', c.id, 'code', c.code, 'completed', c.completed_at is not null,
      'started', c.step_index > 0 or c.step_started_at is not null) order by c.seq), '[]')
     from jobs c where c.assembly_job_id = j.id) as components,
  (select coalesce(json_agg(json_build_object('stepIndex', s.step_index, 'action', s.action, 'at', s.scanned_at, 'station', s.station,
      'operatorId', s.operator_id, 'operatorName', u.name) order by s.id), '[]')
     from scans s left join users u on u.id = s.operator_id where s.job_id = j.id) as scans
from jobs j
join lots l on l.id = j.lot_id
join orders o on o.id = j.order_id
join organizations org on org.id = o.organization_id
left join material_heats h on h.id = j.heat_id
left join furnace_runs fr on fr.id = j.furnace_run_id
left join furnace_runs lfr on lfr.id = l.furnace_run_id
left join jobs a on a.id = j.assembly_job_id${p.joins ? `\n${p.joins}` : ""}
where ${p.where}`;

const BY_ID = { name: "job-view-by-id", text: jsonRows(jobViewSql({ where: "j.id = $1" })), jsonRows: true } as const;
const BY_CODE = { name: "job-view-by-code", text: jsonRows(jobViewSql({ where: "j.code = $1" })), jsonRows: true } as const;

/** One job by id or by the code in its barcode; null when there is none. */
export async function loadJobView(sequelize: Sequelize, by: { id: string } | { code: string }, transaction?: Transaction): Promise<JobView | null> {
  const [row] = await prepared<JobView>(sequelize, "id" in by ? BY_ID : BY_CODE, ["id" in by ? by.id : by.code], transaction);
  return row ?? null;
}
