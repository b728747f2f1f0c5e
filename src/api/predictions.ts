import { keepPreviousData, queryOptions } from "@tanstack/react-query";
import type { PredictionResult } from "../../shared/physics/predict";
import type { PredictionRequest } from "../../shared/schemas/prediction";
import { api } from "./client";

export type { PredictionResult };
export interface SweepPoint {
  frequency_hz: number;
  attenuation_db: number;
}

/** Points on the page's chart: enough for a smooth log-axis curve, cheap to compute. */
export const SWEEP_POINTS = 81;

export const predictionKeys = {
  all: ["predictions"] as const,
  detail: (request: PredictionRequest) => [...predictionKeys.all, "detail", request] as const,
  sweep: (request: PredictionRequest) => [...predictionKeys.all, "sweep", request] as const,
};

export const predictionQueryOptions = (request: PredictionRequest) =>
  queryOptions({
    queryKey: predictionKeys.detail(request),
    queryFn: ({ signal }) => api.post<PredictionResult>("/api/predictions", request, { signal, computation: true }),
    // the last figures stay on screen while the next ones are computed
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    retry: false,
  });

// The sweep sets every frequency itself, so the design's own frequency is left out of the key:
// typing a new frequency does not refetch the curve.
export const sweepQueryOptions = (request: PredictionRequest) => {
  const design = { ...request, field: { ...request.field, frequency_hz: 0 } };
  return queryOptions({
    queryKey: predictionKeys.sweep(design),
    queryFn: ({ signal }) => api.post<SweepPoint[]>("/api/predictions/sweep", { ...design, points: SWEEP_POINTS }, { signal, computation: true }),
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    retry: false,
  });
};
