import type { Transaction } from "sequelize";
import type { PasswordChangeInput } from "../../shared/schemas/auth";
import { checkPassword, hashPassword } from "../auth/passwords";
import { AuthenticationError, ValidationError } from "../errors";
import { User, recordEvent } from "../models";

/** The signed-in person sets a new password, proving the current one first. */
export async function passwordChanger(props: { actorId: string; input: PasswordChangeInput; ip: string | null; transaction: Transaction }): Promise<void> {
  const { input, transaction } = props;
  const user = await User.findByPk(props.actorId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!user?.passwordHash) throw AuthenticationError();
  if (!(await checkPassword(input.currentPassword, user.passwordHash))) {
    throw ValidationError({ currentPassword: "The current password is not right." }, "The current password is not right.");
  }
  user.passwordHash = await hashPassword(input.newPassword);
  await user.save({ transaction });
  await recordEvent({ actor: user, action: "password.changed", subject: { type: "user", id: user.id }, ip: props.ip }, transaction);
}
