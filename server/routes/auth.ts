import { Router, type Request } from "express";
import type { PassportStatic } from "passport";
import {
  invitationAcceptSchema, loginSchema, passwordChangeSchema, passwordResetConfirmSchema, passwordResetRequestSchema,
  profileSchema, registerSchema,
} from "../../shared/schemas/auth";
import type { AppDeps } from "../deps";
import { AppError } from "../errors";
import { parseInput } from "../middleware/validate";
import { mailRateLimit, requireUser, signInRateLimits } from "../middleware/security";
import { Organization, type User } from "../models";
import { presentInvitationPreview } from "../presenters/invitation";
import { presentUser } from "../presenters/user";
import { authTokenFinder } from "../services/authTokenFinder";
import { invitationAccepter } from "../services/invitationAccepter";
import { passwordResetMail, registrationAttemptMail, welcomeMail } from "../services/mail-texts";
import { passwordChanger } from "../services/passwordChanger";
import { passwordResetRequester, passwordResetter } from "../services/passwordResetter";
import { profileUpdater } from "../services/profileUpdater";
import { signInRecorder } from "../services/signInRecorder";
import { userRegisterer } from "../services/userRegisterer";

// Passport 0.7 regenerates the session on login and logout, so the client fetches a new CSRF token after either.
const logIn = (req: Request, user: User) => new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));

export function authRouter(deps: AppDeps & { passport: PassportStatic; generateCsrfToken: (req: Request, res: import("express").Response) => string }): Router {
  const { sequelize, mailer, config, passport } = deps;
  const router = Router();

  router.get("/csrf", (req, res) => {
    req.session.csrfIssued = true; // the token is bound to this session, so the session must be stored
    res.set("Cache-Control", "no-store").json({ csrfToken: deps.generateCsrfToken(req, res) });
  });

  // What the client asks on every load: 200 with user null when signed out, so the console stays clean.
  router.get("/session", (req, res) => {
    res.set("Cache-Control", "no-store").json({ user: req.user ? presentUser(req.user) : null });
  });

  router.get("/me", requireUser, (req, res) => {
    res.json({ user: presentUser(req.user!) });
  });

  router.post("/login", ...signInRateLimits("sign-in", config.RATE_LIMIT_SIGN_IN), async (req, res) => {
    const input = parseInput(loginSchema, req.body);
    const user = await new Promise<User | false>((resolve, reject) => {
      req.body = input;
      passport.authenticate("local", { session: false }, (err: unknown, u: User | false) => (err ? reject(err) : resolve(u)))(req, res, reject);
    });
    if (!user) throw new AppError(401, "INVALID_CREDENTIALS", "That e-mail and password do not match an account.");
    await logIn(req, user);
    await sequelize.transaction((transaction) => signInRecorder({ user, ip: req.ip ?? null, transaction }));
    res.json({ user: presentUser(user) });
  });

  router.post("/logout", async (req, res) => {
    if (req.user) {
      await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    }
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie("fw.sid").status(204).end();
  });

  // Registration must not tell anyone whether an address already has an account (as the reset
  // request does not). The contract answers a new address 201 {"user": …} and signs the person in,
  // so an address that already has an account gets the same status and a body of the same shape
  // (the name and organisation as typed, fresh ids), a new session cookie as a sign-in would set —
  // but nobody is signed in, no account or organisation is made, and the owner is mailed that
  // someone tried. What stays observable is only that the new session is not signed in, which
  // the person typing learns by trying to go on: it costs a registration per probe (rate-limited
  // per address) and mails the owner every time, instead of the silent, free 409 it replaces.
  // The page reads the session after registering and, when nobody is signed in, says to check
  // the mail — which is true for the address's owner, the only one who can read it.
  router.post("/register", mailRateLimit("register", 30), async (req, res) => {
    const input = parseInput(registerSchema, req.body);
    const registration = await sequelize.transaction((transaction) => userRegisterer({ input, ip: req.ip ?? null, transaction }));
    if (registration.kind === "existing") {
      await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
      req.session.registrationMailed = true; // stored, so the answer carries a session cookie like a sign-in's
      mailer.send(registrationAttemptMail({ to: registration.owner.email, appUrl: config.appUrl }));
      res.status(201).json({ user: registration.lookAlike });
      return;
    }
    const { user } = registration;
    await logIn(req, user);
    mailer.send(welcomeMail({ to: user.email, name: user.name, organizationName: user.organization!.name, appUrl: config.appUrl }));
    res.status(201).json({ user: presentUser(user) });
  });

  // Public and read-only: tells the invited person what they were invited as.
  router.get("/invitations/:token", async (req, res) => {
    const invitation = await authTokenFinder({ token: req.params.token, kind: "invitation" });
    if (!invitation) throw new AppError(404, "INVITATION_INVALID", "This invitation link has expired or was already used.");
    const organization = invitation.organizationId ? await Organization.findByPk(invitation.organizationId) : null;
    res.json(presentInvitationPreview(invitation, organization));
  });

  router.post("/invitations/accept", async (req, res) => {
    const input = parseInput(invitationAcceptSchema, req.body);
    const user = await sequelize.transaction((transaction) => invitationAccepter({ input, ip: req.ip ?? null, transaction }));
    await logIn(req, user);
    res.json({ user: presentUser(user) });
  });

  router.post("/password-reset/request", mailRateLimit("password-reset", 20), async (req, res) => {
    const { email } = parseInput(passwordResetRequestSchema, req.body);
    const reset = await sequelize.transaction((transaction) => passwordResetRequester({ email, ip: req.ip ?? null, transaction }));
    if (reset) mailer.send(passwordResetMail({ to: email, link: `${config.appUrl}/reset-password/${reset.token}`, expiresAt: reset.expiresAt }));
    // The same answer whether or not the account exists.
    res.status(202).json({ message: "If an account exists for that address, a reset link is on its way." });
  });

  // Public and read-only: whether a reset link still works, so the page says so before showing a form.
  router.get("/password-reset/:token", async (req, res) => {
    const reset = await authTokenFinder({ token: req.params.token, kind: "password_reset" });
    if (!reset) throw new AppError(404, "RESET_LINK_INVALID", "This reset link has expired or was already used; ask for a new one.");
    res.set("Cache-Control", "no-store").json({ expiresAt: reset.expiresAt.toISOString() });
  });

  router.post("/password-reset/confirm", async (req, res) => {
    const input = parseInput(passwordResetConfirmSchema, req.body);
    await sequelize.transaction((transaction) => passwordResetter({ token: input.token, password: input.password, ip: req.ip ?? null, transaction }));
    res.status(204).end();
  });

  router.patch("/me", requireUser, async (req, res) => {
    const input = parseInput(profileSchema, req.body);
    const user = await sequelize.transaction((transaction) => profileUpdater({ actor: req.user!, input, ip: req.ip ?? null, transaction }));
    res.json({ user: presentUser(user) });
  });

  router.post("/password", requireUser, ...signInRateLimits("password-change", config.RATE_LIMIT_SIGN_IN), async (req, res) => {
    const input = parseInput(passwordChangeSchema, req.body);
    await sequelize.transaction((transaction) => passwordChanger({ actorId: req.user!.id, input, ip: req.ip ?? null, transaction }));
    res.status(204).end();
  });

  return router;
}
