import { Passport, type PassportStatic } from "passport";
import { Strategy as LocalStrategy } from "passport-local";
import { Organization, User } from "../models";
import { checkPassword, spendComparison } from "./passwords";

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
  passport.deserializeUser(async (id: string, done) => {
    try {
      const user = await User.findByPk(id, { include: [{ model: Organization, as: "organization" }] });
      done(null, user && !user.disabledAt ? user : false);
    } catch (err) {
      done(err);
    }
  });
  return passport;
}
