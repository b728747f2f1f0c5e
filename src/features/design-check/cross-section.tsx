import type { PredictionRequest } from "../../../shared/schemas/prediction";
import { fromMillimetres, toMillimetres, unitSymbols } from "../../../shared/units";
import type { MaterialSummary } from "../../api/materials";
import { MIN_LABEL_PX, niceLength, readableFontSize, ScaleBar } from "../../components/drawing/drawing";
import { useElementWidth } from "../../lib/use-element-width";
import { fmt, lengthText, sizeText, type DesignLengthUnit } from "./design-model";

/** Narrower than this (CSS px), the layer labels leave the drawing for a list under it, and the drawing keeps their numbers. */
const LABELS_BELOW_PX = 520;
/** The drawing's greatest height on screen (Tailwind max-h-[26rem]). */
const MAX_HEIGHT_PX = 416;

// The layers drawn to scale: the SVG's user unit is the millimetre, so the rings' radii and the
// scale bar are the design's own lengths. Cylinder: the section across the axis; sphere: through
// the centre; box: the width × depth section.

interface Ring {
  index: number;
  /** half-sizes of the inside (x, y); equal for round shapes */
  inner: [number, number];
  t: number;
  gap: number;
  label: string;
  fill: string;
}

const FILL = { magnetic: "#384859", conductor: "#f9a867", custom: "#7b7c76" };

function roundedRect(hx: number, hy: number, r: number): string {
  const rr = Math.min(r, hx, hy);
  return `M${-hx + rr} ${-hy}H${hx - rr}A${rr} ${rr} 0 0 1 ${hx} ${-hy + rr}V${hy - rr}A${rr} ${rr} 0 0 1 ${hx - rr} ${hy}H${-hx + rr}A${rr} ${rr} 0 0 1 ${-hx} ${hy - rr}V${-hy + rr}A${rr} ${rr} 0 0 1 ${-hx + rr} ${-hy}Z`;
}
const circle = (r: number) => `M${-r} 0A${r} ${r} 0 1 0 ${r} 0A${r} ${r} 0 1 0 ${-r} 0Z`;

export function CrossSection({ request, materials, unit = "mm" }: { request: PredictionRequest; materials: MaterialSummary[]; unit?: DesignLengthUnit }) {
  const [ref, width] = useElementWidth<HTMLElement>();
  const compact = width > 0 && width < LABELS_BELOW_PX;
  const L = (mm: number, digits = 4) => lengthText(mm, unit, digits);
  const box = request.shape === "box";
  const d = request.dimensions_mm as Record<string, number>;
  let hx = box ? d.width / 2 : d.diameter / 2;
  let hy = box ? d.depth / 2 : d.diameter / 2;
  const rings: Ring[] = request.layers.map((l, i) => {
    const m = l.material ? materials.find((x) => x.id === l.material) : undefined;
    const magnetic = l.material ? (m ? m.relativePermeability.maximum > 1.5 : true) : (l.mu_r ?? 1) > 1.5;
    const gap = i < request.layers.length - 1 ? (l.gap_mm ?? 0) : 0;
    const ring: Ring = {
      index: i,
      inner: [hx, hy],
      t: l.thickness_mm,
      gap,
      label: `${i + 1} · ${l.material ?? `μr ${l.mu_r}`} · ${L(l.thickness_mm, 3)}${gap > 0 ? `, gap ${L(gap, 3)}` : ""}`,
      fill: l.material ? (magnetic ? FILL.magnetic : FILL.conductor) : FILL.custom,
    };
    hx += l.thickness_mm + gap;
    hy += l.thickness_mm + gap;
    return ring;
  });
  const last = rings[rings.length - 1];
  const X = last.inner[0] + last.t;
  const Y = last.inner[1] + last.t;
  const R = Math.max(X, Y);
  const margin = R * 0.1;
  const labelX = X + margin;
  const labelChars = compact ? String(rings.length).length + 1 : Math.max(...rings.map((r) => r.label.length));
  const scaleInUnit = niceLength(fromMillimetres(2 * X, unit));
  const scale = toMillimetres(scaleInUnit, unit);
  const scaleLabel = `${fmt(scaleInUnit, 3)} ${unitSymbols[unit]}`;

  // Cable holes: cut through every layer, a collar stub standing out from the outer layer, drawn
  // in the top of the section (round shapes: within 30° either side of the top; box: along the top
  // side), away from the labels on the right. Where the holes really go is the drawing's business.
  const outerT = last.t;
  const innerT = request.layers.slice(0, -1).reduce((sum, l) => sum + l.thickness_mm, 0);
  const holes = (request.holes ?? []).map((h, i, all) => {
    // the outer layer's collar telescopes over the inner ones: its bore is d + 2·Σ inner walls
    const bore = h.diameter_mm + 2 * innerT;
    const n = all.length;
    const spread = n === 1 ? 0 : (i / (n - 1) - 0.5) * 2;
    const angle = box ? -90 : -90 + 30 * spread; // degrees, 0 = right
    const offset = box ? spread * 0.6 * (X - bore / 2 - outerT) : 0;
    const rad = (angle * Math.PI) / 180;
    const reach = (box ? Y : X) + h.collarLength_mm;
    const tip = box ? [offset, -reach] : [reach * Math.cos(rad), reach * Math.sin(rad)];
    return { i, d: h.diameter_mm, bore, L: h.collarLength_mm, angle, offset, tip };
  });
  // every length below is in mm (the SVG's user unit); the font grows on a narrow screen until labels render readable
  const frame = (font: number) => {
    const holeFont = font * 0.8;
    const labelWidth = font * 0.56 * labelChars + font;
    const titleWidth = font * 0.56 * 28;
    const contentTop = Math.min(-Y - margin, ...holes.map((h) => h.tip[1] - holeFont * 1.6));
    const top = contentTop - font * 1.6;
    const bottom = Y + margin + font * 2.6;
    const left = Math.min(-X - margin, ...holes.map((h) => h.tip[0] - holeFont * 2));
    const right = Math.max(labelX + font + labelWidth, left + titleWidth, -X + scale + font * (1 + 0.56 * (scaleLabel.length + 8)), ...holes.map((h) => h.tip[0] + holeFont * 2));
    return { holeFont, top, bottom, left, right, w: right - left, h: bottom - top };
  };
  // hole labels are drawn at 0.8 of the font: the font is sized so that they too read at MIN_LABEL_PX
  const font = readableFontSize(R * 0.085, { width, maxHeight: MAX_HEIGHT_PX }, (fs) => frame(fs), holes.length ? MIN_LABEL_PX / 0.8 : MIN_LABEL_PX);
  const { holeFont, top, bottom, left, right } = frame(font);
  // leaders run level to the right, spread over the innermost opening so each meets its own wall
  const y0 = rings[0].inner[1] * 0.7;
  const labelY = (i: number) => (rings.length === 1 ? -y0 / 2 : -y0 + (2 * y0 * i) / (rings.length - 1));
  const wallX = (r: Ring, y: number) => {
    const mid = r.inner[0] + r.t / 2;
    return box ? mid : Math.sqrt(Math.max(0, mid * mid - y * y));
  };
  const outline = (hxI: number, hyI: number, r = 0) => (box ? roundedRect(hxI, hyI, r) : circle(hxI));
  const inside = box ? `${sizeText([d.width, d.depth], unit, 4)} inside` : `Ø ${L(d.diameter)} inside`;
  const title = request.shape === "cylinder" ? "Section across the axis" : request.shape === "sphere" ? "Section through the centre" : "Section width × depth";
  const outside = box ? sizeText([2 * X, 2 * Y], unit, 4) : `Ø ${L(2 * X)}`;

  return (
    <figure className="space-y-2" ref={ref}>
      <svg
        viewBox={`${left} ${top} ${right - left} ${bottom - top}`}
        className="h-auto max-h-[26rem] w-full text-flux-950"
        role="img"
        aria-label={`${title}: ${rings.length} layer${rings.length === 1 ? "" : "s"} to scale, ${inside}, outside ${outside}${holes.length ? `, ${holes.length} cable hole${holes.length === 1 ? "" : "s"} with ${holes.length === 1 ? "its collar" : "their collars"}` : ""}`}
        data-testid="cross-section"
      >
        <text x={left + font * 0.3} y={top + font * 1.1} fontSize={font} fill="currentColor" fontWeight={600}>
          {title}
        </text>
        {rings.map((r) => {
          const [ix, iy] = r.inner;
          const rIn = box ? r.t : 0;
          return (
            <path
              key={r.index}
              d={`${outline(ix + r.t, iy + r.t, rIn + r.t)} ${outline(ix, iy, rIn)}`}
              fillRule="evenodd"
              fill={r.fill}
              stroke="#131b24"
              strokeWidth={R * 0.004}
              data-role="layer"
              data-inner-mm={fmt(2 * ix, 6)}
              data-outer-mm={fmt(2 * (ix + r.t), 6)}
            />
          );
        })}
        {holes.map((h) => {
          // drawn pointing up from the origin's top, then turned to its place
          const surface = box ? Y : Math.sqrt(Math.max(0, X * X - (h.bore / 2 + outerT) ** 2));
          const turn = box ? `translate(${h.offset} 0)` : `rotate(${h.angle + 90})`;
          const wall = (x: number) => <rect x={x} y={-(box ? Y : X) - h.L} width={outerT} height={h.L + ((box ? Y : X) - surface) + outerT / 2} fill={last.fill} stroke="#131b24" strokeWidth={R * 0.004} />;
          const labelAt = box ? [h.tip[0], h.tip[1] - holeFont * 0.5] : [h.tip[0] + Math.cos((h.angle * Math.PI) / 180) * holeFont * 0.9, h.tip[1] + Math.sin((h.angle * Math.PI) / 180) * holeFont * 0.9];
          return (
            <g key={h.i} data-role="hole" data-diameter-mm={fmt(h.d, 6)} data-collar-mm={fmt(h.L, 6)}>
              <g transform={turn}>
                {/* the hole through every layer, each cut to take the collars inside it */}
                {rings.map((r, k) => {
                  const cut = h.d + 2 * rings.slice(0, k).reduce((sum, q) => sum + q.t, 0);
                  const outer = box ? r.inner[1] + r.t : r.inner[0] + r.t;
                  const inner = box ? r.inner[1] : Math.sqrt(Math.max(0, r.inner[0] ** 2 - (cut / 2) ** 2));
                  return <rect key={k} x={-cut / 2} y={-outer - R * 0.01} width={cut} height={outer - inner + R * 0.02} fill="#ffffff" />;
                })}
                {h.L > 0 && (
                  <>
                    {wall(-h.bore / 2 - outerT)}
                    {wall(h.bore / 2)}
                  </>
                )}
              </g>
              <text x={labelAt[0]} y={labelAt[1] + holeFont * 0.35} fontSize={holeFont} textAnchor="middle" fill="#b34a0c" fontWeight={600}>
                H{h.i + 1}
              </text>
            </g>
          );
        })}
        <text x={0} y={font * 0.35} fontSize={font} textAnchor="middle" fill="currentColor">
          {inside}
        </text>
        {rings.map((r, i) => {
          const y = labelY(i);
          return (
            <g key={r.index} className="layer-label">
              <line x1={wallX(r, y)} y1={y} x2={labelX} y2={y} stroke="#b34a0c" strokeWidth={R * 0.006} />
              <circle cx={wallX(r, y)} cy={y} r={R * 0.012} fill="#b34a0c" />
              <text x={labelX + font * 0.4} y={y + font * 0.35} fontSize={font} fill="currentColor">
                {compact ? r.index + 1 : r.label}
              </text>
            </g>
          );
        })}
        <ScaleBar x={-X} y={Y + margin} length={scale} fontSize={font} label={scaleLabel} />
      </svg>
      {compact && (
        <ol className="space-y-0.5 text-meta text-flux-800" aria-label="Layers on the drawing" data-testid="section-labels">
          {rings.map((r) => (
            <li key={r.index}>{r.label}</li>
          ))}
        </ol>
      )}
      <figcaption className="text-meta text-flux-600">
        Outside {outside}. Dark: magnetic alloy; orange: non-magnetic conductor; grey: custom μr. Drawn to scale.
        {holes.length > 0 ? ` H1${holes.length > 1 ? `–H${holes.length}` : ""}: cable holes with the outer layer's collar, placed at the top for the drawing; their real places are on your drawing.` : ""}
      </figcaption>
    </figure>
  );
}
