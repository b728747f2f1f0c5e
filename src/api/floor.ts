import { queryOptions } from "@tanstack/react-query";
import type { FloorBoardJson } from "../../shared/schemas/floor";
import { api } from "./client";

export type { FloorBoardJson };

export const floorKeys = {
  all: ["floor"] as const,
  board: () => [...floorKeys.all, "board"] as const,
};

/** How often the board refreshes by itself (it hangs on a wall; nobody reloads it). */
export const FLOOR_REFRESH_MS = 15_000;

export const floorBoardQueryOptions = () =>
  queryOptions({
    queryKey: floorKeys.board(),
    queryFn: ({ signal }) => api.get<FloorBoardJson>("/api/floor", { signal }),
    refetchInterval: FLOOR_REFRESH_MS,
    refetchIntervalInBackground: true,
  });
