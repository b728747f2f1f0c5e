import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { MeasuredLot } from "../../shared/calibration";
import type { CalibrationOverviewJson, CalibrationSettingsInput, ControlChartJson } from "../../shared/schemas/calibration";
import { api } from "./client";

export type { CalibrationOverviewJson, ControlChartJson, MeasuredLot };

export const calibrationKeys = {
  all: ["calibration"] as const,
  overview: () => [...calibrationKeys.all, "overview"] as const,
  charts: () => [...calibrationKeys.all, "control-charts"] as const,
  lot: (id: string) => [...calibrationKeys.all, "lot", id] as const,
};

export const calibrationOverviewQueryOptions = queryOptions({
  queryKey: calibrationKeys.overview(),
  queryFn: ({ signal }) => api.get<CalibrationOverviewJson>("/api/calibration/overview", { signal }),
  // while a refit is queued or running, look again every few seconds
  refetchInterval: (q) => (q.state.data?.refitPending ? 3000 : false),
});

export const controlChartsQueryOptions = queryOptions({
  queryKey: calibrationKeys.charts(),
  queryFn: ({ signal }) => api.get<ControlChartJson[]>("/api/calibration/control-charts", { signal }),
});

export const measuredLotQueryOptions = (id: string) =>
  queryOptions({ queryKey: calibrationKeys.lot(id), queryFn: ({ signal }) => api.get<MeasuredLot>(`/api/calibration/lots/${encodeURIComponent(id)}`, { signal }) });

export function useRefitCalibration() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<{ queued: boolean }>("/api/calibration/refits", {}),
    onSuccess: () => qc.invalidateQueries({ queryKey: calibrationKeys.all }),
  });
}

export function useSaveCalibrationSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CalibrationSettingsInput) => api.put<CalibrationSettingsInput>("/api/calibration/settings", body),
    onSuccess: () => qc.invalidateQueries({ queryKey: calibrationKeys.all }),
  });
}
