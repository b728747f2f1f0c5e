import { useEffect, useMemo, useState } from "react";
import { useQueries, useQuery } from "@tanstack/react-query";
import type { PredictionRequest } from "../../../shared/schemas/prediction";
import { ApiError } from "../../api/client";
import { materialsQueryOptions } from "../../api/materials";
import { predictionQueryOptions, sweepQueryOptions } from "../../api/predictions";
import { PanelBoundary } from "../../components/error-boundary";
import { Button } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { useDebounced } from "../../lib/use-debounced";
import { AttenuationChart, SERIES_STYLE, type ChartSeries } from "./attenuation-chart";
import { Cautions } from "./cautions";
import { CrossSection } from "./cross-section";
import { DesignForm } from "./design-form";
import { MakePanel } from "./make-panel";
import { checkDraft, defaultDesign, describeDesign, draftErrors, type DesignDraft } from "./design-model";
import { Headline, HoleTable, LayerBars, Warnings } from "./results";

interface Variant {
  label: "A" | "B";
  request: PredictionRequest;
  description: string;
  attenuation_db: number;
}

/** The design check: inputs on the left; figures, chart and drawing on the right, updated as the person types. */
export function DesignCheck() {
  const [draft, setDraft] = useState<DesignDraft>(defaultDesign);
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
  const sweep = useQuery({ ...sweepQueryOptions(request!), enabled: request !== null });

  const [variants, setVariants] = useState<Variant[]>([]);
  const variantSweeps = useQueries({ queries: variants.map((v) => sweepQueryOptions(v.request)) });

  const server = prediction.isError && prediction.error instanceof ApiError ? draftErrors(prediction.error.fields) : { errors: {}, other: [] };
  const client = checked.errors ? draftErrors(checked.errors) : { errors: {}, other: [] };
  const errors = { ...server.errors, ...client.errors };
  const otherMessages = [...client.other, ...server.other];
  const typing = checked.errors === null && JSON.stringify(request) !== JSON.stringify(lastValid);
  const result = prediction.data;
  const stale = checked.errors !== null || prediction.isError;
  const frequency = result && request ? request.field.frequency_hz : null;

  const keepVariant = () => {
    if (!request || !result) return;
    const label: Variant["label"] = variants.some((v) => v.label === "A") ? "B" : "A";
    setVariants((vs) => [...vs, { label, request, description: describeDesign(request, nameOf), attenuation_db: result.attenuation_db }].sort((a, b) => a.label.localeCompare(b.label)));
  };
  const series: ChartSeries[] = [];
  if (sweep.data) series.push({ name: "This design", points: sweep.data, ...SERIES_STYLE[0] });
  variants.forEach((v, i) => {
    const points = variantSweeps[i]?.data;
    if (points) series.push({ name: `Variant ${v.label}`, points, ...SERIES_STYLE[v.label === "A" ? 1 : 2] });
  });

  return (
    <div className="grid items-start gap-6 md:grid-cols-[19rem_1fr] xl:grid-cols-[25rem_1fr]">
      <Panel title="The design">
        <DesignForm draft={draft} onChange={setDraft} errors={errors} materials={library} materialsError={materials.isError} />
      </Panel>

      <div className="min-w-0 space-y-6">
        <Panel
          title="Predicted shielding"
          actions={
            <span className="flex min-h-6 items-center gap-2 text-meta text-flux-600" aria-live="polite">
              {(prediction.isFetching || typing) && (
                <>
                  <Spinner /> Working it out…
                </>
              )}
            </span>
          }
        >
          <div className="space-y-5">
            {(checked.errors !== null || prediction.isError) && (
              <StatusNote tone="danger" word="Check the inputs">
                {otherMessages.length ? otherMessages.join(" ") : prediction.isError && !(prediction.error instanceof ApiError && prediction.error.isValidation) ? (prediction.error as Error).message : "Some values cannot be used; see the messages beside the fields."}
                {result ? " The figures below are for the last values that worked." : ""}
              </StatusNote>
            )}
            {!result && prediction.isPending && <p className="text-flux-600">Working out the first figures…</p>}
            {result && request && (
              <div className={stale ? "stale space-y-6" : "space-y-6"} data-testid="prediction" aria-busy={prediction.isFetching || undefined}>
                <Headline result={result} frequency={request.field.frequency_hz} />
                <p className="text-meta text-flux-600">
                  <strong className="font-semibold">Method:</strong> {result.method}. <strong className="font-semibold">Range:</strong> {result.band.basis}.
                </p>
                <section className="space-y-3">
                  <h3 className="text-h4">Each layer</h3>
                  <LayerBars result={result} materialName={nameOf} />
                </section>
                {result.holes.length > 0 && (
                  <section className="space-y-3">
                    <h3 className="text-h4">Cable holes</h3>
                    <HoleTable result={result} />
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
            {series.length > 0 ? <AttenuationChart series={series} frequency={frequency} /> : <p className="py-12 text-center text-flux-600">Working out the curve…</p>}
            {variants.length > 0 ? (
              <ul className="mt-4 space-y-2" aria-label="Kept variants">
                {variants.map((v) => (
                  <li key={v.label} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-nickel-200 px-3 py-2">
                    <span>
                      <strong>Variant {v.label}</strong> ({v.label === "A" ? "dashed" : "dotted"}): {v.description}; {v.attenuation_db.toFixed(1)} dB at {v.request.field.frequency_hz} Hz
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
          <Panel title="Cross-section">{request ? <CrossSection request={request} materials={library} /> : <p className="text-flux-600">Enter a valid design to see the drawing.</p>}</Panel>
        </PanelBoundary>

        <PanelBoundary name="what it takes to make">
          <Panel title="What it takes to make">{request ? <MakePanel request={request} /> : <p className="text-flux-600">Enter a valid design to see its parts.</p>}</Panel>
        </PanelBoundary>

        <Panel title="Before you rely on these figures">
          <Cautions />
        </Panel>
      </div>
    </div>
  );
}
