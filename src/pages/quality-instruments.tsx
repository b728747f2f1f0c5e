import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { useId, useState } from "react";
import { Link, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { CALIBRATION_REMINDER_DAYS } from "../../shared/quality/instruments";
import { instrumentKindLabels, instrumentKinds, instrumentStatusLabels } from "../../shared/schemas/instrument";
import { instrumentFiltersFrom, instrumentsQueryOptions, type InstrumentJson } from "../api/instruments";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Disclosure } from "../components/ui/disclosure";
import { SelectField } from "../components/ui/field";
import { PageHeader, Panel } from "../components/ui/panel";
import { ResponsiveTable } from "../components/ui/responsive-table";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { paths } from "../config/paths";
import { DueBadge } from "../features/instruments/due-badge";
import { dueWords, figuresWords } from "../features/instruments/due-state";
import { InstrumentForm } from "../features/instruments/instrument-form";
import { QualityNav } from "../features/quality/quality-nav";
import { requireRole, warm } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["qa", "admin"]);
  await warm(queryClient.ensureQueryData(instrumentsQueryOptions(instrumentFiltersFrom(new URL(request.url).searchParams))));
  return null;
};

/** "7 instruments: 1 overdue, 1 out for calibration, 1 due within 14 days." */
function summary(rows: InstrumentJson[]): string {
  const count = (state: string) => rows.filter((r) => dueWords(r).state === state).length;
  const parts = [
    [count("overdue"), "overdue"],
    [count("out"), "out for calibration"],
    [count("due-soon"), `due within ${CALIBRATION_REMINDER_DAYS} days`],
  ].filter(([n]) => n) as Array<[number, string]>;
  const head = `${rows.length} ${rows.length === 1 ? "instrument" : "instruments"}`;
  return parts.length ? `${head}: ${parts.map(([n, w]) => `${n} ${w}`).join(", ")}.` : `${head}, all in date.`;
}

function Filters() {
  const [search, setSearch] = useSearchParams();
  const filters = instrumentFiltersFrom(search);
  const usableId = useId();
  const go = (next: { kind?: string; usable?: boolean }) => {
    const kind = "kind" in next ? next.kind : filters.kind;
    const usable = "usable" in next ? next.usable : filters.usable;
    const params = new URLSearchParams();
    if (kind) params.set("kind", kind);
    if (usable) params.set("usable", "true");
    setSearch(params);
  };
  return (
    <div className="mb-4 flex flex-wrap items-end gap-x-6 gap-y-3" role="group" aria-label="Filter the register">
      <div className="min-w-0 basis-60">
        <SelectField label="Kind" value={filters.kind ?? ""} onChange={(e) => go({ kind: e.target.value })}>
          <option value="">All kinds</option>
          {instrumentKinds.map((k) => (
            <option key={k} value={k}>
              {instrumentKindLabels[k]}
            </option>
          ))}
        </SelectField>
      </div>
      <div className="flex min-h-touch items-center gap-2">
        <input id={usableId} type="checkbox" className="size-5 accent-anneal-600" checked={filters.usable === true} onChange={(e) => go({ usable: e.target.checked })} />
        <label htmlFor={usableId} className="font-semibold text-flux-900">
          Only those usable today
        </label>
      </div>
    </div>
  );
}

function Register() {
  const [search] = useSearchParams();
  const filters = instrumentFiltersFrom(search);
  const list = useQuery(instrumentsQueryOptions(filters));
  const filtered = Boolean(filters.kind || filters.usable);
  return (
    <Panel title="Register">
      <Filters />
      {list.isPending && <Loading label="Loading the instruments…" />}
      {list.isError && <QueryError error={list.error} onRetry={() => void list.refetch()} what="the instruments" />}
      {list.data && list.data.length === 0 && (
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700">
          {filtered ? (
            <>
              No instrument matches these filters. <Link className="underline" to={paths.instruments.href()}>Show every instrument</Link>.
            </>
          ) : (
            "No instruments yet. Add the first one below."
          )}
        </p>
      )}
      {list.data && list.data.length > 0 && (
        <>
          <p className="mb-3 text-flux-700" data-testid="register-summary">
            {summary(list.data)}
          </p>
          <ResponsiveTable<InstrumentJson>
            caption="Test instruments"
            testId="instruments"
            rowTestId="instrument-row"
            rows={list.data}
            rowKey={(i) => i.id}
            cardsBelow={900}
            columns={[
              {
                key: "name",
                header: "Instrument",
                primary: true,
                cell: (i) => (
                  <Link className="font-semibold text-flux-900 underline" to={paths.instrument.href(i.id)}>
                    {i.name}
                  </Link>
                ),
              },
              { key: "kind", header: "Kind", cell: (i) => instrumentKindLabels[i.kind] },
              { key: "serial", header: "Serial", className: "font-mono whitespace-nowrap", cell: (i) => i.serialNumber ?? "—" },
              { key: "make", header: "Make", cell: (i) => i.make ?? "—" },
              { key: "figures", header: "Figures or range", cell: (i) => figuresWords(i) },
              { key: "status", header: "Status", cell: (i) => instrumentStatusLabels[i.status] },
              {
                key: "due",
                header: "Calibration due",
                cell: (i) => (
                  <span className="flex flex-col items-start gap-1">
                    <span className="whitespace-nowrap font-mono">{i.calibrationDue}</span>
                    <DueBadge instrument={i} />
                  </span>
                ),
              },
            ]}
          />
          <p className="mt-3 text-meta text-flux-600">
            An instrument is usable in measurements while it is in service and its due date (the last day its certificate covers) has not passed. Overdue instruments are refused; a reminder mail goes to the quality inspectors {CALIBRATION_REMINDER_DAYS} days before a due date.
          </p>
        </>
      )}
    </Panel>
  );
}

function AddInstrument() {
  const [added, setAdded] = useState<InstrumentJson | null>(null);
  const [formKey, setFormKey] = useState(0);
  return (
    <Disclosure title="Add an instrument" digest="Probes, search coils, Helmholtz sets, signal sources" testId="add-instrument" defaultOpen={false}>
      <div className="space-y-4">
        {added && (
          <StatusNote tone="ok" word="Added" live="polite">
            {added.name} is on the register, due {added.calibrationDue}.{" "}
            <Link className="underline" to={paths.instrument.href(added.id)}>
              Open {added.name}
            </Link>{" "}
            to attach its calibration certificate.
          </StatusNote>
        )}
        <InstrumentForm
          key={formKey}
          onSaved={(saved) => {
            setAdded(saved);
            setFormKey((k) => k + 1);
          }}
        />
      </div>
    </Disclosure>
  );
}

export function Component() {
  return (
    <>
      <QualityNav />
      <PageHeader
        eyebrow="Quality · instruments"
        title="Test instruments"
        lead="The probes, search coils, Helmholtz coil sets and signal sources lots are measured with: what the arithmetic takes from each, and where each stands with its calibration."
      />
      <div className="space-y-6">
        <PanelBoundary name="the register">
          <Register />
        </PanelBoundary>
        <PanelBoundary name="the form for a new instrument">
          <AddInstrument />
        </PanelBoundary>
      </div>
    </>
  );
}
