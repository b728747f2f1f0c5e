import { Op, type Transaction } from "sequelize";
import type { InvitationCreateInput } from "../../shared/schemas/auth";
import { newToken } from "../auth/passwords";
import { AppError } from "../errors";
import { AuthToken, Organization, User, recordEvent } from "../models";

export const INVITATION_DAYS = 7;

/**
 * The planner invites a user: staff join the shop's organisation, customers the organisation chosen.
 * Returns the token to mail; only its hash is stored.
 */
export async function invitationCreator(props: {
  actor: User;
  input: InvitationCreateInput;
  ip: string | null;
  transaction: Transaction;
}): Promise<{ invitation: AuthToken; token: string; organization: Organization }> {
  const { actor, input, transaction } = props;
  if (await User.findOne({ where: { email: input.email }, transaction })) {
    throw new AppError(409, "EMAIL_TAKEN", "This person already has an account.", { email: "This email address already has an account." });
  }
  let organization: Organization | null;
  if (input.role === "customer") {
    if (!input.organizationId) throw new AppError(400, "VALIDATION_FAILED", "Choose the customer's organisation.", { organizationId: "Choose the customer's organisation." });
    organization = await Organization.findByPk(input.organizationId, { transaction });
    if (!organization || organization.kind !== "customer") {
      throw new AppError(400, "VALIDATION_FAILED", "Choose a customer organisation.", { organizationId: "Choose a customer organisation: staff join the shop." });
    }
  } else {
    organization = await Organization.findByPk(actor.organizationId, { transaction });
    if (!organization) throw new AppError(500, "INTERNAL", "The shop organisation is missing.");
  }
  // A new invitation replaces any open one for the same address.
  await AuthToken.update(
    { usedAt: new Date() },
    { where: { kind: "invitation", email: input.email, usedAt: { [Op.is]: null } }, transaction },
  );
  const { token, tokenHash } = newToken();
  const invitation = await AuthToken.create(
    {
      kind: "invitation",
      tokenHash,
      email: input.email,
      role: input.role,
      organizationId: organization.id,
      userId: null,
      createdById: actor.id,
      expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
    },
    { transaction },
  );
  await recordEvent(
    { actor, action: "invitation.created", subject: { type: "invitation", id: invitation.id }, data: { email: input.email, role: input.role, organizationId: organization.id }, ip: props.ip },
    transaction,
  );
  return { invitation, token, organization };
}
