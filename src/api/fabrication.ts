import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { BlankJson, BlankRequest } from "../../shared/schemas/blank";
import type { DesignConfigurationInput, PriceEstimateJson } from "../../shared/schemas/price-estimate";
import type { ConstructionUpdate, DesignSearchUpdate, FormingLimitsUpdate, PriceRatesInput, ShopRatesJson, ShopRatesVersionJson, StockSheetsUpdate } from "../../shared/schemas/shop-rates";
import { api } from "./client";
import { predictionKeys } from "./predictions";

/** POST /api/blanks: the engine's result plus the material it used. */
export type BlankResponse = BlankJson;

/** A request as the form builds it; the server validates it (numbers may still be missing). */
export type BlankRequestDraft = Partial<BlankRequest> | Record<string, unknown>;

export const blankKeys = {
  all: ["blanks"] as const,
  detail: (request: BlankRequestDraft) => [...blankKeys.all, request] as const,
};

export const blankQueryOptions = (request: BlankRequestDraft) =>
  queryOptions({
    queryKey: blankKeys.detail(request),
    queryFn: ({ signal }) => api.post<BlankResponse>("/api/blanks", request, { signal, computation: true }),
    // the drawing stays on screen while the next one is computed
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });

/** The flat pattern as DXF text, for a Blob download. */
export const fetchFlatPatternDxf = (request: BlankRequestDraft) => api.post<string>("/api/blanks/dxf", request, { responseType: "text", computation: true });

// --- price estimate for a configuration and quantity (signed-in) ---

export type PriceEstimate = PriceEstimateJson;
export type NestingGroup = PriceEstimateJson["nesting"][number];

export interface PriceEstimateRequestDraft {
  configuration: DesignConfigurationInput;
  quantity: number;
}

export const priceEstimateKeys = {
  all: ["price-estimates"] as const,
  detail: (body: PriceEstimateRequestDraft) => [...priceEstimateKeys.all, body] as const,
};

export const priceEstimateQueryOptions = (body: PriceEstimateRequestDraft) =>
  queryOptions({
    queryKey: priceEstimateKeys.detail(body),
    queryFn: ({ signal }) => api.post<PriceEstimate>("/api/price-estimates", body, { signal }),
    placeholderData: keepPreviousData,
  });

// --- the planner's shop rates ---

export type ShopRates = ShopRatesJson;
export type ShopRatesVersion = ShopRatesVersionJson;

export const shopRatesKeys = {
  all: ["shop-rates"] as const,
  current: () => [...shopRatesKeys.all, "current"] as const,
  history: () => [...shopRatesKeys.all, "history"] as const,
};

export const shopRatesQueryOptions = queryOptions({
  queryKey: shopRatesKeys.current(),
  queryFn: ({ signal }) => api.get<ShopRates>("/api/shop-rates", { signal }),
});

export const shopRatesHistoryQueryOptions = queryOptions({
  queryKey: shopRatesKeys.history(),
  queryFn: ({ signal }) => api.get<{ items: ShopRatesVersion[] }>("/api/shop-rates/history", { signal }),
});

type ShopRatesSave =
  | { part: "price-list"; body: PriceRatesInput }
  | { part: "stock-sheets"; body: StockSheetsUpdate }
  | { part: "forming-limits"; body: FormingLimitsUpdate }
  | { part: "construction"; body: ConstructionUpdate }
  | { part: "design-search"; body: DesignSearchUpdate };

/** Saves one part as a new version; every estimate priced with the old list is stale after it. */
export function useSaveShopRates() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (save: ShopRatesSave) => api.put<ShopRates>(`/api/shop-rates/${save.part}`, save.body),
    onSuccess: (saved) => {
      queryClient.setQueryData(shopRatesKeys.current(), saved);
      void queryClient.invalidateQueries({ queryKey: shopRatesKeys.all });
      void queryClient.invalidateQueries({ queryKey: priceEstimateKeys.all });
      // the construction settings change the as-built predictions
      if (saved.part === "construction") void queryClient.invalidateQueries({ queryKey: predictionKeys.all });
    },
  });
}
