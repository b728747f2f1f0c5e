import { useEffect, useState } from "react";

/** The value once it has stopped changing for `ms`; compared by JSON so fresh objects do not re-fire. */
export function useDebounced<T>(value: T, ms = 300): T {
  const key = JSON.stringify(value);
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(JSON.parse(key) as T), ms);
    return () => clearTimeout(t);
  }, [key, ms]);
  return settled;
}
