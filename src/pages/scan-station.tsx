import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { requireRole } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { FloorNav } from "../features/floor/floor-nav";
import { ScanStation } from "../features/scan-station/scan-station";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["operator", "qa", "admin"]);
  return null;
};

export function Component() {
  return (
    <>
      <FloorNav />
      <PageHeader eyebrow="Shop floor" title="Scan station" />
      <PanelBoundary name="the scan station">
        <ScanStation />
      </PanelBoundary>
    </>
  );
}
