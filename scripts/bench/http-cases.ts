import type { HttpCase } from "./http";

// App routes measured against the bare Express route; each engineer adds their public routes here.
export const httpCases: HttpCase[] = [
  // the contract's bent-box example; no minRatio target: the flat pattern is real work
  { name: "blank", method: "POST", path: "/api/blanks", body: { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1.0, bendRadius_mm: 1.5, kFactor: 0.44 } },
  // the contract's prediction example (a library layer and an explicit-μ layer, 60 Hz)
  {
    name: "prediction",
    method: "POST",
    path: "/api/predictions",
    body: {
      shape: "cylinder",
      dimensions_mm: { diameter: 50, length: 120 },
      ends: "closed",
      layers: [
        { material: "ni80", thickness_mm: 1.0, gap_mm: 10 },
        { mu_r: 20000, resistivity_ohm_m: 5.8e-7, saturation_T: 0.75, thickness_mm: 1.0 },
      ],
      field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" },
      state: "annealed",
    },
    minRatio: 0.6,
  },
];
