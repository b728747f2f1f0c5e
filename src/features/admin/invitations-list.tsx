import { useQuery } from "@tanstack/react-query";
import { invitationsQueryOptions, pendingInvitations } from "../../api/invitations";
import { formatDateTime } from "../../lib/format";
import { roleLabels } from "../../lib/roles";
import { Loading } from "../../components/ui/spinner";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";

export function InvitationsList() {
  const invitations = useQuery(invitationsQueryOptions);

  return (
    <Panel title="Pending invitations">
      {invitations.isPending ? (
        <Loading label="Loading invitations…" />
      ) : invitations.isError ? (
        <QueryError error={invitations.error} onRetry={() => invitations.refetch()} what="the invitations" />
      ) : (
        <PendingList items={pendingInvitations(invitations.data.items)} />
      )}
    </Panel>
  );
}

function PendingList({ items }: { items: ReturnType<typeof pendingInvitations> }) {
  if (items.length === 0) {
    return <p className="rounded-md bg-nickel-100 p-4 text-flux-700">No invitations waiting. Ones you send appear here until they are accepted or expire.</p>;
  }
  return (
    <ul className="divide-y divide-nickel-200">
      {items.map((invitation) => (
        <li key={invitation.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-3">
          <span className="break-all font-mono">{invitation.email}</span>
          <span className="text-flux-700">
            {roleLabels[invitation.role]}
            {invitation.organizationName ? ` · ${invitation.organizationName}` : ""} · expires{" "}
            <span className="tabular font-mono">{formatDateTime(invitation.expiresAt)}</span>
          </span>
        </li>
      ))}
    </ul>
  );
}
