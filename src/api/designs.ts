import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { DesignComparisonJson, DesignCreateInput, DesignJson, DesignListQuery, DesignUpdateInput } from "../../shared/schemas/design";
import { DEFAULT_PAGE_SIZE, type Page } from "../../shared/schemas/list";
import { api } from "./client";

export type { DesignComparisonJson, DesignJson };

export interface DesignFilters {
  page: number;
  pageSize: number;
  q: string;
  sort: NonNullable<DesignListQuery["sort"]>;
  dir: "asc" | "desc";
}

const SORTS = ["updatedAt", "createdAt", "name"] as const;

export const designKeys = {
  all: ["designs"] as const,
  lists: () => [...designKeys.all, "list"] as const,
  list: (filters: DesignFilters) => [...designKeys.lists(), filters] as const,
  details: () => [...designKeys.all, "detail"] as const,
  detail: (id: string) => [...designKeys.details(), id] as const,
  comparison: (ids: string[], quantity: number) => [...designKeys.all, "comparison", ids, quantity] as const,
};

/** The list's filters live in the URL, so the loader and the table read the same ones. */
export function designFiltersFrom(search: URLSearchParams): DesignFilters {
  const page = Number.parseInt(search.get("page") ?? "1", 10);
  const sort = search.get("sort") as DesignFilters["sort"];
  return {
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: DEFAULT_PAGE_SIZE,
    q: (search.get("q") ?? "").trim().slice(0, 100),
    sort: SORTS.includes(sort) ? sort : "updatedAt",
    dir: search.get("dir") === "asc" ? "asc" : "desc",
  };
}

export const designsQueryOptions = (filters: DesignFilters) =>
  queryOptions({
    queryKey: designKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<DesignJson>>("/api/designs", { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

export const designQueryOptions = (id: string) =>
  queryOptions({
    queryKey: designKeys.detail(id),
    queryFn: ({ signal }) => api.get<DesignJson>(`/api/designs/${encodeURIComponent(id)}`, { signal }),
  });

/** Up to three saved designs side by side, priced at today's rates. */
export const designComparisonQueryOptions = (ids: string[], quantity = 1) =>
  queryOptions({
    queryKey: designKeys.comparison(ids, quantity),
    queryFn: ({ signal }) => api.post<DesignComparisonJson>("/api/designs/compare", { ids, quantity }, { signal }),
    enabled: ids.length > 0,
  });

export function useCreateDesign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: DesignCreateInput) => api.post<DesignJson>("/api/designs", body),
    onSuccess: (design) => {
      queryClient.setQueryData(designKeys.detail(design.id), design);
      void queryClient.invalidateQueries({ queryKey: designKeys.lists() });
    },
  });
}

export function useUpdateDesign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: DesignUpdateInput & { id: string }) => api.patch<DesignJson>(`/api/designs/${encodeURIComponent(id)}`, body),
    onSuccess: (design) => {
      queryClient.setQueryData(designKeys.detail(design.id), design);
      void queryClient.invalidateQueries({ queryKey: designKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: [...designKeys.all, "comparison"] });
    },
  });
}

export function useDuplicateDesign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, name }: { id: string; name?: string }) => api.post<DesignJson>(`/api/designs/${encodeURIComponent(id)}/duplicate`, name ? { name } : {}),
    onSuccess: (copy) => {
      queryClient.setQueryData(designKeys.detail(copy.id), copy);
      void queryClient.invalidateQueries({ queryKey: designKeys.lists() });
    },
  });
}

export function useDeleteDesign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete<void>(`/api/designs/${encodeURIComponent(id)}`),
    onSuccess: (_void, id) => {
      queryClient.removeQueries({ queryKey: designKeys.detail(id) });
      void queryClient.invalidateQueries({ queryKey: designKeys.lists() });
    },
  });
}
