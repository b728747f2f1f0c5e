import bcrypt from "bcryptjs";
import { createHash, randomBytes } from "node:crypto";

const COST = process.env.NODE_ENV === "test" ? 4 : 12;

export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);
export const checkPassword = (plain: string, hash: string) => bcrypt.compare(plain, hash);

// Compared against when no account matches, so a wrong e-mail costs the same time as a wrong password.
const DUMMY_HASH = bcrypt.hashSync("no-such-account-dummy", COST);
export const spendComparison = (plain: string) => bcrypt.compare(plain, DUMMY_HASH);

/** A mailable secret and the SHA-256 we keep of it. */
export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}
export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");
