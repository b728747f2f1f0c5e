import { contractBlankExamples, contractPredictionExample } from "../../shared/schemas/contract-examples";
import type { HttpCase } from "./http";
import { certificateDigestForBench } from "./verify-digest";

// App routes measured against the bare Express route; each engineer adds their public routes here.
export const httpCases: HttpCase[] = [
  // the contract's bent-box example; no minRatio target: the flat pattern is real work
  { name: "blank", method: "POST", path: "/api/blanks", body: contractBlankExamples.bent },
  // the contract's prediction example (a library layer and an explicit-μ layer, 60 Hz)
  {
    name: "prediction",
    method: "POST",
    path: "/api/predictions",
    body: contractPredictionExample,
    minRatio: 0.6,
  },
  // a deep-drawn 80 % nickel-iron can: a class the demo's measured lots calibrate (calibration on)
  {
    name: "prediction, calibrated class",
    method: "POST",
    path: "/api/predictions",
    body: { shape: "cylinder", dimensions_mm: { diameter: 50, length: 120 }, ends: "closed", method: "drawn", layers: [{ material: "ni80", thickness_mm: 1 }], field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" } },
    minRatio: 0.6,
  },
  // ISO 2859-1 plan for a lot of 500 at AQL 1.0 (public reference data)
  { name: "sampling plan", path: "/api/sampling-plan?lotSize=500&aql=1.0", minRatio: 0.6 },
  // the public check of a certificate the demo issued (one indexed read)
  { name: "verify certificate", path: `/api/verify/${await certificateDigestForBench()}`, minRatio: 0.6 },
];
