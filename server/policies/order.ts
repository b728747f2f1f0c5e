import type { Order } from "../models";
import { definePolicy, isAdmin, isCustomer, isOwnOrganization, isStaff, type Actor } from "./utils";

const own = (actor: Actor, order: Order) => isCustomer(actor) && isOwnOrganization(actor, order);

/**
 * The ordering organisation and the shop's staff see an order. Roles decide here (403); whether
 * the order's status allows the action is the service's answer (409), so a paid order says so.
 */
export const orderPolicy = definePolicy<Order, "read" | "update" | "pay" | "cancel" | "upload" | "refund" | "release" | "ship">({
  name: "order",
  see: (actor, order) => isStaff(actor) || isOwnOrganization(actor, order),
  can: {
    read: () => true,
    update: (actor, order) => own(actor, order) || isAdmin(actor),
    pay: (actor, order) => own(actor, order),
    cancel: (actor, order) => own(actor, order) || isAdmin(actor),
    upload: (actor, order) => own(actor, order) || isAdmin(actor),
    refund: (actor) => isAdmin(actor),
    release: (actor) => isAdmin(actor),
    ship: (actor) => isAdmin(actor),
  },
});

/** Which statuses allow each action (the services check these; presenters show them as abilities). */
export const orderStatusAllows = {
  update: (o: Order) => o.status === "awaiting_payment",
  pay: (o: Order) => o.status === "awaiting_payment",
  cancel: (o: Order) => o.status === "awaiting_payment",
  upload: (o: Order) => o.status === "awaiting_payment" || o.status === "paid",
  refund: (o: Order) => ["paid", "released", "shipped"].includes(o.status),
  release: (o: Order) => o.status === "paid",
  ship: (o: Order) => o.status === "released",
};
