import { useId } from "react";
import { CartesianGrid, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import type { LotPoint } from "../../../shared/calibration";
import { db } from "./words";

const FONT = 13;
const tick = { fontSize: FONT, fill: "#384859" };

/**
 * Each lot's mean measured attenuation against its prediction: with the library's values (before)
 * and with the shop's fit made without that lot (after, cross-validated). On the diagonal a
 * prediction is exact; lots left out as outliers are drawn hollow.
 */
export function FitScatter({ points, title }: { points: LotPoint[]; title: string }) {
  const summaryId = useId();
  const all = points.flatMap((p) => [p.measured_db, p.library_db, p.crossValidated_db]);
  const lo = Math.floor(Math.min(...all) / 10) * 10, hi = Math.ceil(Math.max(...all) / 10) * 10;
  const before = points.map((p) => ({ x: p.measured_db, y: p.library_db, lot: p.number, out: p.leftOut }));
  const after = points.map((p) => ({ x: p.measured_db, y: p.crossValidated_db, lot: p.number, out: p.leftOut }));
  const spread = (key: "library_db" | "crossValidated_db") => {
    const e = points.filter((p) => !p.leftOut).map((p) => Math.abs(p.measured_db - p[key])).sort((a, b) => a - b);
    return e.length ? e[Math.floor(e.length / 2)] : 0;
  };
  return (
    <figure className="space-y-2">
      <ul className="flex flex-wrap gap-x-5 gap-y-1 text-meta text-flux-800" aria-label="Points on the chart">
        <li className="flex items-center gap-2"><svg width="14" height="14" aria-hidden="true"><rect x="2" y="2" width="10" height="10" fill="#7b7c76" /></svg>Before: the library's values</li>
        <li className="flex items-center gap-2"><svg width="14" height="14" aria-hidden="true"><circle cx="7" cy="7" r="5" fill="#b34a0c" /></svg>After: the shop's fit, each lot predicted without it</li>
        <li className="flex items-center gap-2"><svg width="14" height="14" aria-hidden="true"><circle cx="7" cy="7" r="4.5" fill="none" stroke="#b34a0c" strokeWidth="1.5" /></svg>Left out as an outlier</li>
      </ul>
      <div className="h-72 w-full" role="img" aria-label={`${title}: predicted against measured attenuation per lot, before and after calibration.`} aria-describedby={summaryId} data-testid="fit-scatter">
        <ResponsiveContainer width="100%" height="100%">
          <ScatterChart margin={{ top: 8, right: 12, bottom: 22, left: 0 }}>
            <CartesianGrid stroke="#dfdfda" strokeDasharray="2 4" />
            <XAxis type="number" dataKey="x" domain={[lo, hi]} tick={tick} stroke="#7690a8" label={{ value: "Measured (dB)", position: "insideBottom", offset: -14, fill: "#384859", fontSize: FONT }} />
            <YAxis type="number" dataKey="y" domain={[lo, hi]} tick={tick} width={52} stroke="#7690a8" label={{ value: "Predicted (dB)", angle: -90, position: "insideLeft", offset: 10, fill: "#384859", fontSize: FONT }} />
            <ReferenceLine segment={[{ x: lo, y: lo }, { x: hi, y: hi }]} stroke="#5a6f84" strokeDasharray="4 4" />
            <Tooltip cursor={false} formatter={(v) => db(Number(v))} />
            <Scatter name="Before (library)" data={before} fill="#7b7c76" shape="square" isAnimationActive={false} />
            <Scatter
              name="After (cross-validated)"
              data={after}
              isAnimationActive={false}
              shape={(props: { cx?: number; cy?: number; payload?: { out: string | null } }) => (
                <circle cx={props.cx} cy={props.cy} r={4.5} fill={props.payload?.out ? "none" : "#b34a0c"} stroke="#b34a0c" strokeWidth={1.5} />
              )}
            />
          </ScatterChart>
        </ResponsiveContainer>
      </div>
      <figcaption id={summaryId} className="text-meta text-flux-700">
        {points.length} lots. Typical miss (median, outliers aside): {db(spread("library_db"))} with the library's values, {db(spread("crossValidated_db"))} with the shop's fit on lots it had not seen.
      </figcaption>
    </figure>
  );
}
