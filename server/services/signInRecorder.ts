import type { Transaction } from "sequelize";
import { User, recordEvent } from "../models";

/** Notes a successful sign-in on the account and in the audit trail. */
export async function signInRecorder(props: { user: User; ip: string | null; transaction: Transaction }): Promise<void> {
  const { user, transaction } = props;
  await User.update({ lastSignInAt: new Date() }, { where: { id: user.id }, transaction });
  await recordEvent({ actor: user, action: "user.signed_in", subject: { type: "user", id: user.id }, ip: props.ip }, transaction);
}
