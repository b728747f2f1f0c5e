// Every signed-in route, asked by each role that may not use it: the server decides, whatever the
// client hides. Public computations are checked in their own files.
import request from "supertest";
import { describe, expect, it } from "vitest";
import type { Role } from "../../shared/schemas/auth";
import { buildOrganization, buildTestApp, buildUser, signIn } from "../support/app";

const app = buildTestApp();

type Call = { method: "get" | "post" | "put"; path: string; body?: object };
const plannerOnly: Call[] = [
  { method: "get", path: "/api/users" },
  { method: "get", path: "/api/organizations" },
  { method: "get", path: "/api/invitations" },
  { method: "post", path: "/api/invitations", body: { email: "someone@example.test", role: "qa" } },
  { method: "get", path: "/api/shop-rates" },
  { method: "get", path: "/api/shop-rates/history" },
  { method: "put", path: "/api/shop-rates/price-list", body: {} },
  { method: "put", path: "/api/shop-rates/stock-sheets", body: {} },
  { method: "put", path: "/api/shop-rates/forming-limits", body: {} },
  { method: "get", path: "/api/materials/all" },
  { method: "post", path: "/api/materials", body: {} },
  { method: "put", path: "/api/materials/ni80", body: {} },
  { method: "get", path: "/api/materials/ni80/history" },
  { method: "get", path: "/api/shop-settings" },
  { method: "put", path: "/api/shop-settings", body: {} },
];
const ordering: Call[] = [
  { method: "get", path: "/api/designs" },
  { method: "post", path: "/api/designs", body: {} },
  { method: "post", path: "/api/designs/compare", body: {} },
  { method: "get", path: "/api/quotes" },
  { method: "post", path: "/api/quotes", body: {} },
  { method: "get", path: "/api/orders" },
  { method: "post", path: "/api/orders", body: {} },
];
const signedIn: Call[] = [...plannerOnly, ...ordering, { method: "get", path: "/api/auth/me" }, { method: "post", path: "/api/price-estimates", body: {} }];

describe("signed out", () => {
  it.each(signedIn)("401 for $method $path", async (c) => {
    const res = await request(app)[c.method](c.path).send(c.body);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("UNAUTHENTICATED");
  });
});

describe.each<Role>(["customer", "operator", "qa"])("signed in as %s", (role) => {
  it.each(plannerOnly)("403 for $method $path", async (c) => {
    const org = await buildOrganization({ kind: role === "customer" ? "customer" : "shop" });
    const { agent, csrf } = await signIn(app, await buildUser({ role, organizationId: org.id }));
    const res = await agent[c.method](c.path).set("X-CSRF-Token", csrf).send(c.body);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("FORBIDDEN");
  });
});

describe("a second customer organisation", () => {
  it("reads nothing of the first one's: its own account only, and no list that would name the first one's people", async () => {
    const first = await buildOrganization();
    const firstPerson = await buildUser({ organizationId: first.id, name: "First Org Person" });
    const second = await buildOrganization();
    const { agent } = await signIn(app, await buildUser({ organizationId: second.id }));
    for (const path of ["/api/auth/me", "/api/auth/session"]) {
      const res = await agent.get(path);
      expect(res.status).toBe(200);
      expect(res.body.user.organizationId).toBe(second.id);
      expect(res.body.user.organizationName).toBe(second.name);
    }
    // every signed-in route that lists people or organisations, each refused without a word of the first organisation
    for (const path of ["/api/users", "/api/users?q=First%20Org", "/api/organizations", "/api/invitations"]) {
      const res = await agent.get(path);
      expect(res.status).toBe(403);
      for (const secret of [first.name, first.id, firstPerson.email, firstPerson.id]) expect(res.text).not.toContain(secret);
    }
  });
});
