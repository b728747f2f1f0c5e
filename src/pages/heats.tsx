import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { meQueryOptions } from "../api/auth";
import { heatFiltersFrom, heatsQueryOptions } from "../api/heats";
import { materialsQueryOptions } from "../api/materials";
import { requireRole, warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { FloorNav } from "../features/floor/floor-nav";
import { HeatList, ReceiveHeat } from "../features/floor/heats";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["operator", "qa", "admin"]);
  const filters = heatFiltersFrom(new URL(request.url).searchParams);
  await warm(queryClient.ensureQueryData(heatsQueryOptions(filters)), queryClient.ensureQueryData(materialsQueryOptions));
  return null;
};

export function Component() {
  const me = useQuery(meQueryOptions).data;
  const receives = me?.role === "operator" || me?.role === "admin";
  return (
    <>
      <FloorNav />
      <PageHeader eyebrow="Shop floor" title="Material heats" lead="Each delivery of sheet with its heat number and mill certificate; material issue links every job to the heat it was cut from." />
      <div className="space-y-6">
        {receives && (
          <PanelBoundary name="the receiving form">
            <ReceiveHeat />
          </PanelBoundary>
        )}
        <PanelBoundary name="the heats">
          <HeatList />
        </PanelBoundary>
      </div>
    </>
  );
}
