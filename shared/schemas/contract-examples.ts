// The example bodies of the API contract, in one place: tests check the routes with them, the
// benchmark loads the routes with them. Frozen so no caller can change them for the next.

const deepFreeze = <T>(value: T): T => {
  if (value && typeof value === "object") {
    for (const v of Object.values(value)) deepFreeze(v);
    Object.freeze(value);
  }
  return value;
};

/** POST /api/predictions: a library layer inside an explicit-μ layer, 60 Hz across the axis. */
export const contractPredictionExample = deepFreeze({
  shape: "cylinder",
  dimensions_mm: { diameter: 50, length: 120 },
  ends: "closed",
  layers: [
    { material: "ni80", thickness_mm: 1.0, gap_mm: 10 },
    { mu_r: 20000, resistivity_ohm_m: 5.8e-7, saturation_T: 0.75, thickness_mm: 1.0 },
  ],
  field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" },
  state: "annealed",
  method: "drawn",
});

/** POST /api/blanks: the three example bodies. */
export const contractBlankExamples = deepFreeze({
  drawn: { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, thickness_mm: 1.0, cornerRadius_mm: 3, trim_mm: 0 },
  rolled: { shape: "cylinder", method: "rolled", dimensions_mm: { diameter: 50, length: 60 }, thickness_mm: 1.0, seamOverlap_mm: 6 },
  bent: { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1.0, bendRadius_mm: 1.5, kFactor: 0.44 },
});

/**
 * POST /api/quotes: a configuration the shop can make and price: the prediction body (two
 * library layers), the forming method and its blank fields, and the attenuation needed.
 */
export const quoteConfigurationExample = deepFreeze({
  shape: "cylinder",
  method: "drawn",
  dimensions_mm: { diameter: 50, length: 120 },
  ends: "closed",
  layers: [
    { material: "ni80", thickness_mm: 1.0, gap_mm: 10 },
    { material: "ni80", thickness_mm: 1.0 },
  ],
  field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" },
  state: "annealed",
  cornerRadius_mm: 3,
  trim_mm: 0,
  requiredAttenuation_db: 40,
});
