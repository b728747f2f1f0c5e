import { useId } from "react";
import { CartesianGrid, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZAxis, type TooltipContentProps } from "recharts";
import type { DesignCandidateJson } from "../../../shared/schemas/design-advice";
import { adviceSummary, dbText, kgText, moneyText } from "./advice-words";

/** Tick and label text, CSS pixels: readable on a phone held at arm's length. */
const FONT_PX = 13;

interface Point {
  attenuation_db: number;
  price: number;
  index: number;
}

/** Each group differs in shape as well as colour, so the chart reads in greyscale too. */
export const POINT_STYLE = {
  other: { name: "Meets it, off the front", colour: "#7690a8", shape: "circle" as const },
  front: { name: "On the front", colour: "#b34a0c", shape: "diamond" as const },
  recommended: { name: "Recommended", colour: "#1f7a45", shape: "star" as const },
};
type Group = keyof typeof POINT_STYLE;

function Mark({ group }: { group: Group }) {
  const s = POINT_STYLE[group];
  return (
    <svg width="16" height="16" viewBox="-8 -8 16 16" aria-hidden="true" className="shrink-0">
      {s.shape === "circle" && <circle r="4.5" fill={s.colour} fillOpacity={0.55} stroke={s.colour} />}
      {s.shape === "diamond" && <path d="M0 -6L6 0 0 6 -6 0Z" fill={s.colour} />}
      {s.shape === "star" && <path d="M0 -7.5L2 -2.4 7.2 -2.3 3.1 1 4.6 6.2 0 3.2 -4.6 6.2 -3.1 1 -7.2 -2.3 -2 -2.4Z" fill={s.colour} />}
    </svg>
  );
}

function Readout({ active, payload, candidates }: TooltipContentProps<number, string> & { candidates: DesignCandidateJson[] }) {
  if (!active || !payload?.length) return null;
  const point = payload[0].payload as Point;
  const c = candidates[point.index];
  if (!c) return null;
  return (
    <div className="max-w-72 rounded-md border border-flux-300 bg-white/95 px-3 py-2 text-meta text-flux-900 shadow-md">
      <p className="font-semibold">{c.summary}</p>
      <p className="font-mono tabular">
        {moneyText(c.unitPrice_cents, c.currency)} each · {dbText(c.attenuation_db)} (likely {c.band.low_db.toFixed(0)}–{c.band.high_db.toFixed(0)} dB) · {kgText(c.mass_kg)}
      </p>
    </div>
  );
}

/**
 * Unit price against the as-built attenuation: every candidate listed, the front marked, the
 * recommendation starred, and a line at the attenuation asked. The figures are written out
 * beside it (the summary here, the tables under it) for anyone who cannot see the chart.
 */
export function AdviceChart({ candidates, recommended, required_db, evaluated, currency }: { candidates: DesignCandidateJson[]; recommended: number | null; required_db: number; evaluated: number; currency: string }) {
  const summaryId = useId();
  const groups: Record<Group, Point[]> = { other: [], front: [], recommended: [] };
  candidates.forEach((c, index) => {
    const group: Group = index === recommended ? "recommended" : c.front ? "front" : "other";
    groups[group].push({ attenuation_db: c.attenuation_db, price: c.unitPrice_cents / 100, index });
  });
  const tick = { fontSize: FONT_PX, fill: "#384859" };
  const lowest = Math.min(required_db, ...candidates.map((c) => c.attenuation_db));
  const highest = Math.max(...candidates.map((c) => c.attenuation_db));
  const order: Group[] = ["other", "front", "recommended"];
  // whole tens at an even step, so the last tick is not squeezed against the one before
  const from = Math.floor((lowest - 5) / 10) * 10;
  const step = Math.ceil((highest + 5 - from) / 60) * 10;
  const ticks = Array.from({ length: Math.ceil((highest + 5 - from) / step) + 1 }, (_, i) => from + i * step);
  return (
    <figure className="space-y-3" data-testid="advice-chart-figure">
      <ul className="flex flex-wrap gap-x-5 gap-y-1 text-meta text-flux-800" aria-label="Marks on the chart">
        {order.map((g) => (
          <li key={g} className="flex items-center gap-2">
            <Mark group={g} />
            {POINT_STYLE[g].name}
          </li>
        ))}
        <li className="flex items-center gap-2">
          <svg width="16" height="16" aria-hidden="true" className="shrink-0">
            <line x1="8" y1="0" x2="8" y2="16" stroke="#4f504b" strokeWidth="1.5" strokeDasharray="3 2" />
          </svg>
          Attenuation asked
        </li>
      </ul>
      <div
        className="h-72 w-full sm:h-96"
        data-testid="advice-chart"
        role="img"
        aria-label={`Unit price in ${currency} against attenuation as built in dB for ${candidates.length} designs that meet the requirement. The figures are written out below the chart and in the tables.`}
        aria-describedby={summaryId}
      >
        <ResponsiveContainer width="100%" height="100%">
          <ScatterChart margin={{ top: 10, right: 14, bottom: 22, left: 6 }}>
            <CartesianGrid stroke="#dfdfda" strokeDasharray="2 4" />
            <XAxis
              dataKey="attenuation_db"
              type="number"
              name="Attenuation"
              domain={[from, ticks[ticks.length - 1]]}
              ticks={ticks}
              tick={tick}
              tickFormatter={(v: number) => `${v}`}
              label={{ value: "Attenuation as built (dB)", position: "insideBottom", offset: -14, fill: "#384859", fontSize: FONT_PX }}
              stroke="#7690a8"
            />
            <YAxis
              dataKey="price"
              type="number"
              name="Unit price"
              domain={[0, "auto"]}
              tick={tick}
              width={64}
              tickFormatter={(v: number) => `${v}`}
              label={{ value: `Unit price (${currency})`, angle: -90, position: "insideLeft", offset: 4, fill: "#384859", fontSize: FONT_PX, style: { textAnchor: "middle" } }}
              stroke="#7690a8"
            />
            <ZAxis range={[60, 60]} />
            <ZAxis zAxisId="star" range={[220, 220]} />
            <Tooltip content={(props) => <Readout {...(props as TooltipContentProps<number, string>)} candidates={candidates} />} cursor={{ stroke: "#5a6f84", strokeDasharray: "3 3" }} />
            <ReferenceLine x={required_db} stroke="#4f504b" strokeDasharray="3 2" strokeWidth={1.5} />
            {order.map((g) => (
              <Scatter
                key={g}
                name={POINT_STYLE[g].name}
                data={groups[g]}
                fill={POINT_STYLE[g].colour}
                fillOpacity={g === "other" ? 0.55 : 1}
                shape={POINT_STYLE[g].shape}
                isAnimationActive={false}
                {...(g === "recommended" ? { zAxisId: "star" } : {})}
              />
            ))}
          </ScatterChart>
        </ResponsiveContainer>
      </div>
      <figcaption id={summaryId} className="text-meta text-flux-700" data-testid="advice-chart-summary">
        {adviceSummary(candidates, recommended, required_db, evaluated)}
      </figcaption>
    </figure>
  );
}
