import { Button } from "../../components/ui/button";

/** Page n of m with Previous / Next, for the floor's lists. */
export function Pager({ label, page, pageSize, total, noun, onPage }: { label: string; page: number; pageSize: number; total: number; noun: [string, string]; onPage: (page: number) => void }) {
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

/** A small stamp for a late job or lot: a word, not only a colour. */
export function LateMark({ late }: { late: boolean }) {
  return late ? <span className="ml-2 inline-block rounded bg-danger-700 px-1.5 py-0.5 text-meta font-semibold text-white">Late</span> : null;
}
