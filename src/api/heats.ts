import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { HeatCreateInput, HeatJson, HeatListQuery } from "../../shared/schemas/heats";
import { DEFAULT_PAGE_SIZE, type Page } from "../../shared/schemas/list";
import { api } from "./client";

export type { HeatJson };

export interface HeatFilters {
  page: number;
  pageSize: number;
  q: string;
  materialId: string;
  sort: NonNullable<HeatListQuery["sort"]>;
  dir: "asc" | "desc";
}

const SORTS = ["receivedOn", "heatNumber", "createdAt"] as const;

export const heatKeys = {
  all: ["heats"] as const,
  lists: () => [...heatKeys.all, "list"] as const,
  list: (filters: HeatFilters) => [...heatKeys.lists(), filters] as const,
  details: () => [...heatKeys.all, "detail"] as const,
  detail: (id: string) => [...heatKeys.details(), id] as const,
};

export function heatFiltersFrom(search: URLSearchParams): HeatFilters {
  const page = Number.parseInt(search.get("page") ?? "1", 10);
  const sort = search.get("sort") as HeatFilters["sort"];
  return {
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: DEFAULT_PAGE_SIZE,
    q: (search.get("q") ?? "").trim().slice(0, 100),
    materialId: (search.get("materialId") ?? "").trim().slice(0, 40),
    sort: SORTS.includes(sort) ? sort : "receivedOn",
    dir: search.get("dir") === "asc" ? "asc" : "desc",
  };
}

export const heatsQueryOptions = (filters: HeatFilters) =>
  queryOptions({
    queryKey: heatKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<HeatJson>>("/api/heats", { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

export const heatQueryOptions = (id: string) =>
  queryOptions({
    queryKey: heatKeys.detail(id),
    queryFn: ({ signal }) => api.get<HeatJson>(`/api/heats/${encodeURIComponent(id)}`, { signal }),
  });

export const millCertificateUrl = (heatId: string) => `/api/heats/${encodeURIComponent(heatId)}/mill-certificate`;

function useHeatMutation<TVars>(fn: (vars: TVars) => Promise<HeatJson>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (heat) => {
      queryClient.setQueryData(heatKeys.detail(heat.id), heat);
      void queryClient.invalidateQueries({ queryKey: heatKeys.lists() });
    },
  });
}

/** Records a delivery of sheet (a 409 names the record that already holds this heat, alloy and gauge). */
export const useReceiveHeat = () => useHeatMutation((body: HeatCreateInput) => api.post<HeatJson>("/api/heats", body));

/** Attaches the mill certificate: a PDF or an image. */
export const useAttachMillCertificate = () =>
  useHeatMutation(({ id, file }: { id: string; file: File }) => {
    const form = new FormData();
    form.append("file", file, file.name);
    return api.post<HeatJson>(`/api/heats/${encodeURIComponent(id)}/mill-certificate`, form);
  });
