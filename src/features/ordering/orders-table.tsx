import { Link } from "react-router-dom";
import { useQuery } from "@tanstack/react-query";
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { orderStatuses, orderStatusLabels } from "../../../shared/schemas/order";
import { orderFiltersFrom, ordersQueryOptions, type OrderSummaryJson } from "../../api/orders";
import { QueryError } from "../../components/query-error";
import { ChoiceFilter, Pager, SearchBox, SortChoice } from "../../components/ui/list-controls";
import { Panel } from "../../components/ui/panel";
import { ResponsiveTable, type Column } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { paths } from "../../config/paths";
import { formatDate } from "../../lib/format";
import { formatMoney } from "../../lib/money";
import { useListParams } from "../../lib/use-list-params";
import { OrderStatusChip } from "./status-chip";

type Row = OrderSummaryJson;
const col = createColumnHelper<Row>();
/** the server sorts by these keys (OrderListQuery.sort); the other columns are not sortable */
const sortLabels: Record<"createdAt" | "number" | "total" | "status" | "requestedDate", string> = { createdAt: "Placed", number: "Order number", total: "Total", status: "Status", requestedDate: "Requested date" };

function columnsFor(staff: boolean) {
  return [
    col.accessor("number", {
      id: "number",
      header: "Order",
      cell: (c) => (
        <Link className="font-mono font-semibold text-flux-800 underline underline-offset-4" to={paths.order.href(c.row.original.id)}>
          {c.getValue()}
        </Link>
      ),
    }),
    ...(staff ? [col.accessor((o) => o.organization.name, { id: "organization", header: "Organisation", enableSorting: false })] : []),
    col.accessor("summary", { id: "summary", header: "Design", enableSorting: false }),
    col.accessor("purchaseOrder", { id: "purchaseOrder", header: "Purchase order", enableSorting: false, cell: (c) => c.getValue() ?? "—" }),
    col.accessor("quantity", { id: "quantity", header: "Qty", enableSorting: false, meta: { align: "end", mono: true } }),
    col.accessor("total_cents", { id: "total", header: "Total", cell: (c) => formatMoney(c.getValue(), c.row.original.currency), meta: { align: "end", mono: true } }),
    col.accessor("requestedDate", { id: "requestedDate", header: "Requested", cell: (c) => (c.getValue() ? formatDate(c.getValue()!) : "—"), meta: { mono: true } }),
    col.accessor("createdAt", { id: "createdAt", header: "Placed", cell: (c) => formatDate(c.getValue()), meta: { mono: true } }),
    col.accessor("status", { id: "status", header: "Status", cell: (c) => <OrderStatusChip status={c.getValue()} /> }),
  ];
}

/**
 * Orders: a customer's organisation's, or everyone's for the shop's staff. Searching, the status
 * filter, the sort and the page are done by the server and kept in the address; @tanstack/react-table
 * holds the columns and the sort state (manual: it never sorts a page on its own).
 */
export function OrdersTable({ staff }: { staff: boolean }) {
  const [search, setParams] = useListParams();
  const filters = orderFiltersFrom(search);
  const orders = useQuery(ordersQueryOptions(filters));
  const sorting: SortingState = [{ id: filters.sort, desc: filters.dir === "desc" }];
  const table = useReactTable<Row>({
    data: orders.data?.items ?? [],
    columns: columnsFor(staff),
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    rowCount: orders.data?.total ?? 0,
    state: { sorting },
    onSortingChange: (updater) => {
      const next = typeof updater === "function" ? updater(sorting) : updater;
      const first = next[0];
      if (first) setParams({ sort: first.id, dir: first.desc ? "desc" : "asc" });
    },
  });

  const headers = table.getHeaderGroups()[0]?.headers ?? [];
  const tableColumns: Column<ReturnType<typeof table.getRowModel>["rows"][number]>[] = headers.map((h) => {
    const meta = (h.column.columnDef.meta ?? {}) as { align?: "end"; mono?: boolean };
    const title = flexRender(h.column.columnDef.header, h.getContext());
    const sorted = h.column.getIsSorted();
    return {
      key: h.id,
      header: title,
      primary: h.id === "number",
      align: meta.align,
      className: meta.mono ? "font-mono whitespace-nowrap" : "",
      sorted: sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined,
      headerControl: h.column.getCanSort() ? (
        <button type="button" className="inline-flex min-h-9 items-center gap-1 rounded px-1 font-semibold hover:bg-flux-100" onClick={h.column.getToggleSortingHandler()}>
          {title}
          <span aria-hidden="true" className="font-mono">{sorted === "asc" ? "↑" : sorted === "desc" ? "↓" : "↕"}</span>
          <span className="sr-only">{sorted ? `, sorted ${sorted === "asc" ? "lowest first" : "highest first"}; sort the other way` : ", sort by this"}</span>
        </button>
      ) : undefined,
      cell: (row) => {
        const cell = row.getVisibleCells().find((c) => c.column.id === h.column.id)!;
        return flexRender(cell.column.columnDef.cell, cell.getContext());
      },
    };
  });

  return (
    <Panel title={staff ? "All orders" : "Your organisation's orders"}>
      <SearchBox label={staff ? "Search by order, quote, purchase order or organisation" : "Search by order, quote or purchase order"} value={filters.q} onSearch={(q) => setParams({ q })}>
        <ChoiceFilter id="order-status" label="Status" value={filters.status} options={orderStatuses.map((s) => [s, orderStatusLabels[s]] as const)} onChange={(status) => setParams({ status })} />
        <SortChoice id="order-sort" sorts={sortLabels} sort={filters.sort} dir={filters.dir} onChange={(sort, dir) => setParams({ sort, dir })} />
      </SearchBox>
      {orders.isPending ? (
        <Loading label="Loading orders…" />
      ) : orders.isError ? (
        <QueryError error={orders.error} onRetry={() => void orders.refetch()} what="the orders" />
      ) : orders.data.items.length === 0 ? (
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700" data-testid="orders-empty">
          {filters.q || filters.status ? "No order matches. Clear the search or choose another status." : staff ? "No orders yet." : (
            <>
              No orders yet. Order from one of{" "}
              <Link className="font-semibold underline underline-offset-4" to={paths.quotes.href()}>
                your quotes
              </Link>
              .
            </>
          )}
        </p>
      ) : (
        <>
          <ResponsiveTable
            caption={`Orders, page ${filters.page}, sorted by ${sortLabels[filters.sort].toLowerCase()}`}
            testId="orders-table"
            rowTestId="order-row"
            rows={table.getRowModel().rows}
            rowKey={(r) => r.original.id}
            cardsBelow={staff ? 1000 : 900}
            columns={tableColumns}
          />
          <Pager page={filters.page} pageSize={filters.pageSize} total={orders.data.total} noun={["order", "orders"]} label="Order list pages" onPage={(page) => setParams({ page })} />
        </>
      )}
    </Panel>
  );
}
