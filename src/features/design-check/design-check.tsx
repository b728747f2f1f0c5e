import { useEffect, useMemo, useState } from "react";
import { useQueries, useQuery } from "@tanstack/react-query";
import type { PredictionRequest } from "../../../shared/schemas/prediction";
import { blamesInputs } from "../../api/client";
import { materialsQueryOptions } from "../../api/materials";
import { predictionQueryOptions, sweepQueryOptions, type PredictionResult, type SweepPoint, type SweepRange } from "../../api/predictions";
import { PanelBoundary } from "../../components/error-boundary";
import { ServerTrouble } from "../../components/server-trouble";
import { Button } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { quantityScale, UnitInput, unitOptions } from "../../components/ui/unit-input";
import { useChangeAnnouncement, type Figures } from "../../lib/announce";
import { useDebounced } from "../../lib/use-debounced";
import { useLastGood } from "../../lib/use-last-good";
import { useSearchState } from "../../lib/use-search-state";
import { AttenuationChart, SERIES_STYLE, type ChartSeries } from "./attenuation-chart";
import { checkRange, defaultRange, type ChartRangeDraft } from "./chart-range";
import { Cautions } from "./cautions";
import { CrossSection } from "./cross-section";
import { DesignForm } from "./design-form";
import { chartRangeFromParams, chartRangeToParams, designFromParams, designToParams } from "./design-url";
import { MakePanel } from "./make-panel";
import { checkDraft, describeDesign, designFrequencyUnits, draftErrors, type DesignDraft, type DesignUnits } from "./design-model";
import { frequencyText, Headline, HoleTable, LayerBars, Warnings } from "./results";

const builtPoints = (points: SweepPoint[]) => points.map((p) => ({ frequency_hz: p.frequency_hz, attenuation_db: p.attenuation_db }));
const idealPoints = (points: SweepPoint[]) => points.map((p) => ({ frequency_hz: p.frequency_hz, attenuation_db: p.ideal_db }));

interface Variant {
  label: "A" | "B";
  request: PredictionRequest;
  description: string;
  attenuation_db: number;
}

/** Everything the address bar holds: the design, and the chart's range. */
interface PageState {
  design: DesignDraft;
  chart: ChartRangeDraft;
}
const readPage = (p: URLSearchParams): PageState => ({ design: designFromParams(p), chart: chartRangeFromParams(p, defaultRange()) });
const writePage = (s: PageState): URLSearchParams => chartRangeToParams(s.chart, designToParams(s.design));

const dbText = (figure: { attenuation_db: number; beyondLimit: boolean }) => (figure.beyondLimit ? `over ${figure.attenuation_db.toFixed(0)} dB` : `${figure.attenuation_db.toFixed(1)} dB`);

/** The figures a screen reader is told about when they change. */
function figuresOf(result: PredictionResult, frequency: number, units: DesignUnits): Figures {
  return {
    "attenuation as built": `${dbText(result)} at ${frequencyText(frequency, units.frequency)}`,
    "likely range": `${result.band.low_db.toFixed(0)} to ${result.band.high_db.toFixed(0)} dB`,
    "seamless shell": dbText(result.ideal),
    saturation: result.warnings.some((w) => w.code === "SATURATED") ? "a wall saturates" : "no wall saturates",
  };
}

/** The design check: inputs beside (or above) the figures, chart and drawing, updated as the person types; the design lives in the address bar. */
export function DesignCheck() {
  const [page, setPage, commit] = useSearchState(readPage, writePage);
  const draft = page.design;
  const setDraft = (design: DesignDraft, kind: "typing" | "commit") => setPage({ ...page, design }, kind);
  const materials = useQuery(materialsQueryOptions);
  const library = materials.data ?? [];
  const nameOf = (id: string) => id;

  // Checked in the browser with the server's schema first: a message appears beside the field at
  // once, and only a valid design is sent. The last valid one stays on screen meanwhile.
  const checked = useMemo(() => checkDraft(draft), [draft]);
  const [lastValid, setLastValid] = useState<PredictionRequest | null>(() => checked.request);
  useEffect(() => {
    if (checked.request) setLastValid(checked.request);
  }, [checked.request]);
  const request = useDebounced(lastValid, 250);

  const prediction = useQuery({ ...predictionQueryOptions(request!), enabled: request !== null });
  const shown = useLastGood(prediction.data, prediction.isSuccess && !prediction.isPlaceholderData);
  // the request the shown figures belong to (its frequency labels them)
  const [shownFor, setShownFor] = useState<PredictionRequest | null>(null);
  if (prediction.isSuccess && !prediction.isPlaceholderData && request && shownFor !== request) setShownFor(request);

  // the chart's range: as typed, widened to take in the asked frequency; the last good one meanwhile
  const rangeCheck = checkRange(page.chart, request ? request.field.frequency_hz : null);
  const [lastRange, setLastRange] = useState<SweepRange>(() => (rangeCheck.ok ? rangeCheck.range : { from_hz: 1, to_hz: 10_000 }));
  const from = rangeCheck.ok ? rangeCheck.range.from_hz : null, to = rangeCheck.ok ? rangeCheck.range.to_hz : null;
  useEffect(() => {
    if (from !== null && to !== null) setLastRange({ from_hz: from, to_hz: to });
  }, [from, to]);
  const range = useDebounced(lastRange, 250);
  const sweep = useQuery({ ...sweepQueryOptions(request!, range), enabled: request !== null });
  const sweepShown = useLastGood(sweep.data, sweep.isSuccess && !sweep.isPlaceholderData);

  const [variants, setVariants] = useState<Variant[]>([]);
  const variantSweeps = useQueries({ queries: variants.map((v) => sweepQueryOptions(v.request, range)) });

  const inputProblem = prediction.isError && blamesInputs(prediction.error);
  const serverProblem = prediction.isError && !inputProblem;
  const server = prediction.isError && blamesInputs(prediction.error) ? draftErrors(prediction.error.fields) : { errors: {}, other: [] };
  const client = checked.errors ? draftErrors(checked.errors) : { errors: {}, other: [] };
  const errors = { ...server.errors, ...client.errors };
  const otherMessages = [...client.other, ...server.other];
  const typing = checked.errors === null && JSON.stringify(request) !== JSON.stringify(lastValid);
  const result = shown;
  const stale = checked.errors !== null || prediction.isError || prediction.isPlaceholderData;
  const frequency = result && shownFor ? shownFor.field.frequency_hz : null;
  const units = draft.units;
  const working = prediction.isFetching || typing;
  const announcement = useChangeAnnouncement(result && frequency !== null ? figuresOf(result, frequency, units) : null, !working && !stale);

  const keepVariant = () => {
    if (!request || !result) return;
    const label: Variant["label"] = variants.some((v) => v.label === "A") ? "B" : "A";
    setVariants((vs) => [...vs, { label, request, description: describeDesign(request, nameOf, units.length), attenuation_db: result.attenuation_db }].sort((a, b) => a.label.localeCompare(b.label)));
  };
  const series: ChartSeries[] = [];
  if (sweepShown) {
    series.push({ name: "This design, as built", points: builtPoints(sweepShown), ...SERIES_STYLE[0] });
    series.push({ name: "Seamless shell (ideal)", points: idealPoints(sweepShown), ...SERIES_STYLE[0], dash: "6 3", faint: true });
  }
  variants.forEach((v, i) => {
    const points = variantSweeps[i]?.data;
    if (points) series.push({ name: `Variant ${v.label}, as built`, points: builtPoints(points), ...SERIES_STYLE[v.label === "A" ? 1 : 2] });
  });
  const frequencyScale = quantityScale("frequency", units.frequency);
  const setChart = (chart: ChartRangeDraft) => setPage({ ...page, chart }, "typing");
  const setFrequencyUnit = (u: string) => setPage({ ...page, design: { ...draft, units: { ...units, frequency: u as DesignUnits["frequency"] } } }, "commit");

  return (
    <div className="grid items-start gap-6 lg:grid-cols-[minmax(22rem,25rem)_minmax(0,1fr)] xl:grid-cols-[28rem_minmax(0,1fr)]">
      <p role="status" className="sr-only" data-testid="result-announcement">
        {announcement}
      </p>
      <Panel title="The design" className="min-w-0">
        <DesignForm draft={draft} onChange={setDraft} onCommit={commit} errors={errors} materials={library} materialsError={materials.isError} />
      </Panel>

      {/* On a phone or tablet the form fills the screen: the headline figures stay in view at its foot while the person edits. */}
      <ResultSummary result={result} frequency={frequency} units={units} working={working} problem={checked.errors !== null || inputProblem} />

      <div className="min-w-0 space-y-6" id="results">
        <Panel
          title="Predicted shielding"
          actions={
            <span className="flex min-h-6 items-center gap-2 text-meta text-flux-600">
              {working && (
                <>
                  <Spinner /> Working it out…
                </>
              )}
            </span>
          }
        >
          <div className="space-y-5">
            {(checked.errors !== null || inputProblem) && (
              <StatusNote tone="danger" word="Check the inputs">
                {otherMessages.length ? otherMessages.join(" ") : "Some values cannot be used; see the messages beside the fields."}
                {result ? " The figures below are for the last values that worked." : ""}
              </StatusNote>
            )}
            {serverProblem && <ServerTrouble error={prediction.error} what="the prediction" kept={Boolean(result)} onRetry={() => void prediction.refetch()} />}
            {!result && prediction.isPending && <p className="text-flux-600">Working out the first figures…</p>}
            {result && frequency !== null && (
              <div className={stale ? "stale space-y-6" : "space-y-6"} data-testid="prediction" aria-busy={prediction.isFetching || undefined}>
                <Headline result={result} frequency={frequency} units={units} />
                <p className="text-meta text-flux-600">
                  <strong className="font-semibold">Method:</strong> {result.method}. <strong className="font-semibold">Likely range:</strong> {result.band.basis}.
                </p>
                <section className="space-y-3">
                  <h3 className="text-h4">Each layer</h3>
                  <LayerBars result={result} materialName={nameOf} units={units} />
                </section>
                {result.holes.length > 0 && (
                  <section className="space-y-3">
                    <h3 className="text-h4">Cable holes</h3>
                    <HoleTable result={result} units={units} />
                  </section>
                )}
                <section className="space-y-3">
                  <h3 className="text-h4">Warnings</h3>
                  <Warnings result={result} />
                </section>
              </div>
            )}
          </div>
        </Panel>

        <PanelBoundary name="the attenuation chart">
          <Panel
            title="Attenuation against frequency"
            actions={
              <Button variant="secondary" onClick={keepVariant} disabled={!result || !request || variants.length >= 2 || stale}>
                Keep as variant {variants.some((v) => v.label === "A") ? "B" : "A"}
              </Button>
            }
          >
            {sweep.isError && !blamesInputs(sweep.error) && <ServerTrouble error={sweep.error} what="the curve" kept={Boolean(sweepShown)} onRetry={() => void sweep.refetch()} />}
            {series.length > 0 ? <AttenuationChart series={series} frequency={frequency} range={range} /> : <p className="py-12 text-center text-flux-600">Working out the curve…</p>}
            <div className="mt-4 grid max-w-xl gap-3 sm:grid-cols-2" role="group" aria-label="Chart range">
              <UnitInput
                label="Chart from"
                name="chartFrom"
                scale={frequencyScale}
                value={page.chart.from_hz}
                error={rangeCheck.ok ? undefined : rangeCheck.errors.from}
                onValueChange={(v) => setChart({ ...page.chart, from_hz: v })}
                onCommit={commit}
                unitSelect={{ value: units.frequency, options: unitOptions.frequency(designFrequencyUnits), onChange: setFrequencyUnit }}
              />
              <UnitInput
                label="Chart to"
                name="chartTo"
                scale={frequencyScale}
                value={page.chart.to_hz}
                error={rangeCheck.ok ? undefined : rangeCheck.errors.to}
                onValueChange={(v) => setChart({ ...page.chart, to_hz: v })}
                onCommit={commit}
                unitSelect={{ value: units.frequency, options: unitOptions.frequency(designFrequencyUnits), onChange: setFrequencyUnit }}
              />
            </div>
            <p className="mt-2 text-meta text-flux-600" data-testid="chart-range-note">
              {rangeCheck.ok && rangeCheck.widened && frequency !== null
                ? `The chart is widened to take in the asked ${frequencyText(frequency, frequency >= 1000 ? "kHz" : "Hz")}.`
                : frequency === 0
                  ? "At DC the figures are the curve's low-frequency end."
                  : "The solid line is what a built shield of this construction is expected to reach; the pale dashed line is the seamless shell."}
            </p>
            {variants.length > 0 ? (
              <ul className="mt-4 space-y-2" aria-label="Kept variants">
                {variants.map((v) => (
                  <li key={v.label} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-nickel-200 px-3 py-2">
                    <span>
                      <strong>Variant {v.label}</strong> ({v.label === "A" ? "dashed" : "dotted"}): {v.description}; {v.attenuation_db.toFixed(1)} dB at {frequencyText(v.request.field.frequency_hz, units.frequency)}
                    </span>
                    <Button variant="quiet" className="min-h-9 px-2 text-meta" onClick={() => setVariants((vs) => vs.filter((x) => x.label !== v.label))} aria-label={`Remove variant ${v.label}`}>
                      Remove
                    </Button>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="mt-3 text-meta text-flux-600">Keep up to two variants to compare their curves with the design you are editing.</p>
            )}
          </Panel>
        </PanelBoundary>

        <PanelBoundary name="the cross-section drawing">
          <Panel title="Cross-section">{request ? <CrossSection request={request} materials={library} unit={units.length} /> : <p className="text-flux-600">Enter a valid design to see the drawing.</p>}</Panel>
        </PanelBoundary>

        <PanelBoundary name="what it takes to make">
          <Panel title="What it takes to make">{request ? <MakePanel request={request} unit={units.length} /> : <p className="text-flux-600">Enter a valid design to see its parts.</p>}</Panel>
        </PanelBoundary>

        <Panel title="Before you rely on these figures">
          <Cautions />
        </Panel>
      </div>
    </div>
  );
}

/**
 * The headline in one line, pinned to the foot of the screen below the large layout while the
 * form is being edited (a sticky grid item between the form and the results: once the results
 * scroll into view it rests above them).
 */
function ResultSummary({ result, frequency, units, working, problem }: { result: PredictionResult | undefined; frequency: number | null; units: DesignUnits; working: boolean; problem: boolean }) {
  return (
    <div className="sticky bottom-0 z-20 -mx-4 border-t-2 border-anneal-600 bg-flux-900 px-4 py-2 text-white shadow-[0_-4px_12px_rgba(19,27,36,0.25)] sm:-mx-6 sm:px-6 lg:hidden" data-testid="result-summary">
      <div className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1">
        {result && frequency !== null ? (
          <p className="flex flex-wrap items-baseline gap-x-3">
            <span className="font-display text-h4 font-semibold" data-testid="summary-db">
              {dbText(result)}
            </span>
            <span className="text-meta text-flux-100">
              as built at {frequencyText(frequency, units.frequency)} · likely {result.band.low_db.toFixed(0)}–{result.band.high_db.toFixed(0)} dB · ideal {dbText(result.ideal)}
              {result.warnings.some((w) => w.code === "SATURATED") ? " · saturates" : ""}
            </span>
          </p>
        ) : (
          <p className="text-meta text-flux-100">No figures yet.</p>
        )}
        <span className="flex items-center gap-3 text-meta">
          {working ? (
            <span className="flex items-center gap-1.5 text-flux-100">
              <Spinner /> working
            </span>
          ) : problem ? (
            <span className="text-anneal-200">inputs need attention</span>
          ) : null}
          <a href="#results" className="font-semibold text-white underline underline-offset-4">
            Results
          </a>
        </span>
      </div>
    </div>
  );
}
