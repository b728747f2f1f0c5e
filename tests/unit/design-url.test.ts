import { describe, expect, it } from "vitest";
import { chartRangeFromParams, chartRangeToParams, designFromParams, designToParams, sameDesign } from "../../src/features/design-check/design-url";
import { checkDraft, defaultDesign, newHole, newLayer, type DesignDraft } from "../../src/features/design-check/design-model";
import { defaultRange } from "../../src/features/design-check/chart-range";

const strip = (d: DesignDraft) => ({ ...d, layers: d.layers.map(({ key: _k, ...l }) => l), holes: d.holes.map(({ key: _k, ...h }) => h) });

describe("a design in the address bar", () => {
  it("round-trips every part of a design: shape, sizes, layers (library and custom), holes, field, units", () => {
    const d: DesignDraft = {
      ...defaultDesign(),
      shape: "cylinder",
      diameter_mm: 63.5,
      length_mm: 150.000014,
      ends: "open",
      method: "rolled",
      layers: [newLayer({ material: "ni50", thickness_mm: 1.5, gap_mm: 8 }), newLayer({ kind: "custom", mu_r: 30000, resistivity_uohm_m: 0.55, saturation_T: null, thickness_mm: 0.5, gap_mm: null })],
      state: "as-formed",
      amplitude_uT: 2500,
      frequency_hz: 1200,
      orientation: "axial",
      holes: [newHole({ diameter_mm: 8, collar_mm: 16 }), newHole({ diameter_mm: 5, collar_mm: null })],
      units: { length: "in", field: "mT", frequency: "kHz" },
    };
    const back = designFromParams(new URLSearchParams(designToParams(d).toString()));
    expect(strip(back)).toEqual(strip(d));
    expect(sameDesign(back, d)).toBe(true);
    expect(checkDraft(back).request).toEqual(checkDraft(d).request);
  });

  it("a box and a sphere keep only what they use, and come back the same", () => {
    for (const shape of ["box", "sphere"] as const) {
      const d = { ...defaultDesign(), shape };
      const p = designToParams(d);
      expect(p.has("l")).toBe(false);
      expect(checkDraft(designFromParams(p)).request).toEqual(checkDraft(d).request);
    }
  });

  it("an empty box stays empty and a typo stays a typo (the form says what is wrong), rather than turning into a default", () => {
    const d = { ...defaultDesign(), diameter_mm: null, frequency_hz: NaN };
    const back = designFromParams(designToParams(d));
    expect(back.diameter_mm).toBeNull();
    expect(back.frequency_hz).toBeNaN();
    expect(checkDraft(back).errors).toHaveProperty(["dimensions_mm.diameter"]);
  });

  it("a bare, old or hand-edited link opens a design: unknown values fall back to the defaults", () => {
    expect(checkDraft(designFromParams(new URLSearchParams(""))).request).toEqual(checkDraft(defaultDesign()).request);
    const odd = designFromParams(new URLSearchParams("shape=cube&lu=furlong&layer=ni80&B=oops&d=60"));
    expect(odd.shape).toBe("cylinder");
    expect(odd.units.length).toBe("mm");
    expect(odd.layers[0]).toMatchObject({ material: "ni80", thickness_mm: 1 });
    expect(odd.diameter_mm).toBe(60);
    expect(odd.amplitude_uT).toBeNaN();
    expect(designFromParams(new URLSearchParams(Array.from({ length: 20 }, () => "layer=ni80:1:2").join("&"))).layers).toHaveLength(6);
  });

  it("equal designs write equal strings, whatever their React keys (so the page can tell its own writes from back and forward)", () => {
    expect(designToParams(defaultDesign()).toString()).toBe(designToParams(defaultDesign()).toString());
    expect(designToParams(defaultDesign()).toString()).toBe(
      "shape=cylinder&d=50&l=120&ends=closed&method=drawn&layer=ni80%3A1%3A10&state=annealed&B=100&f=60&dir=transverse&lu=mm&fu=uT&fq=Hz",
    );
  });

  it("the chart's range travels beside the design", () => {
    const p = chartRangeToParams({ from_hz: 0.5, to_hz: 5000 }, designToParams(defaultDesign()));
    expect(chartRangeFromParams(p, defaultRange())).toEqual({ from_hz: 0.5, to_hz: 5000 });
    expect(chartRangeFromParams(new URLSearchParams(), defaultRange())).toEqual(defaultRange());
  });
});
