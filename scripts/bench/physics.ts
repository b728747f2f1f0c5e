// Timing of the shielding prediction engine: one exact three-layer AC cylinder prediction and a
// 200-point frequency sweep (what the client's attenuation chart asks for).
import { timeMicros, type BenchRow } from "./types";
import { logFrequencies, predictShield, sweepAttenuation, type PredictionInput } from "../../shared/physics/predict";
import { materialLibrary } from "../../shared/physics/materials";

const threeLayer: PredictionInput = {
  shape: "cylinder",
  dimensions_mm: { diameter: 50, length: 120 },
  ends: "closed",
  layers: [
    { material: "ni80", thickness_mm: 1, gap_mm: 8 },
    { material: "ni80", thickness_mm: 1, gap_mm: 8 },
    { material: "ni50", thickness_mm: 1.5 },
  ],
  field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" },
  state: "annealed",
};

export function benchPhysics(): BenchRow[] {
  // Let the JIT settle first, as it has in a running server (a second of calls: the optimizing
  // compiler needs more than a few thousand calls to finish with the engine's functions);
  // timeMicros' own warm-up is short.
  const warm = Date.now();
  while (Date.now() - warm < 1000) predictShield(threeLayer, materialLibrary);
  const single = timeMicros(() => predictShield(threeLayer, materialLibrary));
  const freqs = logFrequencies(1, 10_000, 200);
  const sweep_ms = timeMicros(() => sweepAttenuation(threeLayer, materialLibrary, freqs), 1000) / 1000;
  return [
    { name: "physics: exact 3-layer AC cylinder prediction", value: +single.toFixed(2), unit: "µs", target: "<= 50 µs", pass: single <= 50 },
    { name: "physics: 200-point frequency sweep, 3 layers", value: +sweep_ms.toFixed(3), unit: "ms", target: "<= 10 ms", pass: sweep_ms <= 10 },
  ];
}
