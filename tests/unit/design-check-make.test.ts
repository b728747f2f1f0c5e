import { describe, expect, it } from "vitest";
import { partsForDesign } from "../../shared/fabrication";
import { blankRequestSchema } from "../../shared/schemas/blank";
import { priceEstimateRequestSchema } from "../../shared/schemas/price-estimate";
import { paths } from "../../src/config/paths";
import { checkDraft, defaultDesign, newHole, newLayer, type DesignDraft } from "../../src/features/design-check/design-model";
import { flatBlankPrefill, layerBlankRequests, methodOf, toPriceEstimateBody, tooManyDraws } from "../../src/features/design-check/make-model";
import { suggestKFactor } from "../../shared/fabrication/bend";
import { DEFAULT_CORNER_RADIUS_MM, DEFAULT_SEAM_OVERLAP_MM } from "../../shared/construction-defaults";
import { blankFromParams, initialBlankForm, suggestedK, toBlankRequest } from "../../src/features/fabrication/blank-form";

const requestOf = (d: DesignDraft) => {
  const r = checkDraft(d);
  if (!r.request) throw new Error(JSON.stringify(r.errors));
  return r.request;
};
const twoLayerCan = () => {
  const d = defaultDesign();
  d.layers = [newLayer({ thickness_mm: 1, gap_mm: 5 }), newLayer({ material: "ni50", thickness_mm: 1.5 })];
  return requestOf(d);
};

describe("design check → what it takes to make", () => {
  it("maps the form to the price-estimate body the server accepts: inside dimensions, layers, method, quantity", () => {
    const r = toPriceEstimateBody(twoLayerCan(), "drawn", 10);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.body).toEqual({
      configuration: { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 120 }, layers: [{ material: "ni80", thickness_mm: 1, gap_mm: 5 }, { material: "ni50", thickness_mm: 1.5 }], cornerRadius_mm: DEFAULT_CORNER_RADIUS_MM, trim_mm: 0 },
      quantity: 10,
    });
    expect(priceEstimateRequestSchema.safeParse(r.body).success).toBe(true);
    const rolled = toPriceEstimateBody(twoLayerCan(), "rolled", 3);
    expect(rolled.ok && rolled.body.configuration).toMatchObject({ method: "rolled", seamOverlap_mm: DEFAULT_SEAM_OVERLAP_MM });

    const box = requestOf({ ...defaultDesign(), shape: "box" });
    const b = toPriceEstimateBody(box, "bent", 25);
    // bend radius and K from the shared defaults, as the engine takes them per layer
    expect(b.ok && b.body).toEqual({ configuration: { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, layers: [{ material: "ni80", thickness_mm: 1 }], lid: true }, quantity: 25 });
    expect(b.ok && priceEstimateRequestSchema.safeParse(b.body).success).toBe(true);
  });

  it("sends the cable holes with the price request, so their collars become parts and are priced", () => {
    const d = defaultDesign();
    d.layers = [newLayer({ thickness_mm: 1, gap_mm: 5 }), newLayer({ material: "ni50", thickness_mm: 1.5 })];
    d.holes = [newHole({ diameter_mm: 8, collar_mm: 16 }), newHole({ diameter_mm: 5, collar_mm: null })];
    for (const method of ["drawn", "rolled"] as const) {
      const r = toPriceEstimateBody(requestOf(d), method, 10);
      if (!r.ok) throw new Error(r.message);
      expect(r.body.configuration.holes).toEqual([{ diameter_mm: 8, collarLength_mm: 16 }, { diameter_mm: 5, collarLength_mm: 0 }]);
      expect(priceEstimateRequestSchema.safeParse(r.body).success).toBe(true);
    }
    const box = toPriceEstimateBody(requestOf({ ...d, shape: "box" }), "bent", 1);
    expect(box.ok && box.body.configuration.holes).toEqual([{ diameter_mm: 8, collarLength_mm: 16 }, { diameter_mm: 5, collarLength_mm: 0 }]);
    // the engine makes one collar per collared hole on each layer, telescoping: 8 mm, then 8 + 2·1 mm
    const r = toPriceEstimateBody(requestOf(d), "drawn", 1);
    if (!r.ok) throw new Error(r.message);
    const c = r.body.configuration;
    const parts = partsForDesign({ ...c, layers: c.layers.map((l) => ({ thickness_mm: l.thickness_mm, gap_mm: l.gap_mm })), holes: c.holes!.filter((h) => (h.collarLength_mm ?? 0) > 0) } as Parameters<typeof partsForDesign>[0]);
    const collars = parts.filter((p) => p.role === "collar");
    expect(collars.map((p) => p.layer)).toEqual([0, 1]);
    expect(collars.every((p) => p.blank.kind === "rectangle" && p.blank.width_mm === 16)).toBe(true);
  });

  it("says in plain words what cannot be priced: a sphere, a custom μr layer, a bad quantity", () => {
    expect(toPriceEstimateBody(requestOf({ ...defaultDesign(), shape: "sphere" }), null, 10)).toMatchObject({ ok: false, reason: "not-made" });
    const d = defaultDesign();
    d.layers = [newLayer(), newLayer({ kind: "custom", mu_r: 20000, resistivity_uohm_m: 0.58, thickness_mm: 1 })];
    const custom = toPriceEstimateBody(requestOf(d), "drawn", 10);
    expect(custom).toMatchObject({ ok: false, reason: "custom-material", layers: [1] });
    expect(!custom.ok && custom.message).toMatch(/layer 2 has a custom μr/i);
    for (const q of [0, 2.5, null, NaN, 100001]) expect(toPriceEstimateBody(twoLayerCan(), "drawn", q)).toMatchObject({ ok: false, reason: "quantity" });
  });

  it("sizes each layer's blank from its own inside, as the engine's parts list does", () => {
    const request = twoLayerCan();
    for (const method of ["drawn", "rolled"] as const) {
      const blanks = layerBlankRequests(request, method);
      expect(blanks).toHaveLength(2);
      expect(blanks[1].dimensions_mm).toEqual({ diameter: 50 + 2 * (1 + 5), length: 120 + 2 * (1 + 5) });
      for (const b of blanks) expect(blankRequestSchema.safeParse(b).success).toBe(true);
    }
    // the same blanks as the price estimate's parts (same engine, same inputs)
    const body = toPriceEstimateBody(request, "drawn", 1);
    if (!body.ok) throw new Error("not priced");
    const parts = partsForDesign({ ...body.body.configuration, layers: body.body.configuration.layers.map((l) => ({ thickness_mm: l.thickness_mm, gap_mm: l.gap_mm })) } as Parameters<typeof partsForDesign>[0]);
    expect(parts.map((p) => p.blank.kind)).toEqual(["disc", "disc"]);
    const box = layerBlankRequests(requestOf({ ...defaultDesign(), shape: "box" }), "bent");
    expect(box[0]).toMatchObject({ method: "bent", bendRadius_mm: 1, kFactor: suggestKFactor(1, 1), lidHeight_mm: 10 });
    // the box's blanks are the engine's parts for the price, bend for bend
    const boxBody = toPriceEstimateBody(requestOf({ ...defaultDesign(), shape: "box" }), "bent", 1);
    if (!boxBody.ok) throw new Error("not priced");
    const boxParts = partsForDesign({ ...boxBody.body.configuration, layers: [{ thickness_mm: 1 }] } as Parameters<typeof partsForDesign>[0]);
    expect(boxParts[0].bendCount).toBe(4);
    expect(layerBlankRequests(requestOf({ ...defaultDesign(), shape: "sphere" }), "drawn")).toEqual([]);
  });

  it("is made as the design says: a can drawn or rolled, a box bent, a sphere not made; more than four draws is flagged", () => {
    expect(methodOf(twoLayerCan())).toBe("drawn");
    expect(methodOf(requestOf({ ...defaultDesign(), method: "rolled" }))).toBe("rolled");
    expect(methodOf(requestOf({ ...defaultDesign(), shape: "box" }))).toBe("bent");
    expect(methodOf(requestOf({ ...defaultDesign(), shape: "sphere" }))).toBeNull();
    expect(tooManyDraws([1, 3, 4])).toBeNull();
    expect(tooManyDraws([2, 5])).toBe(5);
    expect(tooManyDraws(null)).toBeNull();
  });

  it("the flat-blank page opens on the design check's default part, with the same construction defaults (corner radius, seam overlap, bend radius and K-factor)", () => {
    const one = requestOf(defaultDesign());
    // the page's first blank is exactly the design check's first layer's blank
    expect(toBlankRequest(initialBlankForm)).toEqual(layerBlankRequests(one, "drawn")[0]);
    const asForm = (b: Parameters<typeof flatBlankPrefill>[0]) => blankFromParams(new URL(paths.flatBlank.href(flatBlankPrefill(b)), "http://x").searchParams);
    const drawn = asForm(layerBlankRequests(one, "drawn")[0]);
    expect(drawn.cornerRadius_mm).toBe(initialBlankForm.cornerRadius_mm);
    expect(drawn.trim_mm).toBe(initialBlankForm.trim_mm);
    expect(asForm(layerBlankRequests(one, "rolled")[0]).seamOverlap_mm).toBe(initialBlankForm.seamOverlap_mm);
    const box = asForm(layerBlankRequests(requestOf({ ...defaultDesign(), shape: "box" }), "bent")[0]);
    expect(box.bendRadius_mm).toBe(initialBlankForm.bendRadius_mm);
    expect(box.kFactor).toBe(suggestedK(initialBlankForm)); // the page's own "typical K" for that radius
  });

  it("a part's link opens the flat-blank page with the same inputs", () => {
    const [, outer] = layerBlankRequests(twoLayerCan(), "drawn");
    const href = paths.flatBlank.href(flatBlankPrefill(outer));
    expect(href).toMatch(/^\/flat-blank\?/);
    const form = blankFromParams(new URL(href, "http://x").searchParams);
    // the outer cup keeps the gap round the corner: the shared 3 mm plus the 6 mm of the layer inside
    expect(form).toMatchObject({ kind: "cylinder-drawn", diameter_mm: 62, length_mm: 132, thickness_mm: 1.5, cornerRadius_mm: DEFAULT_CORNER_RADIUS_MM + 6, trim_mm: 0, material: "ni50" });
    expect(toBlankRequest(form)).toEqual(outer);
    const [box] = layerBlankRequests(requestOf({ ...defaultDesign(), shape: "box" }), "bent");
    expect(blankFromParams(new URL(paths.flatBlank.href(flatBlankPrefill(box)), "http://x").searchParams)).toMatchObject({ kind: "box-bent", width_mm: 80, depth_mm: 60, height_mm: 40, bendRadius_mm: 1, kFactor: suggestKFactor(1, 1) });
    // unknown kinds and keys are ignored; "none" is no material
    expect(blankFromParams(new URLSearchParams("kind=sphere&material=none&colour=red"))).toMatchObject({ kind: initialBlankForm.kind, material: "" });
    expect(paths.flatBlank.href()).toBe("/flat-blank");
  });
});
