import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type {
  CertificateRevisionInput, CertificateSummaryJson, CertificateVerificationJson, CsvUploadAnswerJson, LotQualityJson, MeasurementAnswerJson, MeasurementInput,
  NonconformanceDecisionInput, QualityQueueRowJson,
} from "../../shared/schemas/quality";
import type { Page } from "../../shared/schemas/list";
import { api } from "./client";

export type { CertificateSummaryJson, CertificateVerificationJson, LotQualityJson, QualityQueueRowJson };

export type QueueStage = "to-measure" | "decided" | "rejected" | "certified" | "all";
export interface QueueFilters {
  stage: QueueStage;
  q?: string;
  page?: number;
}

export const qualityKeys = {
  all: ["quality"] as const,
  queue: (f: QueueFilters) => [...qualityKeys.all, "queue", f] as const,
  lot: (id: string) => [...qualityKeys.all, "lot", id] as const,
  certificates: () => [...qualityKeys.all, "certificates"] as const,
  verify: (digest: string) => ["verify", digest] as const,
};

const lotPath = (id: string, rest = "") => `/api/lots/${encodeURIComponent(id)}${rest}`;

export const qualityQueueQueryOptions = (f: QueueFilters) =>
  queryOptions({
    queryKey: qualityKeys.queue(f),
    queryFn: ({ signal }) => api.get<Page<QualityQueueRowJson>>("/api/quality/lots", { query: { stage: f.stage, q: f.q, page: f.page }, signal }),
  });

export const lotQualityQueryOptions = (id: string) =>
  queryOptions({ queryKey: qualityKeys.lot(id), queryFn: ({ signal }) => api.get<LotQualityJson>(lotPath(id, "/quality"), { signal }) });

export const certificatesQueryOptions = queryOptions({
  queryKey: qualityKeys.certificates(),
  queryFn: ({ signal }) => api.get<CertificateSummaryJson[]>("/api/certificates", { signal }),
});

/** Public: no session is needed (or made) to check a certificate. */
export const verifyQueryOptions = (digest: string) =>
  queryOptions({
    queryKey: qualityKeys.verify(digest),
    queryFn: ({ signal }) => api.get<CertificateVerificationJson>(`/api/verify/${encodeURIComponent(digest)}`, { signal, anonymousOk: true }),
    retry: false,
  });

/** A dropped file checked by its own SHA-256 (computed in the browser; the file never leaves it). */
export const verifyFileHash = (sha256: string) => api.get<CertificateVerificationJson>(`/api/verify/file/${encodeURIComponent(sha256)}`, { anonymousOk: true });

/** Every quality change refreshes the lot, the queue and the certificate lists. */
function useQualityMutation<TVars, TOut>(lotId: string, fn: (vars: TVars) => Promise<TOut>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: qualityKeys.lot(lotId) });
      void queryClient.invalidateQueries({ queryKey: [...qualityKeys.all, "queue"] });
      void queryClient.invalidateQueries({ queryKey: qualityKeys.certificates() });
    },
  });
}

export const useRecordMeasurement = (lotId: string) => useQualityMutation(lotId, (body: MeasurementInput) => api.post<MeasurementAnswerJson>(lotPath(lotId, "/measurements"), body));

export const useUploadReadings = (lotId: string) =>
  useQualityMutation(lotId, (file: File) => {
    const form = new FormData();
    form.append("file", file);
    return api.post<CsvUploadAnswerJson>(lotPath(lotId, "/measurements/csv"), form);
  });

export const useDecideNonconformance = (lotId: string) =>
  useQualityMutation(lotId, ({ id, ...body }: NonconformanceDecisionInput & { id: string }) => api.post<{ id: string }>(`/api/nonconformances/${encodeURIComponent(id)}/disposition`, body));

export const useIssueCertificate = (lotId: string) => useQualityMutation(lotId, () => api.post<{ id: string; digest: string }>(lotPath(lotId, "/certificate")));

export const useReviseCertificate = (lotId: string) =>
  useQualityMutation(lotId, ({ id, ...body }: CertificateRevisionInput & { id: string }) => api.post<{ id: string; digest: string }>(`/api/certificates/${encodeURIComponent(id)}/revisions`, body));
