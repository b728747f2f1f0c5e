/** Shared shapes of the fabrication engine. Lengths mm, areas mm², masses kg. */
import { fieldWords } from "../schemas/messages";

export type Point = [number, number];
export type Segment = [Point, Point];

export interface Warning {
  code: string;
  message: string;
}

/** Square corner relief: lower-left corner (x, y) and side. */
export interface Relief {
  x: number;
  y: number;
  size: number;
}

export interface CircleShape {
  cx: number;
  cy: number;
  diameter: number;
}

/** Flat pattern for drawings and DXF: cut outline (closed), bend lines, reliefs, disc blanks. */
export interface FlatPatternGeometry {
  outline: Point[];
  bendLines: Segment[];
  reliefs: Relief[];
  circles: CircleShape[];
}

/** Raised when an input passed the schema but cannot be built; `field` names the request field. */
export class FabricationInputError extends Error {
  constructor(
    public readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = "FabricationInputError";
  }
}

const named = (field: string) => {
  const { label } = fieldWords(field.split(".").map((k) => (/^\d+$/.test(k) ? Number(k) : k)));
  return label[0].toUpperCase() + label.slice(1);
};

export function requirePositive(value: number, field: string): void {
  if (!Number.isFinite(value) || value <= 0) throw new FabricationInputError(field, `${named(field)} must be more than 0 mm.`);
}

export function requireNonNegative(value: number, field: string): void {
  if (!Number.isFinite(value) || value < 0) throw new FabricationInputError(field, `${named(field)} must be at least 0 mm.`);
}

/** Shoelace area of a simple polygon (absolute value). */
export function polygonArea(points: readonly Point[]): number {
  let s = 0;
  for (let i = 0, n = points.length; i < n; i++) {
    const [x1, y1] = points[i];
    const [x2, y2] = points[(i + 1) % n];
    s += x1 * y2 - x2 * y1;
  }
  return Math.abs(s) / 2;
}

export const discArea = (diameter: number): number => (Math.PI * diameter * diameter) / 4;
