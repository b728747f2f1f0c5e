import type { ReactNode } from "react";
import { useElementWidth } from "../../lib/use-element-width";
import { Button } from "./button";

export interface EditColumn {
  key: string;
  header: string;
  /** the column's CSS grid track, e.g. "minmax(9rem,1.4fr)" */
  track: string;
}

interface Props<R> {
  /** names the rows for screen readers ("Stock sheets") */
  caption: string;
  columns: EditColumn[];
  rows: R[];
  rowKey: (row: R) => string;
  /** one input per column; `wide`: the header row names the columns, so the inputs hide their labels */
  renderRow: (row: R, index: number, wide: boolean) => ReactNode[];
  onRemove: (index: number) => void;
  removeLabel: (index: number) => string;
  onAdd: () => void;
  addLabel: string;
  empty?: ReactNode;
  /** narrower than this (px), each row becomes a card with its labels shown */
  cardsBelow?: number;
}

/**
 * Rows of inputs under one row of column names (not a label above every input), each with its
 * remove button, and an add button; on a narrow screen each row is a card with its labels.
 */
export function EditRows<R>({ caption, columns, rows, rowKey, renderRow, onRemove, removeLabel, onAdd, addLabel, empty, cardsBelow = 640 }: Props<R>) {
  const [ref, width] = useElementWidth<HTMLDivElement>();
  const wide = width === 0 || width >= cardsBelow;
  const template = `${columns.map((c) => c.track).join(" ")} auto`;
  return (
    <div ref={ref} className="space-y-2">
      {rows.length === 0 && empty}
      {rows.length > 0 && (
        <div role="group" aria-label={caption} className={wide ? "space-y-1" : "space-y-3"}>
          {wide && (
            <div className="grid items-end gap-3 border-b border-nickel-300 pb-1 text-meta font-semibold text-flux-600" style={{ gridTemplateColumns: template }} aria-hidden="true">
              {columns.map((c) => (
                <span key={c.key}>{c.header}</span>
              ))}
              <span className="w-20" />
            </div>
          )}
          {rows.map((row, i) => {
            const cells = renderRow(row, i, wide);
            return wide ? (
              <div key={rowKey(row)} className="grid items-start gap-3 border-b border-nickel-100 py-1" style={{ gridTemplateColumns: template }} data-testid="edit-row">
                {cells.map((cell, k) => (
                  <div key={columns[k]?.key ?? k} className="min-w-0">
                    {cell}
                  </div>
                ))}
                <Button variant="quiet" className="min-h-touch w-20 px-2 text-meta" onClick={() => onRemove(i)} aria-label={removeLabel(i)}>
                  Remove
                </Button>
              </div>
            ) : (
              <div key={rowKey(row)} className="space-y-3 rounded-md border border-nickel-200 p-3" data-testid="edit-row">
                {cells}
                <Button variant="quiet" className="min-h-9 px-2 text-meta" onClick={() => onRemove(i)} aria-label={removeLabel(i)}>
                  Remove
                </Button>
              </div>
            );
          })}
        </div>
      )}
      <Button variant="secondary" onClick={onAdd}>
        {addLabel}
      </Button>
    </div>
  );
}
