import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { shopRatesHistoryQueryOptions, shopRatesQueryOptions } from "../api/fabrication";
import { adminMaterialsQueryOptions } from "../api/materials";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Disclosure } from "../components/ui/disclosure";
import { PageHeader } from "../components/ui/panel";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { ConstructionForm } from "../features/shop-rates/construction-form";
import { DesignSearchForm } from "../features/shop-rates/design-search-form";
import { FormingLimitsForm } from "../features/shop-rates/forming-limits-form";
import { PriceListForm } from "../features/shop-rates/price-list-form";
import { ShopRatesHistory } from "../features/shop-rates/shop-rates-history";
import { StockSheetsForm } from "../features/shop-rates/stock-sheets-form";
import { formatDateTime } from "../lib/format";
import { requireRole, warm } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["admin"]);
  await warm(queryClient.ensureQueryData(shopRatesQueryOptions), queryClient.ensureQueryData(shopRatesHistoryQueryOptions), queryClient.ensureQueryData(adminMaterialsQueryOptions));
  return null;
};

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The shop rates in four groups, each closed to a one-line digest until opened; the versions beside them. */
export function Component() {
  const current = useQuery(shopRatesQueryOptions);
  const library = useQuery(adminMaterialsQueryOptions);
  const materials = library.data?.items ?? [];
  const data = current.data;
  return (
    <>
      <PageHeader title="Shop rates" lead="Material prices, operation rates, stock sheet sizes, forming limits and the construction limits predictions assume. Every save is a new version; quotes keep the version they were priced with." />
      {current.isPending && <Loading label="Loading the shop rates…" />}
      {current.isError && <QueryError error={current.error} onRetry={() => void current.refetch()} what="the shop rates" />}
      {data && (
        <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]">
          <div className="min-w-0 space-y-4">
            <StatusNote tone="info" word="Current version">
              Version <strong data-testid="current-version">{data.version}</strong>, saved by {data.createdBy?.name ?? "the demo seed"} on {formatDateTime(data.createdAt)}. The demo values are invented, not quotations.
            </StatusNote>
            {library.isError && <QueryError error={library.error} onRetry={() => void library.refetch()} what="the material library (the material lists need it)" />}
            <Disclosure
              title="Prices and operation rates"
              testId="group-prices"
              digest={`${data.priceList.currency} · ${plural(data.priceList.materials.length, "material price")} · margin ${data.priceList.marginPercent} % · ${plural(data.priceList.quantityBreaks.length, "quantity break")}`}
            >
              <PanelBoundary name="the price list">
                <PriceListForm current={data} materials={materials} />
              </PanelBoundary>
            </Disclosure>
            <Disclosure title="Stock sheets" testId="group-sheets" digest={`${plural(data.stockSheets.length, "sheet size")} in ${plural(new Set(data.stockSheets.map((s) => s.materialId)).size, "material")}`}>
              <PanelBoundary name="the stock sheets">
                <StockSheetsForm current={data} materials={materials} />
              </PanelBoundary>
            </Disclosure>
            <Disclosure title="Forming limits" testId="group-forming" digest={plural(data.formingLimits.length, "material")}>
              <PanelBoundary name="the forming limits">
                <FormingLimitsForm current={data} materials={materials} />
              </PanelBoundary>
            </Disclosure>
            <Disclosure title="Construction limits (predictions)" testId="group-construction" digest={`one drawn can levels off at ${data.construction.ceilings["closed-can"].firstLayer_db} dB`}>
              <PanelBoundary name="the construction limits">
                <ConstructionForm current={data} />
              </PanelBoundary>
            </Disclosure>
            <Disclosure title="Design advisor settings" testId="group-design-search" digest={`gap steps ${data.designSearch.gapSteps_mm.join(", ")} mm · margin ${data.designSearch.minSaturationMargin}`}>
              <PanelBoundary name="the design advisor settings">
                <DesignSearchForm current={data} />
              </PanelBoundary>
            </Disclosure>
          </div>
          <PanelBoundary name="the versions">
            <ShopRatesHistory />
          </PanelBoundary>
        </div>
      )}
    </>
  );
}
