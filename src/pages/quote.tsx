import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { materialsQueryOptions } from "../api/materials";
import { quoteQueryOptions } from "../api/quotes";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { ConfigurationDrawing } from "../features/design-check/configuration-drawing";
import { QuoteDetail } from "../features/ordering/quote-detail";
import { requireRole, warmRecord } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request, params }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["customer", "admin"]);
  void queryClient.prefetchQuery(materialsQueryOptions); // the drawing's layer names
  await warmRecord(queryClient.ensureQueryData(quoteQueryOptions(params.id!)));
  return null;
};

export function Component() {
  const { id } = useParams();
  const quote = useQuery(quoteQueryOptions(id!));
  return (
    <>
      <PageHeader title={quote.data ? `Quote ${quote.data.number}` : "Quote"} />
      <PanelBoundary name="the quote">
        <QuoteDetail id={id!} drawing={(configuration) => <ConfigurationDrawing configuration={configuration} />} />
      </PanelBoundary>
    </>
  );
}
