import { useEffect, useId, useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router-dom";
import { roles, type Role } from "../../../shared/schemas/auth";
import { meQueryOptions } from "../../api/auth";
import { ApiError } from "../../api/client";
import { userEventsQueryOptions, userFiltersFrom, usersQueryOptions, useUpdateUserAccess, type UserEvent, type UserSummary } from "../../api/users";
import { formatDate, formatDateTime } from "../../lib/format";
import { roleLabels } from "../../lib/roles";
import { Button } from "../../components/ui/button";
import { Loading } from "../../components/ui/spinner";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { StatusNote } from "../../components/ui/status-note";

const staffRoles = roles.filter((r) => r !== "customer");

export function UsersTable() {
  const [searchParams, setSearchParams] = useSearchParams();
  // The same filters the route loader warmed, read from the same URL.
  const filters = userFiltersFrom(searchParams);
  const users = useQuery(usersQueryOptions(filters));
  const [draft, setDraft] = useState(filters.q);
  const searchId = useId();

  useEffect(() => setDraft(filters.q), [filters.q]);

  const go = (next: { page?: number; q?: string }) => {
    const params = new URLSearchParams();
    const q = next.q ?? filters.q;
    const page = next.page ?? 1;
    if (q) params.set("q", q);
    if (page > 1) params.set("page", String(page));
    setSearchParams(params);
  };

  const onSearch = (event: FormEvent) => {
    event.preventDefault();
    go({ q: draft.trim(), page: 1 });
  };

  const total = users.data?.total ?? 0;
  const pageCount = Math.max(1, Math.ceil(total / filters.pageSize));

  return (
    <Panel title="People with access">
      <form role="search" onSubmit={onSearch} className="mb-4 flex flex-wrap items-end gap-3">
        <div className="min-w-0 flex-1 basis-56 space-y-1.5">
          <label htmlFor={searchId} className="block font-semibold text-flux-900">
            Search by name, email or organisation
          </label>
          <input
            id={searchId}
            type="search"
            value={draft}
            onChange={(event) => setDraft(event.target.value)}
            className="block min-h-touch w-full rounded-md border border-nickel-400 bg-white px-3 py-2"
          />
        </div>
        <Button type="submit" variant="secondary">
          Search
        </Button>
        {filters.q && (
          <Button variant="quiet" onClick={() => go({ q: "", page: 1 })}>
            Clear
          </Button>
        )}
      </form>

      {users.isPending ? (
        <Loading label="Loading users…" />
      ) : users.isError ? (
        <QueryError error={users.error} onRetry={() => users.refetch()} what="the user list" />
      ) : users.data.items.length === 0 ? (
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700">
          {filters.q ? <>No one matches “{filters.q}”. Try part of a name or an email domain.</> : "No users yet. Invite the first ones below."}
        </p>
      ) : (
        <>
          <ResponsiveTable<UserSummary>
            caption={`Users, page ${filters.page} of ${pageCount}`}
            testId="users-table"
            rowTestId="user-row"
            rows={users.data.items}
            rowKey={(u) => u.id}
            cardsBelow={760}
            rowClassName={(u) => (u.active ? "" : "text-flux-600")}
            columns={[
              { key: "name", header: "Name", primary: true, className: "font-semibold", cell: (u) => u.name },
              { key: "email", header: "Email", className: "break-all font-mono", cell: (u) => u.email },
              { key: "organisation", header: "Organisation", cell: (u) => u.organizationName ?? "—" },
              { key: "since", header: "Since", className: "tabular font-mono whitespace-nowrap", cell: (u) => formatDate(u.createdAt) },
              { key: "access", header: "Role and access", cell: (u) => <UserAccess user={u} /> },
            ]}
          />
          <nav aria-label="User list pages" className="mt-4 flex flex-wrap items-center justify-between gap-3">
            <p className="tabular text-flux-700">
              Page <span className="font-mono">{filters.page}</span> of <span className="font-mono">{pageCount}</span> ·{" "}
              <span className="font-mono">{total}</span> {total === 1 ? "user" : "users"}
            </p>
            <div className="flex gap-2">
              <Button variant="secondary" disabled={filters.page <= 1} onClick={() => go({ page: filters.page - 1 })}>
                Previous
              </Button>
              <Button variant="secondary" disabled={filters.page >= pageCount} onClick={() => go({ page: filters.page + 1 })}>
                Next
              </Button>
            </div>
          </nav>
        </>
      )}
    </Panel>
  );
}

type Change = { kind: "role"; role: Role } | { kind: "active"; active: boolean };

/**
 * One person's role and access: a staff role can be changed among staff roles, anyone but oneself
 * deactivated or reactivated, each after a confirmation that says what will happen; the server
 * keeps the last planner and records each change in the person's trail (shown under "History").
 */
function UserAccess({ user }: { user: UserSummary }) {
  const me = useQuery(meQueryOptions).data;
  const update = useUpdateUserAccess();
  const [asking, setAsking] = useState<Change | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [history, setHistory] = useState(false);
  const selectId = useId();
  const self = me?.id === user.id;
  const apply = async (change: Change) => {
    setProblem(null);
    try {
      await update.mutateAsync({ id: user.id, ...(change.kind === "role" ? { role: change.role } : { active: change.active }) });
      setDone(change.kind === "role" ? `Now ${roleLabels[change.role].toLowerCase()}.` : change.active ? "Reactivated: they can sign in again." : "Deactivated: signed out, and cannot sign in.");
    } catch (error) {
      setProblem(error instanceof ApiError ? (Object.values(error.fields)[0] ?? error.message) : "Something went wrong. Try again.");
    } finally {
      setAsking(null);
    }
  };
  return (
    <div className="space-y-2 text-left">
      <div className="flex flex-wrap items-center gap-2">
        {user.role === "customer" ? (
          <span>{roleLabels.customer}</span>
        ) : (
          <>
            <label htmlFor={selectId} className="sr-only">
              Role of {user.name}
            </label>
            <select
              id={selectId}
              className="min-h-9 rounded-md border border-nickel-400 bg-white px-2"
              value={asking?.kind === "role" ? asking.role : user.role}
              disabled={!user.active || update.isPending}
              onChange={(e) => {
                setDone(null);
                const role = e.target.value as Role;
                setAsking(role === user.role ? null : { kind: "role", role });
              }}
            >
              {staffRoles.map((r) => (
                <option key={r} value={r}>
                  {roleLabels[r]}
                </option>
              ))}
            </select>
          </>
        )}
        <span className={`rounded px-1.5 py-0.5 font-mono text-[0.8125rem] ${user.active ? "bg-ok-50 text-ok-700" : "bg-nickel-200 text-flux-800"}`}>{user.active ? "active" : "deactivated"}</span>
      </div>
      <div className="flex flex-wrap gap-x-1">
        {!self && (
          <Button variant="quiet" className="min-h-9 px-2 text-meta" disabled={update.isPending} onClick={() => { setDone(null); setAsking({ kind: "active", active: !user.active }); }}>
            {user.active ? "Deactivate…" : "Reactivate…"}
          </Button>
        )}
        <Button variant="quiet" className="min-h-9 px-2 text-meta" aria-expanded={history} onClick={() => setHistory((h) => !h)}>
          History
        </Button>
      </div>
      {asking && (
        <div className="space-y-2 rounded-md border border-caution-200 bg-caution-50 p-2" role="group" aria-label={`Confirm the change for ${user.name}`}>
          <p className="text-meta text-caution-900">
            {asking.kind === "role"
              ? `Make ${user.name} ${roleLabels[asking.role].toLowerCase()}? Their menu and what they may do change at their next page.`
              : asking.active
                ? `Let ${user.name} sign in again?`
                : `Deactivate ${user.name}? They are signed out at once and cannot sign in until reactivated. Their records stay.`}
          </p>
          <div className="flex flex-wrap gap-2">
            <Button className="min-h-9" pending={update.isPending} pendingLabel="Saving…" onClick={() => void apply(asking)}>
              {asking.kind === "role" ? "Change the role" : asking.active ? "Reactivate" : "Deactivate"}
            </Button>
            <Button variant="secondary" className="min-h-9" onClick={() => setAsking(null)}>
              Keep as it is
            </Button>
          </div>
        </div>
      )}
      {done && (
        <StatusNote tone="ok" word="Saved" live="polite" className="py-2">
          {done}
        </StatusNote>
      )}
      {problem && (
        <StatusNote tone="danger" word="Not changed" live="assertive" className="py-2">
          {problem}
        </StatusNote>
      )}
      {history && <UserHistory id={user.id} />}
    </div>
  );
}

const eventWords: Record<string, (e: UserEvent) => string> = {
  "user.role_changed": (e) => `Role changed from ${String(e.data.fromLabel ?? e.data.from)} to ${String(e.data.toLabel ?? e.data.to)}`,
  "user.deactivated": () => "Deactivated",
  "user.reactivated": () => "Reactivated",
  "user.registered": () => "Registered",
  "invitation.accepted": () => "Accepted the invitation",
  "user.signed_in": () => "Signed in",
  "password.changed": () => "Changed the password",
  "password.reset": () => "Chose a new password by mail",
  "password.reset_requested": () => "Asked for a password reset",
  "user.profile_updated": (e) => `Name changed to ${String(e.data.name ?? "")}`,
  "user.registration_repeated": () => "Someone tried to register this address again",
};

function UserHistory({ id }: { id: string }) {
  const events = useQuery(userEventsQueryOptions(id));
  if (events.isPending) return <Loading label="Loading the history…" />;
  if (events.isError) return <QueryError error={events.error} onRetry={() => void events.refetch()} what="the history" />;
  if (events.data.items.length === 0) return <p className="text-meta text-flux-600">Nothing recorded yet.</p>;
  return (
    <ol className="space-y-1 border-l-2 border-nickel-300 pl-3 text-meta" aria-label="History">
      {events.data.items.slice(0, 12).map((e) => (
        <li key={e.id}>
          {(eventWords[e.action] ?? ((x: UserEvent) => x.action))(e)}
          <span className="text-flux-600">
            {" "}
            · {e.actor && e.actor.id !== id ? `by ${e.actor.name} · ` : ""}
            {formatDateTime(e.at)}
          </span>
        </li>
      ))}
    </ol>
  );
}
