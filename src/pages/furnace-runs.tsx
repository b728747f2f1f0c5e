import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { furnaceRunsQueryOptions, furnacesQueryOptions } from "../api/furnace-runs";
import { lotsQueryOptions } from "../api/jobs";
import { requireRole, warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { FloorNav } from "../features/floor/floor-nav";
import { HydrogenCaution, RecordRun, RunList, runsFilters, waitingLotsFilters } from "../features/floor/furnace-runs";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["operator", "admin"]);
  await warm(
    queryClient.ensureQueryData(furnacesQueryOptions()),
    queryClient.ensureQueryData(lotsQueryOptions(waitingLotsFilters())),
    queryClient.ensureQueryData(furnaceRunsQueryOptions(runsFilters())),
  );
  return null;
};

export function Component() {
  return (
    <>
      <FloorNav />
      <PageHeader eyebrow="Shop floor" title="Hydrogen anneal" lead="Load lots of one alloy, record the run, and see it checked against the alloy's anneal window." />
      <div className="space-y-6">
        <HydrogenCaution />
        <PanelBoundary name="the furnace run form">
          <RecordRun />
        </PanelBoundary>
        <PanelBoundary name="the furnace runs">
          <RunList />
        </PanelBoundary>
      </div>
    </>
  );
}
