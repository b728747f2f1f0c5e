import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { lotStatusLabels, type LotSummaryJson } from "../../../shared/schemas/jobs";
import type { OrderJson, OrderSummaryJson } from "../../../shared/schemas/order";
import { ApiError } from "../../api/client";
import { lotFiltersFrom, lotsQueryOptions, lotTravelersPdfUrl, lotLabelPdfUrl } from "../../api/jobs";
import { orderFiltersFrom, ordersQueryOptions, useReleaseOrder } from "../../api/orders";
import { paths } from "../../config/paths";
import { formatDate } from "../../lib/format";
import { Button } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { LateMark } from "./late-mark";
import { Pager } from "../../components/ui/list-controls";

export const paidOrdersFilters = () => orderFiltersFrom(new URLSearchParams({ status: "paid", sort: "requestedDate", dir: "asc" }));
export const recentLotsFilters = (page = 1) => lotFiltersFrom(new URLSearchParams({ page: String(page) }));

/** Paid orders waiting to become jobs and lots; each released after a confirmation. */
export function PaidOrders() {
  const orders = useQuery(ordersQueryOptions(paidOrdersFilters()));
  const [released, setReleased] = useState<OrderJson | null>(null);
  return (
    <Panel title="Paid, waiting for release">
      {released && <ReleasedNote order={released} />}
      {orders.isPending ? (
        <Loading label="Loading paid orders…" />
      ) : orders.isError ? (
        <QueryError error={orders.error} onRetry={() => orders.refetch()} what="the paid orders" />
      ) : orders.data.items.length === 0 ? (
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700">No paid order is waiting. Orders appear here once their payment has arrived.</p>
      ) : (
        <ul className="space-y-3" data-testid="paid-orders">
          {orders.data.items.map((o) => (
            <PaidOrder key={o.id} order={o} onReleased={setReleased} />
          ))}
        </ul>
      )}
    </Panel>
  );
}

function PaidOrder({ order, onReleased }: { order: OrderSummaryJson; onReleased: (o: OrderJson) => void }) {
  const release = useReleaseOrder();
  const [asking, setAsking] = useState(false);
  const error = release.error instanceof ApiError ? release.error : null;
  const go = async () => {
    try {
      onReleased(await release.mutateAsync(order.id));
    } catch {
      // shown below
    } finally {
      setAsking(false);
    }
  };
  return (
    <li className="rounded-md border border-nickel-200 p-4" data-testid="paid-order">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="font-semibold">
            <span className="font-mono">{order.number}</span> · {order.organization.name}
          </p>
          <p>
            {order.summary} × {order.quantity}
          </p>
          <p className="text-meta text-flux-700">
            Paid {order.paidAt ? formatDate(order.paidAt) : "—"} · wanted by {order.requestedDate ? formatDate(order.requestedDate) : "the quoted lead time"}
            {order.purchaseOrder ? ` · PO ${order.purchaseOrder}` : ""}
          </p>
        </div>
        {!asking && <Button onClick={() => setAsking(true)}>Release to the floor…</Button>}
      </div>
      {asking && (
        <div className="mt-3 space-y-3 rounded-md border-2 border-caution-200 bg-caution-50 p-4" role="group" aria-label={`Confirm the release of ${order.number}`}>
          <p>
            Release <span className="font-mono">{order.number}</span>? Each part of the design becomes a job with its routing, grouped into lots of one alloy that fit the furnace. The customer is told by mail. Routings can be changed until work starts.
          </p>
          <div className="flex flex-wrap gap-3">
            <Button onClick={() => void go()} pending={release.isPending} pendingLabel="Releasing…">
              Yes, release
            </Button>
            <Button variant="secondary" onClick={() => setAsking(false)}>
              Cancel
            </Button>
          </div>
        </div>
      )}
      {error && (
        <StatusNote tone="danger" word="Not released" live="assertive" className="mt-3">
          {error.message}
        </StatusNote>
      )}
    </li>
  );
}

function ReleasedNote({ order }: { order: OrderJson }) {
  const jobs = order.lots.reduce((n, l) => n + l.jobs.length, 0);
  return (
    <StatusNote tone="ok" word="Released" live="polite" className="mb-4">
      <span data-testid="released-note">
        {order.number}: {jobs} {jobs === 1 ? "job" : "jobs"} in {order.lots.length} {order.lots.length === 1 ? "lot" : "lots"}.
      </span>
      <ul className="mt-2 space-y-2">
        {order.lots.map((l) => (
          <li key={l.id}>
            Lot{" "}
            <Link className="font-mono font-semibold underline" to={paths.floorLot.href(l.id)}>
              {l.number}
            </Link>{" "}
            ({l.materialId}, {l.pieces} pcs): {l.jobs.map((j, i) => (
              <span key={j.id}>
                {i > 0 && ", "}
                <Link className="font-mono underline" to={paths.floorJob.href(j.id)}>
                  {j.code}
                </Link>
              </span>
            ))}{" "}
            ·{" "}
            <a className="underline" href={lotTravelersPdfUrl(l.id)} target="_blank" rel="noopener">
              travelers (PDF)
            </a>
          </li>
        ))}
      </ul>
    </StatusNote>
  );
}

/** Lots on the floor, newest first, with their label and travelers to print. */
export function RecentLots() {
  const [page, setPage] = useState(1);
  const filters = recentLotsFilters(page);
  const lots = useQuery(lotsQueryOptions(filters));
  return (
    <Panel title="Lots on the floor">
      {lots.isPending ? (
        <Loading label="Loading lots…" />
      ) : lots.isError ? (
        <QueryError error={lots.error} onRetry={() => lots.refetch()} what="the lots" />
      ) : lots.data.items.length === 0 ? (
        <p className="text-flux-700">No lots yet.</p>
      ) : (
        <>
          <ResponsiveTable<LotSummaryJson>
            caption="Lots, newest first"
            rows={lots.data.items}
            rowKey={(l) => l.id}
            testId="recent-lots"
            cardsBelow={700}
            columns={[
              { key: "number", header: "Lot", primary: true, cell: (l) => <><Link className="font-mono font-semibold underline" to={paths.floorLot.href(l.id)}>{l.number}</Link><LateMark late={l.late} /></> },
              { key: "order", header: "Order", cell: (l) => <><span className="font-mono">{l.orderNumber}</span> · {l.organizationName}</> },
              { key: "state", header: "State", cell: (l) => lotStatusLabels[l.status] },
              { key: "pieces", header: "Pieces", align: "end", className: "tabular font-mono", cell: (l) => l.pieces },
              {
                key: "print",
                header: "Print",
                cell: (l) => (
                  <span className="flex flex-wrap gap-x-3">
                    <a className="underline" href={lotLabelPdfUrl(l.id)} target="_blank" rel="noopener">label</a>
                    <a className="underline" href={lotTravelersPdfUrl(l.id)} target="_blank" rel="noopener">travelers</a>
                  </span>
                ),
              },
            ]}
          />
          <Pager label="Lot list pages" page={filters.page} pageSize={filters.pageSize} total={lots.data.total} noun={["lot", "lots"]} onPage={setPage} />
        </>
      )}
    </Panel>
  );
}
