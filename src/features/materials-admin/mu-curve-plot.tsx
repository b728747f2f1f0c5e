import type { MuPoint } from "../../../shared/physics/materials";
import { useElementWidth } from "../../lib/use-element-width";
import { grouped } from "./change-words";

/** Decades that cover the values, for log axes. */
function decades(lo: number, hi: number): number[] {
  const out: number[] = [];
  for (let k = Math.floor(Math.log10(lo) + 1e-9); 10 ** k <= hi * (1 + 1e-9); k++) out.push(10 ** k);
  return out;
}

const tesla = (B: number) => (B >= 1 ? `${grouped(B)} T` : B >= 1e-3 ? `${grouped(B * 1000)} mT` : `${grouped(B * 1e6)} µT`);

/** The μ(B) curve in words, for the picture's name: "μr 60 000 at 1 mT rising to 250 000 at 0.3 T, falling to 1 000 at 0.8 T". */
export function muCurveSummary(curve: readonly MuPoint[]): string {
  const points = curve.filter((p) => p.B_T > 0 && p.mu_r > 0);
  if (points.length === 0) return "no points";
  const first = points[0], last = points[points.length - 1];
  const peak = points.reduce((a, p) => (p.mu_r > a.mu_r ? p : a));
  const parts = [`μr ${grouped(first.mu_r, 3)} at ${tesla(first.B_T)}`];
  if (peak !== first && peak !== last) parts.push(`rising to ${grouped(peak.mu_r, 3)} at ${tesla(peak.B_T)}`);
  if (last !== first) parts.push(`${last.mu_r < (peak === last ? first : peak).mu_r ? "falling" : "rising"} to ${grouped(last.mu_r, 3)} at ${tesla(last.B_T)}`);
  return parts.join(", ");
}

/**
 * μr against flux density on log–log axes, points joined as the engine interpolates them (on log
 * scales). `small`: a thumbnail for a table row, without axes' labels. Drawn in CSS pixels, so
 * its text stays readable at any screen width.
 */
export function MuCurvePlot({ curve, small = false, name }: { curve: readonly MuPoint[]; small?: boolean; name: string }) {
  const [ref, width] = useElementWidth<HTMLDivElement>();
  const points = curve.filter((p) => p.B_T > 0 && p.mu_r > 0);
  // the full plot is drawn at its rendered width (user units = CSS pixels), so its 12 px text is 12 px
  const W = small ? 112 : Math.max(240, Math.min(520, Math.round(width) || 420)), H = small ? 40 : 220;
  const m = small ? { l: 2, r: 2, t: 4, b: 4 } : { l: 62, r: 12, t: 10, b: 40 };
  const label = `μ(B) curve of ${name}: ${muCurveSummary(points)}.`;
  if (points.length === 0) return <span className="text-meta text-flux-600">no points</span>;
  if (!small && width === 0) return <div ref={ref} className="h-[220px] w-full max-w-[520px]" />;
  const Bs = points.map((p) => p.B_T), mus = points.map((p) => p.mu_r);
  const bLo = Math.min(...Bs) / 1.5, bHi = Math.max(...Bs) * 1.5;
  const mLo = Math.max(1, Math.min(...mus) / 1.5), mHi = Math.max(...mus) * 1.5;
  const x = (B: number) => m.l + ((Math.log10(B) - Math.log10(bLo)) / (Math.log10(bHi) - Math.log10(bLo))) * (W - m.l - m.r);
  const y = (mu: number) => H - m.b - ((Math.log10(mu) - Math.log10(mLo)) / (Math.log10(mHi) - Math.log10(mLo) || 1)) * (H - m.t - m.b);
  const path = points.map((p, i) => `${i ? "L" : "M"}${x(p.B_T).toFixed(1)} ${y(p.mu_r).toFixed(1)}`).join(" ");
  const bTicks = decades(bLo, bHi).filter((t) => t >= bLo && t <= bHi);
  const mTicks = decades(mLo, mHi).filter((t) => t >= mLo && t <= mHi);
  const svg = (
    <svg role="img" aria-label={label} viewBox={`0 0 ${W} ${H}`} width={W} height={H} className={small ? "inline-block align-middle" : "block"} data-testid={small ? "mu-thumbnail" : "mu-plot"}>
      {!small && (
        <>
          {bTicks.map((t) => (
            <g key={`b${t}`}>
              <line x1={x(t)} y1={m.t} x2={x(t)} y2={H - m.b} stroke="#dfdfda" />
              <text x={x(t)} y={H - m.b + 16} fontSize={12} textAnchor="middle" fill="#384859">
                {tesla(t)}
              </text>
            </g>
          ))}
          {mTicks.map((t) => (
            <g key={`m${t}`}>
              <line x1={m.l} y1={y(t)} x2={W - m.r} y2={y(t)} stroke="#dfdfda" />
              <text x={m.l - 6} y={y(t) + 4} fontSize={12} textAnchor="end" fill="#384859">
                {grouped(t)}
              </text>
            </g>
          ))}
          <rect x={m.l} y={m.t} width={W - m.l - m.r} height={H - m.t - m.b} fill="none" stroke="#7690a8" />
          <text x={(W + m.l) / 2} y={H - 6} fontSize={12} textAnchor="middle" fill="#384859">
            Flux density B (log)
          </text>
          <text x={14} y={(H - m.b) / 2} fontSize={12} textAnchor="middle" fill="#384859" transform={`rotate(-90 14 ${(H - m.b) / 2})`}>
            μr (log)
          </text>
        </>
      )}
      <path d={path} fill="none" stroke="#b34a0c" strokeWidth={small ? 1.75 : 2.25} strokeLinejoin="round" />
      {points.map((p, i) => (
        <circle key={i} cx={x(p.B_T)} cy={y(p.mu_r)} r={small ? 1.6 : 3.2} fill="#1d2834" />
      ))}
    </svg>
  );
  return small ? svg : (
    <div ref={ref} className="w-full max-w-[520px] overflow-hidden">
      {svg}
    </div>
  );
}
