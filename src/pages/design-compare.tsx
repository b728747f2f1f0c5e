import type { QueryClient } from "@tanstack/react-query";
import { useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { MAX_COMPARED_DESIGNS } from "../../shared/schemas/design";
import { designComparisonQueryOptions } from "../api/designs";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { DesignComparison } from "../features/design-check/design-comparison";
import { requireUser, warm } from "../lib/guards";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** The compared designs' ids from the address: at most three, each once. */
const idsFrom = (search: URLSearchParams) => [...new Set((search.get("ids") ?? "").split(",").filter((id) => UUID.test(id)))].slice(0, MAX_COMPARED_DESIGNS);

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireUser(queryClient, request);
  const ids = idsFrom(new URL(request.url).searchParams);
  if (ids.length) await warm(queryClient.ensureQueryData(designComparisonQueryOptions(ids, 10)));
  return null;
};

export function Component() {
  const [search] = useSearchParams();
  return (
    <>
      <PageHeader title="Designs compared" lead="The predicted attenuation as built, its likely range, the curve against frequency, the mass and the price of each design, side by side." />
      <PanelBoundary name="the comparison">
        <DesignComparison ids={idsFrom(search)} />
      </PanelBoundary>
    </>
  );
}
