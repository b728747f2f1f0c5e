import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { DesignAdviceJson, DesignAdviceRequestInput } from "../../shared/schemas/design-advice";
import { api } from "./client";

export type { DesignAdviceJson, DesignAdviceRequestInput, DesignCandidateJson, ClosestDesignJson } from "../../shared/schemas/design-advice";

export const designAdviceKeys = {
  all: ["design-advice"] as const,
  searches: () => [...designAdviceKeys.all, "search"] as const,
  search: (request: DesignAdviceRequestInput) => [...designAdviceKeys.searches(), request] as const,
};

const search = (request: DesignAdviceRequestInput, signal?: AbortSignal) => api.post<DesignAdviceJson>("/api/design-advice", request, { signal });

/**
 * The answer for a requirement. A search takes a second or so: the last answer stays on screen
 * while the next one comes, and leaving a search (a new requirement) aborts it on the server too.
 */
export const designAdviceQueryOptions = (request: DesignAdviceRequestInput) =>
  queryOptions({
    queryKey: designAdviceKeys.search(request),
    queryFn: ({ signal }) => search(request, signal),
    placeholderData: keepPreviousData,
    // prices follow the shop rates; an answer a few minutes old is still the one to show
    staleTime: 5 * 60_000,
    retry: false,
  });

/** A search on demand (the form's button); its answer is kept under the same key the query reads. */
export function useDesignAdvice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: DesignAdviceRequestInput) => search(request),
    onSuccess: (answer, request) => queryClient.setQueryData(designAdviceKeys.search(request), answer),
  });
}
