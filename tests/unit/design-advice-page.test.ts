import { describe, expect, it } from "vitest";
import type { DesignCandidateJson } from "../../shared/schemas/design-advice";
import { nextSort, sortFront } from "../../src/features/design-advice/front-sort";
import {
  checkRequirement, defaultRequirement, readAsked, requirementErrors, requirementField, requirementFromParams, requirementToParams, writeAsked, type RequirementDraft,
} from "../../src/features/design-advice/requirement-model";
import { toCanonical } from "../../shared/units";

describe("the design advisor's requirement form", () => {
  it("sends the issue's example as the contract's body: 60 dB at 60 Hz, 100 µT across a 50 mm × 120 mm can [derived: api-contract.md, Design advice]", () => {
    const checked = checkRequirement(defaultRequirement());
    expect(checked.errors).toBeNull();
    expect(checked.request).toMatchObject({
      shape: "cylinder",
      dimensions_mm: { diameter: 50, length: 120 },
      requiredAttenuation_db: 60,
      field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" },
      quantity: 10,
      constraints: { maxLayers: 3 },
    });
    // no limit set: none sent, so the server uses every alloy and method the shop offers
    expect(checked.request!.constraints).not.toHaveProperty("materials");
    expect(checked.request!.constraints).not.toHaveProperty("maxOutside_mm");
  });

  it("keeps the typed units' meaning: 1 G is 100 µT, 2 in is 50.8 mm [pub: NIST SP 811, 1 G = 1e-4 T; 1 in = 25.4 mm exactly]", () => {
    expect(toCanonical("flux", 1, "G")).toBeCloseTo(100, 9);
    const d: RequirementDraft = { ...defaultRequirement(), inside: { ...defaultRequirement().inside, diameter: toCanonical("length", 2, "in") }, amplitude_uT: toCanonical("flux", 1, "G") };
    const r = checkRequirement(d).request!;
    expect(r.dimensions_mm).toMatchObject({ diameter: 50.8 });
    expect(r.field.amplitude_uT).toBeCloseTo(100, 9);
  });

  it("sends only the limits that are set, a box's with its own sizes and no methods", () => {
    const d: RequirementDraft = {
      ...defaultRequirement(),
      shape: "box",
      inside: { diameter: null, length: null, width: 80, depth: 60, height: 40 },
      materials: ["ni80"],
      methods: ["rolled"],
      outside: { diameter: null, length: null, width: 120, depth: null, height: null },
      maxMass_kg: 2,
      maxLayers: 2,
    };
    const r = checkRequirement(d).request!;
    expect(r.shape).toBe("box");
    expect(r.constraints).toEqual({ maxLayers: 2, materials: ["ni80"], maxOutside_mm: { width: 120 }, maxMass_kg: 2 });
  });

  it("names the field for each problem, with the schema's own words", () => {
    const d: RequirementDraft = { ...defaultRequirement(), requiredAttenuation_db: null, frequency_hz: NaN, inside: { ...defaultRequirement().inside, length: -3 } };
    expect(Object.keys(checkRequirement(d).errors!).sort()).toEqual(["frequency_hz", "inside.length", "requiredAttenuation_db"]);
    // an outside limit inside the space it must hold
    const tight = checkRequirement({ ...defaultRequirement(), outside: { ...defaultRequirement().outside, diameter: 40 } }).errors!;
    expect(Object.keys(tight)).toEqual(["outside.diameter"]);
    expect(tight["outside.diameter"]).toMatch(/largest outside diameter/i);
    // the server's answers land on the same fields; what belongs to no field goes under the limits
    expect(requirementField("constraints.materials.0")).toBe("materials");
    expect(requirementField("constraints.maxOutside_mm.length")).toBe("outside.length");
    expect(requirementErrors({ constraints: "This search would take 60000 designs" })).toEqual({ constraints: "This search would take 60000 designs" });
  });

  it("round-trips the asked requirement through the address bar, and a bare address asks nothing", () => {
    const d: RequirementDraft = {
      ...defaultRequirement(),
      inside: { diameter: 63.5, length: 150.000014, width: 60, depth: 60, height: 60 },
      orientation: "axial",
      materials: ["ni50", "ni80"],
      methods: ["drawn"],
      outside: { diameter: 90, length: null, width: null, depth: null, height: null },
      maxMass_kg: 1.5,
      maxLayers: 4,
      units: { length: "in", field: "G", frequency: "kHz" },
    };
    const back = requirementFromParams(new URLSearchParams(requirementToParams(d).toString()))!;
    expect(checkRequirement(back).request).toEqual(checkRequirement(d).request);
    expect(back.units).toEqual(d.units);
    expect(requirementToParams(back).toString()).toBe(requirementToParams(d).toString());
    expect(readAsked(new URLSearchParams(""))).toBeNull();
    expect(writeAsked(null).toString()).toBe("");
  });

  it("reads a hand-edited address without failing: unreadable numbers reach the form as problems, unknown choices fall back", () => {
    const d = requirementFromParams(new URLSearchParams("shape=sphere&d=abc&layers=9&method=welded&fu=furlong"))!;
    expect(d.shape).toBe("cylinder");
    expect(d.maxLayers).toBe(3);
    expect(d.methods).toEqual([]);
    expect(d.units.field).toBe("uT");
    expect(checkRequirement(d).errors).toHaveProperty("inside.diameter");
  });
});

const candidate = (summary: string, price: number, db: number, kg: number, layers = 1): DesignCandidateJson =>
  ({
    summary,
    unitPrice_cents: price,
    attenuation_db: db,
    band: { low_db: db - 5, high_db: db + 5 },
    mass_kg: kg,
    outside_mm: { diameter: 60 + layers, length: 130 },
    configuration: { layers: Array.from({ length: layers }, () => ({ material: "ni80", thickness_mm: 1 })) },
  }) as unknown as DesignCandidateJson;

describe("the front table's order", () => {
  const rows = [candidate("b", 300, 70, 0.4, 2), candidate("a", 200, 65, 0.5, 1), candidate("c", 300, 90, 0.3, 3)];

  it("sorts by any figure either way, ties by price then name, keeping each row's index in the answer", () => {
    expect(sortFront(rows, { key: "price", descending: false }).map((r) => r.candidate.summary)).toEqual(["a", "b", "c"]);
    expect(sortFront(rows, { key: "attenuation", descending: true }).map((r) => r.index)).toEqual([2, 0, 1]);
    expect(sortFront(rows, { key: "mass", descending: false }).map((r) => r.candidate.summary)).toEqual(["c", "b", "a"]);
    expect(sortFront(rows, { key: "layers", descending: true }).map((r) => r.candidate.summary)).toEqual(["c", "b", "a"]);
    expect(rows.map((r) => r.summary)).toEqual(["b", "a", "c"]); // the answer itself is left alone
  });

  it("turns the order round on a second click; a new column starts its natural way", () => {
    expect(nextSort({ key: "price", descending: false }, "price")).toEqual({ key: "price", descending: true });
    expect(nextSort({ key: "price", descending: false }, "attenuation")).toEqual({ key: "attenuation", descending: true });
    expect(nextSort({ key: "attenuation", descending: true }, "mass")).toEqual({ key: "mass", descending: false });
  });
});
