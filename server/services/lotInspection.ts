import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { samplingPlan, type SamplingPlan } from "../../shared/quality/sampling-plan";
import { switchingState, type SwitchingEntry, type SwitchingResult } from "../../shared/quality/switching";
import type { LotProgressJson, Orientation } from "../../shared/schemas/quality";
import type { SamplingPlanJson } from "../../shared/schemas/sampling";
import { presentSamplingPlan } from "../presenters/sampling";

// What quality inspection reads about a lot: its order's AQL and required attenuation, the quoted
// field and prediction, whether its anneal is done, the plan it is sampled under (after the
// switching rules for its alloy and route), and how far the sample has got in this round.

export interface LotInspectionRow {
  id: string;
  number: string;
  pieces: number;
  material_id: string;
  order_id: string;
  order_number: number;
  organization_id: string;
  organization_name: string;
  purchase_order: string | null;
  aql: number;
  required_db: number;
  method: string;
  configuration: { field?: { frequency_hz?: number; amplitude_uT?: number; orientation?: Orientation } };
  predicted_db: number | null;
  quote_number: number;
  inspection_round: number;
  furnace_run_id: string | null;
  hold_reason: string | null;
  shipment_id: string | null;
  created_at: Date;
  /** annealed jobs not yet past their anneal */
  before_anneal: number;
  annealed_jobs: number;
  /** jobs with a verify step not yet past it */
  before_verify: number;
  /** jobs at their verify step */
  at_verify: number;
}

const LOT_INSPECTION = `
select l.id, l.number, l.pieces, l.material_id, l.order_id, o.number as order_number, o.organization_id, org.name as organization_name,
  o.purchase_order, o.aql, o.required_attenuation_db as required_db, q.configuration ->> 'method' as method, q.configuration,
  (q.prediction ->> 'attenuation_db')::double precision as predicted_db, q.number as quote_number,
  l.inspection_round, l.furnace_run_id, l.hold_reason, l.shipment_id, l.created_at,
  (select count(*)::int from jobs j where j.lot_id = l.id and j.anneal_index is not null and j.step_index <= j.anneal_index) as before_anneal,
  (select count(*)::int from jobs j where j.lot_id = l.id and j.anneal_index is not null) as annealed_jobs,
  (select count(*)::int from jobs j, lateral (select min(o2.i) - 1 as vi from jsonb_array_elements(j.routing) with ordinality o2(s, i) where o2.s ->> 'key' = 'verify') v
     where j.lot_id = l.id and v.vi is not null and j.step_index <= v.vi) as before_verify,
  (select count(*)::int from jobs j where j.lot_id = l.id and j.completed_at is null and j.routing -> j.step_index ->> 'key' = 'verify') as at_verify
from lots l
join orders o on o.id = l.order_id
join organizations org on org.id = o.organization_id
join quotes q on q.id = o.quote_id`;

export async function loadLotInspection(sequelize: Sequelize, lotId: string, transaction?: Transaction): Promise<LotInspectionRow | null> {
  const [row] = await sequelize.query<LotInspectionRow>(`${LOT_INSPECTION} where l.id = $1`, { bind: [lotId], type: QueryTypes.SELECT, transaction });
  return row ?? null;
}

/** Why a lot cannot be measured yet (null when its anneal is done). */
export function notAnnealedReason(lot: LotInspectionRow): string | null {
  if (lot.shipment_id) return `Lot ${lot.number} has shipped.`;
  if (lot.annealed_jobs > 0 && (!lot.furnace_run_id || lot.before_anneal > 0)) {
    return `Lot ${lot.number} has not completed its anneal: measure it after every job has completed the hydrogen anneal.`;
  }
  if (lot.before_verify > lot.at_verify) return `Lot ${lot.number} has jobs that have not reached verify yet.`;
  return null;
}

/** The history of lots of the same alloy and route (original inspection only), oldest first, before this lot. */
async function switchingHistory(sequelize: Sequelize, lot: LotInspectionRow, transaction?: Transaction): Promise<SwitchingEntry[]> {
  const rows = await sequelize.query<{ number: string; lot_size: number; failures: number }>(
    `select l.number, (d.plan ->> 'lotSize')::int as lot_size, d.failures
     from lot_dispositions d join lots l on l.id = d.lot_id join orders o on o.id = l.order_id join quotes q on q.id = o.quote_id
     where d.round = 1 and l.material_id = $1 and q.configuration ->> 'method' = $2 and l.id <> $3
       and d.created_at < coalesce((select created_at from lot_dispositions where lot_id = $3 and round = 1), now())
     order by d.created_at, l.seq`,
    { bind: [lot.material_id, lot.method, lot.id], type: QueryTypes.SELECT, transaction },
  );
  return rows.map((r) => ({ kind: "lot", label: `lot ${r.number}`, lotSize: r.lot_size, nonconforming: r.failures }));
}

export interface LotPlan {
  plan: SamplingPlanJson | null;
  switching: Pick<SwitchingResult, "state" | "reason">;
}

/**
 * The plan this round is sampled under: the one recorded with its disposition once decided, else
 * Table I/II for the lot size and the order's AQL under the switching state of its alloy and route.
 */
export async function lotSamplingPlan(sequelize: Sequelize, lot: LotInspectionRow, transaction?: Transaction): Promise<LotPlan> {
  const history = await switchingHistory(sequelize, lot, transaction);
  const result = switchingState(lot.aql, history);
  const switching = { state: result.state, reason: result.reason };
  const [decided] = await sequelize.query<{ plan: SamplingPlanJson }>(`select plan from lot_dispositions where lot_id = $1 and round = $2`, {
    bind: [lot.id, lot.inspection_round], type: QueryTypes.SELECT, transaction,
  });
  if (decided) return { plan: decided.plan, switching };
  if (result.state === "discontinued") return { plan: null, switching };
  const plan: SamplingPlan = samplingPlan(lot.pieces, lot.aql, result.state);
  return { plan: presentSamplingPlan(plan), switching };
}

/** How far this round's sample has got, and the decision the plan gives (null while open). */
export async function lotProgress(sequelize: Sequelize, lot: LotInspectionRow, plan: SamplingPlanJson | null, transaction?: Transaction): Promise<LotProgressJson> {
  const [counts] = await sequelize.query<{ measured: number; failures: number }>(
    `select count(*)::int as measured, count(*) filter (where not pass)::int as failures from measurements where lot_id = $1 and round = $2`,
    { bind: [lot.id, lot.inspection_round], type: QueryTypes.SELECT, transaction },
  );
  const [decided] = await sequelize.query<{ decision: "accepted" | "rejected" }>(`select decision from lot_dispositions where lot_id = $1 and round = $2`, {
    bind: [lot.id, lot.inspection_round], type: QueryTypes.SELECT, transaction,
  });
  return {
    round: lot.inspection_round,
    measured: counts.measured,
    failures: counts.failures,
    sampleSize: plan?.sampleSize ?? 0,
    accept: plan?.accept ?? 0,
    reject: plan?.reject ?? 0,
    decision: decided?.decision ?? null,
  };
}

/** The plan's verdict on the counts so far: accepted once the sample is measured with at most Ac failing, rejected as soon as Re fail. */
export function verdict(p: Pick<LotProgressJson, "measured" | "failures" | "sampleSize" | "accept" | "reject">): "accepted" | "rejected" | null {
  if (p.failures >= p.reject) return "rejected";
  if (p.measured >= p.sampleSize && p.failures <= p.accept) return "accepted";
  return null;
}
