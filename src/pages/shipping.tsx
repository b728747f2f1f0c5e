import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { lotsQueryOptions } from "../api/jobs";
import { requireRole, warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { FloorNav } from "../features/floor/floor-nav";
import { packedLotsFilters, ReadyToShip } from "../features/floor/shipping";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["admin"]);
  await warm(queryClient.ensureQueryData(lotsQueryOptions(packedLotsFilters())));
  return null;
};

export function Component() {
  return (
    <>
      <FloorNav />
      <PageHeader eyebrow="Planning" title="Shipping" lead="Lots that have passed pack, by order. Record each parcel with its carrier and tracking number; the last one ships the order." />
      <PanelBoundary name="the lots ready to ship">
        <ReadyToShip />
      </PanelBoundary>
    </>
  );
}
