import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { UserAccessUpdate } from "../../shared/schemas/auth";
import type { PageJson, UserEventJson, UserJson } from "../../shared/schemas/people";
import { api } from "./client";

export type UserSummary = UserJson;
export type Page<T> = PageJson<T>;

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

export type UserEvent = UserEventJson;

export const userEventsQueryOptions = (id: string) =>
  queryOptions({
    queryKey: [...userKeys.all, "events", id] as const,
    queryFn: ({ signal }) => api.get<{ items: UserEvent[] }>(`/api/users/${encodeURIComponent(id)}/events`, { signal }),
  });

/** The planner changes a person's role, or deactivates or reactivates them; the list and the trail refresh. */
export function useUpdateUserAccess() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: { id: string } & UserAccessUpdate) => api.patch<UserSummary>(`/api/users/${encodeURIComponent(id)}`, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
}
