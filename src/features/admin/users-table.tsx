import { useEffect, useId, useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router-dom";
import { userFiltersFrom, usersQueryOptions } from "../../api/users";
import { formatDate } from "../../lib/format";
import { roleLabels } from "../../lib/roles";
import { Button } from "../../components/ui/button";
import { Loading } from "../../components/ui/spinner";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { ScrollX } from "../../components/ui/scroll-x";

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
        <div className="min-w-56 flex-1 space-y-1.5">
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
          <ScrollX label="the users table">
            <table className="w-full min-w-[40rem] border-collapse text-left">
              <caption className="sr-only">Users, page {filters.page} of {pageCount}</caption>
              <thead>
                <tr className="border-b-2 border-flux-200 text-flux-700">
                  <th scope="col" className="py-2 pr-4 font-semibold">Name</th>
                  <th scope="col" className="py-2 pr-4 font-semibold">Email</th>
                  <th scope="col" className="py-2 pr-4 font-semibold">Role</th>
                  <th scope="col" className="py-2 pr-4 font-semibold">Organisation</th>
                  <th scope="col" className="py-2 font-semibold">Since</th>
                </tr>
              </thead>
              <tbody aria-busy={users.isPlaceholderData}>
                {users.data.items.map((user) => (
                  <tr key={user.id} className={`border-b border-nickel-200 ${users.isPlaceholderData ? "text-flux-700" : ""}`}>
                    <td className="py-3 pr-4 font-semibold">{user.name}</td>
                    <td className="break-all py-3 pr-4 font-mono">{user.email}</td>
                    <td className="py-3 pr-4">{roleLabels[user.role]}</td>
                    <td className="py-3 pr-4">{user.organizationName ?? "—"}</td>
                    <td className="tabular py-3 font-mono">{formatDate(user.createdAt)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </ScrollX>
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
