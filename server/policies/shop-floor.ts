import { definePolicy, isAdmin, isOwnOrganization, isStaff, type Actor } from "./utils";

// Jobs and lots are the shop's records about a customer's order. The shop's staff work with them;
// the ordering organisation may know they exist (its order lists the lots) but not open them (403);
// anyone else gets 404.

/** The record with the organisation of the order it belongs to. */
export interface OrderOwned {
  organizationId: string;
}

const floorStaff = (actor: Actor) => actor.role === "operator" || actor.role === "qa" || actor.role === "admin";

export const jobPolicy = definePolicy<OrderOwned, "read" | "scan" | "editRouting" | "print">({
  name: "job",
  see: (actor, job) => isStaff(actor) || isOwnOrganization(actor, job),
  can: {
    read: (actor) => isStaff(actor),
    scan: (actor) => floorStaff(actor),
    editRouting: (actor) => isAdmin(actor),
    print: (actor) => isStaff(actor),
  },
});

export const lotPolicy = definePolicy<OrderOwned, "read" | "hold" | "releaseHold" | "label">({
  name: "lot",
  see: (actor, lot) => isStaff(actor) || isOwnOrganization(actor, lot),
  can: {
    read: (actor) => isStaff(actor),
    // quality may stop a lot too; only the planner lets it go again
    hold: (actor) => isAdmin(actor) || actor.role === "qa",
    releaseHold: (actor) => isAdmin(actor),
    label: (actor) => isStaff(actor),
  },
});

/** Who may scan at a station (the contract's operator, qa and admin). */
export const scanRoles = ["operator", "qa", "admin"] as const;
/** Who records furnace runs and receives material. */
export const furnaceRoles = ["operator", "admin"] as const;
