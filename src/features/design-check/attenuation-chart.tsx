import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { SweepPoint } from "../../api/predictions";
import { fmt } from "./design-model";

export interface ChartSeries {
  name: string;
  points: SweepPoint[];
  /** colour and dash together, so the lines differ in greyscale too */
  colour: string;
  dash?: string;
}

const TICKS = [1, 10, 100, 1000, 10_000];
/** Past this the walls no longer decide: seams, lids and holes do. The curve is clipped there. */
export const CHART_MAX_DB = 200;
const hz = (f: number) => (f >= 1000 ? `${fmt(f / 1000)} kHz` : `${fmt(f)} Hz`);

export const SERIES_STYLE = [
  { colour: "#b34a0c", dash: undefined }, // this design: anneal-600, solid
  { colour: "#384859", dash: "8 4" }, // variant A: flux-700, dashed
  { colour: "#1f7a45", dash: "2 3" }, // variant B: ok-700, dotted
];

/** Attenuation against frequency, 1 Hz to 10 kHz on a log axis, for the design and its kept variants. */
export function AttenuationChart({ series, frequency }: { series: ChartSeries[]; frequency: number | null }) {
  const highest = Math.max(0, ...series.flatMap((s) => s.points.map((p) => p.attenuation_db)));
  const top = Math.min(CHART_MAX_DB, Math.max(20, Math.ceil(highest / 20) * 20));
  return (
    <>
    <div className="h-80 w-full" data-testid="attenuation-chart" role="img" aria-label={`Attenuation in dB from 1 Hz to 10 kHz for ${series.map((s) => s.name).join(", ")}`}>
      <ResponsiveContainer width="100%" height="100%">
        <LineChart margin={{ top: 8, right: 16, bottom: 20, left: 4 }}>
          <CartesianGrid stroke="#dfdfda" />
          <XAxis
            dataKey="frequency_hz"
            type="number"
            scale="log"
            domain={[1, 10_000]}
            ticks={TICKS}
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
          <Tooltip
            labelFormatter={(f) => hz(Number(f))}
            formatter={(v) => [`${Number(v).toFixed(1)} dB`]}
          />
          <Legend verticalAlign="top" height={32} />
          {frequency !== null && frequency >= 1 && frequency <= 10_000 && (
            <ReferenceLine x={frequency} stroke="#7b7c76" strokeDasharray="3 3" label={{ value: hz(frequency), position: "insideTopRight", fill: "#4f504b", fontSize: 12 }} />
          )}
          {series.map((s) => (
            <Line key={s.name} data={s.points} dataKey="attenuation_db" name={s.name} stroke={s.colour} strokeDasharray={s.dash} strokeWidth={2.5} dot={false} isAnimationActive={false} type="monotone" />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </div>
    {highest > CHART_MAX_DB && (
      <p className="text-meta text-flux-600">The curve is cut off at {CHART_MAX_DB} dB: far above what seams, lids and holes let a real shield reach.</p>
    )}
    </>
  );
}
