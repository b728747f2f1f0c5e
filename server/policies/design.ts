import type { Design } from "../models";
import { definePolicy, isAdmin, isCustomer, isOwnOrganization } from "./utils";

/** Saved designs belong to a customer organisation; the planner may look at them (support). */
export const designPolicy = definePolicy<Design, "read" | "update" | "delete" | "quote">({
  name: "design",
  see: (actor, design) => isAdmin(actor) || isOwnOrganization(actor, design),
  can: {
    read: () => true,
    update: (actor, design) => isCustomer(actor) && isOwnOrganization(actor, design),
    delete: (actor, design) => isCustomer(actor) && isOwnOrganization(actor, design),
    quote: (actor, design) => isCustomer(actor) && isOwnOrganization(actor, design),
  },
});
