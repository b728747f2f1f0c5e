import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { lotQueryOptions } from "../api/jobs";
import { requireRole, warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { FloorNav } from "../features/floor/floor-nav";
import { LotDetail } from "../features/floor/lot-detail";

export const makeLoader = (queryClient: QueryClient) => async ({ request, params }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["operator", "qa", "admin"]);
  await warm(queryClient.ensureQueryData(lotQueryOptions(params.id!)));
  return null;
};

export function Component() {
  const { id } = useParams();
  const lot = useQuery(lotQueryOptions(id!));
  return (
    <>
      <FloorNav />
      <PageHeader eyebrow="Shop floor · lot" title={lot.data ? `Lot ${lot.data.number}` : "Lot"} lead={lot.data ? `${lot.data.pieces} pieces of ${lot.data.material.name} for ${lot.data.order.organization.name}` : undefined} />
      <PanelBoundary name="the lot">
        <LotDetail id={id!} />
      </PanelBoundary>
    </>
  );
}
