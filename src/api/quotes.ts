import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { DEFAULT_PAGE_SIZE, type Page } from "../../shared/schemas/list";
import { quoteStatuses, type QuoteCreateInput, type QuoteJson, type QuoteListQuery, type QuoteStatus, type QuoteSummaryJson } from "../../shared/schemas/quote";
import { api } from "./client";

export type { QuoteJson, QuoteSummaryJson };

export interface QuoteFilters {
  page: number;
  pageSize: number;
  q: string;
  status: QuoteStatus | "";
  sort: NonNullable<QuoteListQuery["sort"]>;
  dir: "asc" | "desc";
}

const SORTS = ["createdAt", "number", "total", "expiresAt"] as const;

export const quoteKeys = {
  all: ["quotes"] as const,
  lists: () => [...quoteKeys.all, "list"] as const,
  list: (filters: QuoteFilters) => [...quoteKeys.lists(), filters] as const,
  details: () => [...quoteKeys.all, "detail"] as const,
  detail: (id: string) => [...quoteKeys.details(), id] as const,
};

export function quoteFiltersFrom(search: URLSearchParams): QuoteFilters {
  const page = Number.parseInt(search.get("page") ?? "1", 10);
  const status = search.get("status") as QuoteStatus;
  const sort = search.get("sort") as QuoteFilters["sort"];
  return {
    page: Number.isFinite(page) && page >= 1 ? page : 1,
    pageSize: DEFAULT_PAGE_SIZE,
    q: (search.get("q") ?? "").trim().slice(0, 100),
    status: quoteStatuses.includes(status) ? status : "",
    sort: SORTS.includes(sort) ? sort : "createdAt",
    dir: search.get("dir") === "asc" ? "asc" : "desc",
  };
}

export const quotesQueryOptions = (filters: QuoteFilters) =>
  queryOptions({
    queryKey: quoteKeys.list(filters),
    queryFn: ({ signal }) => api.get<Page<QuoteSummaryJson>>("/api/quotes", { query: { ...filters }, signal }),
    placeholderData: keepPreviousData,
  });

export const quoteQueryOptions = (id: string) =>
  queryOptions({
    queryKey: quoteKeys.detail(id),
    queryFn: ({ signal }) => api.get<QuoteJson>(`/api/quotes/${encodeURIComponent(id)}`, { signal }),
  });

/** The quote PDF: a plain link (the session cookie goes along; no CSRF token for a download). */
export const quotePdfUrl = (id: string) => `/api/quotes/${encodeURIComponent(id)}/quote.pdf`;

export function useCreateQuote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: QuoteCreateInput) => api.post<QuoteJson>("/api/quotes", body),
    onSuccess: (quote) => {
      queryClient.setQueryData(quoteKeys.detail(quote.id), quote);
      void queryClient.invalidateQueries({ queryKey: quoteKeys.lists() });
    },
  });
}

/** A new quote of the same configuration and quantity at today's rates. */
export function useRequote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post<QuoteJson>(`/api/quotes/${encodeURIComponent(id)}/requote`),
    onSuccess: (quote) => {
      queryClient.setQueryData(quoteKeys.detail(quote.id), quote);
      void queryClient.invalidateQueries({ queryKey: quoteKeys.lists() });
    },
  });
}
