import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { jobQueryOptions } from "../api/jobs";
import { requireRole, warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { FloorNav } from "../features/floor/floor-nav";
import { JobDetail } from "../features/floor/job-detail";

export const makeLoader = (queryClient: QueryClient) => async ({ request, params }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["operator", "qa", "admin"]);
  await warm(queryClient.ensureQueryData(jobQueryOptions(params.id!)));
  return null;
};

export function Component() {
  const { id } = useParams();
  const job = useQuery(jobQueryOptions(id!));
  return (
    <>
      <FloorNav />
      <PageHeader eyebrow="Shop floor · job" title={job.data ? `Job ${job.data.code}` : "Job"} lead={job.data?.part.description} />
      <PanelBoundary name="the job">
        <JobDetail id={id!} />
      </PanelBoundary>
    </>
  );
}
