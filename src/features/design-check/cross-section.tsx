import type { PredictionRequest } from "../../../shared/schemas/prediction";
import type { MaterialSummary } from "../../api/materials";
import { niceLength, ScaleBar } from "../../components/drawing/drawing";
import { fmt } from "./design-model";

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

export function CrossSection({ request, materials }: { request: PredictionRequest; materials: MaterialSummary[] }) {
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
      label: `${i + 1} · ${l.material ?? `μr ${l.mu_r}`} · ${fmt(l.thickness_mm)} mm${gap > 0 ? `, gap ${fmt(gap)} mm` : ""}`,
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
  const font = R * 0.085;
  const margin = R * 0.1;
  const labelX = X + margin;
  const labelWidth = font * 0.56 * Math.max(...rings.map((r) => r.label.length)) + font;
  const scale = niceLength(2 * X);
  const top = -Y - margin - font * 1.6;
  const bottom = Y + margin + font * 2.6;
  const left = -X - margin;
  const right = labelX + font + labelWidth;
  // leaders run level to the right, spread over the innermost opening so each meets its own wall
  const y0 = rings[0].inner[1] * 0.7;
  const labelY = (i: number) => (rings.length === 1 ? -y0 / 2 : -y0 + (2 * y0 * i) / (rings.length - 1));
  const wallX = (r: Ring, y: number) => {
    const mid = r.inner[0] + r.t / 2;
    return box ? mid : Math.sqrt(Math.max(0, mid * mid - y * y));
  };
  const outline = (hxI: number, hyI: number, r = 0) => (box ? roundedRect(hxI, hyI, r) : circle(hxI));
  const inside = box ? `${fmt(d.width)} × ${fmt(d.depth)} mm inside` : `Ø ${fmt(d.diameter)} mm inside`;
  const title = request.shape === "cylinder" ? "Section across the axis" : request.shape === "sphere" ? "Section through the centre" : "Section width × depth";
  const outside = box ? `${fmt(2 * X, 4)} × ${fmt(2 * Y, 4)} mm` : `Ø ${fmt(2 * X, 4)} mm`;

  return (
    <figure className="space-y-2">
      <svg
        viewBox={`${left} ${top} ${right - left} ${bottom - top}`}
        className="h-auto max-h-[26rem] w-full text-flux-950"
        role="img"
        aria-label={`${title}: ${rings.length} layer${rings.length === 1 ? "" : "s"} to scale, ${inside}, outside ${outside}`}
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
                {r.label}
              </text>
            </g>
          );
        })}
        <ScaleBar x={-X} y={Y + margin} length={scale} fontSize={font} />
      </svg>
      <figcaption className="text-meta text-flux-600">
        Outside {outside}. Dark: magnetic alloy; orange: non-magnetic conductor; grey: custom μr. Drawn to scale.
      </figcaption>
    </figure>
  );
}
