import type { QueryClient } from "@tanstack/react-query";
import { data, redirect } from "react-router-dom";
import { meQueryOptions, type Role, type User } from "../api/auth";
import { ApiError } from "../api/client";
import { paths } from "../config/paths";

// Route guards only decide what to show; the server still authorizes every request.

export async function requireUser(queryClient: QueryClient, request: Request): Promise<User> {
  const user = await queryClient.ensureQueryData(meQueryOptions);
  if (!user) {
    const url = new URL(request.url);
    throw redirect(paths.signIn.href(url.pathname + url.search));
  }
  return user;
}

export async function requireRole(queryClient: QueryClient, request: Request, roles: readonly Role[]): Promise<User> {
  const user = await requireUser(queryClient, request);
  if (!roles.includes(user.role)) {
    throw data({ message: "This page is for another role." }, { status: 403, statusText: "Forbidden" });
  }
  return user;
}

/**
 * Loaders warm the cache with the component's own query options, but a failed warm-up is the
 * panel's business (it shows the error and a retry), not a reason to fail the whole route.
 */
export async function warm(...loads: Promise<unknown>[]): Promise<void> {
  await Promise.allSettled(loads);
}

/**
 * Warms a record the page is about: when the server says it does not exist (or belongs to another
 * organisation, which it answers the same way), the page is the not-found page, not a panel error.
 */
export async function warmRecord(load: Promise<unknown>): Promise<void> {
  try {
    await load;
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) throw data({ message: "Not found." }, { status: 404, statusText: "Not Found" });
  }
}
