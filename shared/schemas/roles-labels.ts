import type { Role } from "./auth";

/** Plain words for each role, shown in the interface and in mails. */
export const roleLabels: Record<Role, string> = {
  customer: "Customer engineer",
  operator: "Shop-floor operator",
  qa: "Quality inspector",
  admin: "Planner",
};
