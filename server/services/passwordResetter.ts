import { Op, type Transaction } from "sequelize";
import { hashPassword, newToken } from "../auth/passwords";
import { GoneError } from "../errors";
import { AuthToken, User, recordEvent } from "../models";
import { authTokenFinder } from "./authTokenFinder";

export const RESET_MINUTES = 60;

/** Returns the token to mail, or null when no active account has that address (the caller says nothing either way). */
export async function passwordResetRequester(props: { email: string; ip: string | null; transaction: Transaction }): Promise<{ token: string; expiresAt: Date; user: User } | null> {
  const { email, transaction } = props;
  const user = await User.findOne({ where: { email, disabledAt: { [Op.is]: null } }, transaction });
  if (!user) return null;
  // One open reset link at a time: a new request spends the older ones.
  await AuthToken.update({ usedAt: new Date() }, { where: { kind: "password_reset", userId: user.id, usedAt: { [Op.is]: null } }, transaction });
  const { token, tokenHash } = newToken();
  const expiresAt = new Date(Date.now() + RESET_MINUTES * 60_000);
  await AuthToken.create(
    { kind: "password_reset", tokenHash, email, role: null, organizationId: user.organizationId, userId: user.id, createdById: null, expiresAt },
    { transaction },
  );
  await recordEvent({ actor: user, action: "password.reset_requested", subject: { type: "user", id: user.id }, ip: props.ip }, transaction);
  return { token, expiresAt, user };
}

export async function passwordResetter(props: { token: string; password: string; ip: string | null; transaction: Transaction }): Promise<User> {
  const { transaction } = props;
  const reset = await authTokenFinder({ token: props.token, kind: "password_reset", transaction });
  const user = reset?.userId ? await User.findByPk(reset.userId, { transaction, lock: transaction.LOCK.UPDATE }) : null;
  if (!reset || !user) throw GoneError("RESET_LINK_INVALID", "This reset link has expired or was already used; ask for a new one.", { token: "This reset link has expired or was already used; ask for a new one." });
  user.passwordHash = await hashPassword(props.password);
  await user.save({ transaction });
  reset.usedAt = new Date();
  await reset.save({ transaction });
  // Sign out every other session of this user: whoever knew the old password is out.
  await user.sequelize.query(`delete from "session" where sess->'passport'->>'user' = :id`, { replacements: { id: user.id }, transaction });
  await recordEvent({ actor: user, action: "password.reset", subject: { type: "user", id: user.id }, ip: props.ip }, transaction);
  return user;
}
