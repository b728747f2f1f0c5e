import { useSearchParams } from "react-router-dom";

/**
 * A list's filters live in its address (a reload keeps them, a link shares them): `set` changes
 * some and, unless the page itself is asked for, goes back to page 1. Empty values leave the address.
 */
export function useListParams() {
  const [search, setSearch] = useSearchParams();
  const set = (changes: Record<string, string | number | null | undefined>) => {
    const next = new URLSearchParams(search);
    if (!("page" in changes)) next.delete("page");
    for (const [key, value] of Object.entries(changes)) {
      if (value === null || value === undefined || value === "" || (key === "page" && Number(value) <= 1)) next.delete(key);
      else next.set(key, String(value));
    }
    setSearch(next);
  };
  return [search, set] as const;
}
