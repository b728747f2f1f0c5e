import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { LotHoldInput, LotHoldReleaseInput } from "../../shared/schemas/jobs";
import { ConflictError } from "../errors";
import { recordEvent, type Lot } from "../models";
import type { Actor } from "../policies/utils";

/** Stops a lot (locked by the caller): no scan moves its jobs until the planner releases the hold. */
export async function lotHolder(props: { actor: Actor; lot: Lot; input: LotHoldInput; ip: string | null; transaction: Transaction; now?: Date }): Promise<Lot> {
  const { actor, lot, transaction } = props;
  const now = props.now ?? new Date();
  if (lot.holdReason) throw ConflictError("LOT_ALREADY_ON_HOLD", `Lot ${lot.number} is already on hold: ${lot.holdReason}`);
  if (lot.shipmentId) throw ConflictError("LOT_SHIPPED", `Lot ${lot.number} has shipped.`);
  Object.assign(lot, { holdReason: props.input.reason.trim(), heldAt: now, heldById: actor.id });
  await lot.save({ transaction });
  await recordEvent({ actor, action: "lot.held", subject: { type: "lot", id: lot.id }, data: { reason: lot.holdReason }, ip: props.ip, at: now }, transaction);
  return lot;
}

/**
 * The planner lets a held lot go on, with the reason. With `reanneal` the lot leaves its furnace
 * run (which stays on record with its deviations) and waits for another load; that is only
 * possible while none of its jobs has completed the anneal.
 */
export async function lotHoldReleaser(props: { actor: Actor; lot: Lot; input: LotHoldReleaseInput; sequelize: Sequelize; ip: string | null; transaction: Transaction }): Promise<Lot> {
  const { actor, lot, input, transaction } = props;
  if (!lot.holdReason) throw ConflictError("LOT_NOT_ON_HOLD", `Lot ${lot.number} is not on hold.`);
  const previous = { reason: lot.holdReason, at: lot.heldAt, by: lot.heldById, furnaceRunId: lot.furnaceRunId };
  if (input.reanneal) {
    if (!lot.furnaceRunId) throw ConflictError("LOT_NOT_ANNEALED", `Lot ${lot.number} has not been in a furnace run: there is nothing to anneal again.`);
    const [past] = await props.sequelize.query<{ code: string }>(
      `select code from jobs where lot_id = $1 and anneal_index is not null and step_index > anneal_index order by seq limit 1`,
      { bind: [lot.id], type: QueryTypes.SELECT, transaction },
    );
    if (past) throw ConflictError("ANNEAL_COMPLETED", `Job ${past.code} of lot ${lot.number} has already completed its anneal; the lot cannot go back into the furnace as a whole.`);
    lot.furnaceRunId = null;
  }
  Object.assign(lot, { holdReason: null, heldAt: null, heldById: null });
  await lot.save({ transaction });
  await recordEvent(
    { actor, action: "lot.hold-released", subject: { type: "lot", id: lot.id }, data: { reason: input.reason.trim(), reanneal: !!input.reanneal, previous }, ip: props.ip },
    transaction,
  );
  return lot;
}
