import { z } from "zod";

// Pieces every list route shares: a page of items and the query that asks for it.

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export const DEFAULT_PAGE_SIZE = 20;

/** page, pageSize, q and dir from the query string (strings), with the sort keys the list allows. */
export function listQuerySchema<S extends readonly [string, ...string[]]>(sorts: S, defaultSort: S[number]) {
  return z.object({
    page: z.coerce.number({ error: "page must be a whole number" }).int({ error: "page must be a whole number" }).min(1, { error: "page starts at 1" }).default(1),
    pageSize: z.coerce.number({ error: "pageSize must be a whole number" }).int().min(1, { error: "pageSize must be at least 1" }).max(100, { error: "pageSize must be at most 100" }).default(DEFAULT_PAGE_SIZE),
    q: z.string().trim().max(100, { error: "search for at most 100 characters" }).optional(),
    sort: z.enum(sorts, { error: `sort by ${sorts.join(", ")}` }).default(defaultSort as never),
    dir: z.enum(["asc", "desc"], { error: 'dir must be "asc" or "desc"' }).default("desc"),
  });
}

/** A person named on a record (who made it), without their e-mail. */
export interface PersonRef {
  id: string;
  name: string;
}
