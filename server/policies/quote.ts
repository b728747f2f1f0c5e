import type { Quote } from "../models";
import { definePolicy, isAdmin, isCustomer, isOwnOrganization, isStaff } from "./utils";

/** A customer sees its organisation's quotes; the shop's staff see all of them. */
export const quotePolicy = definePolicy<Quote, "read" | "order" | "requote">({
  name: "quote",
  see: (actor, quote) => isStaff(actor) || isOwnOrganization(actor, quote),
  can: {
    read: () => true,
    order: (actor, quote) => isCustomer(actor) && isOwnOrganization(actor, quote),
    // a new quote at today's rates: the customer, or the planner on the customer's behalf
    requote: (actor, quote) => isAdmin(actor) || (isCustomer(actor) && isOwnOrganization(actor, quote)),
  },
});
