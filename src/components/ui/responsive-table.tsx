import { Fragment, useId, type ReactNode } from "react";
import { control } from "./field";
import { useElementWidth } from "../../lib/use-element-width";

export interface Column<R> {
  key: string;
  header: ReactNode;
  cell: (row: R) => ReactNode;
  /** numbers line up on the right */
  align?: "start" | "end";
  /** the cell that names the row: the card's title on a narrow screen */
  primary?: boolean;
  className?: string;
  /** the rows may be ordered by this column (when the table is given a `sort`) */
  sortable?: boolean;
  /** the column's name in the sort choice of the card layout, when its header is not plain text */
  sortLabel?: string;
}

/** The order the rows are shown in; the caller sorts them and is told what the person picked. */
export interface TableSort {
  key: string;
  descending: boolean;
  /** a column's header clicked (no direction: the caller decides), or a column and direction picked */
  onSort: (key: string, descending?: boolean) => void;
}

export interface FooterLine {
  key: string;
  label: ReactNode;
  value: ReactNode;
  strong?: boolean;
  testId?: string;
}

interface Props<R> {
  columns: Column<R>[];
  rows: R[];
  rowKey: (row: R) => string;
  /** names the table for screen readers (and the list of cards on a narrow screen) */
  caption: string;
  /** totals under the rows: label and value */
  footer?: FooterLine[];
  testId?: string;
  rowTestId?: string;
  /** narrower than this (px), the rows become cards: no page or panel scrolls sideways */
  cardsBelow?: number;
  className?: string;
  rowClassName?: (row: R) => string;
  sort?: TableSort;
}

const align = (a?: "start" | "end") => (a === "end" ? "text-right" : "text-left");

/**
 * A table that fits its place: a table where there is room, one card per row (each value with its
 * column's name) where there is not. It measures its own width, so it fits a narrow side panel on
 * a wide screen as well as a phone.
 */
export function ResponsiveTable<R>({ columns, rows, rowKey, caption, footer, testId, rowTestId, cardsBelow = 560, className = "", rowClassName, sort }: Props<R>) {
  const [ref, width] = useElementWidth<HTMLDivElement>();
  const cards = width > 0 && width < cardsBelow;
  const primary = columns.find((c) => c.primary);
  const sortable = sort ? columns.filter((c) => c.sortable) : [];
  return (
    <div ref={ref} className={`min-w-0 ${className}`}>
      {cards ? (
        <>
          {sort && sortable.length > 0 && <CardSort columns={sortable} sort={sort} />}
          <ul className="divide-y divide-nickel-200 border-y border-nickel-200" aria-label={caption} data-testid={testId} data-layout="cards">
            {rows.map((row) => (
              <li key={rowKey(row)} className={`space-y-1 py-3 ${rowClassName?.(row) ?? ""}`} data-testid={rowTestId}>
                {primary && <p className="font-semibold text-flux-950">{primary.cell(row)}</p>}
                <dl className="flex flex-wrap items-baseline gap-x-5 gap-y-1">
                  {columns
                    .filter((c) => c !== primary)
                    .map((c) => (
                      <div key={c.key} className="flex min-w-0 max-w-full items-baseline gap-1.5">
                        <dt className="shrink-0 text-meta text-flux-600">{c.header}</dt>
                        <dd className={`min-w-0 break-words ${c.className ?? ""}`}>{c.cell(row)}</dd>
                      </div>
                    ))}
                </dl>
              </li>
            ))}
          </ul>
          {footer && footer.length > 0 && (
            <dl className="mt-2 grid grid-cols-[minmax(0,1fr)_auto] gap-x-4 gap-y-1">
              {footer.map((f) => (
                <Fragment key={f.key}>
                  <dt className={f.strong ? "font-semibold" : ""}>{f.label}</dt>
                  <dd className={`text-right font-mono ${f.strong ? "font-semibold" : ""}`} data-testid={f.testId}>
                    {f.value}
                  </dd>
                </Fragment>
              ))}
            </dl>
          )}
        </>
      ) : (
        <table className="w-full border-collapse text-left text-body" data-testid={testId} data-layout="table">
          <caption className="sr-only">{caption}</caption>
          <thead className="border-b-2 border-nickel-300 text-meta text-flux-600">
            <tr>
              {columns.map((c) => (
                <th
                  key={c.key}
                  scope="col"
                  className={`py-1.5 pr-3 font-semibold last:pr-0 ${align(c.align)}`}
                  aria-sort={sort && c.sortable ? (sort.key === c.key ? (sort.descending ? "descending" : "ascending") : "none") : undefined}
                >
                  {sort && c.sortable ? (
                    <button
                      type="button"
                      className={`inline-flex min-h-touch items-center gap-1 rounded hover:text-flux-900 hover:underline ${c.align === "end" ? "justify-end text-right" : "text-left"} ${sort.key === c.key ? "text-flux-900" : ""}`}
                      onClick={() => sort.onSort(c.key)}
                    >
                      {c.header}
                      <SortMark state={sort.key === c.key ? (sort.descending ? "descending" : "ascending") : "none"} />
                    </button>
                  ) : (
                    c.header
                  )}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={rowKey(row)} className={`border-b border-nickel-200 ${rowClassName?.(row) ?? ""}`} data-testid={rowTestId}>
                {columns.map((c) => (
                  <td key={c.key} className={`py-1.5 pr-3 align-top last:pr-0 ${align(c.align)} ${c.className ?? ""}`}>
                    {c.cell(row)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
          {footer && footer.length > 0 && (
            <tfoot>
              {footer.map((f, i) => (
                <tr key={f.key} className={i === 0 ? "border-t-2 border-nickel-300" : ""}>
                  <th scope="row" colSpan={columns.length - 1} className={`py-1 pr-3 text-right ${f.strong ? "font-semibold" : "font-normal"}`}>
                    {f.label}
                  </th>
                  <td className={`py-1 text-right font-mono ${f.strong ? "font-semibold" : ""}`} data-testid={f.testId}>
                    {f.value}
                  </td>
                </tr>
              ))}
            </tfoot>
          )}
        </table>
      )}
    </div>
  );
}

/** An arrow for the column the rows are ordered by, a faint double arrow on the others; the header's aria-sort says it in words. */
function SortMark({ state }: { state: "ascending" | "descending" | "none" }) {
  return (
    <svg className={`size-3.5 shrink-0 ${state === "none" ? "opacity-40" : ""}`} viewBox="0 0 12 12" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" aria-hidden="true">
      {state === "none" ? <path d="M3.5 4.5L6 2l2.5 2.5M3.5 7.5L6 10l2.5-2.5" /> : state === "ascending" ? <path d="M6 10V2M3 5l3-3 3 3" /> : <path d="M6 2v8M3 7l3 3 3-3" />}
    </svg>
  );
}

/** Cards have no header row to click: the order is a choice above them. */
function CardSort<R>({ columns, sort }: { columns: Column<R>[]; sort: TableSort }) {
  const id = useId();
  return (
    <div className="mb-2 flex flex-wrap items-end gap-2">
      <div className="min-w-0 flex-1 space-y-1">
        <label htmlFor={id} className="block text-meta font-semibold text-flux-700">
          Order by
        </label>
        <select id={id} className={`${control} border-nickel-400`} value={sort.key} onChange={(e) => sort.onSort(e.target.value)}>
          {columns.map((c) => (
            <option key={c.key} value={c.key}>
              {c.sortLabel ?? (typeof c.header === "string" ? c.header : c.key)}
            </option>
          ))}
        </select>
      </div>
      <div className="space-y-1">
        <label htmlFor={`${id}-way`} className="block text-meta font-semibold text-flux-700">
          Which first
        </label>
        <select id={`${id}-way`} className={`${control} border-nickel-400`} value={sort.descending ? "descending" : "ascending"} onChange={(e) => sort.onSort(sort.key, e.target.value === "descending")}>
          <option value="ascending">Smallest first</option>
          <option value="descending">Largest first</option>
        </select>
      </div>
    </div>
  );
}
