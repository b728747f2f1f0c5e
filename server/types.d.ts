import type { User as UserModel } from "./models/User";

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserModel {}
  }
}

declare module "express-session" {
  interface SessionData {
    /** set by GET /api/auth/csrf so an anonymous visitor's session is stored (the token is bound to it) */
    csrfIssued?: boolean;
    /** set when a registration for an address that already has an account was answered (see the register route) */
    registrationMailed?: boolean;
  }
}

export {};
