import { QueryClient } from "@tanstack/react-query";
import { ApiError } from "./client";

// Client errors (4xx) will not change on a retry; network trouble and 5xx get two more tries.
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      gcTime: 5 * 60_000,
      retry: shouldRetry,
    },
    mutations: {
      retry: false,
    },
  },
});
