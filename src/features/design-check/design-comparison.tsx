import { useState } from "react";
import { Link } from "react-router-dom";
import { useQueries, useQuery } from "@tanstack/react-query";
import { predictionRequestSchema, type PredictionRequest } from "../../../shared/schemas/prediction";
import { designComparisonQueryOptions, type DesignComparisonJson } from "../../api/designs";
import { sweepQueryOptions } from "../../api/predictions";
import { PanelBoundary } from "../../components/error-boundary";
import { QueryError } from "../../components/query-error";
import { ButtonLink } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { plainScale, UnitInput } from "../../components/ui/unit-input";
import { paths } from "../../config/paths";
import { formatMoney } from "../../lib/money";
import { useDebounced } from "../../lib/use-debounced";
import { AttenuationChart, SERIES_STYLE, type ChartSeries } from "./attenuation-chart";
import { SWEEP_FROM_HZ, SWEEP_TO_HZ } from "../../../shared/schemas/prediction";
import { Cautions } from "./cautions";
import { ConfigurationDrawing } from "./configuration-drawing";
import { openHref } from "./saved-designs";

type Item = DesignComparisonJson["items"][number];
const db = (x: number, beyond = false) => (beyond ? `over ${x.toFixed(0)} dB` : `${x.toFixed(1)} dB`);
/** A saved configuration as the prediction engine takes it (the blank fields and the need left out). */
const predictionOf = (item: Item): PredictionRequest | null => {
  const parsed = predictionRequestSchema.safeParse(item.design.configuration);
  return parsed.success ? parsed.data : null;
};

/** Up to three saved designs side by side: figures, the curve, mass and price at one quantity, each one's cross-section. */
export function DesignComparison({ ids }: { ids: string[] }) {
  const [quantity, setQuantity] = useState<number | null>(10);
  const asked = useDebounced(quantity !== null && Number.isInteger(quantity) && quantity >= 1 ? quantity : 1, 300);
  const compared = useQuery(designComparisonQueryOptions(ids, asked));
  const items = compared.data?.items ?? [];
  const requests = items.map(predictionOf);
  const range = { from_hz: SWEEP_FROM_HZ, to_hz: SWEEP_TO_HZ };
  const sweeps = useQueries({ queries: requests.map((r) => ({ ...sweepQueryOptions(r!, range), enabled: r !== null })) });

  if (ids.length === 0) {
    return (
      <StatusNote tone="info" word="Nothing chosen">
        Choose two or three designs on <Link to={paths.designs.href()} className="font-semibold underline underline-offset-4">your designs</Link> to compare them.
      </StatusNote>
    );
  }
  if (compared.isPending) return <Loading label="Working out the designs’ figures…" />;
  if (compared.isError) return <QueryError error={compared.error} onRetry={() => void compared.refetch()} what="the comparison" />;

  const money = (c: number, currency: string) => formatMoney(c, currency);
  const series: ChartSeries[] = items.flatMap((item, i) => {
    const points = sweeps[i]?.data;
    return points ? [{ name: item.design.name, points: points.map((p) => ({ frequency_hz: p.frequency_hz, attenuation_db: p.attenuation_db })), ...SERIES_STYLE[i % SERIES_STYLE.length] }] : [];
  });
  const frequencies = new Set(items.map((i) => i.design.configuration.field.frequency_hz));

  return (
    <div className="space-y-6">
      <Panel title="Figures side by side">
        <div className="mb-4 w-40">
          <UnitInput label="Quantity priced" name="compareQuantity" inputMode="numeric" scale={plainScale} value={quantity} onValueChange={setQuantity} error={quantity === null || !Number.isInteger(quantity) || quantity < 1 ? "Enter a whole number of pieces, 1 or more." : undefined} />
        </div>
        <ResponsiveTable<Item>
          caption="Compared designs"
          testId="comparison-table"
          rowTestId="comparison-row"
          rows={items}
          rowKey={(i) => i.design.id}
          cardsBelow={900}
          columns={[
            {
              key: "name",
              header: "Design",
              primary: true,
              cell: (i) => (
                <Link className="font-semibold text-flux-800 underline underline-offset-4" to={openHref(i.design)}>
                  {i.design.name}
                </Link>
              ),
            },
            { key: "what", header: "Shape and layers", cell: (i) => i.design.summary },
            { key: "built", header: "As built", align: "end", className: "font-mono whitespace-nowrap", cell: (i) => db(i.prediction.attenuation_db, i.prediction.beyondLimit) },
            { key: "band", header: "Likely range", align: "end", className: "font-mono whitespace-nowrap", cell: (i) => `${i.prediction.band.low_db.toFixed(0)}–${i.prediction.band.high_db.toFixed(0)} dB` },
            { key: "ideal", header: "Seamless shell", align: "end", className: "font-mono whitespace-nowrap", cell: (i) => db(i.prediction.ideal.attenuation_db, i.prediction.ideal.beyondLimit) },
            {
              key: "need",
              header: "Needs",
              align: "end",
              className: "whitespace-nowrap",
              cell: (i) => {
                const need = i.design.configuration.requiredAttenuation_db;
                const meets = i.prediction.band.low_db >= need;
                return (
                  <span className={meets ? "text-ok-700" : "font-semibold text-danger-700"}>
                    <span className="font-mono">{need} dB</span> {meets ? "met" : "short"}
                  </span>
                );
              },
            },
            { key: "sat", header: "Saturation", cell: (i) => (i.prediction.warnings.some((w) => w.code === "SATURATED") ? "a wall saturates" : "no wall saturates") },
            { key: "mass", header: "Mass", align: "end", className: "font-mono whitespace-nowrap", cell: (i) => (i.mass_kg === null ? "—" : `${i.mass_kg.toFixed(3)} kg`) },
            { key: "unit", header: "Per piece", align: "end", className: "font-mono whitespace-nowrap", cell: (i) => money(i.unitPrice_cents, i.currency) },
            { key: "total", header: `Total for ${asked}`, align: "end", className: "font-mono whitespace-nowrap", cell: (i) => money(i.total_cents, i.currency) },
          ]}
        />
        <p className="mt-3 text-meta text-flux-600">
          {frequencies.size === 1 ? `Figures at ${[...frequencies][0]} Hz, each design's own field.` : "Each design's figures are at its own field and frequency."} Prices at today's rates (price list version {compared.data.priceListVersion}); a quote fixes them. “Met” means even the low end of the likely range reaches the attenuation needed.
        </p>
        {ids.length > items.length && <StatusNote tone="caution" className="mt-3">Some of the chosen designs were deleted and are left out.</StatusNote>}
      </Panel>

      <PanelBoundary name="the curves">
        <Panel title="Attenuation against frequency, as built">{series.length > 0 ? <AttenuationChart series={series} frequency={null} range={range} /> : <Loading label="Working out the curves…" />}</Panel>
      </PanelBoundary>

      <PanelBoundary name="the cross-sections">
        <Panel title="Cross-sections">
          <div className="grid grid-cols-1 gap-6 md:grid-cols-2 xl:grid-cols-3">
            {items.map((item) => (
              <figure key={item.design.id} className="min-w-0 space-y-2">
                <figcaption className="font-semibold text-flux-900">{item.design.name}</figcaption>
                <ConfigurationDrawing configuration={item.design.configuration} fallback={<p className="text-flux-600">No drawing for this design.</p>} />
              </figure>
            ))}
          </div>
        </Panel>
      </PanelBoundary>

      <div className="flex flex-wrap gap-2">
        <ButtonLink to={paths.designs.href()}>Back to your designs</ButtonLink>
      </div>
      <Panel title="Before you rely on these figures">
        <Cautions />
      </Panel>
    </div>
  );
}
