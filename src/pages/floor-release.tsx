import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { lotsQueryOptions } from "../api/jobs";
import { ordersQueryOptions } from "../api/orders";
import { requireRole, warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { FloorNav } from "../features/floor/floor-nav";
import { PaidOrders, paidOrdersFilters, RecentLots, recentLotsFilters } from "../features/floor/release-orders";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["admin"]);
  await warm(queryClient.ensureQueryData(ordersQueryOptions(paidOrdersFilters())), queryClient.ensureQueryData(lotsQueryOptions(recentLotsFilters())));
  return null;
};

export function Component() {
  return (
    <>
      <FloorNav />
      <PageHeader eyebrow="Planning" title="Release to the floor" lead="Paid orders become jobs and lots. Change a job's routing on its page before work starts; print travelers and lot labels for the floor." />
      <div className="space-y-6">
        <PanelBoundary name="the paid orders">
          <PaidOrders />
        </PanelBoundary>
        <PanelBoundary name="the lots">
          <RecentLots />
        </PanelBoundary>
      </div>
    </>
  );
}
