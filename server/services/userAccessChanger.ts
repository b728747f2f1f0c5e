import { Op, type Transaction } from "sequelize";
import type { UserAccessUpdate } from "../../shared/schemas/auth";
import { roleLabels } from "../../shared/schemas/roles-labels";
import { AppError, ValidationError } from "../errors";
import { User, recordEvent } from "../models";
import type { Actor } from "../policies/utils";

/**
 * The planner changes a person's role or deactivates (or reactivates) them. Staff move between
 * staff roles only (a customer belongs to a customer organisation, staff to the shop). The shop
 * always keeps an active planner: the shop's active planners are locked first, so two planners demoting
 * each other at the same moment cannot both succeed. Each change is an event in the same
 * transaction; a deactivated person is signed out everywhere.
 */
export async function userAccessChanger(props: { actor: Actor; user: User; input: UserAccessUpdate; ip: string | null; transaction: Transaction }): Promise<User> {
  const { actor, user, input, transaction } = props;
  const role = input.role ?? user.role;
  const active = input.active ?? user.disabledAt === null;
  if (role !== user.role && (user.role === "customer") !== (role === "customer")) {
    throw ValidationError({ role: user.role === "customer" ? "A customer's role stays customer: shop staff join by an invitation to the shop." : "Shop staff cannot become customers: invite the person to a customer organisation instead." });
  }
  if (user.id === actor.id && !active) throw ValidationError({ active: "You cannot deactivate your own account; another planner can." });

  const wasPlanner = user.role === "admin" && user.disabledAt === null;
  const staysPlanner = role === "admin" && active;
  if (wasPlanner && !staysPlanner) {
    const planners = await User.findAll({ where: { role: "admin", organizationId: user.organizationId, disabledAt: { [Op.is]: null } }, transaction, lock: transaction.LOCK.UPDATE, order: [["id", "ASC"]] });
    if (!planners.some((p) => p.id !== user.id)) {
      throw new AppError(409, "LAST_PLANNER", `${user.name} is the last active planner: make someone else a planner first, so the shop is never left without one.`);
    }
  }

  if (role !== user.role) {
    const from = user.role;
    user.role = role;
    await recordEvent({ actor, action: "user.role_changed", subject: { type: "user", id: user.id }, data: { from, to: role, fromLabel: roleLabels[from], toLabel: roleLabels[role] }, ip: props.ip }, transaction);
  }
  if (active !== (user.disabledAt === null)) {
    user.disabledAt = active ? null : new Date();
    await recordEvent({ actor, action: active ? "user.reactivated" : "user.deactivated", subject: { type: "user", id: user.id }, ip: props.ip }, transaction);
  }
  await user.save({ transaction });
  if (!active) {
    // whoever is signed in as this person is out at once
    await user.sequelize.query(`delete from "session" where sess->'passport'->>'user' = :id`, { replacements: { id: user.id }, transaction });
  }
  return user;
}
