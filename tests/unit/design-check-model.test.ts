import { describe, expect, it } from "vitest";
import { checkDraft, defaultDesign, draftErrors, newLayer, toRequestBody } from "../../src/features/design-check/design-model";

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
    expect(errors["layers.0.thickness"]).toMatch(/greater than 0 mm/);
    expect(errors["layers.1.thickness"]).toBeTruthy();
    expect(errors.frequency).toMatch(/cannot be negative/);
    expect(draftErrors({ "layers.2.material": "Unknown material", "dimensions_mm.width": "x", weird: "y" })).toEqual({ errors: { "layers.2.material": "Unknown material", width: "x" }, other: ["y"] });
  });
});
