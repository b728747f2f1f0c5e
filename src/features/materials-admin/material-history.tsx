import { useQuery } from "@tanstack/react-query";
import { materialHistoryQueryOptions } from "../../api/materials";
import { QueryError } from "../../components/query-error";
import { Panel } from "../../components/ui/panel";
import { Loading } from "../../components/ui/spinner";
import { formatDateTime } from "../../lib/format";

const show = (v: unknown) => (v === null || v === undefined ? "—" : typeof v === "object" ? JSON.stringify(v) : String(v));

/** Who changed the material, when, and each value's before and after. */
export function MaterialHistory({ id }: { id: string }) {
  const history = useQuery(materialHistoryQueryOptions(id));
  return (
    <Panel title={`Changes to ${id}`}>
      {history.isPending && <Loading label="Loading the changes…" />}
      {history.isError && <QueryError error={history.error} onRetry={() => void history.refetch()} what="the changes" />}
      {history.data && history.data.items.length === 0 && <p className="text-flux-600">No changes since it was loaded from the library.</p>}
      {history.data && history.data.items.length > 0 && (
        <ol className="space-y-4" aria-label="Changes">
          {history.data.items.map((e) => (
            <li key={e.id} className="border-l-4 border-nickel-300 pl-3">
              <p className="font-semibold">
                {e.action === "material.created" ? "Added" : "Changed"} by {e.actor?.name ?? "the system"} · {formatDateTime(e.at)}
              </p>
              {e.changes.length > 0 && (
                <ul className="mt-1 space-y-0.5 text-meta">
                  {e.changes.slice(0, 20).map((c) => (
                    <li key={c.path} className="break-words">
                      <span className="font-mono">{c.path}</span>: {show(c.before)} → <strong>{show(c.after)}</strong>
                    </li>
                  ))}
                </ul>
              )}
            </li>
          ))}
        </ol>
      )}
    </Panel>
  );
}
