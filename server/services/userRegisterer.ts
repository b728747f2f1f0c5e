import { randomUUID } from "node:crypto";
import type { Transaction } from "sequelize";
import type { RegisterInput } from "../../shared/schemas/auth";
import type { UserJson } from "../../shared/schemas/people";
import { hashPassword } from "../auth/passwords";
import { AppError } from "../errors";
import { Organization, User, recordEvent } from "../models";

export type Registration =
  /** a new customer organisation with its first user */
  | { kind: "created"; user: User }
  /** the address already has an account: nothing is made; the answer looks like a new account's, the owner is told by mail */
  | { kind: "existing"; lookAlike: UserJson; owner: User };

/**
 * Self-registration of a customer engineer. An address that already has an account is not told
 * apart from a new one in the answer (see the register route): the password is hashed all the
 * same, so the answer takes as long, and the attempt is recorded against the existing account.
 */
export async function userRegisterer(props: { input: RegisterInput; ip: string | null; transaction: Transaction }): Promise<Registration> {
  const { input, transaction } = props;
  const passwordHash = await hashPassword(input.password);
  const owner = await User.findOne({ where: { email: input.email }, transaction });
  if (owner) {
    await recordEvent({ actor: null, organizationId: owner.organizationId, action: "user.registration_repeated", subject: { type: "user", id: owner.id }, ip: props.ip }, transaction);
    const lookAlike: UserJson = {
      id: randomUUID(), email: input.email, name: input.name, role: "customer", organizationId: randomUUID(), organizationName: input.organization,
      createdAt: new Date().toISOString(), active: true,
    };
    return { kind: "existing", lookAlike, owner };
  }
  if (await Organization.findOne({ where: { name: input.organization }, transaction })) {
    // Joining an existing organisation takes an invitation from it, never just typing its name.
    throw new AppError(409, "ORGANIZATION_EXISTS", "That organisation already uses Fluxwright; ask its users or the shop for an invitation.", {
      organization: "This organisation is already registered: ask its users or the shop for an invitation.",
    });
  }
  const org = await Organization.create({ name: input.organization, kind: "customer" }, { transaction });
  const user = await User.create({ email: input.email, name: input.name, role: "customer", organizationId: org.id, passwordHash }, { transaction });
  user.organization = org;
  await recordEvent({ actor: user, action: "user.registered", subject: { type: "user", id: user.id }, data: { organization: org.name }, ip: props.ip }, transaction);
  return { kind: "created", user };
}
