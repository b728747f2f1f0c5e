import { describe, expect, it } from "vitest";
import { predictionIssueFields, predictionRequestSchema, type PredictionRequest } from "../../shared/schemas/prediction";
import { predictShield, type PredictionInput } from "../../shared/physics/predict";
import { contractPredictionExample } from "../../shared/schemas/contract-examples";

// The example body of POST /api/predictions in api-contract.md
const example = structuredClone(contractPredictionExample);

const fieldsOf = (body: unknown): Record<string, string> => {
  const r = predictionRequestSchema.safeParse(body);
  if (r.success) return {};
  return predictionIssueFields(r.error);
};
// a deep copy the checks below may bend into invalid shapes (JSON.parse's answer is untyped)
const clone = <T>(x: T) => JSON.parse(JSON.stringify(x));

describe("predictionRequestSchema", () => {
  it("accepts the contract's example body, and its output feeds predictShield", () => {
    const r = predictionRequestSchema.safeParse(example);
    expect(r.success).toBe(true);
    const body: PredictionRequest = r.data!;
    const input: PredictionInput = body;
    const p = predictShield(input);
    expect(p.shieldingFactor).toBeGreaterThanOrEqual(1);
    expect(p.estimate).toBe(true);
  });

  it("fills defaults: state annealed, ends closed, orientation transverse", () => {
    const b = clone(example);
    delete b.state;
    delete b.ends;
    delete b.field.orientation;
    const r = predictionRequestSchema.parse(b);
    expect(r.state).toBe("annealed");
    expect(r.shape === "cylinder" && r.ends).toBe("closed");
    expect(r.field.orientation).toBe("transverse");
  });

  it("accepts a sphere and a box with their own dimensions, and optional holes", () => {
    expect(fieldsOf({ ...clone(example), shape: "sphere", dimensions_mm: { diameter: 40 } })).toEqual({});
    expect(fieldsOf({ ...clone(example), shape: "box", dimensions_mm: { width: 80, depth: 60, height: 40 }, holes: [{ diameter_mm: 8, collarLength_mm: 12 }] })).toEqual({});
  });

  it("rejects zero and negative dimensions with the field path", () => {
    expect(fieldsOf({ ...clone(example), dimensions_mm: { diameter: 0, length: 120 } })).toHaveProperty(["dimensions_mm.diameter"]);
    expect(fieldsOf({ ...clone(example), dimensions_mm: { diameter: 50, length: -1 } })).toHaveProperty(["dimensions_mm.length"]);
    expect(fieldsOf({ ...clone(example), shape: "box", dimensions_mm: { width: 80, depth: 0, height: 40 } })).toHaveProperty(["dimensions_mm.depth"]);
  });

  it("rejects a box without its dimensions, naming each", () => {
    const f = fieldsOf({ ...clone(example), shape: "box" });
    expect(Object.keys(f)).toEqual(expect.arrayContaining(["dimensions_mm.width", "dimensions_mm.depth", "dimensions_mm.height"]));
  });

  it("rejects a wall at least as thick as its radius at layers.N.thickness_mm", () => {
    const b = clone(example);
    b.layers[0].thickness_mm = 25;
    expect(fieldsOf(b)).toHaveProperty(["layers.0.thickness_mm"]);
    const ok = clone(example);
    ok.layers[0].thickness_mm = 24.9;
    expect(fieldsOf(ok)).toEqual({});
  });

  it("rejects empty layers, more than six, and layers with neither a material nor mu_r", () => {
    expect(fieldsOf({ ...clone(example), layers: [] })).toHaveProperty(["layers"]);
    expect(fieldsOf({ ...clone(example), layers: Array(7).fill({ material: "ni80", thickness_mm: 1 }) })).toHaveProperty(["layers"]);
    expect(fieldsOf({ ...clone(example), layers: [{ thickness_mm: 1 }] })).toHaveProperty(["layers.0.mu_r"]);
    expect(fieldsOf({ ...clone(example), layers: [{ mu_r: 1000, thickness_mm: 1 }] })).toHaveProperty(["layers.0.resistivity_ohm_m"]);
    expect(fieldsOf({ ...clone(example), layers: [{ material: "ni80", mu_r: 1000, thickness_mm: 1 }] })).toHaveProperty(["layers.0.mu_r"]);
  });

  it("rejects an unknown shape at `shape`", () => {
    expect(fieldsOf({ ...clone(example), shape: "cone" })).toHaveProperty(["shape"]);
  });

  it("rejects NaN, Infinity and numeric strings with the field path", () => {
    expect(fieldsOf({ ...clone(example), dimensions_mm: { diameter: Number.NaN, length: 120 } })).toHaveProperty(["dimensions_mm.diameter"]);
    expect(fieldsOf({ ...clone(example), dimensions_mm: { diameter: "50", length: 120 } })).toHaveProperty(["dimensions_mm.diameter"]);
    const b = clone(example);
    b.layers[1].mu_r = Infinity;
    expect(fieldsOf(b)).toHaveProperty(["layers.1.mu_r"]);
    expect(fieldsOf({ ...clone(example), field: { ...example.field, amplitude_uT: "100" } })).toHaveProperty(["field.amplitude_uT"]);
  });

  it("rejects frequency above 100 kHz or below 0, and a non-positive field amplitude", () => {
    expect(fieldsOf({ ...clone(example), field: { ...example.field, frequency_hz: 100_001 } })).toHaveProperty(["field.frequency_hz"]);
    expect(fieldsOf({ ...clone(example), field: { ...example.field, frequency_hz: -1 } })).toHaveProperty(["field.frequency_hz"]);
    expect(fieldsOf({ ...clone(example), field: { ...example.field, frequency_hz: 100_000 } })).toEqual({});
    expect(fieldsOf({ ...clone(example), field: { ...example.field, frequency_hz: 0 } })).toEqual({});
    expect(fieldsOf({ ...clone(example), field: { ...example.field, amplitude_uT: 0 } })).toHaveProperty(["field.amplitude_uT"]);
    expect(fieldsOf({ ...clone(example), field: { ...example.field, amplitude_uT: 1e9 } })).toHaveProperty(["field.amplitude_uT"]);
  });

  it("rejects a bad orientation, state or ends, and a body that is not an object", () => {
    expect(fieldsOf({ ...clone(example), field: { ...example.field, orientation: "diagonal" } })).toHaveProperty(["field.orientation"]);
    expect(fieldsOf({ ...clone(example), state: "raw" })).toHaveProperty(["state"]);
    expect(fieldsOf({ ...clone(example), ends: "half" })).toHaveProperty(["ends"]);
    expect(fieldsOf("hello")).toHaveProperty(["body"]);
  });
});
