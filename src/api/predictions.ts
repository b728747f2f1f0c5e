import { keepPreviousData, queryOptions } from "@tanstack/react-query";
import type { PredictionResult, SweepPoint } from "../../shared/physics/predict";
import type { PredictionRequest } from "../../shared/schemas/prediction";
import { api } from "./client";

export type { PredictionResult, SweepPoint };
/** The chart's frequency range, hertz, both ends included. */
export interface SweepRange {
  from_hz: number;
  to_hz: number;
}

/** Points on the page's chart: enough for a smooth log-axis curve, cheap to compute. */
export const SWEEP_POINTS = 81;

export const predictionKeys = {
  all: ["predictions"] as const,
  detail: (request: PredictionRequest) => [...predictionKeys.all, "detail", request] as const,
  sweep: (request: PredictionRequest, range: SweepRange) => [...predictionKeys.all, "sweep", request, range] as const,
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
// typing a new frequency does not refetch the curve (unless it widens the range).
export const sweepQueryOptions = (request: PredictionRequest, range: SweepRange) => {
  const design = { ...request, field: { ...request.field, frequency_hz: 0 } };
  return queryOptions({
    queryKey: predictionKeys.sweep(design, range),
    queryFn: ({ signal }) => api.post<SweepPoint[]>("/api/predictions/sweep", { ...design, points: SWEEP_POINTS, ...range }, { signal, computation: true }),
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    retry: false,
  });
};
