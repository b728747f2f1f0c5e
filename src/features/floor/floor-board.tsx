import { useEffect, useId, useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link, useSearchParams } from "react-router-dom";
import { jobStatuses, jobStatusLabels } from "../../../shared/schemas/jobs";
import { stepKeys, stepLabels } from "../../../shared/shop-floor/routing";
import { FLOOR_REFRESH_MS, floorBoardQueryOptions, type FloorBoardJson } from "../../api/floor";
import { jobFiltersFrom, jobsQueryOptions, type JobFilters, type JobSummaryJson } from "../../api/jobs";
import { paths } from "../../config/paths";
import { formatDate, formatDateTime } from "../../lib/format";
import { Button } from "../../components/ui/button";
import { control } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { LateMark } from "./late-mark";
import { Pager } from "../../components/ui/list-controls";

/** The URL's search for the board's job list: only what differs from the defaults. */
export function boardSearch(f: Partial<JobFilters>): URLSearchParams {
  const s = new URLSearchParams();
  if (f.q) s.set("q", f.q);
  if (f.step) s.set("step", f.step);
  if (f.status) s.set("status", f.status);
  if (f.late) s.set("late", f.late);
  if (f.page && f.page > 1) s.set("page", String(f.page));
  return s;
}

/** Work in progress at each step: waiting there and started, each a link that filters the list. */
export function StepTiles() {
  const board = useQuery(floorBoardQueryOptions());
  const [search] = useSearchParams();
  const filters = jobFiltersFrom(search);
  if (board.isPending) return <Loading label="Loading the board…" />;
  if (board.isError) return <QueryError error={board.error} onRetry={() => board.refetch()} what="the floor board" />;
  const b = board.data;
  return (
    <section aria-labelledby="wip-title" className="space-y-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="wip-title" className="text-h3">
          Work at each step
        </h2>
        <p className="text-meta text-flux-600">
          {b.openJobs} open jobs · as of {formatDateTime(b.generatedAt)} · refreshes every {FLOOR_REFRESH_MS / 1000} s
        </p>
      </div>
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4" data-testid="wip-tiles">
        {b.wip.map((w) => {
          const active = filters.step === w.step;
          return (
            <li key={w.step}>
              <Link
                to={paths.floorBoard.href(boardSearch({ ...filters, page: 1, step: active ? "" : w.step }).toString())}
                aria-current={active ? "true" : undefined}
                className={`block rounded-lg border-2 p-3 hover:border-anneal-600 ${active ? "border-anneal-600 bg-anneal-50" : "border-nickel-200 bg-white"}`}
                data-testid={`wip-${w.step}`}
              >
                <span className="block font-semibold">{w.label}</span>
                <span className="tabular block font-mono text-h3">{w.waiting + w.started}</span>
                <span className="block text-meta text-flux-700">
                  {w.waiting} waiting · {w.started} in work
                </span>
              </Link>
            </li>
          );
        })}
      </ul>
    </section>
  );
}

export function FloorJobList() {
  const [search, setSearch] = useSearchParams();
  const filters = jobFiltersFrom(search);
  const jobs = useQuery({ ...jobsQueryOptions(filters), refetchInterval: FLOOR_REFRESH_MS });
  const [draft, setDraft] = useState(filters.q);
  const ids = { q: useId(), step: useId(), status: useId(), late: useId() };
  useEffect(() => setDraft(filters.q), [filters.q]);
  const go = (next: Partial<JobFilters>) => setSearch(boardSearch({ ...filters, page: 1, ...next }));
  const onSearch = (e: FormEvent) => {
    e.preventDefault();
    go({ q: draft.trim() });
  };
  const anyFilter = Boolean(filters.q || filters.step || filters.status || filters.late);
  return (
    <Panel title="Jobs">
      <form role="search" aria-label="Filter jobs" onSubmit={onSearch} className="mb-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-[2fr_1fr_1fr_auto_auto] lg:items-end">
        <div className="space-y-1.5">
          <label htmlFor={ids.q} className="block font-semibold">
            Job code, lot, order or customer
          </label>
          <input id={ids.q} type="search" value={draft} onChange={(e) => setDraft(e.target.value)} className={`${control} border-nickel-400`} />
        </div>
        <div className="space-y-1.5">
          <label htmlFor={ids.step} className="block font-semibold">
            At step
          </label>
          <select id={ids.step} value={filters.step} onChange={(e) => go({ step: e.target.value as JobFilters["step"] })} className={`${control} border-nickel-400`}>
            <option value="">Any step</option>
            {stepKeys.map((k) => (
              <option key={k} value={k}>
                {stepLabels[k]}
              </option>
            ))}
          </select>
        </div>
        <div className="space-y-1.5">
          <label htmlFor={ids.status} className="block font-semibold">
            State
          </label>
          <select id={ids.status} value={filters.status} onChange={(e) => go({ status: e.target.value as JobFilters["status"] })} className={`${control} border-nickel-400`}>
            <option value="">Any state</option>
            {jobStatuses.map((s) => (
              <option key={s} value={s}>
                {jobStatusLabels[s]}
              </option>
            ))}
          </select>
        </div>
        <label htmlFor={ids.late} className="flex min-h-touch items-center gap-2 font-semibold">
          <input id={ids.late} type="checkbox" className="size-5" checked={filters.late === "true"} onChange={(e) => go({ late: e.target.checked ? "true" : "" })} />
          Late only
        </label>
        <div className="flex gap-2">
          <Button type="submit" variant="secondary">
            Search
          </Button>
          {anyFilter && (
            <Button variant="quiet" onClick={() => setSearch(new URLSearchParams())}>
              Clear
            </Button>
          )}
        </div>
      </form>
      {jobs.isPending ? (
        <Loading label="Loading jobs…" />
      ) : jobs.isError ? (
        <QueryError error={jobs.error} onRetry={() => jobs.refetch()} what="the job list" />
      ) : jobs.data.items.length === 0 ? (
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700">{anyFilter ? "No job matches these filters." : "No jobs on the floor. Release a paid order to make some."}</p>
      ) : (
        <>
          <ResponsiveTable<JobSummaryJson>
            caption="Jobs on the floor, most urgent first"
            testId="floor-jobs"
            rowTestId="floor-job"
            rows={jobs.data.items}
            rowKey={(j) => j.id}
            cardsBelow={700}
            rowClassName={(j) => (j.late ? "bg-danger-50" : "")}
            columns={[
              { key: "code", header: "Job", primary: true, cell: (j) => <><Link className="font-mono font-semibold underline" to={paths.floorJob.href(j.id)}>{j.code}</Link><LateMark late={j.late} /></> },
              { key: "part", header: "Part", cell: (j) => `${j.description} × ${j.quantity}` },
              { key: "step", header: "Step", cell: (j) => (j.step ? `${stepLabels[j.step]}${j.stepStarted ? " (in work)" : " (waiting)"}` : jobStatusLabels[j.status]) },
              { key: "lot", header: "Lot / order", cell: (j) => <><Link className="font-mono underline" to={paths.floorLot.href(j.lotId)}>{j.lotNumber}</Link> · <span className="font-mono">{j.orderNumber}</span></> },
              { key: "due", header: "Due", className: "tabular whitespace-nowrap font-mono", cell: (j) => formatDate(j.dueDate) },
            ]}
          />
          <Pager label="Job list pages" page={filters.page} pageSize={filters.pageSize} total={jobs.data.total} noun={["job", "jobs"]} onPage={(page) => go({ page })} />
        </>
      )}
    </Panel>
  );
}

/** Late jobs, lots waiting for a furnace load and lots on hold: what the planner acts on first. */
export function BoardSide() {
  const board = useQuery(floorBoardQueryOptions());
  if (!board.data) return null;
  const b: FloorBoardJson = board.data;
  return (
    <div className="grid gap-6 lg:grid-cols-3">
      <Panel title={`Late (${b.late.count})`}>
        {b.late.jobs.length === 0 ? (
          <p className="text-flux-700">Nothing is past its due date.</p>
        ) : (
          <ul className="space-y-2" data-testid="late-jobs">
            {b.late.jobs.slice(0, 8).map((j) => (
              <li key={j.id} className="flex flex-wrap justify-between gap-2">
                <Link className="font-mono font-semibold underline" to={paths.floorJob.href(j.id)}>
                  {j.code}
                </Link>
                <span className="text-danger-700">
                  {j.daysLate} {j.daysLate === 1 ? "day" : "days"} late{j.step ? ` · ${stepLabels[j.step]}` : ""}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Panel>
      <Panel title="Waiting for a furnace load">
        {b.waitingForFurnace.length === 0 ? (
          <p className="text-flux-700">No lot is ready for the furnace.</p>
        ) : (
          <ul className="space-y-2" data-testid="waiting-lots">
            {b.waitingForFurnace.map((l) => (
              <li key={l.id} className="flex flex-wrap justify-between gap-2">
                <Link className="font-mono font-semibold underline" to={paths.floorLot.href(l.id)}>
                  {l.number}
                </Link>
                <span className="tabular">
                  {l.materialId} · {l.pieces} pcs · {l.mass_kg.toFixed(1)} kg
                </span>
              </li>
            ))}
          </ul>
        )}
        {b.waitingForFurnace.length > 0 && (
          <p className="mt-3">
            <Link className="underline" to={paths.furnaceRuns.href()}>
              Plan a furnace load
            </Link>
          </p>
        )}
      </Panel>
      <Panel title="On hold">
        {b.holds.length === 0 ? (
          <p className="text-flux-700">No lot is on hold.</p>
        ) : (
          <ul className="space-y-3" data-testid="holds">
            {b.holds.map((h) => (
              <li key={h.lotId}>
                <Link className="font-mono font-semibold underline" to={paths.floorLot.href(h.lotId)}>
                  {h.lotNumber}
                </Link>{" "}
                <span className="text-flux-700">({h.orderNumber})</span>
                <p className="text-danger-900">{h.reason}</p>
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </div>
  );
}
