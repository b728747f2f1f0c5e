import { describe, expect, it } from "vitest";
import { checkDraft, defaultDesign, draftErrors, draftField, newHole, newLayer, toRequestBody } from "../../src/features/design-check/design-model";

describe("design-check form → prediction body", () => {
  it("the defaults are a valid 50 × 120 mm closed can with one 1 mm ni80 layer at 60 Hz, 100 µT", () => {
    const r = checkDraft(defaultDesign());
    expect(r.errors).toBeNull();
    expect(r.request).toMatchObject({ shape: "cylinder", dimensions_mm: { diameter: 50, length: 120 }, ends: "closed", layers: [{ material: "ni80", thickness_mm: 1 }], field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" } });
    // the outermost layer's gap means nothing and is not sent
    expect(r.request!.layers[0]).not.toHaveProperty("gap_mm");
  });

  it("converts the units a person types: inches, mil, gauss, A/m, µΩ·m", () => {
    const d = { ...defaultDesign(), unit: "in" as const, diameter: "2", length: "5", fieldUnit: "G" as const, amplitude: "0.5" };
    d.layers = [newLayer({ thickness: "0.04", gap: "0.5" }), newLayer({ kind: "custom", mu_r: "20000", resistivity: "0.58", saturation: "", thickness: "0.04" })];
    const body = toRequestBody(d) as { dimensions_mm: { diameter: number }; layers: Record<string, number>[]; field: { amplitude_uT: number } };
    expect(body.dimensions_mm.diameter).toBeCloseTo(50.8, 9);
    expect(body.layers[0].thickness_mm).toBeCloseTo(1.016, 9);
    expect(body.layers[0].gap_mm).toBeCloseTo(12.7, 9);
    expect(body.layers[1].resistivity_ohm_m).toBeCloseTo(5.8e-7, 15);
    expect(body.layers[1]).not.toHaveProperty("saturation_T");
    expect(body.field.amplitude_uT).toBeCloseTo(50, 9);
    expect(toRequestBody({ ...defaultDesign(), fieldUnit: "A/m", amplitude: "80" }).field).toMatchObject({ amplitude_uT: expect.closeTo(100.53, 2) });
  });

  it("puts the schema's messages beside the form's fields", () => {
    const d = defaultDesign();
    d.layers = [newLayer({ thickness: "0" }), newLayer({ thickness: "abc" })];
    d.frequency = "-5";
    const r = checkDraft(d);
    expect(r.request).toBeNull();
    const { errors } = draftErrors(r.errors!);
    expect(errors["layers.0.thickness"]).toMatch(/wall thickness is too small: at least 0.01 mm/i);
    expect(errors["layers.1.thickness"]).toBeTruthy();
    expect(errors.frequency).toMatch(/too small: at least 0 Hz \(0 is a static field\)/);
    expect(draftErrors({ "layers.2.material": "Unknown material", "dimensions_mm.width": "x", weird: "y" })).toEqual({ errors: { "layers.2.material": "Unknown material", width: "x" }, other: ["y"] });
  });

  it("maps cable holes: diameter and collar in the page's unit, an empty collar a plain hole, none sent when there are none", () => {
    expect(toRequestBody(defaultDesign())).not.toHaveProperty("holes");
    expect(toRequestBody({ ...defaultDesign(), holes: [] })).not.toHaveProperty("holes");
    const mm = checkDraft({ ...defaultDesign(), holes: [newHole("mm"), newHole("mm", { diameter: "6", collar: "" })] });
    expect(mm.errors).toBeNull();
    expect(mm.request!.holes).toEqual([{ diameter_mm: 10, collarLength_mm: 20 }, { diameter_mm: 6, collarLength_mm: 0 }]);
    // inches: converted before they are sent, as every other length
    const inch = toRequestBody({ ...defaultDesign(), unit: "in", diameter: "2", length: "5", layers: [newLayer({ thickness: "0.04" })], holes: [newHole("in", { diameter: "0.5", collar: "1" })] }) as { holes: { diameter_mm: number; collarLength_mm: number }[] };
    expect(inch.holes[0].diameter_mm).toBeCloseTo(12.7, 9);
    expect(inch.holes[0].collarLength_mm).toBeCloseTo(25.4, 9);
    expect(newHole("in")).toMatchObject({ diameter: "0.4", collar: "0.8" });
  });

  it("puts the holes' messages beside their fields, from the schema and from the server's 400", () => {
    const r = checkDraft({ ...defaultDesign(), holes: [newHole("mm", { diameter: "0" }), newHole("mm", { collar: "-2" }), newHole("mm", { diameter: "60" })] });
    expect(r.request).toBeNull();
    const { errors } = draftErrors(r.errors!);
    expect(errors["holes.0.diameter"]).toMatch(/hole diameter is too small: at least 0.5 mm/i);
    expect(errors["holes.1.collar"]).toMatch(/collar length is too small: at least 0 mm/i);
    expect(errors["holes.2.diameter"]).toMatch(/narrower than the shield's smallest inside size \(50 mm\)/);
    expect(checkDraft({ ...defaultDesign(), holes: [newHole("mm", { collar: "abc" })] }).errors).toHaveProperty(["holes.0.collarLength_mm"]);
    // the server's field names map to the same fields
    expect(draftField("holes.3.diameter_mm")).toBe("holes.3.diameter");
    expect(draftField("holes.3.collarLength_mm")).toBe("holes.3.collar");
    expect(draftErrors({ "holes.0.diameter_mm": "too big", holes: "At most 50 holes." }).errors).toEqual({ "holes.0.diameter": "too big", holes: "At most 50 holes." });
  });
});
