import { useState } from "react";

/**
 * The latest answer that worked, kept while newer input is being checked, computed, refused or
 * failing: a result stays on screen until a better one replaces it. `fresh` is false while the
 * shown data is a placeholder from an earlier request.
 */
export function useLastGood<T>(data: T | undefined, fresh: boolean): T | undefined {
  const [last, setLast] = useState<T | undefined>(data);
  if (fresh && data !== undefined && data !== last) setLast(data);
  return fresh && data !== undefined ? data : last;
}
