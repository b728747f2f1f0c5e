import { queryOptions } from "@tanstack/react-query";
import type { OrganizationJson } from "../../shared/schemas/people";
import { api } from "./client";

export type Organization = OrganizationJson;

export const organizationKeys = {
  all: ["organizations"] as const,
  list: () => [...organizationKeys.all, "list"] as const,
};

export const organizationsQueryOptions = queryOptions({
  queryKey: organizationKeys.list(),
  queryFn: ({ signal }) => api.get<{ items: Organization[] }>("/api/organizations", { signal }),
  staleTime: 5 * 60_000,
});
