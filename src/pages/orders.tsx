import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { meQueryOptions } from "../api/auth";
import { orderFiltersFrom, ordersQueryOptions } from "../api/orders";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { OrdersTable } from "../features/ordering/orders-table";
import { requireUser, warm } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireUser(queryClient, request);
  await warm(queryClient.ensureQueryData(ordersQueryOptions(orderFiltersFrom(new URL(request.url).searchParams))));
  return null;
};

export function Component() {
  const staff = useQuery(meQueryOptions).data?.role !== "customer";
  return (
    <>
      <PageHeader title="Orders" lead={staff ? "Every customer's orders: search, filter by status, sort by a column heading with arrows." : "Your organisation's orders, their payment and their progress through the shop."} />
      <PanelBoundary name="the order list">
        <OrdersTable staff={staff} />
      </PanelBoundary>
    </>
  );
}
