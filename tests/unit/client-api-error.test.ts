import { describe, expect, it } from "vitest";
import { ApiError, buildUrl, isCsrfFailure, toApiError } from "../../src/api/client";
import { splitServerErrors } from "../../src/lib/form-errors";
import { pendingInvitations, type Invitation } from "../../src/api/invitations";

describe("toApiError", () => {
  it("reads the error envelope, fields included", () => {
    const error = toApiError(400, {
      error: { code: "VALIDATION", message: "Check the fields.", fields: { email: "Enter a valid email address.", "layers.0.thickness_mm": "Too thin." } },
    });
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: "VALIDATION", message: "Check the fields." });
    expect(error.fields).toEqual({ email: "Enter a valid email address.", "layers.0.thickness_mm": "Too thin." });
    expect(error.isValidation).toBe(true);
  });

  it("survives bodies that are not ours", () => {
    const fromHtml = toApiError(502, null);
    expect(fromHtml).toMatchObject({ status: 502, code: "HTTP_502", fields: {} });
    expect(fromHtml.message).toMatch(/server/i);
    expect(toApiError(429, { error: "slow down" })).toMatchObject({ code: "HTTP_429" });
    expect(toApiError(400, { error: { fields: { name: 42, email: "bad" } } }).fields).toEqual({ email: "bad" });
  });

  it("recognises a refused CSRF token and nothing else", () => {
    expect(isCsrfFailure(toApiError(403, { error: { code: "CSRF_INVALID", message: "Bad token." } }))).toBe(true);
    expect(isCsrfFailure(toApiError(403, { error: { code: "FORBIDDEN", message: "invalid csrf token" } }))).toBe(true);
    expect(isCsrfFailure(toApiError(403, { error: { code: "FORBIDDEN", message: "Not yours." } }))).toBe(false);
    expect(isCsrfFailure(toApiError(400, { error: { code: "CSRF_INVALID", message: "x" } }))).toBe(false);
  });
});

describe("buildUrl", () => {
  it("drops empty parameters", () => {
    expect(buildUrl("/api/users", { page: 2, pageSize: 25, q: "" })).toBe("/api/users?page=2&pageSize=25");
    expect(buildUrl("/api/users", { q: undefined })).toBe("/api/users");
  });
});

describe("splitServerErrors", () => {
  it("puts known fields beside the field and the rest above the form", () => {
    const error = toApiError(400, { error: { code: "VALIDATION", message: "Invalid.", fields: { email: "Taken.", token: "Expired." } } });
    expect(splitServerErrors(error, ["email", "password"] as const)).toEqual({ fieldErrors: { email: "Taken." }, formMessage: "Expired." });
  });

  it("uses the form's own wording for a status", () => {
    const error = toApiError(401, { error: { code: "UNAUTHENTICATED", message: "Nope." } });
    expect(splitServerErrors(error, ["email"] as const, { 401: "Wrong pair." }).formMessage).toBe("Wrong pair.");
    expect(splitServerErrors(error, ["email"] as const).formMessage).toBe("Nope.");
  });
});

describe("pendingInvitations", () => {
  it("drops the ones that expired since the list was fetched, soonest expiry first", () => {
    const now = new Date("2026-01-10T00:00:00Z");
    const invitation = (id: string, expiresAt: string): Invitation => ({
      id, email: `${id}@x.test`, role: "customer", organizationId: "5f0c", organizationName: "Org", expiresAt, createdAt: "2026-01-01T00:00:00Z",
    });
    const items = [invitation("a", "2026-01-12T00:00:00Z"), invitation("b", "2026-01-09T00:00:00Z"), invitation("c", "2026-01-11T00:00:00Z")];
    expect(pendingInvitations(items, now).map((item) => item.id)).toEqual(["c", "a"]);
  });
});
