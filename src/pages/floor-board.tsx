import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { floorBoardQueryOptions } from "../api/floor";
import { jobFiltersFrom, jobsQueryOptions } from "../api/jobs";
import { paths } from "../config/paths";
import { requireRole, warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { ButtonLink } from "../components/ui/button";
import { PageHeader } from "../components/ui/panel";
import { FloorNav } from "../features/floor/floor-nav";
import { BoardSide, FloorJobList, StepTiles } from "../features/floor/floor-board";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["operator", "admin"]);
  const filters = jobFiltersFrom(new URL(request.url).searchParams);
  await warm(queryClient.ensureQueryData(floorBoardQueryOptions()), queryClient.ensureQueryData(jobsQueryOptions(filters)));
  return null;
};

export function Component() {
  return (
    <>
      <FloorNav />
      <PageHeader eyebrow="Shop floor" title="Floor board" lead="Open work by step, what is late, lots waiting for the furnace and lots on hold." />
      <div className="mb-6 flex flex-wrap gap-3">
        <ButtonLink variant="primary" to={paths.scanStation.href()}>
          Open the scan station
        </ButtonLink>
      </div>
      <div className="space-y-6">
        <PanelBoundary name="the work at each step">
          <StepTiles />
        </PanelBoundary>
        <PanelBoundary name="late work, furnace queue and holds">
          <BoardSide />
        </PanelBoundary>
        <PanelBoundary name="the job list">
          <FloorJobList />
        </PanelBoundary>
      </div>
    </>
  );
}
