import { definePolicy, isOwnOrganization, isStaff, type Actor } from "./utils";
import type { OrderOwned } from "./shop-floor";

// Quality inspection of lots is the shop's work: quality inspectors measure and certify; the
// planner reads and decides nonconformances. The ordering organisation may know its lots exist but
// not inspect them (403); anyone else gets 404. Certificates go to their organisation and the staff.

const isQa = (a: Actor) => a.role === "qa";
const isQaOrPlanner = (a: Actor) => a.role === "qa" || a.role === "admin";

export const qualityPolicy = definePolicy<OrderOwned, "read" | "measure" | "decide" | "certify">({
  name: "lot",
  see: (actor, lot) => isStaff(actor) || isOwnOrganization(actor, lot),
  can: {
    read: (actor) => isQaOrPlanner(actor),
    measure: (actor) => isQa(actor),
    decide: (actor) => isQaOrPlanner(actor),
    certify: (actor) => isQa(actor),
  },
});

export const certificatePolicy = definePolicy<OrderOwned, "download">({
  name: "certificate",
  see: (actor, c) => isStaff(actor) || isOwnOrganization(actor, c),
  can: { download: () => true },
});
