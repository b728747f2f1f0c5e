import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { shopRatesHistoryQueryOptions } from "../../api/fabrication";
import { QueryError } from "../../components/query-error";
import { Button } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { Loading } from "../../components/ui/spinner";
import { formatDateTime } from "../../lib/format";

const partLabels: Record<string, string> = { seed: "Demo defaults", "price-list": "Prices and rates", "stock-sheets": "Stock sheets", "forming-limits": "Forming limits", construction: "Construction limits", "design-search": "Design advisor settings" };
const SHOWN = 6;

export function ShopRatesHistory() {
  const history = useQuery(shopRatesHistoryQueryOptions);
  const [all, setAll] = useState(false);
  const items = history.data?.items ?? [];
  return (
    <Panel title="Versions">
      {history.isPending && <Loading label="Loading the versions…" />}
      {history.isError && <QueryError error={history.error} onRetry={() => void history.refetch()} what="the versions" />}
      {history.data && items.length === 0 && <p className="text-flux-600">No versions yet.</p>}
      {items.length > 0 && (
        <>
          <ol className="divide-y divide-nickel-100" aria-label="Price list versions">
            {(all ? items : items.slice(0, SHOWN)).map((v) => (
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
          {items.length > SHOWN && (
            <Button variant="quiet" className="mt-2 min-h-9 px-2 text-meta" aria-expanded={all} onClick={() => setAll((a) => !a)}>
              {all ? "Show the latest only" : `Show all ${items.length} versions`}
            </Button>
          )}
        </>
      )}
    </Panel>
  );
}
