import type { User } from "../models";
import { definePolicy, isAdmin, isOwnOrganization } from "./utils";

export const userPolicy = definePolicy<User, "read" | "update" | "disable">({
  name: "user",
  see: (actor, user) => isAdmin(actor) || actor.id === user.id || isOwnOrganization(actor, user),
  can: {
    read: () => true,
    update: (actor, user) => isAdmin(actor) || actor.id === user.id,
    disable: (actor, user) => isAdmin(actor) && actor.id !== user.id,
  },
});
