import { useEffect, useId, useState, type FormEvent, type ReactNode } from "react";
import { Button } from "./button";

/** The search box of a list: searched on Enter or the button, cleared with one click; the list's address keeps it. */
export function SearchBox({ label, value, onSearch, children }: { label: string; value: string; onSearch: (q: string) => void; children?: ReactNode }) {
  const [draft, setDraft] = useState(value);
  const id = useId();
  useEffect(() => setDraft(value), [value]);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onSearch(draft.trim());
  };
  return (
    <form role="search" onSubmit={submit} className="mb-4 flex flex-wrap items-end gap-3">
      <div className="min-w-0 flex-1 basis-56 space-y-1.5">
        <label htmlFor={id} className="block font-semibold text-flux-900">
          {label}
        </label>
        <input id={id} type="search" value={draft} onChange={(e) => setDraft(e.target.value)} className="block min-h-touch w-full rounded-md border border-nickel-400 bg-white px-3 py-2" />
      </div>
      <Button type="submit" variant="secondary">
        Search
      </Button>
      {value && (
        <Button variant="quiet" onClick={() => onSearch("")}>
          Clear
        </Button>
      )}
      {children}
    </form>
  );
}

/** Previous / next under a list, with where the reader is: "Page 2 of 5 · 93 orders". */
export function Pager({ page, pageSize, total, noun, label, onPage }: { page: number; pageSize: number; total: number; noun: [string, string]; label: string; onPage: (page: number) => void }) {
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  return (
    <nav aria-label={label} className="mt-4 flex flex-wrap items-center justify-between gap-3">
      <p className="tabular text-flux-700">
        Page <span className="font-mono">{page}</span> of <span className="font-mono">{pageCount}</span> · <span className="font-mono">{total}</span> {total === 1 ? noun[0] : noun[1]}
      </p>
      <div className="flex gap-2">
        <Button variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
          Previous
        </Button>
        <Button variant="secondary" disabled={page >= pageCount} onClick={() => onPage(page + 1)}>
          Next
        </Button>
      </div>
    </nav>
  );
}
