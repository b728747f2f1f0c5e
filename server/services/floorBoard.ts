import { QueryTypes, type Sequelize } from "sequelize";
import { documentNumber } from "../../shared/schemas/documents";
import { FLOOR_LIST_LIMIT, type FloorBoardJson } from "../../shared/schemas/floor";
import { stepKeys, stepLabels, type StepKey } from "../../shared/shop-floor/routing";

// The floor board in one statement. Every part reads a partial index that holds only what is
// open (jobs not finished, lots not yet annealed, lots on hold), so its cost follows the work on
// the floor, not the years of finished jobs behind it (migration 0020).
const BOARD = `
with wip as (
  select current_step as step, count(*) filter (where step_started_at is null)::int as waiting,
    count(*) filter (where step_started_at is not null)::int as started
  from jobs where completed_at is null group by current_step
),
late as (
  select j.id, j.code, j.lot_id, l.number as lot_number, o.number as order_number, j.current_step as step,
    to_char(j.due_date, 'YYYY-MM-DD') as due_date, (current_date - j.due_date) as days_late
  from jobs j join lots l on l.id = j.lot_id join orders o on o.id = j.order_id
  where j.completed_at is null and j.due_date < current_date
  order by j.due_date, j.seq limit $1
),
waiting as (
  select l.id, l.number, l.material_id, l.pieces, l.mass_kg, to_char(l.due_date, 'YYYY-MM-DD') as due_date
  from lots l
  where l.furnace_run_id is null and l.shipment_id is null and l.hold_reason is null
    and exists (select 1 from jobs x where x.lot_id = l.id and x.anneal_index is not null)
    and not exists (select 1 from jobs x where x.lot_id = l.id and x.anneal_index is not null and x.step_index < x.anneal_index)
  order by l.due_date, l.seq limit $1
),
holds as (
  select l.id, l.number, o.number as order_number, l.hold_reason, l.held_at, u.id as by_id, u.name as by_name, l.furnace_run_id
  from lots l join orders o on o.id = l.order_id left join users u on u.id = l.held_by_id
  where l.hold_reason is not null
  order by l.held_at desc limit $1
)
select
  (select coalesce(json_agg(wip), '[]') from wip) as wip,
  (select count(*)::int from jobs where completed_at is null and due_date < current_date) as late_count,
  (select coalesce(json_agg(late), '[]') from late) as late,
  (select coalesce(json_agg(waiting), '[]') from waiting) as waiting,
  (select coalesce(json_agg(holds), '[]') from holds) as holds`;

interface BoardRow {
  wip: Array<{ step: StepKey; waiting: number; started: number }>;
  late_count: number;
  late: Array<{ id: string; code: string; lot_id: string; lot_number: string; order_number: number; step: StepKey | null; due_date: string; days_late: number }>;
  waiting: Array<{ id: string; number: string; material_id: string; pieces: number; mass_kg: number; due_date: string }>;
  holds: Array<{ id: string; number: string; order_number: number; hold_reason: string; held_at: string; by_id: string | null; by_name: string | null; furnace_run_id: string | null }>;
}

export async function floorBoard(sequelize: Sequelize, now = new Date()): Promise<FloorBoardJson> {
  const [row] = await sequelize.query<BoardRow>(BOARD, { bind: [FLOOR_LIST_LIMIT], type: QueryTypes.SELECT });
  const wip = stepKeys.map((step) => {
    const r = row.wip.find((w) => w.step === step);
    return { step, label: stepLabels[step], waiting: r?.waiting ?? 0, started: r?.started ?? 0 };
  });
  return {
    generatedAt: now.toISOString(),
    wip,
    openJobs: wip.reduce((s, w) => s + w.waiting + w.started, 0),
    late: {
      count: row.late_count,
      jobs: row.late.map((j) => ({ id: j.id, code: j.code, lotId: j.lot_id, lotNumber: j.lot_number, orderNumber: documentNumber("order", j.order_number), step: j.step, dueDate: j.due_date, daysLate: j.days_late })),
    },
    waitingForFurnace: row.waiting.map((l) => ({ id: l.id, number: l.number, materialId: l.material_id, pieces: l.pieces, mass_kg: l.mass_kg, dueDate: l.due_date })),
    holds: row.holds.map((h) => ({
      lotId: h.id, lotNumber: h.number, orderNumber: documentNumber("order", h.order_number), reason: h.hold_reason, heldAt: new Date(h.held_at).toISOString(),
      heldBy: h.by_id ? { id: h.by_id, name: h.by_name ?? "" } : null, furnaceRunId: h.furnace_run_id,
    })),
  };
}
