import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { meQueryOptions } from "../api/auth";
import { quoteFiltersFrom, quotesQueryOptions } from "../api/quotes";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { QuotesList } from "../features/ordering/quotes-list";
import { requireRole, warm } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["customer", "admin"]);
  await warm(queryClient.ensureQueryData(quotesQueryOptions(quoteFiltersFrom(new URL(request.url).searchParams))));
  return null;
};

export function Component() {
  const staff = useQuery(meQueryOptions).data?.role !== "customer";
  return (
    <>
      <PageHeader title="Quotes" lead={staff ? "Every customer's quotes: what was priced, at which rates, and whether it was ordered." : "Your organisation's quotes. A quote holds its price for 30 days; an expired one can be quoted again at today's rates."} />
      <PanelBoundary name="the quote list">
        <QuotesList staff={staff} />
      </PanelBoundary>
    </>
  );
}
