import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { ApiError } from "../../api/client";
import { invitationsQueryOptions, pendingInvitations, useResendInvitation, useWithdrawInvitation, type Invitation } from "../../api/invitations";
import { formatDateTime } from "../../lib/format";
import { roleLabels } from "../../lib/roles";
import { Button } from "../../components/ui/button";
import { Loading } from "../../components/ui/spinner";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { StatusNote } from "../../components/ui/status-note";

export function InvitationsList() {
  const invitations = useQuery(invitationsQueryOptions);
  const [note, setNote] = useState<{ tone: "ok" | "danger"; text: string } | null>(null);

  return (
    <Panel title="Pending invitations">
      {invitations.isPending ? (
        <Loading label="Loading invitations…" />
      ) : invitations.isError ? (
        <QueryError error={invitations.error} onRetry={() => invitations.refetch()} what="the invitations" />
      ) : (
        <div className="space-y-3">
          {note && (
            <StatusNote tone={note.tone} word={note.tone === "ok" ? "Done" : "Not done"} live={note.tone === "ok" ? "polite" : "assertive"}>
              {note.text}
            </StatusNote>
          )}
          <PendingList items={pendingInvitations(invitations.data.items)} onDone={setNote} />
        </div>
      )}
    </Panel>
  );
}

function PendingList({ items, onDone }: { items: Invitation[]; onDone: (note: { tone: "ok" | "danger"; text: string }) => void }) {
  if (items.length === 0) {
    return <p className="rounded-md bg-nickel-100 p-4 text-flux-700">No invitations waiting. Ones you send appear here until they are accepted, withdrawn or expire.</p>;
  }
  return (
    <ul className="divide-y divide-nickel-200" aria-label="Invitations waiting to be accepted">
      {items.map((invitation) => (
        <PendingInvitation key={invitation.id} invitation={invitation} onDone={onDone} />
      ))}
    </ul>
  );
}

/** One invitation: who, as what, until when; sent again with a fresh link, or withdrawn after a confirmation. */
function PendingInvitation({ invitation, onDone }: { invitation: Invitation; onDone: (note: { tone: "ok" | "danger"; text: string }) => void }) {
  const resend = useResendInvitation();
  const withdraw = useWithdrawInvitation();
  const [asking, setAsking] = useState(false);
  const fail = (error: unknown) => onDone({ tone: "danger", text: error instanceof ApiError ? error.message : "Something went wrong. Try again." });
  return (
    <li className="space-y-2 py-3" data-testid="invitation-row">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <span className="break-all font-mono">{invitation.email}</span>
        <span className="text-flux-700">
          {roleLabels[invitation.role]}
          {invitation.organizationName ? ` · ${invitation.organizationName}` : ""} · expires <span className="tabular font-mono">{formatDateTime(invitation.expiresAt)}</span>
        </span>
      </div>
      {asking ? (
        <div className="flex flex-wrap items-center gap-2" role="group" aria-label={`Withdraw the invitation to ${invitation.email}`}>
          <span className="text-meta text-flux-800">Withdraw it? The link stops working.</span>
          <Button
            variant="danger"
            className="min-h-9"
            pending={withdraw.isPending}
            pendingLabel="Withdrawing…"
            onClick={() =>
              withdraw.mutate(invitation.id, {
                onSuccess: () => onDone({ tone: "ok", text: `The invitation to ${invitation.email} is withdrawn; its link no longer works.` }),
                onError: fail,
                onSettled: () => setAsking(false),
              })
            }
          >
            Withdraw
          </Button>
          <Button variant="secondary" className="min-h-9" onClick={() => setAsking(false)}>
            Keep it
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-x-1">
          <Button
            variant="quiet"
            className="min-h-9 px-2 text-meta"
            pending={resend.isPending}
            pendingLabel="Sending…"
            onClick={() =>
              resend.mutate(invitation.id, {
                onSuccess: (fresh) => onDone({ tone: "ok", text: `Sent again to ${fresh.email} with a new link, valid until ${formatDateTime(fresh.expiresAt)}; the old link no longer works.` }),
                onError: fail,
              })
            }
          >
            Send again
          </Button>
          <Button variant="quiet" className="min-h-9 px-2 text-meta" onClick={() => setAsking(true)}>
            Withdraw…
          </Button>
        </div>
      )}
    </li>
  );
}
