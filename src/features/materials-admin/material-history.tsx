import { useQuery } from "@tanstack/react-query";
import { materialHistoryQueryOptions } from "../../api/materials";
import { QueryError } from "../../components/query-error";
import { Panel } from "../../components/ui/panel";
import { Loading } from "../../components/ui/spinner";
import { formatDateTime } from "../../lib/format";
import { describeMaterialChange } from "./change-words";

/** Who changed the material, when, and each value's before and after, in words. */
export function MaterialHistory({ id }: { id: string }) {
  const history = useQuery(materialHistoryQueryOptions(id));
  return (
    <Panel title={`Changes to ${id}`}>
      {history.isPending && <Loading label="Loading the changes…" />}
      {history.isError && <QueryError error={history.error} onRetry={() => void history.refetch()} what="the changes" />}
      {history.data && history.data.items.length === 0 && <p className="text-flux-600">No changes since it was loaded from the library.</p>}
      {history.data && history.data.items.length > 0 && (
        <ol className="space-y-4" aria-label="Changes" data-testid="material-changes">
          {history.data.items.map((e) => (
            <li key={e.id} className="space-y-1">
              <p className="font-semibold">
                {e.action === "material.created" ? "Added" : "Changed"} by {e.actor?.name ?? "the system"} <span className="font-normal text-flux-600">· {formatDateTime(e.at)}</span>
              </p>
              {e.changes.length > 0 && (
                <ul className="list-disc space-y-0.5 pl-5 text-meta">
                  {e.changes.slice(0, 20).map((c) => (
                    <li key={c.path} className="break-words">
                      {describeMaterialChange(c)}
                    </li>
                  ))}
                  {e.changes.length > 20 && <li>and {e.changes.length - 20} more</li>}
                </ul>
              )}
            </li>
          ))}
        </ol>
      )}
    </Panel>
  );
}
