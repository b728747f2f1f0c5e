import { useState, type FormEvent } from "react";
import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { Link, type LoaderFunctionArgs } from "react-router-dom";
import { meQueryOptions } from "../api/auth";
import { calibrationOverviewQueryOptions, useRefitCalibration, useSaveCalibrationSettings } from "../api/calibration";
import { blamesInputs } from "../api/client";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Button } from "../components/ui/button";
import { TextField } from "../components/ui/field";
import { PageHeader, Panel } from "../components/ui/panel";
import { ResponsiveTable } from "../components/ui/responsive-table";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { paths } from "../config/paths";
import { ClassFitPanel } from "../features/calibration/class-fit-panel";
import { classWords, when } from "../features/calibration/words";
import { requireRole, warm } from "../lib/guards";
import { QualityNav } from "../features/quality/quality-nav";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["qa", "admin"]);
  await warm(queryClient.ensureQueryData(calibrationOverviewQueryOptions));
  return null;
};

function MinLotsForm({ minLots }: { minLots: number }) {
  const save = useSaveCalibrationSettings();
  const [value, setValue] = useState(String(minLots));
  const submit = (e: FormEvent) => {
    e.preventDefault();
    save.mutate({ minLots: Number(value) });
  };
  const fieldError = save.error && blamesInputs(save.error) ? save.error.fields.minLots : undefined;
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3" noValidate>
      <TextField label="Lots a class needs before its fit is used" inputMode="numeric" value={value} onChange={(e) => setValue(e.target.value)} error={fieldError} className="w-28" />
      <Button type="submit" variant="secondary" pending={save.isPending} pendingLabel="Saving…">Save and fit again</Button>
      {save.isSuccess && <StatusNote tone="ok" live="polite">Saved; a new fit is queued.</StatusNote>}
      {save.error && !fieldError && <StatusNote tone="danger" live="assertive">{save.error.message}</StatusNote>}
    </form>
  );
}

export function Component() {
  const overview = useQuery(calibrationOverviewQueryOptions);
  const me = useQuery(meQueryOptions);
  const refit = useRefitCalibration();
  const data = overview.data;
  return (
    <>
      <QualityNav />
      <PageHeader
        eyebrow="Quality · calibration"
        title="Predictions calibrated by measured lots"
        lead="Each class of shield (alloy, forming method, construction) fitted to this shop's own measured lots: effective permeability and construction ceiling, judged by how well they predict lots they have not seen."
      />
      <StatusNote tone="caution" word="Estimates" className="mb-6">
        Calibrated predictions are still engineering estimates, not a guarantee: the certificate's measured values rule, and safety-critical uses (medical, life safety) need the customer's own qualified review.
      </StatusNote>
      {overview.isPending && <Loading label="Loading the calibration…" />}
      {overview.isError && <QueryError error={overview.error} onRetry={() => void overview.refetch()} what="the calibration" />}
      {data && (
        <div className="space-y-6">
          <Panel
            title="Latest fit"
            actions={
              <div className="flex flex-wrap gap-3">
                <Link className="underline" to={paths.controlCharts.href()}>Control charts</Link>
                <Button variant="secondary" onClick={() => refit.mutate()} pending={refit.isPending || data.refitPending} pendingLabel="Fitting…">Fit again now</Button>
              </div>
            }
          >
            {data.run ? (
              <p className="text-body" data-testid="latest-run">
                {when(data.run.fittedAt)}, on {data.run.lots} measured lots ({data.run.reason}{data.run.fittedBy ? `, by ${data.run.fittedBy.name}` : ""}); {data.run.classesInUse} of {data.fits.length} classes in use. A new fit runs by itself when a certificate is issued.
              </p>
            ) : (
              <p className="text-body" data-testid="latest-run">No fit yet: the first runs when measured lots are recorded, or now with "Fit again now".</p>
            )}
            {data.refitPending && <StatusNote tone="info" live="polite" className="mt-3">A new fit is queued or running; this page updates when it is done.</StatusNote>}
            {refit.error && <StatusNote tone="danger" live="assertive" className="mt-3">{refit.error.message}</StatusNote>}
            <div className="mt-4">
              {me.data?.role === "admin" ? <MinLotsForm key={data.settings.minLots} minLots={data.settings.minLots} /> : <p className="text-meta text-flux-700">A class is used once it has {data.settings.minLots} lots (the planner's setting) and beats the library values in cross-validation.</p>}
            </div>
          </Panel>
          {data.fits.length === 0 && data.waiting.length === 0 && <StatusNote tone="info">No measured lots yet. Until a class has enough, every prediction uses the library values.</StatusNote>}
          {data.fits.map((fit) => (
            <PanelBoundary key={fit.id} name={`the fit of ${fit.material}`}>
              <ClassFitPanel fit={fit} />
            </PanelBoundary>
          ))}
          {(data.waiting.length > 0 || data.unclassified.length > 0) && (
            <Panel title="Not fitted">
              <ul className="list-disc space-y-1 pl-5 text-body">
                {data.waiting.map((w) => <li key={`${w.material}|${w.method}|${w.construction}`}>{classWords(w)}: {w.lots} lot, nothing to fit yet.</li>)}
                {data.unclassified.map((u) => <li key={`${u.lotId}-${u.reason}`}>Lot <Link className="underline" to={paths.measuredLot.href(u.lotId)}>{u.lotNumber}</Link> ({u.parts} parts): {u.reason}.</li>)}
              </ul>
            </Panel>
          )}
          <Panel title="Every fit kept">
            <ResponsiveTable
              caption="Fits, newest first"
              testId="calibration-history"
              rows={data.history}
              rowKey={(r) => r.id}
              columns={[
                { key: "when", header: "When", primary: true, className: "whitespace-nowrap", cell: (r) => when(r.fittedAt) },
                { key: "why", header: "Why", cell: (r) => r.reason },
                { key: "who", header: "Who", cell: (r) => r.fittedBy?.name ?? "automatic" },
                { key: "lots", header: "Lots", align: "end", className: "font-mono", cell: (r) => r.lots },
                { key: "use", header: "Classes in use", align: "end", className: "font-mono", cell: (r) => r.classesInUse },
              ]}
            />
          </Panel>
        </div>
      )}
    </>
  );
}
