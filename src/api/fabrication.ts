import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { BlankResult } from "../../shared/fabrication";
import type { BlankRequest } from "../../shared/schemas/blank";
import type { DesignConfigurationInput } from "../../shared/schemas/price-estimate";
import type { FormingLimits, PriceList, StockSheet } from "../../shared/schemas/pricing";
import type { PriceBuildUp } from "../../shared/fabrication";
import type { ConstructionUpdate, FormingLimitsUpdate, PriceRatesInput, ShopRatePart, StockSheetsUpdate } from "../../shared/schemas/shop-rates";
import type { ConstructionSettings } from "../../shared/physics/build-model";
import { api } from "./client";
import { predictionKeys } from "./predictions";

/** POST /api/blanks: the engine's result plus the material it used. */
export type BlankResponse = BlankResult & {
  material?: { id: string; name: string; density_kg_m3: number };
  suggestedKFactor?: number;
};

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

export interface PricedPart {
  layer: number;
  role: string;
  method: string;
  materialId?: string;
  thickness_mm: number;
  quantityPerAssembly: number;
  blank: { kind: "disc"; diameter_mm: number } | { kind: "rectangle" | "cross"; length_mm: number; width_mm: number };
  area_mm2: number;
  mass_kg?: number;
}

export interface NestingGroup {
  materialId: string;
  thickness_mm: number;
  sheet: { width_mm: number; length_mm: number } | null;
  partsPerSheet: number;
  sheets: number;
  sheetsEstimated: boolean;
  utilisation: number;
  scrapFraction: number;
  placements: Array<{ label: string; kind: "rectangle" | "disc"; x: number; y: number; w: number; h: number; rotated: boolean }>;
}

export interface PriceEstimate {
  parts: PricedPart[];
  nesting: NestingGroup[];
  price: PriceBuildUp;
  currency: string;
  priceListVersion: number;
}

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

export interface ShopRatesAuthor {
  id: string;
  name: string;
}

export interface ShopRates {
  version: number;
  part: ShopRatePart;
  createdAt: string;
  createdBy: ShopRatesAuthor | null;
  priceList: Omit<PriceList, "stockSheets" | "formingLimits" | "construction">;
  stockSheets: StockSheet[];
  formingLimits: FormingLimits[];
  /** what the as-built prediction assumes of the shop's construction (defaults until first saved) */
  construction: ConstructionSettings;
}

export interface ShopRatesVersion {
  version: number;
  part: ShopRatePart;
  createdAt: string;
  createdBy: ShopRatesAuthor | null;
}

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
  | { part: "construction"; body: ConstructionUpdate };

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
