import { describe, expect, it } from "vitest";
import { blankRequestSchema, fieldErrors } from "../../shared/schemas/blank";

const drawn = { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, thickness_mm: 1.0, cornerRadius_mm: 3, trim_mm: 0 };
const rolled = { shape: "cylinder", method: "rolled", dimensions_mm: { diameter: 50, length: 60 }, thickness_mm: 1.0, seamOverlap_mm: 6 };
const bent = { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1.0, bendRadius_mm: 1.5, kFactor: 0.44 };

const fields = (body: unknown) => {
  const r = blankRequestSchema.safeParse(body);
  if (r.success) return null;
  return Object.keys(fieldErrors(r.error));
};

describe("blank request schema", () => {
  it("accepts the three contract bodies", () => {
    for (const b of [drawn, rolled, bent]) expect(blankRequestSchema.safeParse(b).success).toBe(true);
  });

  it.each([
    ["zero diameter", { ...drawn, dimensions_mm: { diameter: 0, length: 60 } }, "dimensions_mm.diameter"],
    ["negative diameter", { ...rolled, dimensions_mm: { diameter: -5, length: 60 } }, "dimensions_mm.diameter"],
    ["negative bend radius", { ...bent, bendRadius_mm: -1 }, "bendRadius_mm"],
    ["K above 0.5", { ...bent, kFactor: 0.6 }, "kFactor"],
    ["K below 0", { ...bent, kFactor: -0.1 }, "kFactor"],
    ["box drawn", { ...bent, method: "drawn" }, "method"],
    ["cylinder bent", { ...drawn, method: "bent" }, "method"],
    ["corner radius over half the diameter", { ...drawn, cornerRadius_mm: 26 }, "cornerRadius_mm"],
    ["thickness not smaller than the part", { ...bent, thickness_mm: 40 }, "thickness_mm"],
    ["thickness as string", { ...drawn, thickness_mm: "1" }, "thickness_mm"],
    ["NaN length", { ...drawn, dimensions_mm: { diameter: 50, length: NaN } }, "dimensions_mm.length"],
    ["string width", { ...bent, dimensions_mm: { width: "80", depth: 60, height: 40 } }, "dimensions_mm.width"],
    ["unknown shape", { ...drawn, shape: "torus" }, "shape"],
  ])("%s → the error names the field", (_label, body, path) => {
    expect(fields(body)).toEqual([path]);
  });

  it("infers the variant", () => {
    const r = blankRequestSchema.parse(bent);
    expect(r.method === "bent" && r.kFactor).toBe(0.44);
  });
});
