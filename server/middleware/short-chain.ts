import cookieParser from "cookie-parser";
import type { RequestHandler } from "express";
import type session from "express-session";
import type { Logger } from "pino";
import type { User } from "../models";

// The short chain for the calls made most often (a scan and the job looked up by its barcode, sent
// hundreds of times a minute from the floor; a customer's quote, asked for at every change of a
// design) and for public reads. The general chain (helmet computing its headers, pino-http's child
// logger, express-session rebuilding, hashing and re-signing the session, passport's strategies)
// cost several times such a call's own statement. These do the same checks with less work; the
// order of the checks and every refusal stay those of the general chain.

/**
 * The page-security headers helmet sets, computed once: with no nonce they are the same for every
 * answer, so the short chain sets the very same list without running helmet per request.
 */
export function fixedHeaders(helmetMiddleware: RequestHandler): RequestHandler {
  const headers: Array<[string, string]> = [];
  const recorder = { setHeader: (name: string, value: string) => void headers.push([name, value]), removeHeader: () => {} };
  helmetMiddleware({} as never, recorder as never, () => {});
  if (!headers.length) throw new Error("helmet set no headers");
  return (_req, res, next) => {
    for (const [name, value] of headers) res.setHeader(name, value);
    next();
  };
}

/** No request line (errors are still logged by on-error through `req.log`). */
export const quietLog = (logger: Logger): RequestHandler => (req, _res, next) => {
  req.log = logger;
  next();
};

type StoreWithCache = session.Store & {
  get(sid: string, fn: (err: unknown, sess?: session.SessionData | null) => void): void;
  touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void;
};

/**
 * Reads the signed-in user the way express-session and passport would, without their per-request
 * machinery: the signed session cookie, the session from the store (its one-second read cache,
 * expired sessions are not found), the user from passport's cached read (disabled users are not
 * found). The session is never written here except its rolling expiry (the store writes it at most
 * once a minute) and the cookie's new expiry, as `rolling: true` does for the general chain.
 */
export function sessionUser(opts: {
  store: StoreWithCache;
  secret: string;
  cookieName: string;
  cookie: { httpOnly: boolean; sameSite: "lax"; secure: boolean; maxAge: number };
  loadUser: (id: string) => Promise<User | false>;
}): RequestHandler[] {
  const { store, secret, cookieName, cookie } = opts;
  const readSession: RequestHandler = (req, res, next) => {
    const raw = req.cookies?.[cookieName] as string | undefined;
    const sid = typeof raw === "string" && raw.startsWith("s:") ? cookieParser.signedCookie(raw, secret) : false;
    if (!sid) return next();
    store.get(sid, (err, sess) => {
      if (err) return next(err);
      const userId = (sess as { passport?: { user?: unknown } } | null | undefined)?.passport?.user;
      if (!sess || typeof userId !== "string") return next();
      opts.loadUser(userId).then((user) => {
        if (!user) return next();
        req.sessionID = sid;
        req.session = Object.assign(sess, { id: sid }) as never;
        req.user = user;
        const expires = new Date(Date.now() + cookie.maxAge);
        sess.cookie = { ...sess.cookie, expires, originalMaxAge: cookie.maxAge } as never;
        store.touch(sid, sess, (touchErr?: unknown) => touchErr && req.log?.warn({ err: touchErr }, "session touch failed"));
        // express-session's cookie with its new expiry (the same signed value: no new signature)
        if (!cookie.secure || req.secure) res.append("Set-Cookie", `${cookieName}=${encodeURIComponent(raw!)}; Path=/; Expires=${expires.toUTCString()}${cookie.httpOnly ? "; HttpOnly" : ""}; SameSite=Lax${cookie.secure ? "; Secure" : ""}`);
        next();
      }, next);
    });
  };
  return [cookieParser(), readSession];
}
