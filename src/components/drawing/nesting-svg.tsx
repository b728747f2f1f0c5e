import type { NestingGroup } from "../../api/fabrication";
import { fmtMm, niceLength, ScaleBar } from "./drawing";

const pct = (x: number) => `${(x * 100).toFixed(1)} %`;

/**
 * The first stock sheet with its blanks. The engine places x across the sheet width and y along
 * its length; drawn here with the length across the page, so a long sheet fits the screen.
 */
export function NestingSvg({ group }: { group: NestingGroup }) {
  if (!group.sheet) return null;
  const L = group.sheet.length_mm;
  const W = group.sheet.width_mm;
  const fs = Math.max(L, W) * 0.022;
  const pad = fs * 1.5;
  const bar = niceLength(L);
  const label = `Stock sheet ${fmtMm(L)} × ${fmtMm(W)} mm, ${group.materialId} ${fmtMm(group.thickness_mm)} mm: ${group.partsPerSheet} blanks on the first sheet, ${group.sheets} sheet${group.sheets === 1 ? "" : "s"} in all, material utilisation ${pct(group.utilisation)}.`;
  return (
    <figure className="space-y-2">
      <svg role="img" aria-label={label} viewBox={`${-pad} ${-pad} ${L + 2 * pad} ${W + pad + fs * 5}`} className="h-auto w-full text-flux-900" fontFamily="IBM Plex Sans, system-ui, sans-serif">
        <title>{label}</title>
        <rect data-role="sheet" x={0} y={0} width={L} height={W} fill="#f7f7f5" stroke="currentColor" strokeWidth={fs * 0.1} />
        {group.placements.map((p, i) =>
          p.kind === "disc" ? (
            <circle key={i} data-role="placed-blank" cx={p.y + p.h / 2} cy={p.x + p.w / 2} r={p.w / 2} fill="#fdcba0" stroke="#923b0c" strokeWidth={fs * 0.06}>
              <title>{p.label}</title>
            </circle>
          ) : (
            <rect key={i} data-role="placed-blank" x={p.y} y={p.x} width={p.h} height={p.w} fill="#fdcba0" stroke="#923b0c" strokeWidth={fs * 0.06}>
              <title>{`${p.label}${p.rotated ? " (turned 90°)" : ""}`}</title>
            </rect>
          ),
        )}
        <ScaleBar x={0} y={W + fs * 1.2} length={bar} fontSize={fs} />
      </svg>
      <figcaption className="text-meta text-flux-700">
        {fmtMm(L)} × {fmtMm(W)} mm sheet · {group.partsPerSheet} blanks per sheet · {group.sheets}
        {group.sheetsEstimated ? " (estimated)" : ""} sheet{group.sheets === 1 ? "" : "s"} · utilisation <strong>{pct(group.utilisation)}</strong> · scrap {pct(group.scrapFraction)}
      </figcaption>
    </figure>
  );
}
