import { Op, type Transaction } from "sequelize";
import { hashToken } from "../auth/passwords";
import { AuthToken } from "../models";

/** The open (unused, unexpired) token of that kind, locked for the caller's transaction when one is given. */
export function authTokenFinder(props: { token: string; kind: AuthToken["kind"]; transaction?: Transaction }): Promise<AuthToken | null> {
  return AuthToken.findOne({
    where: { tokenHash: hashToken(props.token), kind: props.kind, usedAt: { [Op.is]: null }, expiresAt: { [Op.gt]: new Date() } },
    transaction: props.transaction,
    lock: props.transaction ? props.transaction.LOCK.UPDATE : undefined,
  });
}
