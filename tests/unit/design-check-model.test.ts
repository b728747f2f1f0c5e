import { describe, expect, it } from "vitest";
import { checkDraft, defaultDesign, describeDesign, draftErrors, draftField, newHole, newLayer, toRequestBody } from "../../src/features/design-check/design-model";
import { canonicalOf, quantityScale } from "../../src/components/ui/unit-input";

describe("design-check form → prediction body", () => {
  it("the defaults are a valid 50 × 120 mm closed can with one 1 mm ni80 layer at 60 Hz, 100 µT", () => {
    const r = checkDraft(defaultDesign());
    expect(r.errors).toBeNull();
    expect(r.request).toMatchObject({ shape: "cylinder", dimensions_mm: { diameter: 50, length: 120 }, ends: "closed", layers: [{ material: "ni80", thickness_mm: 1 }], field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" } });
    // the outermost layer's gap means nothing and is not sent
    expect(r.request!.layers[0]).not.toHaveProperty("gap_mm");
  });

  it("sends the kept canonical values whatever units the page shows (mm, µT, Hz; µΩ·m → Ω·m)", () => {
    const d = { ...defaultDesign(), units: { length: "in" as const, field: "G" as const, frequency: "kHz" as const }, diameter_mm: 50.8 };
    d.layers = [newLayer({ thickness_mm: 1.016, gap_mm: 12.7 }), newLayer({ kind: "custom", mu_r: 20000, resistivity_uohm_m: 0.58, saturation_T: null, thickness_mm: 1.016 })];
    const body = toRequestBody(d) as { dimensions_mm: { diameter: number }; layers: Record<string, number>[]; field: { amplitude_uT: number; frequency_hz: number } };
    expect(body.dimensions_mm.diameter).toBe(50.8);
    expect(body.layers[0]).toMatchObject({ thickness_mm: 1.016, gap_mm: 12.7 });
    expect(body.layers[1].resistivity_ohm_m).toBeCloseTo(5.8e-7, 15);
    expect(body.layers[1]).not.toHaveProperty("saturation_T");
    expect(body.field).toMatchObject({ amplitude_uT: 100, frequency_hz: 60 });
  });

  it("what a person types in their unit becomes the canonical value the state keeps (2 in → 50.8 mm, 0.5 G → 50 µT, 80 A/m → 100.53 µT)", () => {
    expect(canonicalOf("2", quantityScale("length", "in"))).toBeCloseTo(50.8, 12);
    expect(canonicalOf("0,04", quantityScale("length", "in"))).toBeCloseTo(1.016, 12);
    expect(canonicalOf("0.5", quantityScale("flux", "G"))).toBeCloseTo(50, 12);
    expect(canonicalOf("80", quantityScale("flux", "A/m"))).toBeCloseTo(100.53, 2);
    expect(canonicalOf("1.2", quantityScale("frequency", "kHz"))).toBeCloseTo(1200, 9);
    expect(canonicalOf("", quantityScale("length", "mm"))).toBeNull();
    expect(canonicalOf("abc", quantityScale("length", "mm"))).toBeNaN();
  });

  it("puts the schema's messages beside the form's fields: an empty box and a typo are named, never zod's own words", () => {
    const d = defaultDesign();
    d.layers = [newLayer({ thickness_mm: 0 }), newLayer({ thickness_mm: NaN })];
    d.frequency_hz = -5;
    d.diameter_mm = null;
    const r = checkDraft(d);
    expect(r.request).toBeNull();
    const { errors } = draftErrors(r.errors!);
    expect(errors["layers.0.thickness"]).toMatch(/wall thickness is too small: at least 0.01 mm/i);
    expect(errors["layers.1.thickness"]).toBe("Enter the wall thickness as a number.");
    expect(errors.diameter).toBe("Enter the inside diameter as a number.");
    expect(errors.frequency).toMatch(/too small: at least 0 Hz \(0 is a static field\)/);
    for (const m of Object.values(r.errors!)) expect(m).not.toMatch(/invalid input|expected number|received/i);
    expect(draftErrors({ "layers.2.material": "Unknown material", "dimensions_mm.width": "x", weird: "y" })).toEqual({ errors: { "layers.2.material": "Unknown material", width: "x" }, other: ["y"] });
  });

  it("maps cable holes: an empty collar is a plain hole, none sent when there are none", () => {
    expect(toRequestBody(defaultDesign())).not.toHaveProperty("holes");
    const mm = checkDraft({ ...defaultDesign(), holes: [newHole(), newHole({ diameter_mm: 6, collar_mm: null })] });
    expect(mm.errors).toBeNull();
    expect(mm.request!.holes).toEqual([{ diameter_mm: 10, collarLength_mm: 20 }, { diameter_mm: 6, collarLength_mm: 0 }]);
  });

  it("puts the holes' messages beside their fields, from the schema and from the server's 400", () => {
    const r = checkDraft({ ...defaultDesign(), holes: [newHole({ diameter_mm: 0 }), newHole({ collar_mm: -2 }), newHole({ diameter_mm: 60 })] });
    expect(r.request).toBeNull();
    const { errors } = draftErrors(r.errors!);
    expect(errors["holes.0.diameter"]).toMatch(/hole diameter is too small: at least 0.5 mm/i);
    expect(errors["holes.1.collar"]).toMatch(/collar length is too small: at least 0 mm/i);
    expect(errors["holes.2.diameter"]).toMatch(/narrower than the shield's smallest inside size \(50 mm\)/);
    expect(checkDraft({ ...defaultDesign(), holes: [newHole({ collar_mm: NaN })] }).errors).toHaveProperty(["holes.0.collarLength_mm"]);
    expect(draftField("holes.3.diameter_mm")).toBe("holes.3.diameter");
    expect(draftField("holes.3.collarLength_mm")).toBe("holes.3.collar");
    expect(draftErrors({ "holes.0.diameter_mm": "too big", holes: "At most 50 holes." }).errors).toEqual({ "holes.0.diameter": "too big", holes: "At most 50 holes." });
  });

  it("describes a design in the person's length unit", () => {
    const r = checkDraft(defaultDesign()).request!;
    expect(describeDesign(r)).toBe("can Ø 50 × 120 mm, 1 mm ni80");
    expect(describeDesign(r, (id) => id, "in")).toBe("can Ø 1.969 × 4.724 in, 0.03937 in ni80");
  });
});
