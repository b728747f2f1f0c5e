import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
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
const hz = (f: number) => (f >= 1000 ? `${fmt(f / 1000)} kHz` : `${fmt(f)} Hz`);

export const SERIES_STYLE = [
  { colour: "#b34a0c", dash: undefined }, // this design: anneal-600, solid
  { colour: "#384859", dash: "8 4" }, // variant A: flux-700, dashed
  { colour: "#1f7a45", dash: "2 3" }, // variant B: ok-700, dotted
];

/** Attenuation against frequency on a log axis over `range`: the built figure of the design and its kept variants, and the design's ideal, faint. */
export function AttenuationChart({ series, frequency, range }: { series: ChartSeries[]; frequency: number | null; range: SweepRange }) {
  const built = series.filter((s) => !s.faint);
  const highest = Math.max(0, ...built.flatMap((s) => s.points.map((p) => p.attenuation_db)));
  const top = Math.min(CHART_MAX_DB, Math.max(40, Math.ceil((highest + 30) / 20) * 20));
  const clipped = series.some((s) => s.faint && s.points.some((p) => p.attenuation_db > top));
  const ticks = chartTicks(range);
  return (
    <>
      <div
        className="h-80 w-full"
        data-testid="attenuation-chart"
        role="img"
        aria-label={`Attenuation in dB from ${hz(range.from_hz)} to ${hz(range.to_hz)} for ${series.map((s) => s.name).join(", ")}`}
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart margin={{ top: 8, right: 16, bottom: 20, left: 4 }}>
            <CartesianGrid stroke="#dfdfda" />
            <XAxis
              dataKey="frequency_hz"
              type="number"
              scale="log"
              domain={[range.from_hz, range.to_hz]}
              ticks={ticks}
              tickFormatter={hz}
              allowDataOverflow
              label={{ value: "Frequency (log scale)", position: "insideBottom", offset: -12, fill: "#475a6e" }}
              stroke="#475a6e"
            />
            <YAxis
              dataKey="attenuation_db"
              type="number"
              domain={[0, top]}
              allowDataOverflow
              tickFormatter={(v: number) => `${v}`}
              width={56}
              label={{ value: "Attenuation (dB)", angle: -90, position: "insideLeft", offset: 8, fill: "#475a6e" }}
              stroke="#475a6e"
            />
            <Tooltip labelFormatter={(f) => hz(Number(f))} formatter={(v, name) => [`${Number(v).toFixed(1)} dB`, name]} />
            <Legend verticalAlign="top" height={32} />
            {frequency !== null && frequency >= range.from_hz && frequency <= range.to_hz && (
              <ReferenceLine x={frequency} stroke="#7b7c76" strokeDasharray="3 3" label={{ value: hz(frequency), position: "insideTopRight", fill: "#4f504b", fontSize: 12 }} />
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
                isAnimationActive={false}
                type="monotone"
              />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
      {clipped && (
        <p className="text-meta text-flux-600">The seamless-shell curve leaves the chart above {top} dB: far above what lids, welds and holes let a built shield reach.</p>
      )}
    </>
  );
}
