// Synthetic lots of one class for the calibration tests: three drawn can designs (one and two
// layers) so that μ and the ceiling are both identifiable.
import type { MeasuredDesign } from "../../shared/calibration";

export const NI80_DRAWN = { material: "ni80", method: "drawn", construction: "closed-can" } as const;

export const CAN_DESIGNS: MeasuredDesign[] = [
  { shape: "cylinder", ends: "closed", method: "drawn", dimensions_mm: { diameter: 40, length: 80 }, layers: [{ material: "ni80", thickness_mm: 1 }] },
  { shape: "cylinder", ends: "closed", method: "drawn", dimensions_mm: { diameter: 80, length: 150 }, layers: [{ material: "ni80", thickness_mm: 0.5 }] },
  {
    shape: "cylinder", ends: "closed", method: "drawn", dimensions_mm: { diameter: 30, length: 60 },
    layers: [{ material: "ni80", thickness_mm: 1, gap_mm: 5 }, { material: "ni80", thickness_mm: 1 }],
  },
];
