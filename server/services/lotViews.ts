import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { LotStatus } from "../../shared/schemas/jobs";

// A lot's state is read from its jobs: in work, waiting for a furnace load (every annealed job has
// completed clean), annealed, on hold, finished (every job packed), shipped. One SQL expression,
// so the lists filter by it and the lot page shows the same.
export const LOT_STATUS_SQL = `
case
  when l.shipment_id is not null then 'shipped'
  when l.hold_reason is not null then 'on_hold'
  when not exists (select 1 from jobs x where x.lot_id = l.id and x.completed_at is null) then 'finished'
  when l.furnace_run_id is not null then 'annealed'
  when exists (select 1 from jobs x where x.lot_id = l.id and x.anneal_index is not null)
   and not exists (select 1 from jobs x where x.lot_id = l.id and x.anneal_index is not null and x.step_index < x.anneal_index) then 'ready_for_anneal'
  else 'in_work'
end`;

export interface LotView {
  id: string;
  seq: number;
  number: string;
  status: LotStatus;
  order_id: string;
  order_number: number;
  organization_id: string;
  organization_name: string;
  material_id: string;
  pieces: number;
  mass_kg: number;
  due_date: string;
  hold_reason: string | null;
  held_at: Date | null;
  held_by_id: string | null;
  held_by_name: string | null;
  furnace_run_id: string | null;
  furnace_run_number: string | null;
  furnace_run_within: boolean | null;
  shipment_id: string | null;
  carrier: string | null;
  tracking_number: string | null;
  shipped_at: Date | null;
  created_at: Date;
}

const LOT_VIEW = `
select l.id, l.seq, l.number, (${LOT_STATUS_SQL}) as status, l.order_id, o.number as order_number, o.organization_id, org.name as organization_name,
  l.material_id, l.pieces, l.mass_kg, to_char(l.due_date, 'YYYY-MM-DD') as due_date, l.hold_reason, l.held_at, l.held_by_id, u.name as held_by_name,
  l.furnace_run_id, fr.number as furnace_run_number, fr.within_window as furnace_run_within,
  l.shipment_id, sh.carrier, sh.tracking_number, sh.shipped_at, l.created_at
from lots l
join orders o on o.id = l.order_id
join organizations org on org.id = o.organization_id
left join users u on u.id = l.held_by_id
left join furnace_runs fr on fr.id = l.furnace_run_id
left join shipments sh on sh.id = l.shipment_id`;

export async function loadLotView(sequelize: Sequelize, id: string, transaction?: Transaction): Promise<LotView | null> {
  const [row] = await sequelize.query<LotView>(`${LOT_VIEW} where l.id = $1`, { bind: [id], type: QueryTypes.SELECT, transaction });
  return row ?? null;
}

export interface LotListFilter {
  status?: LotStatus;
  orderId?: string;
  q?: string;
  furnaceRunId?: string;
  sort: "createdAt" | "number" | "dueDate";
  dir: "asc" | "desc";
  limit: number;
  offset: number;
}

const LOT_SORTS = { createdAt: "created_at", number: "seq", dueDate: "due_date" } as const;

export async function listLotViews(sequelize: Sequelize, f: LotListFilter): Promise<{ rows: LotView[]; total: number }> {
  const where: string[] = [];
  const bind: unknown[] = [];
  const param = (v: unknown) => `$${bind.push(v)}`;
  if (f.status) where.push(`v.status = ${param(f.status)}`);
  if (f.orderId) where.push(`v.order_id = ${param(f.orderId)}`);
  if (f.furnaceRunId) where.push(`v.furnace_run_id = ${param(f.furnaceRunId)}`);
  if (f.q) where.push(`(v.number ilike ${param(`%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`)} or 'O-' || v.order_number = upper(${param(f.q.trim())}))`);
  const sql = `
    select v.*, count(*) over () as total from (${LOT_VIEW}) v
    ${where.length ? `where ${where.join(" and ")}` : ""}
    order by v.${LOT_SORTS[f.sort]} ${f.dir === "asc" ? "asc" : "desc"}, v.seq desc
    limit ${param(f.limit)} offset ${param(f.offset)}`;
  const rows = await sequelize.query<LotView & { total: string }>(sql, { bind, type: QueryTypes.SELECT });
  return { rows, total: rows.length ? Number(rows[0].total) : 0 };
}

export interface LotJobRow {
  id: string;
  code: string;
  lot_id: string;
  layer: number;
  role: string;
  method: string;
  quantity: number;
  current_step: string | null;
  step_index: number;
  step_started_at: Date | null;
  completed_at: Date | null;
  due_date: string;
}

export async function lotJobs(sequelize: Sequelize, lotId: string, transaction?: Transaction): Promise<LotJobRow[]> {
  return sequelize.query<LotJobRow>(
    `select id, code, lot_id, layer, role, method, quantity, current_step, step_index, step_started_at, completed_at, to_char(due_date, 'YYYY-MM-DD') as due_date
     from jobs where lot_id = $1 order by seq`,
    { bind: [lotId], type: QueryTypes.SELECT, transaction },
  );
}

export interface LotHeatRow {
  id: string;
  heat_number: string;
  supplier: string;
  thickness_mm: number;
  mill_certificate_file_id: string | null;
}

/** Every material heat the lot's jobs were issued from. */
export async function lotHeats(sequelize: Sequelize, lotId: string, transaction?: Transaction): Promise<LotHeatRow[]> {
  return sequelize.query<LotHeatRow>(
    `select h.id, h.heat_number, h.supplier, h.thickness_mm, h.mill_certificate_file_id
     from material_heats h where h.id in (select heat_id from jobs where lot_id = $1 and heat_id is not null) order by h.heat_number`,
    { bind: [lotId], type: QueryTypes.SELECT, transaction },
  );
}
