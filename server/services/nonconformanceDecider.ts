import type { Sequelize, Transaction } from "sequelize";
import { dispositionLabels, type NonconformanceDecisionInput } from "../../shared/schemas/quality";
import { ConflictError } from "../errors";
import { Lot, LotDisposition, recordEvent, type Nonconformance } from "../models";
import type { Actor } from "../policies/utils";
import { completeVerify } from "./measurementRecorder";

/** The steps a lot sent back takes again: nickel-iron loses its permeability in any rework, so every way back goes through the furnace. */
const AGAIN = JSON.stringify([{ key: "clean" }, { key: "anneal" }, { key: "verify" }, { key: "pack" }]);

/**
 * Closes a rejected lot's nonconformance (locked by the caller) with its cause and disposition:
 * re-anneal and retest, or rework, send the lot's jobs back through clean, anneal and verify (their
 * routing grows by those steps, the scans already recorded stay) and open a new inspection round;
 * scrap keeps the lot on hold for good; use as is, with the customer's written consent, accepts the
 * lot by concession and completes its verify step.
 */
export async function nonconformanceDecider(props: {
  actor: Actor & { name: string };
  nonconformance: Nonconformance;
  input: NonconformanceDecisionInput;
  sequelize: Sequelize;
  ip: string | null;
  transaction: Transaction;
  now?: Date;
}): Promise<Nonconformance> {
  const { actor, nonconformance: nc, input, sequelize, transaction } = props;
  const now = props.now ?? new Date();
  if (nc.status === "closed") throw ConflictError("NONCONFORMANCE_CLOSED", `${nc.number} is already closed (${nc.disposition}).`);
  const lot = (await Lot.findByPk(nc.lotId, { transaction, lock: transaction.LOCK.UPDATE }))!;
  if (lot.shipmentId) throw ConflictError("LOT_SHIPPED", `Lot ${lot.number} has shipped.`);
  const consent = input.disposition === "use-as-is" ? input.customerConsent!.trim() : null;
  Object.assign(nc, { cause: input.cause.trim(), disposition: input.disposition, customerConsent: consent, status: "closed", closedById: actor.id, closedAt: now });
  await nc.save({ transaction });
  const event = (action: string, data: Record<string, unknown>) => recordEvent({ actor, action, subject: { type: "lot", id: lot.id }, data, ip: props.ip, at: now }, transaction);
  await recordEvent({ actor, action: "nonconformance.closed", subject: { type: "nonconformance", id: nc.id }, data: { lot: lot.number, cause: nc.cause, disposition: nc.disposition, customerConsent: consent }, ip: props.ip, at: now }, transaction);

  if (input.disposition === "reanneal-retest" || input.disposition === "rework") {
    await sequelize.query(
      `update jobs set
         routing = (select coalesce(jsonb_agg(e order by i), '[]'::jsonb) from jsonb_array_elements(routing) with ordinality t(e, i) where i <= step_index) || $2::jsonb,
         anneal_index = step_index + 1, current_step = 'clean', step_started_at = null, updated_at = now()
       where lot_id = $1 and completed_at is null and routing -> step_index ->> 'key' = 'verify'`,
      { bind: [lot.id, AGAIN], transaction },
    );
    const previous = { round: lot.inspectionRound, furnaceRunId: lot.furnaceRunId, holdReason: lot.holdReason };
    Object.assign(lot, { furnaceRunId: null, holdReason: null, heldAt: null, heldById: null, inspectionRound: lot.inspectionRound + 1 });
    await lot.save({ transaction });
    await event("lot.sent-back", { nonconformance: nc.number, disposition: dispositionLabels[input.disposition], previous, steps: ["clean", "anneal", "verify", "pack"] });
  } else if (input.disposition === "scrap") {
    lot.holdReason = `Scrapped under ${nc.number}.`;
    await lot.save({ transaction });
    await event("lot.scrapped", { nonconformance: nc.number });
  } else {
    await LotDisposition.update({ concession: consent }, { where: { lotId: lot.id, round: lot.inspectionRound }, transaction });
    Object.assign(lot, { holdReason: null, heldAt: null, heldById: null });
    await lot.save({ transaction });
    await event("lot.accepted-by-concession", { nonconformance: nc.number, customerConsent: consent });
    await completeVerify({ actor, lot: { id: lot.id, number: lot.number }, sequelize, transaction, now });
  }
  return nc;
}
