import type { Transaction } from "sequelize";
import type { InvitationAcceptInput } from "../../shared/schemas/auth";
import { hashPassword } from "../auth/passwords";
import { AppError, GoneError } from "../errors";
import { Organization, User, recordEvent } from "../models";
import { authTokenFinder } from "./authTokenFinder";

/** The invited person chooses a name and password; the token is spent in the same transaction. */
export async function invitationAccepter(props: { input: InvitationAcceptInput; ip: string | null; transaction: Transaction }): Promise<User> {
  const { input, transaction } = props;
  const invitation = await authTokenFinder({ token: input.token, kind: "invitation", transaction });
  if (!invitation || !invitation.role || !invitation.organizationId) {
    throw GoneError("INVITATION_INVALID", "This invitation link has expired or was already used; ask for a new one.", { token: "This invitation link has expired or was already used; ask for a new one." });
  }
  if (await User.findOne({ where: { email: invitation.email }, transaction })) {
    throw new AppError(409, "EMAIL_TAKEN", "This person already has an account; sign in instead.");
  }
  const user = await User.create(
    { email: invitation.email, name: input.name, role: invitation.role, organizationId: invitation.organizationId, passwordHash: await hashPassword(input.password) },
    { transaction },
  );
  invitation.usedAt = new Date();
  invitation.userId = user.id;
  await invitation.save({ transaction });
  user.organization = (await Organization.findByPk(user.organizationId, { transaction })) ?? undefined;
  await recordEvent({ actor: user, action: "invitation.accepted", subject: { type: "user", id: user.id }, data: { invitationId: invitation.id }, ip: props.ip }, transaction);
  return user;
}
