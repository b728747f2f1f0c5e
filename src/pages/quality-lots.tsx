import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { Link, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { qualityQueueQueryOptions, type QualityQueueRowJson, type QueueStage } from "../api/quality";
import { QueryError } from "../components/query-error";
import { PageHeader, Panel } from "../components/ui/panel";
import { ResponsiveTable } from "../components/ui/responsive-table";
import { Loading } from "../components/ui/spinner";
import { paths } from "../config/paths";
import { requireRole, warm } from "../lib/guards";
import { QualityNav } from "../features/quality/quality-nav";

const stages: Array<{ value: QueueStage; label: string }> = [
  { value: "to-measure", label: "To measure" },
  { value: "decided", label: "Accepted, no certificate yet" },
  { value: "rejected", label: "Rejected" },
  { value: "certified", label: "Certified" },
  { value: "all", label: "All lots" },
];

const filtersFrom = (search: URLSearchParams) => {
  const stage = (stages.find((s) => s.value === search.get("stage"))?.value ?? "to-measure") as QueueStage;
  const page = Math.max(1, Number(search.get("page")) || 1);
  return { stage, page };
};

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["qa", "admin"]);
  await warm(queryClient.ensureQueryData(qualityQueueQueryOptions(filtersFrom(new URL(request.url).searchParams))));
  return null;
};

const statusWords: Record<string, string> = { to_measure: "to measure", accepted: "accepted", rejected: "rejected", on_hold: "on hold", shipped: "shipped" };

export function Component() {
  const [search, setSearch] = useSearchParams();
  const filters = filtersFrom(search);
  const list = useQuery(qualityQueueQueryOptions(filters));
  const pages = list.data ? Math.max(1, Math.ceil(list.data.total / list.data.pageSize)) : 1;
  return (
    <>
      <QualityNav />
      <PageHeader title="Lots to inspect" lead="Annealed lots wait here for their sample to be measured; accepted lots for their certificate." />
      <nav aria-label="Lot stages" className="mb-4 flex flex-wrap gap-2">
        {stages.map((s) => (
          <Link key={s.value} to={paths.qualityLots.href(s.value)} aria-current={filters.stage === s.value ? "page" : undefined}
            className={`rounded-md border px-3 py-2 text-meta ${filters.stage === s.value ? "border-flux-800 bg-flux-900 text-white" : "border-nickel-400 bg-white text-flux-900"}`}>
            {s.label}
          </Link>
        ))}
      </nav>
      <Panel>
        {list.isPending && <Loading label="Loading the lots…" />}
        {list.isError && <QueryError error={list.error} onRetry={() => void list.refetch()} what="the lots" />}
        {list.data && list.data.items.length === 0 && <p className="text-flux-700">No lots at this stage.</p>}
        {list.data && list.data.items.length > 0 && (
          <ResponsiveTable<QualityQueueRowJson>
            caption="Lots"
            testId="quality-lots"
            rowTestId="quality-lot-row"
            rows={list.data.items}
            rowKey={(r) => r.id}
            cardsBelow={760}
            columns={[
              { key: "lot", header: "Lot", primary: true, cell: (r) => <Link className="font-semibold text-flux-900 underline" to={paths.qualityLot.href(r.id)}>{r.number}</Link> },
              { key: "customer", header: "Customer", cell: (r) => `${r.customer}, ${r.order.number}` },
              { key: "material", header: "Material", cell: (r) => r.material },
              { key: "pieces", header: "Pieces", align: "end", cell: (r) => r.pieces },
              { key: "measured", header: "Measured", align: "end", cell: (r) => `${r.measured}${r.failures ? ` (${r.failures} failing)` : ""}` },
              { key: "status", header: "Status", cell: (r) => [statusWords[r.status] ?? r.status, r.openNonconformance, r.certificate ? `${r.certificate.number} rev. ${r.certificate.revision}` : null].filter(Boolean).join(" · ") },
            ]}
          />
        )}
        {list.data && pages > 1 && (
          <div className="mt-4 flex items-center gap-3">
            <button type="button" className="underline disabled:opacity-50" disabled={filters.page <= 1} onClick={() => setSearch({ stage: filters.stage, page: String(filters.page - 1) })}>Previous page</button>
            <span className="text-meta">Page {filters.page} of {pages}</span>
            <button type="button" className="underline disabled:opacity-50" disabled={filters.page >= pages} onClick={() => setSearch({ stage: filters.stage, page: String(filters.page + 1) })}>Next page</button>
          </div>
        )}
      </Panel>
    </>
  );
}
