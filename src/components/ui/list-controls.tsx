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

const selectClass = "block min-h-touch rounded-md border border-nickel-400 bg-white px-3";

/** A list's filter by one value (a status), "Any" first; the list's address keeps it. */
export function ChoiceFilter({ id, label, value, options, onChange }: { id: string; label: string; value: string; options: ReadonlyArray<readonly [string, string]>; onChange: (value: string) => void }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block font-semibold text-flux-900">
        {label}
      </label>
      <select id={id} className={selectClass} value={value} onChange={(e) => onChange(e.target.value)}>
        <option value="">Any</option>
        {options.map(([key, text]) => (
          <option key={key} value={key}>
            {text}
          </option>
        ))}
      </select>
    </div>
  );
}

const latestFirst = (): [string, string] => [", highest or latest first", ", lowest or earliest first"];

/** "Order by": each sortable column both ways, as one choice; the list's address keeps it. */
export function SortChoice({ id, sorts, sort, dir, onChange, directions = latestFirst }: {
  id: string;
  sorts: Record<string, string>;
  sort: string;
  dir: string;
  onChange: (sort: string, dir: string) => void;
  /** what follows the column's name for descending and ascending */
  directions?: (key: string) => [string, string];
}) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block font-semibold text-flux-900">
        Order by
      </label>
      <select
        id={id}
        className={selectClass}
        value={`${sort}:${dir}`}
        onChange={(e) => {
          const [s, d] = e.target.value.split(":");
          onChange(s, d);
        }}
      >
        {Object.entries(sorts).flatMap(([key, label]) => {
          const [desc, asc] = directions(key);
          return [
            <option key={`${key}:desc`} value={`${key}:desc`}>
              {label}
              {desc}
            </option>,
            <option key={`${key}:asc`} value={`${key}:asc`}>
              {label}
              {asc}
            </option>,
          ];
        })}
      </select>
    </div>
  );
}
