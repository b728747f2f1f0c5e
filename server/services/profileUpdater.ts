import type { Transaction } from "sequelize";
import type { ProfileInput } from "../../shared/schemas/auth";
import { User, recordEvent } from "../models";

/** The signed-in person renames themself; the change is recorded. Returns the updated user (organisation kept). */
export async function profileUpdater(props: { actor: User; input: ProfileInput; ip: string | null; transaction: Transaction }): Promise<User> {
  const { actor, input, transaction } = props;
  await User.update({ name: input.name }, { where: { id: actor.id }, transaction });
  await recordEvent({ actor, action: "user.profile_updated", subject: { type: "user", id: actor.id }, data: { name: input.name }, ip: props.ip }, transaction);
  actor.name = input.name;
  return actor;
}
