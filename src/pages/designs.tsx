import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { designFiltersFrom, designsQueryOptions } from "../api/designs";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { SavedDesigns } from "../features/design-check/saved-designs";
import { requireUser, warm } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireUser(queryClient, request);
  await warm(queryClient.ensureQueryData(designsQueryOptions(designFiltersFrom(new URL(request.url).searchParams))));
  return null;
};

export function Component() {
  return (
    <>
      <PageHeader title="Your designs" lead="Shield designs saved from the design check: open one to change it or quote it, or compare up to three side by side." />
      <PanelBoundary name="the design list">
        <SavedDesigns />
      </PanelBoundary>
    </>
  );
}
