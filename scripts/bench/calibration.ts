// The calibration's fit in process: one class of 1 000 measured lots (three parts each, three
// designs at three test frequencies), robust fit of μ and the ceiling with 5-fold cross-validation.
// Target: at most 2 s.
import { fitClass } from "../../shared/calibration";
import { libraryMuOf } from "../../shared/calibration/fit";
import { syntheticLots } from "../../shared/calibration/synthetic";
import { buildModelFrom, DEFAULT_CONSTRUCTION_SETTINGS, materialLibrary } from "../../shared/physics";
import type { BenchRow } from "./types";

const key = { material: "ni80", method: "drawn", construction: "closed-can" } as const;
const can = (diameter: number, length: number, t: number, layers = 1) => ({
  shape: "cylinder" as const, ends: "closed" as const, method: "drawn" as const, dimensions_mm: { diameter, length },
  layers: Array.from({ length: layers }, (_, i) => ({ material: "ni80", thickness_mm: t, ...(i < layers - 1 ? { gap_mm: 5 } : {}) })),
});

export function benchCalibration(): BenchRow[] {
  const lots = syntheticLots({
    key, mu_effective: 0.6 * libraryMuOf(materialLibrary, "ni80")!, ceiling_db: 60, designs: [can(40, 80, 1), can(80, 150, 0.5), can(30, 60, 1, 2)],
    frequencies_hz: [10, 60, 400], lots: 1000, partsPerLot: 3, partNoise_db: 0.5, lotNoise_db: 1, requiredAttenuation_db: 30, seed: 1,
  });
  const shop = { materials: materialLibrary, model: buildModelFrom(DEFAULT_CONSTRUCTION_SETTINGS) };
  fitClass(key, lots.slice(0, 100), shop); // the JIT settles
  const times: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t = performance.now();
    fitClass(key, lots, shop);
    times.push(performance.now() - t);
  }
  const ms = Math.round(times.sort((a, b) => a - b)[1]);
  return [{ name: "fit of one class, 1 000 lots (median of 3)", value: ms, unit: "ms", target: "<= 2000 ms", pass: ms <= 2000 }];
}
