import { queryOptions } from "@tanstack/react-query";
import { api } from "./client";

export interface Organization {
  id: string;
  name: string;
  kind: "shop" | "customer";
}

export const organizationKeys = {
  all: ["organizations"] as const,
  list: () => [...organizationKeys.all, "list"] as const,
};

export const organizationsQueryOptions = queryOptions({
  queryKey: organizationKeys.list(),
  queryFn: ({ signal }) => api.get<{ items: Organization[] }>("/api/organizations", { signal }),
  staleTime: 5 * 60_000,
});
