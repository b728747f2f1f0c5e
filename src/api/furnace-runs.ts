import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { FurnaceRunCreateInput, FurnaceRunJson, FurnaceRunListQuery, FurnaceRunSummaryJson, FurnacesJson } from "../../shared/schemas/furnace-runs";
import { DEFAULT_PAGE_SIZE, type Page } from "../../shared/schemas/list";
import { api } from "./client";
import { floorKeys } from "./floor";
import { jobKeys, lotKeys } from "./jobs";

export type { FurnaceRunJson, FurnaceRunSummaryJson, FurnacesJson };

export interface FurnaceRunFilters {
  page: number;
  pageSize: number;
  q: string;
  withinWindow: "true" | "false" | "";
  sort: NonNullable<FurnaceRunListQuery["sort"]>;
  dir: "asc" | "desc";
}

export const furnaceRunKeys = {
  all: ["furnace-runs"] as const,
  furnaces: () => [...furnaceRunKeys.all, "furnaces"] as const,
  lists: () => [...furnaceRunKeys.all, "list"] as const,
  list: (filters: FurnaceRunFilters) => [...furnaceRunKeys.lists(), filters] as const,
  details: () => [...furnaceRunKeys.all, "detail"] as const,
  detail: (id: string) => [...furnaceRunKeys.details(), id] as const,
};

export function furnaceRunFiltersFrom(search: URLSearchParams): FurnaceRunFilters {
  const page = Number.parseInt(search.get("page") ?? "1", 10);
  const within = search.get("withinWindow");
  return {
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: DEFAULT_PAGE_SIZE,
    q: (search.get("q") ?? "").trim().slice(0, 100),
    withinWindow: within === "true" || within === "false" ? within : "",
    sort: search.get("sort") === "number" ? "number" : "createdAt",
    dir: search.get("dir") === "asc" ? "asc" : "desc",
  };
}

/** The shop's furnaces, each alloy's anneal window and the hydrogen caution the page shows. */
export const furnacesQueryOptions = () =>
  queryOptions({
    queryKey: furnaceRunKeys.furnaces(),
    queryFn: ({ signal }) => api.get<FurnacesJson>("/api/furnaces", { signal }),
    staleTime: 60_000,
  });

export const furnaceRunsQueryOptions = (filters: FurnaceRunFilters) =>
  queryOptions({
    queryKey: furnaceRunKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<FurnaceRunSummaryJson>>("/api/furnace-runs", { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

export const furnaceRunQueryOptions = (id: string) =>
  queryOptions({
    queryKey: furnaceRunKeys.detail(id),
    queryFn: ({ signal }) => api.get<FurnaceRunJson>(`/api/furnace-runs/${encodeURIComponent(id)}`, { signal }),
  });

export const furnaceChartUrl = (runId: string) => `/api/furnace-runs/${encodeURIComponent(runId)}/chart`;

function useRunMutation<TVars>(fn: (vars: TVars) => Promise<FurnaceRunJson>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (run) => {
      queryClient.setQueryData(furnaceRunKeys.detail(run.id), run);
      void queryClient.invalidateQueries({ queryKey: furnaceRunKeys.lists() });
      // the lots are in the run now, and on hold when it fell outside the window
      void queryClient.invalidateQueries({ queryKey: lotKeys.all });
      void queryClient.invalidateQueries({ queryKey: jobKeys.all });
      void queryClient.invalidateQueries({ queryKey: floorKeys.all });
    },
  });
}

/** Records a furnace run; the answer says whether it was inside the alloy's window and why not. */
export const useRecordFurnaceRun = () => useRunMutation((body: FurnaceRunCreateInput) => api.post<FurnaceRunJson>("/api/furnace-runs", body));

/** Attaches the run's chart: a PDF or an image. */
export const useAttachFurnaceChart = () =>
  useRunMutation(({ id, file }: { id: string; file: File }) => {
    const form = new FormData();
    form.append("file", file, file.name);
    return api.post<FurnaceRunJson>(`/api/furnace-runs/${encodeURIComponent(id)}/chart`, form);
  });
