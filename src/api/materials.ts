import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { MaterialChangeJson, MaterialCreate, MaterialJson, MaterialRecordJson, MaterialUpdate } from "../../shared/schemas/material";
import { api } from "./client";
import { predictionKeys } from "./predictions";

/** GET /api/materials: one row of the library (the server's presenter shape). */
export type MaterialSummary = MaterialJson;

/** The admin's view of a row. */
export type MaterialRecord = MaterialRecordJson;
export type MaterialChange = MaterialChangeJson;

export const materialKeys = {
  all: ["materials"] as const,
  list: () => [...materialKeys.all, "list"] as const,
  admin: () => [...materialKeys.all, "admin"] as const,
  history: (id: string) => [...materialKeys.all, "history", id] as const,
};

export const materialsQueryOptions = queryOptions({
  queryKey: materialKeys.list(),
  queryFn: ({ signal }) => api.get<MaterialSummary[]>("/api/materials", { signal }),
  staleTime: 5 * 60_000,
});

export const adminMaterialsQueryOptions = queryOptions({
  queryKey: materialKeys.admin(),
  queryFn: ({ signal }) => api.get<{ items: MaterialRecord[] }>("/api/materials/all", { signal }),
});

export const materialHistoryQueryOptions = (id: string) =>
  queryOptions({
    queryKey: materialKeys.history(id),
    queryFn: ({ signal }) => api.get<{ items: MaterialChange[] }>(`/api/materials/${encodeURIComponent(id)}/history`, { signal }),
  });

/** Save an edit or a new material; every prediction computed with the old values is stale after it. */
export function useSaveMaterial() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (save: { id: string; body: MaterialUpdate } | { id: null; body: MaterialCreate }) =>
      save.id === null ? api.post<MaterialRecord>("/api/materials", save.body) : api.put<MaterialRecord>(`/api/materials/${encodeURIComponent(save.id)}`, save.body),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: materialKeys.all });
      void queryClient.invalidateQueries({ queryKey: predictionKeys.all });
    },
  });
}
