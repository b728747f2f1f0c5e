import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { OrderAqlJson, QualitySettingsInput, QualitySettingsJson, SamplingPlanJson } from "../../shared/schemas/sampling";
import { api } from "./client";
import { orderKeys } from "./orders";

export type { OrderAqlJson, QualitySettingsJson, SamplingPlanJson };

export const samplingKeys = {
  all: ["sampling"] as const,
  plans: () => [...samplingKeys.all, "plan"] as const,
  plan: (lotSize: number, aql: number) => [...samplingKeys.plans(), lotSize, aql] as const,
  settings: () => [...samplingKeys.all, "settings"] as const,
};

/** GET /api/sampling-plan: public reference data, the same for everyone and never changing with time. */
export const samplingPlanQueryOptions = (lotSize: number, aql: number) =>
  queryOptions({
    queryKey: samplingKeys.plan(lotSize, aql),
    queryFn: ({ signal }) => api.get<SamplingPlanJson>("/api/sampling-plan", { query: { lotSize, aql }, signal }),
    staleTime: Infinity,
  });

/** The shop's default AQL (quality staff read it, the planner changes it). */
export const qualitySettingsQueryOptions = queryOptions({
  queryKey: samplingKeys.settings(),
  queryFn: ({ signal }) => api.get<QualitySettingsJson>("/api/shop-settings/quality", { signal }),
});

export function useSaveQualitySettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: QualitySettingsInput) => api.put<QualitySettingsJson>("/api/shop-settings/quality", body),
    onSuccess: (saved) => queryClient.setQueryData(samplingKeys.settings(), saved),
  });
}

/** The planner changes an order's AQL; the order page shows it. */
export function useSetOrderAql() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ orderId, aql }: { orderId: string; aql: number }) => api.put<OrderAqlJson>(`/api/orders/${encodeURIComponent(orderId)}/aql`, { aql }),
    onSuccess: (saved) => void queryClient.invalidateQueries({ queryKey: orderKeys.detail(saved.orderId) }),
  });
}
