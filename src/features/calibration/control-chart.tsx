import { useId } from "react";
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { IndividualsChart } from "../../../shared/calibration";
import { day, db, ruleName } from "./words";

const FONT = 13;
const tick = { fontSize: FONT, fill: "#384859" };

type Limits = { center_db: number; ucl_db: number; lcl_db: number };

/** One of the pair: each lot in the order decided, the centre line and the limits; flagged lots drawn as red diamonds. */
function SeriesChart({ chart, which, name }: { chart: IndividualsChart; which: "individuals" | "moving-range"; name: string }) {
  const limits: Limits | null = which === "individuals" ? chart.individuals : chart.movingRange;
  const data = chart.points
    .map((p, i) => ({ i: i + 1, lot: p.number, decided: day(p.decidedAt), value: which === "individuals" ? p.margin_db : p.movingRange_db, flagged: p.signals.some((s) => (which === "individuals" ? s !== "moving-range" : s === "moving-range")) }))
    .filter((d) => d.value !== null) as { i: number; lot: string; decided: string; value: number; flagged: boolean }[];
  const values = data.map((d) => d.value).concat(limits ? [limits.ucl_db, limits.lcl_db] : []);
  const lo = Math.floor(Math.min(0, ...values) - 1), hi = Math.ceil(Math.max(...values) + 1);
  return (
    <div className="h-56 w-full" role="img" aria-label={`${name}${limits ? `: centre ${db(limits.center_db)}, limits ${db(limits.lcl_db)} to ${db(limits.ucl_db)}` : ""}; ${data.filter((d) => d.flagged).length} lots flagged.`}>
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={data} margin={{ top: 10, right: 48, bottom: 22, left: 0 }}>
          <CartesianGrid stroke="#dfdfda" strokeDasharray="2 4" />
          <XAxis dataKey="i" type="number" domain={[1, Math.max(2, data.length + (which === "individuals" ? 0 : 1))]} tick={tick} stroke="#7690a8" allowDecimals={false} label={{ value: "Lot, in the order decided", position: "insideBottom", offset: -14, fill: "#384859", fontSize: FONT }} />
          <YAxis domain={[lo, hi]} tick={tick} width={52} stroke="#7690a8" label={{ value: which === "individuals" ? "Margin (dB)" : "Range (dB)", angle: -90, position: "insideLeft", offset: 10, fill: "#384859", fontSize: FONT }} />
          {limits && (
            <>
              <ReferenceLine y={limits.center_db} stroke="#1f7a45" label={{ value: "CL", position: "right", fill: "#1f7a45", fontSize: FONT }} />
              <ReferenceLine y={limits.ucl_db} stroke="#a32020" strokeDasharray="6 3" label={{ value: "UCL", position: "right", fill: "#a32020", fontSize: FONT }} />
              {(which === "individuals" || limits.lcl_db > 0) && <ReferenceLine y={limits.lcl_db} stroke="#a32020" strokeDasharray="6 3" label={{ value: "LCL", position: "right", fill: "#a32020", fontSize: FONT }} />}
            </>
          )}
          {which === "individuals" && <ReferenceLine y={0} stroke="#384859" strokeWidth={1.5} label={{ value: "required", position: "insideBottomLeft", fill: "#384859", fontSize: FONT }} />}
          <Tooltip formatter={(v) => db(Number(v))} labelFormatter={(_l, p) => (p?.[0] ? `Lot ${(p[0].payload as { lot: string }).lot}, ${(p[0].payload as { decided: string }).decided}` : "")} />
          <Line
            dataKey="value"
            name={which === "individuals" ? "Margin" : "Moving range"}
            stroke="#384859"
            strokeWidth={1.5}
            isAnimationActive={false}
            dot={(props: { cx?: number; cy?: number; index?: number; payload?: { flagged: boolean } }) =>
              props.payload?.flagged ? (
                <path key={props.index} d={`M${props.cx} ${(props.cy ?? 0) - 6} l6 6 l-6 6 l-6 -6 z`} fill="#a32020" />
              ) : (
                <circle key={props.index} cx={props.cx} cy={props.cy} r={3.5} fill="#384859" />
              )
            }
          />
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}

/** The individuals and moving-range pair with the signals in words. */
export function ControlChartPair({ chart, title }: { chart: IndividualsChart; title: string }) {
  const listId = useId();
  return (
    <div className="space-y-3">
      <SeriesChart chart={chart} which="individuals" name={`Individuals chart of ${title}`} />
      <SeriesChart chart={chart} which="moving-range" name={`Moving-range chart of ${title}`} />
      <div>
        <h4 id={listId} className="text-body font-semibold">Signals</h4>
        {chart.signals.length === 0 ? (
          <p className="text-meta text-flux-700">None: no lot beyond the limits and no run rule met.</p>
        ) : (
          <ul aria-labelledby={listId} className="list-disc space-y-1 pl-5 text-meta text-flux-800" data-testid="chart-signals">
            {chart.signals.map((s, i) => {
              const lots = s.lotIds.map((id) => chart.points.find((p) => p.lotId === id)?.number ?? id);
              return (
                <li key={i}>
                  <span className="font-semibold">{ruleName(s.rule)}</span> ({s.chart === "individuals" ? "individuals" : "moving range"}): lot{lots.length > 1 ? "s" : ""} {lots.length > 3 ? `${lots[0]} to ${lots[lots.length - 1]}` : lots.join(", ")}
                </li>
              );
            })}
          </ul>
        )}
      </div>
    </div>
  );
}
