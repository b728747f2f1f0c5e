/** Fabrication engine timings: one blank computation and nesting 200 blanks on a sheet. */
import { computeBlank, nestBlanks, type NestBlank } from "../../shared/fabrication";
import { timeMicros, type BenchRow } from "./types";

export function benchFabrication(): BenchRow[] {
  const box = { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1, bendRadius_mm: 1.5, kFactor: 0.44 } as const;
  const cup = { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, thickness_mm: 1, cornerRadius_mm: 3 } as const;
  const blankUs = timeMicros(() => {
    computeBlank(box, { density_kg_m3: 8740 });
    computeBlank(cup, { density_kg_m3: 8740 });
  }) / 2;

  // mixed rectangles and discs, as a multi-layer job's blanks would be
  const blanks: NestBlank[] = Array.from({ length: 200 }, (_, i) =>
    i % 4 === 0 ? { kind: "disc", diameter_mm: 50 + (i % 30) } : { kind: "rectangle", length_mm: 60 + ((i * 37) % 180), width_mm: 40 + ((i * 53) % 90) },
  );
  const sheet = { width_mm: 1000, length_mm: 2000 };
  const nestMs = timeMicros(() => nestBlanks(blanks, sheet, { gap_mm: 3 }), 600) / 1000;

  return [
    { name: "fabrication: one blank computation", value: Number(blankUs.toFixed(2)), unit: "µs", target: "<= 50 µs", pass: blankUs <= 50 },
    { name: "fabrication: nesting 200 blanks on a sheet", value: Number(nestMs.toFixed(3)), unit: "ms", target: "<= 50 ms", pass: nestMs <= 50 },
  ];
}
