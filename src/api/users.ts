import { keepPreviousData, queryOptions } from "@tanstack/react-query";
import type { Role } from "../../shared/schemas/auth";
import { api } from "./client";

export interface UserSummary {
  id: string;
  email: string;
  name: string;
  role: Role;
  organizationName: string | null;
  createdAt: string;
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export interface UserFilters {
  page: number;
  pageSize: number;
  q: string;
}

export const USERS_PAGE_SIZE = 25;

export const userKeys = {
  all: ["users"] as const,
  lists: () => [...userKeys.all, "list"] as const,
  list: (filters: UserFilters) => [...userKeys.lists(), filters] as const,
};

/** The list filters live in the URL so the loader and the table read the same ones. */
export function userFiltersFrom(search: URLSearchParams): UserFilters {
  const page = Number.parseInt(search.get("page") ?? "1", 10);
  return {
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: USERS_PAGE_SIZE,
    q: (search.get("q") ?? "").trim().slice(0, 200),
  };
}

export const usersQueryOptions = (filters: UserFilters) =>
  queryOptions({
    queryKey: userKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<UserSummary>>("/api/users", { query: { ...filters }, signal }),
    // Keep the current page on screen while the next one loads.
    placeholderData: keepPreviousData,
  });
