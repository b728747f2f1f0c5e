import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Scan, User } from "../../server/models";
import { buildTestApp, TEST_PASSWORD } from "../support/app";
import { ensureReferenceData } from "../support/ordering";
import { buildReleasedOrder, customer, staff } from "../support/shop-floor";

// The scan and the job lookup by barcode run on the station's short chain (server/middleware/short-chain.ts),
// not the general one: these check it refuses exactly what the general chain refuses, and answers
// with the same security headers and the rolling session cookie.

const app = buildTestApp();
beforeAll(ensureReferenceData);

/** Signs in with plain requests, keeping the cookie header by hand (so it can be replayed later). */
async function session(email: string): Promise<{ cookie: string; csrf: string }> {
  const jar = new Map<string, string>();
  const keep = (res: request.Response) => {
    for (const c of ([] as string[]).concat(res.headers["set-cookie"] ?? [])) {
      const [pair] = c.split(";");
      jar.set(pair.slice(0, pair.indexOf("=")), pair.slice(pair.indexOf("=") + 1));
    }
  };
  const header = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const login = await request(app).post("/api/auth/login").send({ email, password: TEST_PASSWORD });
  expect(login.status).toBe(200);
  keep(login);
  const csrf = await request(app).get("/api/auth/csrf").set("Cookie", header());
  keep(csrf);
  return { cookie: header(), csrf: csrf.body.csrfToken };
}

const scan = (s: { cookie?: string; csrf?: string }, body: Record<string, unknown>) => {
  const r = request(app).post("/api/scans");
  if (s.cookie) r.set("Cookie", s.cookie);
  if (s.csrf) r.set("X-CSRF-Token", s.csrf);
  return r.send({ station: "press 2", ...body });
};

describe("the scan station's short chain", { timeout: 30_000 }, () => {
  it("refuses a scan signed out, without the CSRF token, with another session's token, by a customer, and with a forged cookie", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const body = { code: jobs[0].code, step: "material", action: "start" };
    const operator = await staff(app, "operator");
    const mine = await session(operator.user.email);
    const other = await session(operator.user.email);

    expect((await scan({}, body)).status).toBe(401);
    const noToken = await scan({ cookie: mine.cookie }, body);
    expect(noToken.status).toBe(403);
    expect(noToken.body.error.code).toBe("CSRF_INVALID");
    // the double-submit token is bound to its own session
    expect((await scan({ cookie: mine.cookie, csrf: other.csrf }, body)).status).toBe(403);
    expect((await scan({ cookie: mine.cookie, csrf: "not-a-token" }, body)).status).toBe(403);
    // a session cookie whose signature does not match is nobody
    const forged = mine.cookie.replace(/fw\.sid=s%3A([^.;]+)\.[^;]+/, "fw.sid=s%3A$1.AAAA");
    expect(forged).not.toBe(mine.cookie);
    expect((await scan({ cookie: forged, csrf: mine.csrf }, body)).status).toBe(401);
    // an anonymous post from another site is refused before anything else
    expect((await request(app).post("/api/scans").set("Origin", "https://elsewhere.example").send(body)).status).toBe(403);

    const buyer = await customer(app);
    const buyerSession = await session(buyer.user.email);
    const refused = await scan(buyerSession, body);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("FORBIDDEN");
    expect(await Scan.count({ where: { jobId: jobs[0].id } })).toBe(0);

    // the same session with its own token may scan
    expect((await scan(mine, body)).status).toBe(201);
  });

  it("a session ended by sign-out, or a disabled user, can no longer scan or look a job up", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const operator = await staff(app, "operator");
    const ended = await session(operator.user.email);
    const kept = await session(operator.user.email);
    const body = { code: jobs[0].code, step: "material", action: "start" };
    expect((await request(app).get(`/api/jobs/by-code/${jobs[0].code}`).set("Cookie", ended.cookie)).status).toBe(200);

    expect((await request(app).post("/api/auth/logout").set("Cookie", ended.cookie).set("X-CSRF-Token", ended.csrf)).status).toBe(204);
    expect((await scan(ended, body)).status).toBe(401);
    expect((await request(app).get(`/api/jobs/by-code/${jobs[0].code}`).set("Cookie", ended.cookie)).status).toBe(401);

    await User.update({ disabledAt: new Date() }, { where: { id: operator.user.id } });
    expect((await scan(kept, body)).status).toBe(401);
    expect(await Scan.count({ where: { jobId: jobs[0].id } })).toBe(0);
  });

  it("the job lookup by barcode: 401 signed out, 404 for another organisation's customer, 200 for the floor", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const path = `/api/jobs/by-code/${jobs[0].code.toLowerCase()}`;
    expect((await request(app).get(path)).status).toBe(401);
    const stranger = await customer(app);
    expect((await stranger.agent.get(path)).status).toBe(404);
    const qa = await staff(app, "qa");
    const res = await qa.agent.get(path);
    expect(res.status).toBe(200);
    expect(res.body.code).toBe(jobs[0].code);
  });

  it("answers with the general chain's security headers and rolls the session cookie", async () => {
    const { jobs } = await buildReleasedOrder(app);
    const operator = await staff(app, "operator");
    const s = await session(operator.user.email);
    const general = await request(app).get("/api/auth/me").set("Cookie", s.cookie);
    expect(general.status).toBe(200);
    const scanned = await scan(s, { code: jobs[0].code, step: "material", action: "start" });
    expect(scanned.status).toBe(201);
    const looked = await request(app).get(`/api/jobs/by-code/${jobs[0].code}`).set("Cookie", s.cookie);
    for (const name of ["content-security-policy", "x-content-type-options", "x-frame-options", "referrer-policy", "cross-origin-opener-policy", "cross-origin-resource-policy"]) {
      expect(general.headers[name], name).toBeTruthy();
      expect(scanned.headers[name], name).toBe(general.headers[name]);
      expect(looked.headers[name], name).toBe(general.headers[name]);
    }
    expect(scanned.headers["x-powered-by"]).toBeUndefined();
    // the same signed session id with a fresh expiry, as express-session's rolling cookie
    const sid = (h: request.Response) => ([] as string[]).concat(h.headers["set-cookie"] ?? []).find((c) => c.startsWith("fw.sid="));
    const rolled = sid(scanned);
    expect(rolled).toBeDefined();
    expect(rolled!.split(";")[0]).toBe(s.cookie.split("; ").find((c) => c.startsWith("fw.sid=")));
    expect(rolled).toMatch(/; HttpOnly/);
    expect(rolled).toMatch(/; SameSite=Lax/);
    const expires = Date.parse(/Expires=([^;]+)/.exec(rolled!)![1]);
    expect(Math.abs(expires - (Date.now() + 8 * 3600_000))).toBeLessThan(60_000);
  });
});
