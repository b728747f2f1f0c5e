import { Fragment, type ReactNode } from "react";
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
}

const align = (a?: "start" | "end") => (a === "end" ? "text-right" : "text-left");

/**
 * A table that fits its place: a table where there is room, one card per row (each value with its
 * column's name) where there is not. It measures its own width, so it fits a narrow side panel on
 * a wide screen as well as a phone.
 */
export function ResponsiveTable<R>({ columns, rows, rowKey, caption, footer, testId, rowTestId, cardsBelow = 560, className = "", rowClassName }: Props<R>) {
  const [ref, width] = useElementWidth<HTMLDivElement>();
  const cards = width > 0 && width < cardsBelow;
  const primary = columns.find((c) => c.primary);
  return (
    <div ref={ref} className={`min-w-0 ${className}`}>
      {cards ? (
        <>
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
                <th key={c.key} scope="col" className={`py-1.5 pr-3 font-semibold last:pr-0 ${align(c.align)}`}>
                  {c.header}
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
