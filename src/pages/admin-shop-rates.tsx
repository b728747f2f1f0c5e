import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { shopRatesHistoryQueryOptions, shopRatesQueryOptions } from "../api/fabrication";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { PageHeader } from "../components/ui/panel";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { ConstructionForm } from "../features/shop-rates/construction-form";
import { DesignSearchForm } from "../features/shop-rates/design-search-form";
import { FormingLimitsForm } from "../features/shop-rates/forming-limits-form";
import { PriceListForm } from "../features/shop-rates/price-list-form";
import { ShopRatesHistory } from "../features/shop-rates/shop-rates-history";
import { StockSheetsForm } from "../features/shop-rates/stock-sheets-form";
import { requireRole, warm } from "../lib/guards";
import { formatDateTime } from "../lib/format";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["admin"]);
  await warm(queryClient.ensureQueryData(shopRatesQueryOptions), queryClient.ensureQueryData(shopRatesHistoryQueryOptions));
  return null;
};

export function Component() {
  const current = useQuery(shopRatesQueryOptions);
  const data = current.data;
  return (
    <>
      <PageHeader title="Shop rates" lead="Material prices, operation rates, stock sheet sizes, forming limits and the construction limits predictions assume. Every save is a new version; quotes keep the version they were priced with." />
      {current.isPending && <Loading label="Loading the shop rates…" />}
      {current.isError && <QueryError error={current.error} onRetry={() => void current.refetch()} what="the shop rates" />}
      {data && (
        <div className="grid gap-6 xl:grid-cols-[1fr_20rem]">
          <div className="space-y-6">
            <StatusNote tone="info" word="Current">
              version <strong data-testid="current-version">{data.version}</strong>, saved by {data.createdBy?.name ?? "the demo seed"} on {formatDateTime(data.createdAt)}. The demo values are invented, not quotations.
            </StatusNote>
            <PanelBoundary name="the price list">
              <PriceListForm current={data} />
            </PanelBoundary>
            <PanelBoundary name="the stock sheets">
              <StockSheetsForm current={data} />
            </PanelBoundary>
            <PanelBoundary name="the forming limits">
              <FormingLimitsForm current={data} />
            </PanelBoundary>
            <PanelBoundary name="the construction limits">
              <ConstructionForm current={data} />
            </PanelBoundary>
            <PanelBoundary name="the design advisor settings">
              <DesignSearchForm current={data} />
            </PanelBoundary>
          </div>
          <PanelBoundary name="the versions">
            <ShopRatesHistory />
          </PanelBoundary>
        </div>
      )}
    </>
  );
}
