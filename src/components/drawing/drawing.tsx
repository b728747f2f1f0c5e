// Drawing helpers shared by the flat pattern, the nesting layout and the design cross-section. Coordinates are millimetres
// (the SVG's user units), so anything measured in the viewBox is measured in mm.

export const fmtMm = (x: number, digits = 2) => String(+x.toFixed(digits));

/** A round length near a quarter of the drawing for the scale bar: 1, 2 or 5 × 10ⁿ mm. */
export function niceLength(span: number): number {
  const target = span / 3;
  const p = 10 ** Math.floor(Math.log10(target));
  for (const m of [5, 2, 1]) if (m * p <= target) return m * p;
  return p;
}

interface DimProps {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  /** offset of the dimension line from the measured points, perpendicular */
  offset: number;
  label: string;
  fontSize: number;
}

/** A dimension: extension lines, the line with arrowheads and the value in the middle. */
export function Dimension({ x1, y1, x2, y2, offset, label, fontSize }: DimProps) {
  const horizontal = Math.abs(y2 - y1) < 1e-9;
  const a = fontSize * 0.6; // arrowhead length
  if (horizontal) {
    const y = y1 + offset;
    const mid = (x1 + x2) / 2;
    const ty = offset > 0 ? y + fontSize * 1.1 : y - fontSize * 0.35;
    return (
      <g className="dimension" stroke="currentColor" fill="currentColor">
        <line x1={x1} y1={y1} x2={x1} y2={y + Math.sign(offset) * a * 0.6} strokeWidth={fontSize * 0.06} />
        <line x1={x2} y1={y2} x2={x2} y2={y + Math.sign(offset) * a * 0.6} strokeWidth={fontSize * 0.06} />
        <line x1={x1} y1={y} x2={x2} y2={y} strokeWidth={fontSize * 0.08} />
        <path d={`M${x1} ${y} l${a} ${-a / 3} v${(2 * a) / 3} z M${x2} ${y} l${-a} ${-a / 3} v${(2 * a) / 3} z`} stroke="none" />
        <text x={mid} y={ty} fontSize={fontSize} textAnchor="middle" stroke="none">
          {label}
        </text>
      </g>
    );
  }
  const x = x1 + offset;
  const mid = (y1 + y2) / 2;
  return (
    <g className="dimension" stroke="currentColor" fill="currentColor">
      <line x1={x1} y1={y1} x2={x + Math.sign(offset) * a * 0.6} y2={y1} strokeWidth={fontSize * 0.06} />
      <line x1={x2} y1={y2} x2={x + Math.sign(offset) * a * 0.6} y2={y2} strokeWidth={fontSize * 0.06} />
      <line x1={x} y1={y1} x2={x} y2={y2} strokeWidth={fontSize * 0.08} />
      <path d={`M${x} ${y1} l${-a / 3} ${a} h${(2 * a) / 3} z M${x} ${y2} l${-a / 3} ${-a} h${(2 * a) / 3} z`} stroke="none" />
      <text x={x + fontSize * 0.45} y={mid} fontSize={fontSize} transform={`rotate(90 ${x + fontSize * 0.45} ${mid})`} textAnchor="middle" stroke="none">
        {label}
      </text>
    </g>
  );
}

/** A scale bar of a round length, so the drawing can be read off the screen at any zoom. */
export function ScaleBar({ x, y, length, fontSize, label }: { x: number; y: number; length: number; fontSize: number; label?: string }) {
  const h = fontSize * 0.5;
  return (
    <g className="scale-bar" data-length-mm={length}>
      <rect x={x} y={y} width={length / 2} height={h} fill="currentColor" />
      <rect x={x + length / 2} y={y} width={length / 2} height={h} fill="white" stroke="currentColor" strokeWidth={fontSize * 0.06} />
      {/* the length beside the bar, so a short bar's labels never collide */}
      <text x={x + length + fontSize * 0.5} y={y + h} fontSize={fontSize} fill="currentColor">
        {label ?? `${fmtMm(length, 1)} mm`} (scale)
      </text>
    </g>
  );
}

/** Smallest text on a drawing, in CSS pixels as rendered: readable on a phone. */
export const MIN_LABEL_PX = 12;

/**
 * The font size (in the drawing's user units, mm) at which labels render at least `minPx` CSS
 * pixels tall, for a drawing whose viewBox grows with its labels (`view(fs)`) and which is shown
 * `box.width` pixels wide (and at most `box.maxHeight` tall). `base` is the size the drawing would
 * choose for itself; it is kept when it is already readable.
 */
export function readableFontSize(base: number, box: { width: number; maxHeight?: number }, view: (fs: number) => { w: number; h: number }, minPx = MIN_LABEL_PX): number {
  if (!(box.width > 0)) return base;
  let fs = base;
  for (let i = 0; i < 12; i++) {
    const v = view(fs);
    const scale = Math.min(box.width / v.w, box.maxHeight ? box.maxHeight / v.h : Infinity);
    const needed = minPx / scale;
    if (needed <= fs * 1.0001) break;
    fs = needed;
  }
  return fs;
}
