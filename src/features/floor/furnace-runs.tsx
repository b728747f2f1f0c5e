import { useMemo, useRef, useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { annealDeviations, type AnnealWindow } from "../../../shared/shop-floor/anneal";
import type { FurnaceRunJson, FurnaceRunSummaryJson } from "../../../shared/schemas/furnace-runs";
import type { LotSummaryJson } from "../../../shared/schemas/jobs";
import { ApiError } from "../../api/client";
import { furnaceChartUrl, furnaceRunFiltersFrom, furnaceRunsQueryOptions, furnacesQueryOptions, useAttachFurnaceChart, useRecordFurnaceRun } from "../../api/furnace-runs";
import { lotFiltersFrom, lotsQueryOptions } from "../../api/jobs";
import { paths } from "../../config/paths";
import { formatDate, formatDateTime } from "../../lib/format";
import { Button } from "../../components/ui/button";
import { control } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { fixedUnitScale, UnitInput } from "../../components/ui/unit-input";
import { Pager } from "../../components/ui/list-controls";

export const waitingLotsFilters = () => lotFiltersFrom(new URLSearchParams({ status: "ready_for_anneal", sort: "dueDate", dir: "asc" }));
export const runsFilters = (page = 1) => furnaceRunFiltersFrom(new URLSearchParams({ page: String(page) }));

const celsius = fixedUnitScale("°C", "degrees Celsius");
const minutes = fixedUnitScale("min", "minutes");
const perHour = fixedUnitScale("°C/h", "degrees Celsius per hour");

type Reading = "setpoint_c" | "peakTemperature_c" | "soak_min" | "dewPoint_c" | "dewPointOut_c" | "coolingRate_c_per_h";
const readingsEmpty: Record<Reading, number | null> = { setpoint_c: null, peakTemperature_c: null, soak_min: null, dewPoint_c: null, dewPointOut_c: null, coolingRate_c_per_h: null };

/** The hydrogen caution, where the furnace is planned and recorded. */
export function HydrogenCaution() {
  const furnaces = useQuery(furnacesQueryOptions());
  return (
    <StatusNote tone="caution" word="Hydrogen furnace">
      {furnaces.data?.caution ?? "Follow NFPA 86 (or the local equivalent) and the site's procedures; trained staff only."} Defer to the local code and the site&rsquo;s licensed practice where they ask for more.
    </StatusNote>
  );
}

const windowText = (w: AnnealWindow) =>
  `peak ${w.peak_c.min}–${w.peak_c.max} °C, ${w.soak_min.min}–${w.soak_min.max} min at temperature, dew point ${w.dewPointMax_c} °C or drier, cooling ${w.coolingRate_c_per_h.min}–${w.coolingRate_c_per_h.max} °C/h`;

/**
 * A furnace load: lots of one alloy waiting for the anneal, within the furnace's load, and the run's
 * record checked against the alloy's window as it is typed. Outside the window, the lots go on hold.
 */
export function RecordRun() {
  const furnaces = useQuery(furnacesQueryOptions());
  const lots = useQuery(lotsQueryOptions(waitingLotsFilters()));
  const record = useRecordFurnaceRun();
  const [chosen, setChosen] = useState<string[]>([]);
  const [furnaceId, setFurnaceId] = useState("");
  const [readings, setReadings] = useState(readingsEmpty);
  const [notes, setNotes] = useState("");
  const [confirming, setConfirming] = useState(false);
  const [result, setResult] = useState<FurnaceRunJson | null>(null);
  const error = record.error instanceof ApiError ? record.error : null;

  const waiting = lots.data?.items ?? [];
  const picked = waiting.filter((l) => chosen.includes(l.id));
  const alloy = picked[0]?.materialId ?? null;
  const furnace = furnaces.data?.furnaces.find((f) => f.id === furnaceId) ?? furnaces.data?.furnaces[0];
  const load = picked.reduce((kg, l) => kg + l.mass_kg, 0);
  const annealWindow = furnaces.data?.annealWindows.find((w) => w.materialId === alloy) ?? null;
  const complete = readings.peakTemperature_c != null && readings.soak_min != null && readings.dewPoint_c != null && readings.coolingRate_c_per_h != null;
  const deviations = useMemo(
    () =>
      annealWindow && complete
        ? annealDeviations({ peakTemperature_c: readings.peakTemperature_c!, soak_min: readings.soak_min!, dewPoint_c: readings.dewPoint_c!, dewPointOut_c: readings.dewPointOut_c, coolingRate_c_per_h: readings.coolingRate_c_per_h! }, annealWindow)
        : [],
    [annealWindow, complete, readings],
  );
  const over = furnace ? load > furnace.maxLoad_kg : false;

  const toggle = (lot: LotSummaryJson) => setChosen((c) => (c.includes(lot.id) ? c.filter((id) => id !== lot.id) : [...c, lot.id]));
  const ask = (e: FormEvent) => {
    e.preventDefault();
    setResult(null);
    setConfirming(true);
  };
  const go = async () => {
    const body = Object.fromEntries(Object.entries(readings).filter(([, v]) => v !== null)) as Partial<Record<Reading, number>>;
    try {
      const run = await record.mutateAsync({ lotIds: chosen, furnaceId: furnace?.id, ...body, notes: notes.trim() || undefined } as Parameters<typeof record.mutateAsync>[0]);
      setResult(run);
      setChosen([]);
      setReadings(readingsEmpty);
      setNotes("");
    } catch {
      // shown below
    } finally {
      setConfirming(false);
    }
  };
  const field = (k: Reading) => error?.fields[k];

  if (furnaces.isPending || lots.isPending) return <Loading label="Loading the furnace queue…" />;
  if (furnaces.isError) return <QueryError error={furnaces.error} onRetry={() => furnaces.refetch()} what="the furnaces" />;
  if (lots.isError) return <QueryError error={lots.error} onRetry={() => lots.refetch()} what="the lots waiting" />;

  return (
    <Panel title="Record a furnace run">
      {result && <RunResult run={result} />}
      <form onSubmit={ask} className="space-y-5" data-testid="furnace-form">
        <fieldset className="space-y-2">
          <legend className="font-semibold">Lots in the load (one alloy; cleaned and waiting)</legend>
          {waiting.length === 0 ? (
            <p className="rounded-md bg-nickel-100 p-3 text-flux-700">No lot is waiting for a furnace load.</p>
          ) : (
            <ul className="grid gap-2 sm:grid-cols-2">
              {waiting.map((l) => {
                const other = alloy !== null && l.materialId !== alloy;
                return (
                  <li key={l.id}>
                    <label className={`flex min-h-touch items-center gap-3 rounded-md border p-3 ${chosen.includes(l.id) ? "border-anneal-600 bg-anneal-50" : "border-nickel-200"} ${other ? "opacity-60" : ""}`}>
                      <input type="checkbox" className="size-5" checked={chosen.includes(l.id)} disabled={other} onChange={() => toggle(l)} data-testid="furnace-lot" />
                      <span>
                        <span className="font-mono font-semibold">{l.number}</span> · {l.materialId} · {l.pieces} pcs · {l.mass_kg.toFixed(1)} kg
                        <span className="block text-meta text-flux-700">
                          {l.orderNumber} · due {formatDate(l.dueDate)}
                          {other ? " · another alloy" : ""}
                        </span>
                      </span>
                    </label>
                  </li>
                );
              })}
            </ul>
          )}
          {error?.fields.lotIds && <p className="font-semibold text-danger-700">{error.fields.lotIds}</p>}
        </fieldset>

        <div className="grid gap-4 sm:grid-cols-2">
          <div className="space-y-1.5">
            <label htmlFor="furnace-id" className="block font-semibold">
              Furnace
            </label>
            <select id="furnace-id" className={`${control} border-nickel-400`} value={furnace?.id ?? ""} onChange={(e) => setFurnaceId(e.target.value)}>
              {furnaces.data.furnaces.map((f) => (
                <option key={f.id} value={f.id}>
                  {f.name} ({f.id}), up to {f.maxLoad_kg} kg
                </option>
              ))}
            </select>
          </div>
          <div className={`rounded-md p-3 ${over ? "bg-danger-50 text-danger-900" : "bg-nickel-50"}`} data-testid="furnace-load">
            <p className="font-semibold">
              Load {load.toFixed(1)} kg of {furnace?.maxLoad_kg ?? "—"} kg
            </p>
            {over && <p>Over the furnace&rsquo;s load: take a lot out or use a larger furnace.</p>}
          </div>
        </div>

        {annealWindow ? (
          <p className="rounded-md bg-flux-50 p-3" data-testid="anneal-window">
            <span className="font-semibold">Window for {alloy}:</span> {windowText(annealWindow)}. <span className="text-meta text-flux-700">{annealWindow.source}</span>
          </p>
        ) : (
          alloy && <StatusNote tone="caution">No anneal window is set for {alloy}: the planner sets it in the shop settings.</StatusNote>
        )}

        <div className="grid gap-4 sm:grid-cols-3">
          <UnitInput label="Setpoint" scale={celsius} value={readings.setpoint_c} onValueChange={(v) => setReadings((r) => ({ ...r, setpoint_c: v }))} error={field("setpoint_c")} />
          <UnitInput label="Measured peak" scale={celsius} value={readings.peakTemperature_c} onValueChange={(v) => setReadings((r) => ({ ...r, peakTemperature_c: v }))} error={field("peakTemperature_c")} />
          <UnitInput label="Time at temperature" scale={minutes} value={readings.soak_min} onValueChange={(v) => setReadings((r) => ({ ...r, soak_min: v }))} error={field("soak_min")} />
          <UnitInput label="Dew point in" scale={celsius} value={readings.dewPoint_c} onValueChange={(v) => setReadings((r) => ({ ...r, dewPoint_c: v }))} error={field("dewPoint_c")} />
          <UnitInput label="Dew point out" scale={celsius} value={readings.dewPointOut_c} onValueChange={(v) => setReadings((r) => ({ ...r, dewPointOut_c: v }))} error={field("dewPointOut_c")} hint="optional" />
          <UnitInput label="Cooling rate" scale={perHour} value={readings.coolingRate_c_per_h} onValueChange={(v) => setReadings((r) => ({ ...r, coolingRate_c_per_h: v }))} error={field("coolingRate_c_per_h")} />
        </div>
        <div className="space-y-1.5">
          <label htmlFor="run-notes" className="block font-semibold">
            Notes
          </label>
          <textarea id="run-notes" rows={2} className={`${control} border-nickel-400`} value={notes} onChange={(e) => setNotes(e.target.value)} />
        </div>

        {annealWindow && complete && (
          <div data-testid="window-check">
            {deviations.length === 0 ? (
              <StatusNote tone="ok" word="Inside the window">
                The record is inside the {alloy} window.
              </StatusNote>
            ) : (
              <StatusNote tone="danger" word="Outside the window">
                <ul className="list-disc pl-5">
                  {deviations.map((d) => (
                    <li key={d.field}>{d.message}</li>
                  ))}
                </ul>
                The lots will go on hold until the planner releases them or sends them to be annealed again.
              </StatusNote>
            )}
          </div>
        )}

        {!confirming && (
          <Button type="submit" disabled={chosen.length === 0 || over}>
            Record the run…
          </Button>
        )}
      </form>
      {confirming && (
        <div className="mt-4 space-y-3 rounded-md border-2 border-caution-200 bg-caution-50 p-4" role="group" aria-label="Confirm the run">
          <p className="font-semibold">
            Record the run of {picked.map((l) => l.number).join(", ")} in {furnace?.name}?{deviations.length > 0 ? " It is outside the window: the lots go on hold." : ""}
          </p>
          <div className="flex flex-wrap gap-3">
            <Button onClick={() => void go()} pending={record.isPending} pendingLabel="Recording…">
              Yes, record it
            </Button>
            <Button variant="secondary" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
          </div>
        </div>
      )}
      {error && (
        <StatusNote tone="danger" word="Not recorded" live="assertive" className="mt-4">
          {error.message}
        </StatusNote>
      )}
    </Panel>
  );
}

function RunResult({ run }: { run: FurnaceRunJson }) {
  return run.withinWindow ? (
    <StatusNote tone="ok" word="Run recorded" live="polite" className="mb-4">
      <span data-testid="run-result">
        {run.number}: inside the window. Lots {run.lots.map((l) => l.number).join(", ")} may complete the anneal.
      </span>
    </StatusNote>
  ) : (
    <StatusNote tone="danger" word="Run recorded, lots on hold" live="polite" className="mb-4">
      <span data-testid="run-result">
        {run.number} is outside the window: {run.deviations.join("; ")}. On hold:{" "}
        {run.lots.map((l, i) => (
          <span key={l.id}>
            {i > 0 && ", "}
            <Link className="font-mono underline" to={paths.floorLot.href(l.id)}>
              {l.number}
            </Link>
          </span>
        ))}
        . The planner releases them on the lot&rsquo;s page.
      </span>
    </StatusNote>
  );
}

export function RunList() {
  const [page, setPage] = useState(1);
  const filters = runsFilters(page);
  const runs = useQuery(furnaceRunsQueryOptions(filters));
  if (runs.isPending) return <Loading label="Loading runs…" />;
  if (runs.isError) return <QueryError error={runs.error} onRetry={() => runs.refetch()} what="the furnace runs" />;
  return (
    <Panel title="Runs">
      {runs.data.items.length === 0 ? (
        <p className="text-flux-700">No runs recorded yet.</p>
      ) : (
        <>
          <ResponsiveTable<FurnaceRunSummaryJson>
            caption="Furnace runs, newest first"
            rows={runs.data.items}
            rowKey={(r) => r.id}
            testId="furnace-runs"
            cardsBelow={700}
            columns={[
              { key: "number", header: "Run", primary: true, className: "whitespace-nowrap font-mono font-semibold", cell: (r) => r.number },
              { key: "when", header: "Ran", className: "whitespace-nowrap", cell: (r) => formatDateTime(r.ranAt) },
              { key: "load", header: "Load", cell: (r) => `${r.furnaceName} · ${r.materialId} · ${r.lotNumbers.join(", ")} · ${r.load_kg.toFixed(1)} kg` },
              { key: "peak", header: "Peak", align: "end", className: "tabular font-mono", cell: (r) => `${r.peakTemperature_c} °C` },
              { key: "window", header: "Window", cell: (r) => (r.withinWindow ? <span className="font-semibold text-ok-700">Inside</span> : <span className="font-semibold text-danger-700">Outside: on hold</span>) },
              { key: "chart", header: "Chart", cell: (r) => <ChartCell run={r} /> },
            ]}
          />
          <Pager label="Run list pages" page={filters.page} pageSize={filters.pageSize} total={runs.data.total} noun={["run", "runs"]} onPage={setPage} />
        </>
      )}
    </Panel>
  );
}

function ChartCell({ run }: { run: FurnaceRunSummaryJson }) {
  const attach = useAttachFurnaceChart();
  const input = useRef<HTMLInputElement>(null);
  const error = attach.error instanceof ApiError ? attach.error : null;
  if (run.chart)
    return (
      <a className="underline" href={furnaceChartUrl(run.id)} target="_blank" rel="noopener">
        open
      </a>
    );
  return (
    <span className="space-y-1">
      <label className="block">
        <span className="sr-only">Chart file for {run.number} (PDF or image)</span>
        <input ref={input} type="file" accept="application/pdf,image/png,image/jpeg,image/tiff,image/webp" className="max-w-48 text-meta" onChange={(e) => e.target.files?.[0] && attach.mutate({ id: run.id, file: e.target.files[0] })} />
      </label>
      {attach.isPending && <span className="text-meta">Uploading…</span>}
      {error && <span className="block text-meta font-semibold text-danger-700">{error.fields.file ?? error.message}</span>}
    </span>
  );
}
