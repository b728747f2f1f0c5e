import type { User } from "../models";

/** The whitelist of what the API says about a user: never the password hash. */
export function presentUser(user: User) {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    organizationId: user.organizationId,
    organizationName: user.organization?.name ?? null,
    createdAt: user.createdAt,
  };
}
