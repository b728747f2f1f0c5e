import { Link } from "react-router-dom";
import { useQuery } from "@tanstack/react-query";
import { quoteStatuses, quoteStatusLabels } from "../../../shared/schemas/quote";
import { quoteFiltersFrom, quotesQueryOptions, type QuoteSummaryJson } from "../../api/quotes";
import { QueryError } from "../../components/query-error";
import { ButtonLink } from "../../components/ui/button";
import { ChoiceFilter, Pager, SearchBox, SortChoice } from "../../components/ui/list-controls";
import { Panel } from "../../components/ui/panel";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { paths } from "../../config/paths";
import { formatDate } from "../../lib/format";
import { formatMoney } from "../../lib/money";
import { useListParams } from "../../lib/use-list-params";
import { QuoteStatusChip } from "./status-chip";

const sorts = { createdAt: "Date", number: "Quote number", total: "Total", expiresAt: "Valid until" } as const;

/** The organisation's quotes (the planner: everyone's), newest first, with search, status and pages in the address. */
export function QuotesList({ staff }: { staff: boolean }) {
  const [search, setParams] = useListParams();
  const filters = quoteFiltersFrom(search);
  const quotes = useQuery(quotesQueryOptions(filters));
  return (
    <Panel
      title="Quotes"
      actions={
        staff ? undefined : (
          <ButtonLink to={paths.designs.href()} variant="secondary">
            Quote a saved design
          </ButtonLink>
        )
      }
    >
      <SearchBox label={staff ? "Search by quote number, organisation or design" : "Search by quote number or design"} value={filters.q} onSearch={(q) => setParams({ q })}>
        <ChoiceFilter id="quote-status" label="Status" value={filters.status} options={quoteStatuses.map((s) => [s, quoteStatusLabels[s]] as const)} onChange={(status) => setParams({ status })} />
        <SortChoice id="quote-sort" sorts={sorts} sort={filters.sort} dir={filters.dir} onChange={(sort, dir) => setParams({ sort, dir })} />
      </SearchBox>
      {quotes.isPending ? (
        <Loading label="Loading quotes…" />
      ) : quotes.isError ? (
        <QueryError error={quotes.error} onRetry={() => void quotes.refetch()} what="the quotes" />
      ) : quotes.data.items.length === 0 ? (
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700" data-testid="quotes-empty">
          {filters.q || filters.status ? "No quote matches. Clear the search or choose another status." : staff ? "No quotes yet." : (
            <>
              No quotes yet. Open a design in the{" "}
              <Link className="font-semibold underline underline-offset-4" to={paths.designCheck.href()}>
                design check
              </Link>{" "}
              and ask for a quote there.
            </>
          )}
        </p>
      ) : (
        <>
          <ResponsiveTable<QuoteSummaryJson>
            caption={`Quotes, page ${filters.page}`}
            testId="quotes-table"
            rowTestId="quote-row"
            rows={quotes.data.items}
            rowKey={(q) => q.id}
            cardsBelow={820}
            columns={[
              {
                key: "number",
                header: "Quote",
                primary: true,
                cell: (q) => (
                  <Link className="font-mono font-semibold text-flux-800 underline underline-offset-4" to={paths.quote.href(q.id)}>
                    {q.number}
                  </Link>
                ),
              },
              ...(staff ? [{ key: "org", header: "Organisation", cell: (q: QuoteSummaryJson) => q.organization.name }] : []),
              { key: "what", header: "Design", cell: (q) => q.summary },
              { key: "qty", header: "Qty", align: "end", className: "font-mono", cell: (q) => q.quantity },
              { key: "db", header: "Predicted", align: "end", className: "font-mono whitespace-nowrap", cell: (q) => `${q.attenuation_db.toFixed(1)} dB` },
              { key: "total", header: "Total", align: "end", className: "font-mono whitespace-nowrap", cell: (q) => formatMoney(q.total_cents, q.currency) },
              { key: "until", header: "Valid until", className: "font-mono whitespace-nowrap", cell: (q) => formatDate(q.expiresAt) },
              { key: "status", header: "Status", cell: (q) => <QuoteStatusChip status={q.status} /> },
            ]}
          />
          <Pager page={filters.page} pageSize={filters.pageSize} total={quotes.data.total} noun={["quote", "quotes"]} label="Quote list pages" onPage={(page) => setParams({ page })} />
        </>
      )}
    </Panel>
  );
}
