import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { Link, type LoaderFunctionArgs } from "react-router-dom";
import { controlChartsQueryOptions } from "../api/calibration";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { PageHeader, Panel } from "../components/ui/panel";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { paths } from "../config/paths";
import { ControlChartPair } from "../features/calibration/control-chart";
import { classWords, db, day } from "../features/calibration/words";
import { requireRole, warm } from "../lib/guards";
import { RUN_RULES } from "../../shared/calibration/control-chart";
import { QualityNav } from "../features/quality/quality-nav";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["qa", "admin"]);
  await warm(queryClient.ensureQueryData(controlChartsQueryOptions));
  return null;
};

const ci = (x: number) => x.toFixed(2);

export function Component() {
  const charts = useQuery(controlChartsQueryOptions);
  return (
    <>
      <QualityNav />
      <PageHeader
        eyebrow="Quality · control charts"
        title="Attenuation margin, lot by lot"
        lead="Per alloy and forming route: each decided lot's mean measured attenuation minus the attenuation its order requires, with limits from the moving range, the run rules, and the process capability against the requirement."
      />
      <p className="mb-6 text-meta text-flux-700">
        <Link className="underline" to={paths.calibration.href()}>Calibrated predictions</Link> · Constants for moving ranges of two: d2 = 1.128, D3 = 0, D4 = 3.267 (Montgomery, Introduction to Statistical Quality Control, table of factors).
      </p>
      {charts.isPending && <Loading label="Loading the charts…" />}
      {charts.isError && <QueryError error={charts.error} onRetry={() => void charts.refetch()} what="the control charts" />}
      {charts.data?.length === 0 && <StatusNote tone="info">No decided lots with measurements yet.</StatusNote>}
      <div className="space-y-6">
        {charts.data?.map((c) => {
          const title = classWords(c);
          const last = c.chart.points[c.chart.points.length - 1];
          return (
            <PanelBoundary key={`${c.material}|${c.method}`} name={`the chart of ${c.material}`}>
              <Panel title={title}>
                <div data-testid="control-chart" data-group={`${c.material}|${c.method}`} className="space-y-4">
                  <p className="text-body">
                    {c.lots} lots{c.chart.trial ? " (trial limits: fewer than 20 lots)" : ""}.
                    {last && <> Latest: lot <Link className="font-mono underline" to={paths.measuredLot.href(last.lotId)} data-testid="latest-lot">{last.number}</Link>, {day(last.decidedAt)}, margin {db(last.margin_db, true)}.</>}
                    {c.chart.individuals && <> Centre {db(c.chart.individuals.center_db, true)}, limits {db(c.chart.individuals.lcl_db, true)} to {db(c.chart.individuals.ucl_db, true)} (σ {db(c.chart.individuals.sigma_db)} from MR̄/d2).</>}
                  </p>
                  <ControlChartPair chart={c.chart} title={title} />
                  <div data-testid="capability">
                    <h4 className="text-body font-semibold">Process capability against the required attenuation</h4>
                    {c.chart.capability ? (
                      <p className="text-body">
                        <span className="font-mono">Cpk {ci(c.chart.capability.cpk)}</span> (95 % interval {ci(c.chart.capability.interval.low)} to {ci(c.chart.capability.interval.high)}), Ppk {ci(c.chart.capability.ppk)}, over {c.chart.capability.lots} lots. {c.chart.capability.basis}
                      </p>
                    ) : (
                      <p className="text-body">{c.chart.capabilityNote}</p>
                    )}
                  </div>
                </div>
              </Panel>
            </PanelBoundary>
          );
        })}
      </div>
      {charts.data && charts.data.length > 0 && (
        <Panel title="The run rules" className="mt-6">
          <dl className="grid gap-3 text-body sm:grid-cols-2">
            {Object.values(RUN_RULES).map((r) => (
              <div key={r.id}>
                <dt className="font-semibold">{r.name}</dt>
                <dd className="text-meta text-flux-700">{r.description}</dd>
              </div>
            ))}
          </dl>
          <p className="mt-3 text-meta text-flux-600">Nelson's tests for special causes (Journal of Quality Technology 16(4), 1984); tests 1, 5 and 6 are the Western Electric rules 1–3.</p>
        </Panel>
      )}
    </>
  );
}
