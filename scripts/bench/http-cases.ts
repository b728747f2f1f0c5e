import type { HttpCase } from "./http";

// App routes measured against the bare Express route; each engineer adds their public routes here.
export const httpCases: HttpCase[] = [
  // the contract's bent-box example; no minRatio target: the flat pattern is real work
  { name: "blank", method: "POST", path: "/api/blanks", body: { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1.0, bendRadius_mm: 1.5, kFactor: 0.44 } },
];
