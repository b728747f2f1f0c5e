import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { orderQueryOptions } from "../api/orders";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { OrderDetail } from "../features/ordering/order-detail";
import { requireUser, warmRecord } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request, params }: LoaderFunctionArgs) => {
  await requireUser(queryClient, request);
  await warmRecord(queryClient.ensureQueryData(orderQueryOptions(params.id!)));
  return null;
};

export function Component() {
  const { id } = useParams();
  const order = useQuery(orderQueryOptions(id!));
  return (
    <>
      <PageHeader title={order.data ? `Order ${order.data.number}` : "Order"} />
      <PanelBoundary name="the order">
        <OrderDetail id={id!} />
      </PanelBoundary>
    </>
  );
}
