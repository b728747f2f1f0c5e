import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import {
  jobStatuses, lotStatuses, type JobJson, type JobListQuery, type JobStatus, type JobSummaryJson, type LotHoldInput, type LotHoldReleaseInput, type LotJson,
  type LotListQuery, type LotStatus, type LotSummaryJson, type RoutingUpdateInput,
} from "../../shared/schemas/jobs";
import { DEFAULT_PAGE_SIZE, type Page } from "../../shared/schemas/list";
import type { PaperSize } from "../../shared/schemas/shop-settings";
import { normalizeCode } from "../../shared/shop-floor/codes";
import { stepKeys, type StepKey } from "../../shared/shop-floor/routing";
import { api } from "./client";
import { floorKeys } from "./floor";
import { orderKeys } from "./orders";

export type { JobJson, JobSummaryJson, LotJson, LotSummaryJson };

// --- jobs ---

export interface JobFilters {
  page: number;
  pageSize: number;
  q: string;
  step: StepKey | "";
  status: JobStatus | "";
  late: "true" | "";
  lotId: string;
  orderId: string;
  sort: NonNullable<JobListQuery["sort"]>;
  dir: "asc" | "desc";
}

const JOB_SORTS = ["dueDate", "code", "createdAt"] as const;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const jobKeys = {
  all: ["jobs"] as const,
  lists: () => [...jobKeys.all, "list"] as const,
  list: (filters: JobFilters) => [...jobKeys.lists(), filters] as const,
  details: () => [...jobKeys.all, "detail"] as const,
  detail: (id: string) => [...jobKeys.details(), id] as const,
  /** the scan station's lookup by the code in the barcode */
  byCode: (code: string) => [...jobKeys.all, "code", normalizeCode(code)] as const,
};

/** The job list's filters live in the URL; what the server would refuse falls back to the default. */
export function jobFiltersFrom(search: URLSearchParams): JobFilters {
  const page = Number.parseInt(search.get("page") ?? "1", 10);
  const step = search.get("step") as StepKey;
  const status = search.get("status") as JobStatus;
  const sort = search.get("sort") as JobFilters["sort"];
  const id = (name: string) => (UUID.test(search.get(name) ?? "") ? search.get(name)! : "");
  return {
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: DEFAULT_PAGE_SIZE,
    q: (search.get("q") ?? "").trim().slice(0, 100),
    step: stepKeys.includes(step) ? step : "",
    status: jobStatuses.includes(status) ? status : "",
    late: search.get("late") === "true" ? "true" : "",
    lotId: id("lotId"),
    orderId: id("orderId"),
    sort: JOB_SORTS.includes(sort) ? sort : "dueDate",
    // the most urgent first unless asked otherwise
    dir: search.get("dir") === "desc" ? "desc" : "asc",
  };
}

export const jobsQueryOptions = (filters: JobFilters) =>
  queryOptions({
    queryKey: jobKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<JobSummaryJson>>("/api/jobs", { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

export const jobQueryOptions = (id: string) =>
  queryOptions({
    queryKey: jobKeys.detail(id),
    queryFn: ({ signal }) => api.get<JobJson>(`/api/jobs/${encodeURIComponent(id)}`, { signal }),
  });

/** A job by the code a scanner read (lower case and spaces forgiven); an unknown code is a 404 ApiError. */
export const jobByCodeQueryOptions = (code: string) =>
  queryOptions({
    queryKey: jobKeys.byCode(code),
    queryFn: ({ signal }) => api.get<JobJson>(`/api/jobs/by-code/${encodeURIComponent(normalizeCode(code))}`, { signal }),
    enabled: normalizeCode(code).length > 0,
    retry: false,
  });

export const travelerPdfUrl = (jobId: string, paper?: PaperSize) => `/api/jobs/${encodeURIComponent(jobId)}/traveler.pdf${paper ? `?paper=${paper}` : ""}`;

/** After anything that moves a job: its page, the lists, its lot, and the board. */
export function rememberJob(queryClient: ReturnType<typeof useQueryClient>, job: JobJson): void {
  queryClient.setQueryData(jobKeys.detail(job.id), job);
  queryClient.setQueryData(jobKeys.byCode(job.code), job);
  void queryClient.invalidateQueries({ queryKey: jobKeys.lists() });
  void queryClient.invalidateQueries({ queryKey: lotKeys.detail(job.lotId) });
  void queryClient.invalidateQueries({ queryKey: lotKeys.lists() });
  void queryClient.invalidateQueries({ queryKey: floorKeys.all });
}

export function useUpdateRouting() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: RoutingUpdateInput & { id: string }) => api.put<JobJson>(`/api/jobs/${encodeURIComponent(id)}/routing`, body),
    onSuccess: (job) => rememberJob(queryClient, job),
  });
}

// --- lots ---

export interface LotFilters {
  page: number;
  pageSize: number;
  q: string;
  status: LotStatus | "";
  orderId: string;
  sort: NonNullable<LotListQuery["sort"]>;
  dir: "asc" | "desc";
}

const LOT_SORTS = ["createdAt", "number", "dueDate"] as const;

export const lotKeys = {
  all: ["lots"] as const,
  lists: () => [...lotKeys.all, "list"] as const,
  list: (filters: LotFilters) => [...lotKeys.lists(), filters] as const,
  details: () => [...lotKeys.all, "detail"] as const,
  detail: (id: string) => [...lotKeys.details(), id] as const,
};

export function lotFiltersFrom(search: URLSearchParams): LotFilters {
  const page = Number.parseInt(search.get("page") ?? "1", 10);
  const status = search.get("status") as LotStatus;
  const sort = search.get("sort") as LotFilters["sort"];
  return {
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: DEFAULT_PAGE_SIZE,
    q: (search.get("q") ?? "").trim().slice(0, 100),
    status: lotStatuses.includes(status) ? status : "",
    orderId: UUID.test(search.get("orderId") ?? "") ? search.get("orderId")! : "",
    sort: LOT_SORTS.includes(sort) ? sort : "createdAt",
    dir: search.get("dir") === "asc" ? "asc" : "desc",
  };
}

export const lotsQueryOptions = (filters: LotFilters) =>
  queryOptions({
    queryKey: lotKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<LotSummaryJson>>("/api/lots", { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

export const lotQueryOptions = (id: string) =>
  queryOptions({
    queryKey: lotKeys.detail(id),
    queryFn: ({ signal }) => api.get<LotJson>(`/api/lots/${encodeURIComponent(id)}`, { signal }),
  });

export const lotLabelPdfUrl = (lotId: string, paper?: PaperSize) => `/api/lots/${encodeURIComponent(lotId)}/label.pdf${paper ? `?paper=${paper}` : ""}`;
export const lotTravelersPdfUrl = (lotId: string, paper?: PaperSize) => `/api/lots/${encodeURIComponent(lotId)}/travelers.pdf${paper ? `?paper=${paper}` : ""}`;

function useLotMutation<TVars extends { id: string }>(fn: (vars: TVars) => Promise<LotJson>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (lot) => {
      queryClient.setQueryData(lotKeys.detail(lot.id), lot);
      void queryClient.invalidateQueries({ queryKey: lotKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: jobKeys.all });
      void queryClient.invalidateQueries({ queryKey: floorKeys.all });
      void queryClient.invalidateQueries({ queryKey: orderKeys.detail(lot.order.id) });
    },
  });
}

/** The planner or quality stops a lot (no scan moves its jobs until the planner releases it). */
export const useHoldLot = () => useLotMutation(({ id, ...body }: LotHoldInput & { id: string }) => api.post<LotJson>(`/api/lots/${encodeURIComponent(id)}/hold`, body));

/** The planner lets a held lot go on, with the reason; `reanneal` sends it back to wait for a furnace load. */
export const useReleaseLotHold = () =>
  useLotMutation(({ id, ...body }: LotHoldReleaseInput & { id: string }) => api.post<LotJson>(`/api/lots/${encodeURIComponent(id)}/hold-release`, body));
