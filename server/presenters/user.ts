import type { UserJson } from "../../shared/schemas/people";
import type { User } from "../models";

/** The whitelist of what the API says about a user: never the password hash. */
export function presentUser(user: User): UserJson {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    organizationId: user.organizationId ?? null,
    organizationName: user.organization?.name ?? null,
    createdAt: user.createdAt.toISOString(),
    active: user.disabledAt === null || user.disabledAt === undefined,
  };
}
