import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { instrumentKinds } from "../../shared/schemas/instrument";
import type {
  CalibrationRecordInput, InstrumentCreateInput, InstrumentDetailJson, InstrumentJson, InstrumentKind, InstrumentSendInput, InstrumentUpdateInput,
} from "../../shared/schemas/instrument";
import { api } from "./client";

export type { InstrumentDetailJson, InstrumentJson };

export interface InstrumentFilters {
  kind?: InstrumentKind;
  /** only those usable today (in service, not past due) */
  usable?: boolean;
}

/** The register's filters as its address holds them (unknown values are ignored): ?kind=search-coil&usable=true. */
export function instrumentFiltersFrom(search: URLSearchParams): InstrumentFilters {
  const kind = instrumentKinds.find((k) => k === search.get("kind"));
  return { ...(kind ? { kind } : {}), ...(search.get("usable") === "true" ? { usable: true } : {}) };
}

export const instrumentKeys = {
  all: ["instruments"] as const,
  lists: () => [...instrumentKeys.all, "list"] as const,
  list: (filters: InstrumentFilters = {}) => [...instrumentKeys.lists(), filters] as const,
  details: () => [...instrumentKeys.all, "detail"] as const,
  detail: (id: string) => [...instrumentKeys.details(), id] as const,
};

const path = (id: string, rest = "") => `/api/instruments/${encodeURIComponent(id)}${rest}`;

export const instrumentsQueryOptions = (filters: InstrumentFilters = {}) =>
  queryOptions({
    queryKey: instrumentKeys.list(filters),
    queryFn: ({ signal }) => api.get<InstrumentJson[]>("/api/instruments", { query: { kind: filters.kind, usable: filters.usable === undefined ? undefined : String(filters.usable) }, signal }),
  });

export const instrumentQueryOptions = (id: string) =>
  queryOptions({
    queryKey: instrumentKeys.detail(id),
    queryFn: ({ signal }) => api.get<InstrumentDetailJson>(path(id), { signal }),
  });

export const certificateUrl = (instrumentId: string, fileId: string) => path(instrumentId, `/certificates/${encodeURIComponent(fileId)}`);

/** Every change to an instrument refreshes its page and the register's lists. */
function useInstrumentMutation<TVars>(fn: (vars: TVars) => Promise<InstrumentJson>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (saved) => {
      void queryClient.invalidateQueries({ queryKey: instrumentKeys.detail(saved.id) });
      void queryClient.invalidateQueries({ queryKey: instrumentKeys.lists() });
    },
  });
}

export const useCreateInstrument = () => useInstrumentMutation((body: InstrumentCreateInput) => api.post<InstrumentJson>("/api/instruments", body));

export const useUpdateInstrument = () => useInstrumentMutation(({ id, ...body }: InstrumentUpdateInput & { id: string }) => api.patch<InstrumentJson>(path(id), body));

export const useSendToCalibration = () =>
  useInstrumentMutation(({ id, ...body }: InstrumentSendInput & { id: string }) => api.post<InstrumentJson>(path(id, "/send-to-calibration"), body));

/** The certificate and its dates as one multipart form. */
export function calibrationForm(record: CalibrationRecordInput, file: File): FormData {
  const form = new FormData();
  for (const [key, value] of Object.entries(record)) if (value !== undefined && value !== "") form.append(key, String(value));
  form.append("file", file, file.name);
  return form;
}

/** Back from the laboratory with its new certificate (the instrument must be out). */
export const useReturnFromCalibration = () =>
  useInstrumentMutation(({ id, record, file }: { id: string; record: CalibrationRecordInput; file: File }) => api.post<InstrumentJson>(path(id, "/return-from-calibration"), calibrationForm(record, file)));

/** A calibration done in place, with its certificate (the instrument is in service). */
export const useRecordCalibration = () =>
  useInstrumentMutation(({ id, record, file }: { id: string; record: CalibrationRecordInput; file: File }) => api.post<InstrumentJson>(path(id, "/calibrations"), calibrationForm(record, file)));
