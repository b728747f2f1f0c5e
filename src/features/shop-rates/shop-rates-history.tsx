import { useQuery } from "@tanstack/react-query";
import { shopRatesHistoryQueryOptions } from "../../api/fabrication";
import { QueryError } from "../../components/query-error";
import { Panel } from "../../components/ui/panel";
import { Loading } from "../../components/ui/spinner";
import { formatDateTime } from "../../lib/format";

const partLabels: Record<string, string> = { seed: "Demo defaults", "price-list": "Prices and rates", "stock-sheets": "Stock sheets", "forming-limits": "Forming limits", construction: "Construction limits", "design-search": "Design advisor settings" };

export function ShopRatesHistory() {
  const history = useQuery(shopRatesHistoryQueryOptions);
  return (
    <Panel title="Versions">
      {history.isPending && <Loading label="Loading the versions…" />}
      {history.isError && <QueryError error={history.error} onRetry={() => void history.refetch()} what="the versions" />}
      {history.data && history.data.items.length === 0 && <p className="text-flux-600">No versions yet.</p>}
      {history.data && history.data.items.length > 0 && (
        <ol className="divide-y divide-nickel-100" aria-label="Price list versions">
          {history.data.items.map((v) => (
            <li key={v.version} className="py-2">
              <p className="font-semibold">
                Version <span className="font-mono">{v.version}</span> · {partLabels[v.part] ?? v.part}
              </p>
              <p className="text-meta text-flux-600">
                {v.createdBy?.name ?? "Seeded"} · {formatDateTime(v.createdAt)}
              </p>
            </li>
          ))}
        </ol>
      )}
    </Panel>
  );
}
