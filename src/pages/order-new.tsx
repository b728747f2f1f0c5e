import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { quoteQueryOptions } from "../api/quotes";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { OrderForm } from "../features/ordering/order-form";
import { requireRole, warmRecord } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request, params }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["customer"]);
  await warmRecord(queryClient.ensureQueryData(quoteQueryOptions(params.id!)));
  return null;
};

export function Component() {
  const { id } = useParams();
  const quote = useQuery(quoteQueryOptions(id!));
  return (
    <>
      <PageHeader title={quote.data ? `Order quote ${quote.data.number}` : "Order a quote"} lead="The design, the prediction, the blanks and the price are ordered as quoted. Add your purchase order, where to deliver and your drawings; then pay." />
      <PanelBoundary name="the order form">
        <OrderForm quoteId={id!} />
      </PanelBoundary>
    </>
  );
}
