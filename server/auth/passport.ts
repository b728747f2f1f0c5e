import { Passport, type PassportStatic } from "passport";
import { Strategy as LocalStrategy } from "passport-local";
import { Organization, User } from "../models";
import { checkPassword, spendComparison } from "./passwords";

// Every signed-in request reads its user (and organisation) again; a user read in the last second
// is as good, and saves a joined query per request. Any change to a user through the models
// clears the memory at once (other processes see it within the second).
const RECENT_MS = 1000;
const recent = new Map<string, { user: User; at: number }>();
let watching = false;
function forgetUsersOnChange(): void {
  if (watching) return;
  watching = true;
  for (const hook of ["afterSave", "afterUpdate", "afterDestroy", "afterBulkUpdate", "afterBulkDestroy"] as const) User.addHook(hook, "forget-recent-users", () => recent.clear());
}

/** The signed-in user named by a session (read in the last second, or now); false when gone or disabled. */
export async function signedInUser(id: string): Promise<User | false> {
  forgetUsersOnChange();
  const hit = recent.get(id);
  if (hit && Date.now() - hit.at < RECENT_MS) return hit.user;
  const user = await User.findByPk(id, { include: [{ model: Organization, as: "organization" }] });
  if (!user || user.disabledAt) return false;
  if (recent.size > 10_000) recent.clear();
  recent.set(id, { user, at: Date.now() });
  return user;
}

/** A Passport instance of this app (not the global one), so several apps can live in one test process. */
export function createPassport(): PassportStatic {
  const passport = new Passport() as PassportStatic;
  passport.use(
    new LocalStrategy({ usernameField: "email", passwordField: "password" }, async (email, password, done) => {
      try {
        const user = await User.findOne({ where: { email: email.trim().toLowerCase() }, include: [{ model: Organization, as: "organization" }] });
        if (!user || !user.passwordHash || user.disabledAt) {
          await spendComparison(password);
          return done(null, false);
        }
        return (await checkPassword(password, user.passwordHash)) ? done(null, user) : done(null, false);
      } catch (err) {
        return done(err);
      }
    }),
  );
  passport.serializeUser((user, done) => done(null, (user as User).id));
  forgetUsersOnChange();
  passport.deserializeUser(async (id: string, done) => {
    try {
      done(null, await signedInUser(id));
    } catch (err) {
      done(err);
    }
  });
  return passport;
}
