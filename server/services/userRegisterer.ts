import type { Transaction } from "sequelize";
import type { RegisterInput } from "../../shared/schemas/auth";
import { hashPassword } from "../auth/passwords";
import { AppError } from "../errors";
import { Organization, User, recordEvent } from "../models";

/** Self-registration of a customer engineer: a new customer organisation with its first user. */
export async function userRegisterer(props: { input: RegisterInput; ip: string | null; transaction: Transaction }): Promise<User> {
  const { input, transaction } = props;
  if (await User.findOne({ where: { email: input.email }, transaction })) {
    throw new AppError(409, "EMAIL_TAKEN", "An account with this e-mail exists; sign in or reset the password.", {
      email: "already has an account",
    });
  }
  if (await Organization.findOne({ where: { name: input.organization }, transaction })) {
    // Joining an existing organisation takes an invitation from it, never just typing its name.
    throw new AppError(409, "ORGANIZATION_EXISTS", "That organisation already uses Fluxwright; ask its users or the shop for an invitation.", {
      organization: "is already registered; ask for an invitation",
    });
  }
  const org = await Organization.create({ name: input.organization, kind: "customer" }, { transaction });
  const user = await User.create(
    { email: input.email, name: input.name, role: "customer", organizationId: org.id, passwordHash: await hashPassword(input.password) },
    { transaction },
  );
  user.organization = org;
  await recordEvent({ actor: user, action: "user.registered", subject: { type: "user", id: user.id }, data: { organization: org.name }, ip: props.ip }, transaction);
  return user;
}
