import { useId } from "react";
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis, type TooltipContentProps } from "recharts";
import type { SweepRange } from "../../api/predictions";
import { chartTicks } from "./chart-range";
import { fmt } from "./design-model";

export interface ChartPoint {
  frequency_hz: number;
  attenuation_db: number;
}

export interface ChartSeries {
  name: string;
  points: ChartPoint[];
  /** colour and dash together, so the lines differ in greyscale too */
  colour: string;
  dash?: string;
  /** drawn thin and pale: the seamless shell beside the built figure */
  faint?: boolean;
}

/** The top of the chart: what the built curves need, with room; the ideal may run off it. */
export const CHART_MAX_DB = 300;
/** Tick and label text, CSS pixels: readable on a phone held at arm's length. */
export const CHART_FONT_PX = 13;
const hz = (f: number) => (f >= 1000 ? `${fmt(f / 1000)} kHz` : `${fmt(f)} Hz`);

export const SERIES_STYLE = [
  { colour: "#b34a0c", dash: undefined }, // this design: anneal-600, solid
  { colour: "#384859", dash: "8 4" }, // variant A: flux-700, dashed
  { colour: "#1f7a45", dash: "2 3" }, // variant B: ok-700, dotted
];

/** A line sample as drawn in the legend and the readout: the series' own colour, dash and weight. */
function Swatch({ s }: { s: ChartSeries }) {
  return (
    <svg width="30" height="10" aria-hidden="true" className="shrink-0">
      <line x1="1" y1="5" x2="29" y2="5" stroke={s.colour} strokeWidth={s.faint ? 1.5 : 3} strokeOpacity={s.faint ? 0.55 : 1} strokeDasharray={s.dash} strokeLinecap="butt" />
    </svg>
  );
}

/** The value of each curve at the point under the pointer, as a small readout card of the page's own. */
function Readout({ active, label, payload, series }: TooltipContentProps<number, string> & { series: ChartSeries[] }) {
  if (!active || !payload?.length) return null;
  return (
    <div className="rounded-md border border-flux-300 bg-white/95 px-3 py-2 text-meta text-flux-900 shadow-md">
      <p className="mb-1 font-mono text-flux-700">{hz(Number(label))}</p>
      <ul className="space-y-0.5">
        {payload.map((p) => {
          const s = series.find((x) => x.name === p.name);
          return (
            <li key={String(p.name)} className="flex items-center gap-2">
              {s && <Swatch s={s} />}
              <span className="font-mono tabular">{Number(p.value).toFixed(1)} dB</span>
              <span className="text-flux-600">{p.name}</span>
            </li>
          );
        })}
      </ul>
    </div>
  );
}

/** The figures in words, for anyone who cannot see the curve: each curve at the decades and at the asked frequency. */
export function chartSummary(series: ChartSeries[], frequency: number | null, range: SweepRange): string {
  const at = (points: ChartPoint[], f: number) => {
    let best = points[0];
    for (const p of points) if (Math.abs(Math.log(p.frequency_hz / f)) < Math.abs(Math.log(best.frequency_hz / f))) best = p;
    return best;
  };
  const marks = chartTicks(range);
  const parts = series
    .filter((s) => s.points.length > 0)
    .map((s) => {
      const values = marks.map((f) => `${at(s.points, f).attenuation_db.toFixed(0)} dB at ${hz(f)}`);
      const asked = frequency !== null && frequency > 0 ? `; ${at(s.points, frequency).attenuation_db.toFixed(1)} dB at the asked ${hz(frequency)}` : "";
      return `${s.name}: ${values.join(", ")}${asked}.`;
    });
  return parts.join(" ");
}

/** Attenuation against frequency on a log axis over `range`: the built figure of the design and its kept variants, and the design's ideal, faint. */
export function AttenuationChart({ series, frequency, range }: { series: ChartSeries[]; frequency: number | null; range: SweepRange }) {
  const summaryId = useId();
  const built = series.filter((s) => !s.faint);
  const highest = Math.max(0, ...built.flatMap((s) => s.points.map((p) => p.attenuation_db)));
  const top = Math.min(CHART_MAX_DB, Math.max(40, Math.ceil((highest + 30) / 20) * 20));
  const clipped = series.some((s) => s.faint && s.points.some((p) => p.attenuation_db > top));
  const ticks = chartTicks(range);
  const tick = { fontSize: CHART_FONT_PX, fill: "#384859" };
  return (
    <figure className="space-y-3">
      <ul className="flex flex-wrap gap-x-5 gap-y-1 text-meta text-flux-800" aria-label="Curves on the chart" data-testid="chart-key">
        {series.map((s) => (
          <li key={s.name} className="flex items-center gap-2">
            <Swatch s={s} />
            {s.name}
          </li>
        ))}
      </ul>
      <div
        className="h-72 w-full sm:h-80"
        data-testid="attenuation-chart"
        role="img"
        aria-label={`Attenuation in dB from ${hz(range.from_hz)} to ${hz(range.to_hz)} against frequency on a log scale: ${series.map((s) => s.name).join(", ")}. The figures are written out below the chart.`}
        aria-describedby={summaryId}
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart margin={{ top: 8, right: 12, bottom: 22, left: 0 }}>
            <CartesianGrid stroke="#dfdfda" strokeDasharray="2 4" />
            <XAxis
              dataKey="frequency_hz"
              type="number"
              scale="log"
              domain={[range.from_hz, range.to_hz]}
              ticks={ticks}
              tickFormatter={hz}
              tick={tick}
              allowDataOverflow
              label={{ value: "Frequency (log scale)", position: "insideBottom", offset: -14, fill: "#384859", fontSize: CHART_FONT_PX }}
              stroke="#7690a8"
            />
            <YAxis
              dataKey="attenuation_db"
              type="number"
              domain={[0, top]}
              allowDataOverflow
              tickFormatter={(v: number) => `${v}`}
              tick={tick}
              width={52}
              label={{ value: "Attenuation (dB)", angle: -90, position: "insideLeft", offset: 10, fill: "#384859", fontSize: CHART_FONT_PX }}
              stroke="#7690a8"
            />
            <Tooltip content={(props) => <Readout {...(props as TooltipContentProps<number, string>)} series={series} />} cursor={{ stroke: "#5a6f84", strokeWidth: 1 }} />
            {frequency !== null && frequency >= range.from_hz && frequency <= range.to_hz && (
              <ReferenceLine x={frequency} stroke="#7b7c76" strokeDasharray="3 3" label={{ value: hz(frequency), position: "insideTopRight", fill: "#4f504b", fontSize: CHART_FONT_PX }} />
            )}
            {series.map((s) => (
              <Line
                key={s.name}
                data={s.points}
                dataKey="attenuation_db"
                name={s.name}
                stroke={s.colour}
                strokeDasharray={s.dash}
                strokeWidth={s.faint ? 1.5 : 2.5}
                strokeOpacity={s.faint ? 0.45 : 1}
                dot={false}
                activeDot={{ r: 3.5, strokeWidth: 0, fill: s.colour }}
                isAnimationActive={false}
                type="monotone"
              />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption id={summaryId} className="text-meta text-flux-700" data-testid="chart-summary">
        {chartSummary(series, frequency, range)}
      </figcaption>
      {clipped && <p className="text-meta text-flux-600">The seamless-shell curve leaves the chart above {top} dB: far above what lids, welds and holes let a built shield reach.</p>}
    </figure>
  );
}
