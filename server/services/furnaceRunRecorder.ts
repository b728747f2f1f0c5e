import { Op, QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { z } from "zod";
import type { furnaceRunCreateSchema } from "../../shared/schemas/furnace-runs";
import { annealDeviations } from "../../shared/shop-floor/anneal";
import { furnaceRunNumber } from "../../shared/shop-floor/codes";
import { ConflictError, ValidationError } from "../errors";
import type { FileStore } from "../files/store";
import type { Upload } from "../files/upload";
import { FurnaceRun, Lot, ShopSettings, recordEvent } from "../models";
import type { Actor } from "../policies/utils";
import { materialCatalog } from "./materialCatalog";
import { paperRecordKeeper } from "./paperRecordKeeper";

export const MAX_CHART_BYTES = 20 * 1024 * 1024;

/** The first job of each lot still before its anneal step (none: the lot is ready for the furnace). */
const NOT_READY = `
select distinct on (lot_id) lot_id, code, current_step
from jobs
where lot_id = any($1::uuid[]) and anneal_index is not null and step_index < anneal_index
order by lot_id, seq`;

/**
 * Records a hydrogen furnace run: a load of lots of one alloy, each ready for its anneal (every
 * job that is annealed has completed clean), within the furnace's heaviest load, and the run's
 * record checked against the alloy's anneal window in the shop settings. A record outside the
 * window puts every lot of the load on hold with the reason; only the planner releases it.
 * Lots are locked in id order, so two runs recorded at once cannot take the same lot.
 */
export async function furnaceRunRecorder(props: { actor: Actor; input: z.output<typeof furnaceRunCreateSchema>; sequelize: Sequelize; ip: string | null; transaction: Transaction; now?: Date }): Promise<FurnaceRun> {
  const { actor, input, sequelize, transaction } = props;
  const now = props.now ?? new Date();
  const settings = await ShopSettings.current(transaction);
  const furnace = input.furnaceId ? settings.furnaces.find((f) => f.id === input.furnaceId) : settings.furnaces[0];
  if (!furnace) throw ValidationError({ furnaceId: input.furnaceId ? `no furnace ${input.furnaceId} in the shop settings` : "the shop settings name no furnace" });

  const lots = await Lot.findAll({ where: { id: { [Op.in]: input.lotIds } }, order: [["id", "ASC"]], lock: transaction.LOCK.UPDATE, transaction });
  const missing = input.lotIds.map((id, i) => [id, i] as const).filter(([id]) => !lots.some((l) => l.id === id));
  if (missing.length) throw ValidationError(Object.fromEntries(missing.map(([, i]) => [`lotIds.${i}`, "no such lot"])), "A lot of the load does not exist.");
  const byInput = input.lotIds.map((id) => lots.find((l) => l.id === id)!);

  const catalog = await materialCatalog();
  const name = (id: string) => catalog.byId.get(id)?.name ?? id;
  const alloys = [...new Set(byInput.map((l) => l.materialId))];
  if (alloys.length > 1) {
    const example = alloys.map((a) => `${byInput.find((l) => l.materialId === a)!.number} (${name(a)})`).join(" and ");
    throw ValidationError({ lotIds: `a furnace load takes one alloy: ${example} differ` }, "A furnace run cannot mix alloys.");
  }
  for (const lot of byInput) {
    if (lot.furnaceRunId) throw ConflictError("LOT_ALREADY_ANNEALED", `Lot ${lot.number} is already in a furnace run; release its hold with "anneal again" first if it must go back in.`);
    if (lot.holdReason) throw ConflictError("LOT_ON_HOLD", `Lot ${lot.number} is on hold: ${lot.holdReason}`);
    if (lot.shipmentId) throw ConflictError("LOT_SHIPPED", `Lot ${lot.number} has shipped.`);
  }
  const [annealed, waiting] = await Promise.all([
    sequelize.query<{ lot_id: string }>(`select distinct lot_id from jobs where lot_id = any($1::uuid[]) and anneal_index is not null`, { bind: [input.lotIds], type: QueryTypes.SELECT, transaction }),
    sequelize.query<{ lot_id: string; code: string; current_step: string }>(NOT_READY, { bind: [input.lotIds], type: QueryTypes.SELECT, transaction }),
  ]);
  for (const lot of byInput) {
    if (!annealed.some((a) => a.lot_id === lot.id)) throw ConflictError("LOT_NOT_ANNEALED", `Lot ${lot.number} (${name(lot.materialId)}) is not hydrogen-annealed: its routing has no anneal step.`);
    const w = waiting.find((x) => x.lot_id === lot.id);
    if (w) throw ConflictError("LOT_NOT_READY", `Lot ${lot.number} is not ready for the furnace: job ${w.code} is at ${w.current_step}. Every job is cleaned before the anneal.`);
  }
  const load = byInput.reduce((s, l) => s + l.massKg, 0);
  if (load > furnace.maxLoad_kg) {
    throw ValidationError({ lotIds: `the load is ${load.toFixed(1)} kg; ${furnace.name} takes at most ${furnace.maxLoad_kg} kg` }, "The load is over the furnace's capacity.");
  }
  const window = settings.annealWindows.find((w) => w.materialId === alloys[0]);
  if (!window) throw ConflictError("NO_ANNEAL_WINDOW", `The shop settings have no anneal window for ${name(alloys[0])}: the planner adds one before its lots are annealed.`);

  const deviations = annealDeviations(input, window).map((d) => d.message);
  const ranAt = input.ranAt ? new Date(input.ranAt) : now;
  if (ranAt.getTime() > now.getTime() + 5 * 60_000) throw ValidationError({ ranAt: "cannot be in the future" });
  const [{ n }] = await sequelize.query<{ n: number }>(`select nextval('furnace_run_number_seq')::int as n`, { type: QueryTypes.SELECT, transaction });
  const run = await FurnaceRun.create(
    {
      seq: n, number: furnaceRunNumber(n), furnaceId: furnace.id, furnace, materialId: alloys[0],
      setpointC: input.setpoint_c ?? null, peakTemperatureC: input.peakTemperature_c, soakMin: input.soak_min, dewPointC: input.dewPoint_c,
      dewPointOutC: input.dewPointOut_c ?? null, coolingRateCPerH: input.coolingRate_c_per_h, window, withinWindow: deviations.length === 0, deviations,
      lots: byInput.map((l) => ({ id: l.id, number: l.number, pieces: l.pieces, mass_kg: l.massKg })),
      pieces: byInput.reduce((s, l) => s + l.pieces, 0), loadKg: +load.toFixed(3), operatorId: actor.id, notes: input.notes || null, ranAt,
    },
    { transaction },
  );
  const holdReason = deviations.length ? `Furnace run ${run.number} was outside the ${name(alloys[0])} anneal window: ${deviations.join("; ")}.` : null;
  for (const lot of byInput) {
    lot.furnaceRunId = run.id;
    if (holdReason) Object.assign(lot, { holdReason, heldAt: now, heldById: actor.id });
    await lot.save({ transaction });
    if (holdReason) await recordEvent({ actor, action: "lot.held", subject: { type: "lot", id: lot.id }, data: { reason: holdReason, furnaceRunId: run.id }, ip: props.ip, at: now }, transaction);
  }
  await recordEvent(
    {
      actor, action: "furnace-run.recorded", subject: { type: "furnace_run", id: run.id },
      data: { number: run.number, furnaceId: furnace.id, lots: byInput.map((l) => l.number), withinWindow: run.withinWindow, deviations }, ip: props.ip, at: now,
    },
    transaction,
  );
  return run;
}

/** Attaches (or replaces) the run's temperature and dew-point chart: a PDF or an image. */
export async function furnaceChartAttacher(props: { actor: Actor; run: FurnaceRun; uploads: Upload[]; store: FileStore; ip: string | null; transaction: Transaction }): Promise<FurnaceRun> {
  const { actor, run, transaction } = props;
  const file = await paperRecordKeeper({ actor, uploads: props.uploads, purpose: "furnace-chart", what: "a furnace chart", maxBytes: MAX_CHART_BYTES, store: props.store, transaction });
  const previous = run.chartFileId;
  run.chartFileId = file.id;
  await run.save({ transaction });
  await recordEvent({ actor, action: "furnace-run.chart-attached", subject: { type: "furnace_run", id: run.id }, data: { fileId: file.id, filename: file.filename, sha256: file.sha256, replaced: previous }, ip: props.ip }, transaction);
  run.chart = file;
  return run;
}
