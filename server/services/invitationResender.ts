import { Op, type Transaction } from "sequelize";
import { newToken } from "../auth/passwords";
import { AppError, NotFoundError } from "../errors";
import { AuthToken, Organization, User, recordEvent } from "../models";
import type { Actor } from "../policies/utils";
import { INVITATION_DAYS } from "./invitationCreator";

/** An invitation not yet accepted or withdrawn (it may have expired: resending is how it is renewed), locked. */
async function openInvitation(id: string, transaction: Transaction): Promise<AuthToken> {
  const invitation = await AuthToken.findOne({ where: { id, kind: "invitation", usedAt: { [Op.is]: null } }, transaction, lock: transaction.LOCK.UPDATE });
  if (!invitation) throw NotFoundError("invitation");
  return invitation;
}

/**
 * Sends an invitation again with a fresh link and a fresh week: the old link stops working (it is
 * spent in the same transaction) and the new one is returned to mail after commit.
 */
export async function invitationResender(props: { actor: Actor; id: string; ip: string | null; transaction: Transaction }): Promise<{ invitation: AuthToken; token: string; organization: Organization | null }> {
  const { actor, transaction } = props;
  const old = await openInvitation(props.id, transaction);
  if (await User.findOne({ where: { email: old.email }, transaction })) throw new AppError(409, "EMAIL_TAKEN", "This person already has an account.");
  old.usedAt = new Date();
  await old.save({ transaction });
  const { token, tokenHash } = newToken();
  const invitation = await AuthToken.create(
    { kind: "invitation", tokenHash, email: old.email, role: old.role, organizationId: old.organizationId, userId: null, createdById: actor.id, expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000) },
    { transaction },
  );
  await recordEvent({ actor, action: "invitation.resent", subject: { type: "invitation", id: invitation.id }, data: { email: old.email, previousId: old.id }, ip: props.ip }, transaction);
  const organization = old.organizationId ? await Organization.findByPk(old.organizationId, { transaction }) : null;
  return { invitation, token, organization };
}

/** Withdraws an invitation: its link stops working; the trail keeps who withdrew it and when. */
export async function invitationWithdrawer(props: { actor: Actor; id: string; ip: string | null; transaction: Transaction }): Promise<void> {
  const { actor, transaction } = props;
  const invitation = await openInvitation(props.id, transaction);
  invitation.usedAt = new Date();
  await invitation.save({ transaction });
  await recordEvent({ actor, action: "invitation.withdrawn", subject: { type: "invitation", id: invitation.id }, data: { email: invitation.email }, ip: props.ip }, transaction);
}
