import { describe, expect, it } from "vitest";
import { paths, safeRedirect } from "../../src/config/paths";
import { navItemsFor } from "../../src/components/layout/nav-items";
import { userFiltersFrom } from "../../src/api/users";

describe("paths", () => {
  it("builds param paths with the token encoded", () => {
    expect(paths.resetPassword.href("a/b c")).toBe("/reset-password/a%2Fb%20c");
    expect(paths.invitation.href("tok123")).toBe("/invitation/tok123");
  });

  it("keeps the return path on the sign-in link, and drops a pointless one", () => {
    expect(paths.signIn.href("/admin/users?page=2")).toBe("/sign-in?redirectTo=%2Fadmin%2Fusers%3Fpage%3D2");
    expect(paths.signIn.href("/")).toBe("/sign-in");
    expect(paths.signIn.href()).toBe("/sign-in");
  });

  it("puts user-list filters in the query string only when they matter", () => {
    expect(paths.adminUsers.href()).toBe("/admin/users");
    expect(paths.adminUsers.href({ page: 1, q: "" })).toBe("/admin/users");
    expect(paths.adminUsers.href({ page: 3, q: "ni fe" })).toBe("/admin/users?q=ni+fe&page=3");
  });
});

describe("ordering paths", () => {
  it("a list's search, status, sort and page go in its address only when they matter", () => {
    expect(paths.orders.href()).toBe("/orders");
    expect(paths.orders.href({ status: "paid", page: 1 })).toBe("/orders?status=paid");
    expect(paths.orders.href({ q: "O-1002", sort: "total", dir: "asc", page: 2 })).toBe("/orders?q=O-1002&sort=total&dir=asc&page=2");
    expect(paths.quotes.href({ status: "expired" })).toBe("/quotes?status=expired");
    expect(paths.designs.href({ q: "can" })).toBe("/designs?q=can");
  });

  it("records and the comparison by id; a saved design opens the design check with its own search", () => {
    expect(paths.order.href("a/b")).toBe("/orders/a%2Fb");
    expect(paths.orderNew.href("q1")).toBe("/quotes/q1/order");
    expect(paths.designCompare.href(["a", "b"])).toBe("/designs/compare?ids=a,b");
    expect(paths.designCheck.href()).toBe("/design-check");
    expect(paths.designCheck.href(new URLSearchParams({ shape: "box", saved: "x" }))).toBe("/design-check?shape=box&saved=x");
  });

  it("the customer's menu has designs, quotes and orders; the planner's has the orders", () => {
    expect(navItemsFor({ role: "customer" }).map((i) => i.label)).toEqual(expect.arrayContaining(["Designs", "Quotes", "Orders"]));
    expect(navItemsFor({ role: "admin" }).map((i) => i.label)).toContain("Orders");
    expect(navItemsFor({ role: "operator" }).map((i) => i.label)).not.toContain("Orders");
  });
});

describe("safeRedirect", () => {
  it("accepts same-origin paths", () => {
    expect(safeRedirect("/account")).toBe("/account");
    expect(safeRedirect("/admin/users?q=x")).toBe("/admin/users?q=x");
  });

  it("refuses other origins, protocol-relative and backslash tricks", () => {
    for (const bad of ["https://elsewhere.example/", "//elsewhere.example", "/\\elsewhere.example", "javascript:alert(1)", "", null, undefined]) {
      expect(safeRedirect(bad, "/")).toBe("/");
    }
  });

  it("does not loop back to sign-in", () => {
    expect(safeRedirect("/sign-in?redirectTo=%2F")).toBeNull();
  });
});

describe("navigation per role", () => {
  const labels = (role: Parameters<typeof navItemsFor>[0]) => navItemsFor(role).map((item) => item.label);

  // Other features add their own links; these are the ones each role must always have.
  it("offers each role its own set", () => {
    expect(labels(null)).toEqual(expect.arrayContaining(["Design check", "Sign in", "Register"]));
    expect(labels({ role: "customer" })).toEqual(expect.arrayContaining(["Home", "Design check", "Account"]));
    expect(labels({ role: "operator" })).toEqual(expect.arrayContaining(["Floor", "Account"]));
    expect(labels({ role: "qa" })).toEqual(expect.arrayContaining(["Inspection", "Account"]));
    expect(labels({ role: "admin" })).toEqual(expect.arrayContaining(["Planning", "Users", "Account"]));
  });

  it("the instrument register: its own link for the quality inspector, the planner's one quality link leads to it", () => {
    expect(labels({ role: "qa" })).toEqual(expect.arrayContaining(["Lots to inspect", "Instruments", "Calibration", "Control charts"]));
    expect(navItemsFor({ role: "admin" }).find((i) => i.label === "Quality")?.to).toBe(paths.quality.href());
    expect(labels({ role: "admin" })).not.toContain("Control charts");
    for (const role of ["customer", "operator"] as const) expect(labels({ role })).not.toContain("Instruments");
  });

  it("shows user management and sign-out-only links to the right people", () => {
    for (const role of ["customer", "operator", "qa"] as const) expect(labels({ role })).not.toContain("Users");
    for (const role of ["customer", "operator", "qa", "admin"] as const) expect(labels({ role })).not.toContain("Sign in");
    expect(labels(null)).not.toContain("Account");
  });

  it("puts home first for signed-in roles", () => {
    for (const role of ["customer", "operator", "qa", "admin"] as const) expect(navItemsFor({ role })[0]).toMatchObject({ to: "/", end: true });
  });
});

describe("user list filters from the URL", () => {
  it("defaults and sanitises", () => {
    expect(userFiltersFrom(new URLSearchParams(""))).toEqual({ page: 1, pageSize: 25, q: "" });
    expect(userFiltersFrom(new URLSearchParams("page=-4&q=%20ada%20"))).toEqual({ page: 1, pageSize: 25, q: "ada" });
    expect(userFiltersFrom(new URLSearchParams("page=3"))).toMatchObject({ page: 3 });
  });
});
