import connectPgSimple from "connect-pg-simple";
import session from "express-session";
import type pg from "pg";
import { User } from "../models";

const READ_FRESH_MS = 1000;
const TOUCH_EVERY_MS = 60_000;
const MAX_REMEMBERED = 10_000;

/**
 * Sessions in PostgreSQL (connect-pg-simple), with the two round trips every signed-in request
 * used to cost made cheaper: a session read in the last second is reused (a copy; any write or
 * destruction through this store, and any change to a user, such as a password reset that ends
 * the user's sessions, forgets it at once; other processes see changes within the second), and
 * the rolling expiry is written at most once a minute per session (it is eight hours).
 */
export function createSessionStore(pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  class SessionStore extends PgStore {
    #read = new Map<string, { json: string; at: number }>();
    #touched = new Map<string, number>();
    readonly #forget = () => this.#read.clear();

    constructor() {
      super({ pool, tableName: "session", createTableIfMissing: false, pruneSessionInterval: 15 * 60 });
      for (const hook of ["afterSave", "afterUpdate", "afterDestroy", "afterBulkUpdate", "afterBulkDestroy"] as const) User.addHook(hook, this.#forget);
    }

    override get(sid: string, fn: (err: unknown, sess?: session.SessionData | null) => void): void {
      const hit = this.#read.get(sid);
      if (hit && Date.now() - hit.at < READ_FRESH_MS) return void fn(null, JSON.parse(hit.json));
      super.get(sid, (err: unknown, sess?: session.SessionData | null) => {
        if (!err && sess) {
          if (this.#read.size > MAX_REMEMBERED) this.#read.clear();
          this.#read.set(sid, { json: JSON.stringify(sess), at: Date.now() });
        }
        fn(err, sess);
      });
    }

    override set(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
      this.#read.delete(sid);
      super.set(sid, sess, fn);
    }

    override destroy(sid: string, fn?: (err?: unknown) => void): void {
      this.#read.delete(sid);
      super.destroy(sid, fn);
    }

    override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
      const now = Date.now();
      if (now - (this.#touched.get(sid) ?? 0) < TOUCH_EVERY_MS) return void fn?.();
      if (this.#touched.size > MAX_REMEMBERED) this.#touched.clear();
      this.#touched.set(sid, now);
      super.touch(sid, sess, fn);
    }

    override close(): void {
      for (const hook of ["afterSave", "afterUpdate", "afterDestroy", "afterBulkUpdate", "afterBulkDestroy"] as const) User.removeHook(hook, this.#forget as never);
      super.close();
    }
  }
  return new SessionStore();
}
