import { Op, QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { documentNumber } from "../../shared/schemas/documents";
import type { ShipmentCreateInput } from "../../shared/schemas/order";
import { ConflictError, ValidationError } from "../errors";
import type { Mailer } from "../jobs/mailer";
import { Lot, Shipment, User, recordEvent, type Order } from "../models";
import { orderStatusAllows } from "../policies/order";
import type { Actor } from "../policies/utils";
import { orderShippedMail } from "./mail-texts";

/**
 * Records a parcel that left the shop (the order locked by the caller): carrier, tracking number and
 * the lots in it (default every lot not yet shipped). Every job of those lots has completed its
 * routing (packed), and none is on hold. When no lot is left the order is shipped; each parcel
 * sends the customer the "shipped" mail with its tracking number.
 */
export async function shipmentRecorder(props: { actor: Actor; order: Order; input: ShipmentCreateInput; sequelize: Sequelize; mailer: Mailer; appUrl: string; ip: string | null; transaction: Transaction; now?: Date }): Promise<Shipment> {
  const { actor, order, input, transaction } = props;
  const now = props.now ?? new Date();
  const number = documentNumber("order", order.number);
  if (!orderStatusAllows.ship(order)) {
    throw ConflictError("ORDER_NOT_SHIPPABLE", order.status === "shipped" ? `Order ${number} has shipped already.` : `Order ${number} is ${order.status.replace("_", " ")}: only a released order ships.`);
  }
  const all = await Lot.findAll({ where: { orderId: order.id }, order: [["seq", "ASC"]], lock: transaction.LOCK.UPDATE, transaction });
  let lots: Lot[];
  if (input.lotIds) {
    const missing = input.lotIds.map((id, i) => [id, i] as const).filter(([id]) => !all.some((l) => l.id === id));
    if (missing.length) throw ValidationError(Object.fromEntries(missing.map(([, i]) => [`lotIds.${i}`, "not a lot of this order"])));
    lots = all.filter((l) => input.lotIds!.includes(l.id));
    const shipped = lots.find((l) => l.shipmentId);
    if (shipped) throw ConflictError("LOT_ALREADY_SHIPPED", `Lot ${shipped.number} has shipped already.`);
  } else {
    lots = all.filter((l) => !l.shipmentId);
    if (!lots.length) throw ConflictError("NOTHING_TO_SHIP", `Every lot of order ${number} has shipped.`);
  }
  const held = lots.find((l) => l.holdReason);
  if (held) throw ConflictError("LOT_ON_HOLD", `Lot ${held.number} is on hold: ${held.holdReason}`);
  const [open] = await props.sequelize.query<{ code: string; lot_number: string; current_step: string }>(
    `select j.code, l.number as lot_number, j.current_step from jobs j join lots l on l.id = j.lot_id
     where j.lot_id = any($1::uuid[]) and j.completed_at is null order by j.seq limit 1`,
    { bind: [lots.map((l) => l.id)], type: QueryTypes.SELECT, transaction },
  );
  if (open) throw ConflictError("NOT_PACKED", `Lot ${open.lot_number} is not packed yet: job ${open.code} is at ${open.current_step}.`);

  const shipment = await Shipment.create(
    { orderId: order.id, carrier: input.carrier, trackingNumber: input.trackingNumber, parts: lots.map((l) => ({ lotId: l.id, lotNumber: l.number, pieces: l.pieces })), shippedAt: now, createdById: actor.id },
    { transaction },
  );
  await Lot.update({ shipmentId: shipment.id }, { where: { id: { [Op.in]: lots.map((l) => l.id) } }, transaction });
  const complete = all.every((l) => l.shipmentId || lots.includes(l));
  if (complete) {
    order.status = "shipped";
    await order.save({ transaction });
  }
  await recordEvent(
    {
      actor, organizationId: order.organizationId, action: complete ? "order.shipped" : "order.part-shipped", subject: { type: "order", id: order.id },
      data: { shipmentId: shipment.id, carrier: input.carrier, trackingNumber: input.trackingNumber, lots: lots.map((l) => l.number) }, ip: props.ip, at: now,
    },
    transaction,
  );
  const buyer = order.createdById ? await User.findByPk(order.createdById, { transaction }) : null;
  if (buyer) {
    await props.mailer.enqueue(
      orderShippedMail({ to: buyer.email, name: buyer.name, orderNumber: number, link: `${props.appUrl}/orders/${order.id}`, carrier: input.carrier, trackingReference: input.trackingNumber }),
      transaction,
    );
  }
  return shipment;
}
