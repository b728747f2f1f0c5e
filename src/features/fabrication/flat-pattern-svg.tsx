import type { FlatPatternGeometry } from "../../../shared/fabrication";
import { fromMillimetres, toMillimetres, unitSymbols, type LengthUnit } from "../../../shared/units";
import type { BlankResponse } from "../../api/fabrication";
import { Dimension, fmtMm, niceLength, readableFontSize, ScaleBar } from "../../components/drawing/drawing";
import { useElementWidth } from "../../lib/use-element-width";

/** The drawing's greatest height on screen (Tailwind max-h-[36rem]). */
const MAX_HEIGHT_PX = 576;

function describe(result: BlankResponse): string {
  const b = result.blank;
  if (b.kind === "disc") return `Flat pattern: round blank, diameter ${fmtMm(b.diameter_mm)} mm.`;
  if (b.kind === "cross") {
    return `Flat pattern: cross-shaped blank ${fmtMm(b.length_mm)} by ${fmtMm(b.width_mm)} mm with ${result.geometry.bendLines.length} dashed bend lines and ${result.geometry.reliefs.length} corner reliefs.`;
  }
  const caps = result.method === "rolled" ? result.endCaps : [];
  return `Flat pattern: wall blank ${fmtMm(b.length_mm)} by ${fmtMm(b.width_mm)} mm${caps.length ? ` and ${caps.length} end discs of diameter ${fmtMm(caps[0].diameter_mm)} mm` : ""}.`;
}

function bounds(g: FlatPatternGeometry) {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const [x, y] of g.outline) {
    xs.push(x);
    ys.push(y);
  }
  for (const c of g.circles) {
    xs.push(c.cx - c.diameter / 2, c.cx + c.diameter / 2);
    ys.push(c.cy - c.diameter / 2, c.cy + c.diameter / 2);
  }
  return { minX: Math.min(...xs), maxX: Math.max(...xs), minY: Math.min(...ys), maxY: Math.max(...ys) };
}

/**
 * The flat pattern to scale: the viewBox is in millimetres, so the outline's width in user units is
 * the blank's length in mm. The engine's y axis points up (as in the DXF); the drawing flips it.
 */
export function FlatPatternSvg({ result, unit = "mm" }: { result: BlankResponse; unit?: LengthUnit }) {
  const [ref, width] = useElementWidth<HTMLDivElement>();
  const g = result.geometry;
  const { minX, maxX, minY, maxY } = bounds(g);
  const w = maxX - minX;
  const h = maxY - minY;
  const size = Math.max(w, h);
  const Y = (y: number) => minY + maxY - y; // flip to SVG's downward y, keeping the same range
  const frame = (fs: number) => ({ w: w + 10 * fs, h: h + 14 * fs });
  // label height in mm: the drawing's own choice, grown on a narrow screen until it renders readable
  const fs = readableFontSize(Math.max(size * 0.032, 2.2), { width, maxHeight: MAX_HEIGHT_PX }, frame);
  const pad = fs * 5;
  const bottom = fs * 9; // dimension line and scale bar
  const view = { x: minX - pad, y: minY - pad, w: w + 2 * pad, h: h + pad + bottom };
  const thin = fs * 0.07;
  const L = (mm: number) => (unit === "mm" ? `${fmtMm(mm)} mm` : `${+fromMillimetres(mm, unit).toFixed(3)} ${unitSymbols[unit]}`);

  const outlineXs = g.outline.map((p) => p[0]);
  const outlineYs = g.outline.map((p) => Y(p[1]));
  const hasOutline = g.outline.length >= 3;
  const oMinX = Math.min(...outlineXs), oMaxX = Math.max(...outlineXs);
  const oMinY = Math.min(...outlineYs), oMaxY = Math.max(...outlineYs);
  const barInUnit = niceLength(fromMillimetres(w, unit));
  const bar = toMillimetres(barInUnit, unit);

  return (
    <div ref={ref}>
    <svg
      role="img"
      aria-label={describe(result)}
      viewBox={`${view.x} ${view.y} ${view.w} ${view.h}`}
      className="h-auto max-h-[36rem] w-full text-flux-900"
      data-outline-width-mm={hasOutline ? oMaxX - oMinX : undefined}
      fontFamily="IBM Plex Sans, system-ui, sans-serif"
    >
      <title>{describe(result)}</title>
      {hasOutline && (
        <polygon
          data-role="outline"
          points={g.outline.map(([x, y]) => `${x},${Y(y)}`).join(" ")}
          fill="#efefec"
          stroke="currentColor"
          strokeWidth={fs * 0.12}
          strokeLinejoin="miter"
        />
      )}
      {g.reliefs.map((r, i) => (
        <rect key={`r${i}`} data-role="relief" x={r.x} y={Y(r.y + r.size)} width={r.size} height={r.size} fill="none" stroke="#0e7490" strokeWidth={thin} strokeDasharray={`${fs * 0.25} ${fs * 0.2}`} />
      ))}
      {g.bendLines.map(([[x1, y1], [x2, y2]], i) => (
        <line key={`b${i}`} data-role="bend-line" x1={x1} y1={Y(y1)} x2={x2} y2={Y(y2)} stroke="#b34a0c" strokeWidth={fs * 0.1} strokeDasharray={`${fs * 0.9} ${fs * 0.5}`} />
      ))}
      {g.circles.map((c, i) => {
        const cy = Y(c.cy);
        const r = c.diameter / 2;
        return (
          <g key={`c${i}`}>
            <circle data-role="disc" cx={c.cx} cy={cy} r={r} fill="#efefec" stroke="currentColor" strokeWidth={fs * 0.12} />
            <path d={`M${c.cx - fs} ${cy} h${2 * fs} M${c.cx} ${cy - fs} v${2 * fs}`} stroke="currentColor" strokeWidth={thin} />
            {/* diameter dimension straight through the centre */}
            <line x1={c.cx - r} y1={cy} x2={c.cx + r} y2={cy} stroke="currentColor" strokeWidth={thin} strokeDasharray={`${fs * 0.6} ${fs * 0.3}`} />
            {hasOutline && (
              <text x={c.cx} y={cy - fs * 0.5} fontSize={fs} textAnchor="middle" fill="currentColor">
                Ø {L(c.diameter)}
              </text>
            )}
          </g>
        );
      })}
      {hasOutline && (
        <>
          <Dimension x1={oMinX} y1={oMaxY} x2={oMaxX} y2={oMaxY} offset={fs * 2.2} label={L(oMaxX - oMinX)} fontSize={fs} />
          <Dimension x1={oMinX} y1={oMinY} x2={oMinX} y2={oMaxY} offset={-fs * 2.2} label={L(oMaxY - oMinY)} fontSize={fs} />
        </>
      )}
      {!hasOutline && g.circles[0] && (
        <Dimension x1={minX} y1={maxY} x2={maxX} y2={maxY} offset={fs * 2.2} label={`Ø ${L(g.circles[0].diameter)}`} fontSize={fs} />
      )}
      <ScaleBar x={minX} y={maxY + fs * 5.2} length={bar} fontSize={fs} label={`${+barInUnit.toPrecision(3)} ${unitSymbols[unit]}`} />
    </svg>
    </div>
  );
}

const LINE_KINDS = [
  { key: "edge", label: "Blank edge (cut)", stroke: "#1d2834", width: 2, dash: undefined, present: (g: FlatPatternGeometry) => g.outline.length >= 3 || g.circles.length > 0 },
  { key: "bend", label: "Bend line (centre of the bend)", stroke: "#b34a0c", width: 2, dash: "6 4", present: (g: FlatPatternGeometry) => g.bendLines.length > 0 },
  { key: "relief", label: "Corner relief", stroke: "#0e7490", width: 1.5, dash: "2 2", present: (g: FlatPatternGeometry) => g.reliefs.length > 0 },
] as const;

/** The key to the drawing: only the kinds of line this blank has (a disc has no bend lines). */
export function FlatPatternLegend({ geometry }: { geometry: FlatPatternGeometry }) {
  return (
    <ul className="mt-2 flex flex-wrap gap-x-6 gap-y-1 text-meta text-flux-700" aria-label="Lines on the drawing" data-testid="pattern-key">
      {LINE_KINDS.filter((k) => k.present(geometry)).map((k) => (
        <li key={k.key} className="flex items-center gap-2" data-kind={k.key}>
          <svg width="28" height="8" aria-hidden="true">
            <line x1="0" y1="4" x2="28" y2="4" stroke={k.stroke} strokeWidth={k.width} strokeDasharray={k.dash} />
          </svg>
          {k.label}
        </li>
      ))}
    </ul>
  );
}
