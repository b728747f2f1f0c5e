import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { invitationsQueryOptions } from "../api/invitations";
import { organizationsQueryOptions } from "../api/organizations";
import { userFiltersFrom, usersQueryOptions } from "../api/users";
import { requireRole, warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { InvitationsList } from "../features/admin/invitations-list";
import { InviteForm } from "../features/admin/invite-form";
import { UsersTable } from "../features/admin/users-table";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["admin"]);
  const filters = userFiltersFrom(new URL(request.url).searchParams);
  await warm(
    queryClient.ensureQueryData(usersQueryOptions(filters)),
    queryClient.ensureQueryData(invitationsQueryOptions),
    queryClient.ensureQueryData(organizationsQueryOptions),
  );
  return null;
};

export function Component() {
  return (
    <>
      <PageHeader title="Users" lead="Everyone with access, their role and whether they may sign in; invitations waiting to be accepted, and new invitations." />
      <div className="space-y-6">
        <PanelBoundary name="the user list">
          <UsersTable />
        </PanelBoundary>
        <div className="grid items-start gap-6 lg:grid-cols-2">
          <PanelBoundary name="the invitation form">
            <InviteForm />
          </PanelBoundary>
          <PanelBoundary name="the pending invitations">
            <InvitationsList />
          </PanelBoundary>
        </div>
      </div>
    </>
  );
}
