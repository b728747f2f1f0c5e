import type { Role } from "../../shared/schemas/auth";

// The words the shop uses for each role; the planner is the admin role.
export const roleLabels: Record<Role, string> = {
  customer: "Customer",
  operator: "Operator",
  qa: "Quality",
  admin: "Planner",
};

export const homeLabels: Record<Role, string> = {
  customer: "Home",
  operator: "Floor",
  qa: "Inspection",
  admin: "Planning",
};
