import { useId } from "react";
import type { NestingGroup } from "../../api/fabrication";
import { useElementWidth } from "../../lib/use-element-width";
import { fmtMm, niceLength, readableFontSize, ScaleBar } from "./drawing";

const pct = (x: number) => `${Math.round(x * 100)} %`;

/**
 * The first stock sheet as the shop marks it out: the offcut hatched, each blank left clear with
 * its outline and its number (the key under the picture says which part each number is). The
 * engine places x across the sheet width and y along its length; drawn here with the length
 * across the page, so a long sheet fits the screen.
 */
export function NestingSvg({ group }: { group: NestingGroup }) {
  const hatchId = useId();
  const [ref, width] = useElementWidth<HTMLDivElement>();
  if (!group.sheet) return null;
  const L = group.sheet.length_mm;
  const W = group.sheet.width_mm;
  const frame = (f: number) => ({ w: L + 3 * f, h: W + f * 6.5 });
  const fs = readableFontSize(Math.max(L, W) * 0.022, { width }, frame);
  const pad = fs * 1.5;
  const bar = niceLength(L);
  // one number per kind of blank ("L1 cup", "L2 lid"): in the picture where it fits, in the key always
  const kinds = [...new Set(group.placements.map((p) => p.label))];
  const numberOf = (label: string) => kinds.indexOf(label) + 1;
  const used = group.utilisation;
  const label = `Stock sheet ${fmtMm(L)} × ${fmtMm(W)} mm of ${group.materialId} ${fmtMm(group.thickness_mm)} mm with ${group.partsPerSheet} blanks marked out; ${group.sheets} sheet${group.sheets === 1 ? "" : "s"} in all; blanks use ${pct(used)} of the sheet, the rest is offcut.`;
  return (
    <figure className="space-y-2" ref={ref}>
      <svg role="img" aria-label={label} viewBox={`${-pad} ${-pad} ${L + 2 * pad} ${W + pad + fs * 5}`} className="h-auto w-full text-flux-900" fontFamily="IBM Plex Sans, system-ui, sans-serif" data-testid="nesting-picture">
        <defs>
          <pattern id={hatchId} patternUnits="userSpaceOnUse" width={fs * 0.9} height={fs * 0.9} patternTransform="rotate(45)">
            <line x1="0" y1="0" x2="0" y2={fs * 0.9} stroke="#9fb2c4" strokeWidth={fs * 0.12} />
          </pattern>
        </defs>
        <rect data-role="sheet" x={0} y={0} width={L} height={W} fill={`url(#${hatchId})`} stroke="#384859" strokeWidth={fs * 0.12} />
        {group.placements.map((p, i) => {
          const n = numberOf(p.label);
          const big = Math.min(p.w, p.h) > fs * 2.2;
          const cx = p.y + p.h / 2, cy = p.x + p.w / 2;
          return (
            <g key={i} data-role="placed-blank" data-kind={p.kind}>
              <title>{`${p.label}${p.rotated ? " (turned 90°)" : ""}`}</title>
              {p.kind === "disc" ? (
                <circle cx={cx} cy={cy} r={p.w / 2} fill="#ffffff" stroke="#1d2834" strokeWidth={fs * 0.08} />
              ) : (
                <rect x={p.y} y={p.x} width={p.h} height={p.w} fill="#ffffff" stroke="#1d2834" strokeWidth={fs * 0.08} />
              )}
              {big && (
                <text x={cx} y={cy + fs * 0.35} fontSize={fs} textAnchor="middle" fill="#384859">
                  {n}
                </text>
              )}
            </g>
          );
        })}
        <ScaleBar x={0} y={W + fs * 1.2} length={bar} fontSize={fs} />
      </svg>
      <figcaption className="space-y-2 text-meta text-flux-800">
        <ul className="flex flex-wrap gap-x-4 gap-y-1" aria-label="Blanks on the sheet">
          {kinds.map((k) => (
            <li key={k}>
              <span className="mr-1 inline-grid size-5 place-items-center rounded-full border border-flux-700 font-mono text-[0.8125rem] leading-none">{numberOf(k)}</span>
              {k}
            </li>
          ))}
        </ul>
        <dl className="grid grid-cols-2 gap-x-6 gap-y-1 sm:grid-cols-4" data-testid="nesting-figures">
          <div>
            <dt className="text-flux-600">Sheet</dt>
            <dd className="font-mono">
              {fmtMm(L)} × {fmtMm(W)} mm
            </dd>
          </div>
          <div>
            <dt className="text-flux-600">Blanks marked out</dt>
            <dd className="font-mono">{group.partsPerSheet} on this sheet</dd>
          </div>
          <div>
            <dt className="text-flux-600">Sheets for the order</dt>
            <dd className="font-mono">
              {group.sheets}
              {group.sheetsEstimated ? " (estimated)" : ""}
            </dd>
          </div>
          <div>
            <dt className="text-flux-600">In blanks · offcut</dt>
            <dd className="font-mono">
              {pct(used)} · {pct(1 - used)}
            </dd>
          </div>
        </dl>
      </figcaption>
    </figure>
  );
}
