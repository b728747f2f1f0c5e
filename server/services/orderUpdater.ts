import type { Transaction } from "sequelize";
import type { OrderUpdateInput } from "../../shared/schemas/order";
import { ConflictError } from "../errors";
import { recordEvent, type Order } from "../models";
import { orderStatusAllows } from "../policies/order";
import type { Actor } from "../policies/utils";
import { checkRequestedDate } from "./orderPlacer";

type Details = { [K in keyof OrderUpdateInput]?: string | null };

/** Purchase order, delivery address, requested date and notes, while the order awaits payment. */
export async function orderUpdater(props: { actor: Actor; order: Order; input: Details; ip: string | null; transaction: Transaction; now?: Date }): Promise<Order> {
  const { actor, order, input, transaction } = props;
  if (!orderStatusAllows.update(order)) throw ConflictError("ORDER_LOCKED", "Only an order awaiting payment can be changed; ask the shop for changes after payment.");
  checkRequestedDate(input.requestedDate, props.now ?? new Date());
  const fields: string[] = [];
  const set = <K extends "purchaseOrder" | "deliveryAddress" | "requestedDate" | "notes">(key: K) => {
    const v = input[key];
    if (v === undefined) return;
    const value = v === "" ? null : v;
    if (value !== order[key]) {
      order[key] = value as Order[K];
      fields.push(key);
    }
  };
  set("purchaseOrder");
  set("deliveryAddress");
  set("requestedDate");
  set("notes");
  if (fields.length) {
    await order.save({ transaction });
    await recordEvent({ actor, organizationId: order.organizationId, action: "order.updated", subject: { type: "order", id: order.id }, data: { fields }, ip: props.ip }, transaction);
  }
  return order;
}
