import type { Organization } from "../models";
import { definePolicy, isAdmin } from "./utils";

export const organizationPolicy = definePolicy<Organization, "read" | "invite">({
  name: "organization",
  see: (actor, org) => isAdmin(actor) || org.id === actor.organizationId,
  can: {
    read: () => true,
    // Staff accounts are invited by the planner only; customers by the planner, for now.
    invite: (actor) => isAdmin(actor),
  },
});
