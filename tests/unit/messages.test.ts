import { describe, expect, it } from "vitest";
import { blankRequestSchema } from "../../shared/schemas/blank";
import { describeIssue, fieldWords, issueFields } from "../../shared/schemas/messages";
import { materialUpdateSchema } from "../../shared/schemas/material";
import { priceEstimateRequestSchema } from "../../shared/schemas/price-estimate";
import { priceRatesSchema, stockSheetsUpdateSchema } from "../../shared/schemas/shop-rates";
import { defaultPriceList } from "../../shared/fabrication";

// One error map for the server and the forms: each message names the field in plain words and
// says what would be right.
const fieldsOf = (r: { success: boolean; error?: unknown }) => issueFields((r as { error: Parameters<typeof issueFields>[0] }).error);

describe("form and API messages in plain words", () => {
  it("names the field and what would be right: 'Seam overlap must be at least 0 mm.'", () => {
    const r = blankRequestSchema.safeParse({ shape: "cylinder", method: "rolled", dimensions_mm: { diameter: 50, length: 0 }, thickness_mm: 1, seamOverlap_mm: -1 });
    expect(fieldsOf(r)).toEqual({ seamOverlap_mm: "Seam overlap must be at least 0 mm.", "dimensions_mm.length": "Inside length must be more than 0 mm." });
  });

  it("never zod's defaults: an empty box and NaN from a number input read as sentences", () => {
    const r = blankRequestSchema.safeParse({ shape: "box", method: "bent", dimensions_mm: { width: NaN, depth: null, height: 40 }, thickness_mm: "1", bendRadius_mm: 1, kFactor: NaN });
    const f = fieldsOf(r);
    expect(f).toMatchObject({
      "dimensions_mm.width": "Inside width must be a number in mm.",
      "dimensions_mm.depth": "Enter the inside depth in mm.",
      thickness_mm: "Sheet thickness must be a number in mm.",
      kFactor: "K-factor must be a number.",
    });
    for (const m of Object.values(f)) expect(m).not.toMatch(/invalid input|expected|received/i);
  });

  it("money speaks of amounts, never of cents; percentages and lists in words", () => {
    const f = fieldsOf(priceRatesSchema.safeParse({ ...defaultPriceList, materials: [{ materialId: "", pricePerKg_cents: -5, scrapCreditPerKg_cents: NaN }], marginPercent: 120, blankingPerPart_cents: null }));
    expect(f).toMatchObject({
      "materials.0.materialId": "Choose the material.",
      "materials.0.pricePerKg_cents": "Price per kg must not be negative.",
      "materials.0.scrapCreditPerKg_cents": "Scrap credit per kg must be a number.",
      marginPercent: "Margin must be at most 100 %.",
      blankingPerPart_cents: "Enter the blanking rate per blank.",
    });
    expect(fieldsOf(stockSheetsUpdateSchema.safeParse({ stockSheets: [{ materialId: "ni80", thickness_mm: 0, width_mm: 610, length_mm: 1524 }] }))).toEqual({ "stockSheets.0.thickness_mm": "Gauge must be more than 0 mm." });
  });

  it("names a layer's field by the layer, counted from one", () => {
    expect(fieldWords(["configuration", "layers", 1, "thickness_mm"])).toEqual({ label: "wall thickness of layer 2", unit: "mm" });
    const f = fieldsOf(priceEstimateRequestSchema.safeParse({ configuration: { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, layers: [{ material: "ni80", thickness_mm: -1 }] }, quantity: 0 }));
    expect(f["configuration.layers.0.thickness_mm"]).toBe("Wall thickness of layer 1 must be more than 0 mm.");
    expect(f.quantity).toBe("Quantity must be at least 1 piece.");
  });

  it("a schema's own words for a rule still come first (material values keep theirs)", () => {
    const r = materialUpdateSchema.safeParse({});
    expect(fieldsOf(r).name).toBe("Give a name.");
    expect(describeIssue({ code: "too_big", origin: "string", maximum: 5, path: ["name"], input: "xxxxxxx", message: "" } as never)).toBe("Name must be at most 5 characters long.");
  });
});
