import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { defaultPriceList, partsForDesign, priceBuildUp } from "../../shared/fabrication";
import { contractPredictionExample, quoteConfigurationExample } from "../../shared/schemas/contract-examples";
import { designSummary } from "../../shared/schemas/design";
import { documentNumber, parseDocumentNumber } from "../../shared/schemas/documents";
import { orderCreateSchema, refundCreateSchema } from "../../shared/schemas/order";
import { priceListSchema } from "../../shared/schemas/pricing";
import { closestLibraryMaterial, forFabrication, quoteConfigurationSchema, quoteCreateSchema } from "../../shared/schemas/quote";
import { sellingLines } from "../../server/presenters/quote";
import { pdfText } from "../../server/documents/pdf";

const paths = (r: { success: boolean; error?: { issues: Array<{ path: PropertyKey[] }> } }) => (r.error?.issues ?? []).map((i) => i.path.join("."));

describe("the quote configuration", () => {
  it("accepts the contract's configuration and keeps only what the engines know", () => {
    const parsed = quoteConfigurationSchema.parse({ ...quoteConfigurationExample, colour: "red", field: { ...quoteConfigurationExample.field, extra: 1 } });
    expect(parsed).not.toHaveProperty("colour");
    expect(parsed.field).not.toHaveProperty("extra");
    expect(parsed).toMatchObject({ shape: "cylinder", method: "drawn", requiredAttenuation_db: 40, cornerRadius_mm: 3, ends: "closed", state: "annealed" });
  });

  it("names the fields either engine refuses", () => {
    const r = quoteCreateSchema.safeParse({ configuration: { ...quoteConfigurationExample, method: "bent", requiredAttenuation_db: -3 }, quantity: 1.5 });
    expect(paths(r)).toEqual(expect.arrayContaining(["configuration.method", "configuration.requiredAttenuation_db", "quantity"]));
    // the wall-against-radius check runs once the fields themselves are valid
    const thick = quoteCreateSchema.safeParse({ configuration: { ...quoteConfigurationExample, layers: [{ material: "ni80", thickness_mm: 30 }] }, quantity: 1 });
    expect(paths(thick)).toEqual(["configuration.layers.0.thickness_mm"]);
    // a sphere cannot be formed here
    expect(paths(quoteConfigurationSchema.safeParse({ ...quoteConfigurationExample, shape: "sphere", dimensions_mm: { diameter: 40 } }))).toContain("shape");
  });

  it("a layer given by its own properties keeps them for the prediction and is made in the closest library alloy", () => {
    const parsed = quoteConfigurationSchema.parse({ ...contractPredictionExample, method: "drawn", requiredAttenuation_db: 40 });
    expect(parsed.layers[0]).toEqual({ material: "ni80", thickness_mm: 1, gap_mm: 10 });
    expect(parsed.layers[1]).toEqual({ mu_r: 20000, resistivity_ohm_m: 5.8e-7, saturation_T: 0.75, thickness_mm: 1, pricedAs: "ni80" });
    expect(forFabrication(parsed).layers.map((l) => l.material)).toEqual(["ni80", "ni80"]);
    // the same parsed again (a saved design sent back) stays the same
    expect(quoteConfigurationSchema.parse(parsed)).toEqual(parsed);
    expect(closestLibraryMaterial({ mu_r: 8000, saturation_T: 1.5 })).toBe("ni50");
    expect(closestLibraryMaterial({ mu_r: 300, saturation_T: 2.1 })).toBe("steel-lc");
    expect(closestLibraryMaterial({ mu_r: 1, resistivity_ohm_m: 2.8e-8 })).toBe("aluminium");
    expect(closestLibraryMaterial({ mu_r: 1, resistivity_ohm_m: 1.7e-8 })).toBe("copper");
    expect(paths(quoteConfigurationSchema.safeParse({ ...contractPredictionExample, method: "drawn", requiredAttenuation_db: 40, layers: [{ mu_r: 2000, thickness_mm: 1 }] }))).toContain("layers.0.resistivity_ohm_m");
  });

  it("summarises a design in one line", () => {
    expect(designSummary(quoteConfigurationSchema.parse(quoteConfigurationExample))).toBe("cylinder, drawn, 2 layers, ⌀50 × 120 mm");
  });
});

describe("orders and refunds", () => {
  it("an order names its quote by id and takes a calendar date", () => {
    expect(paths(orderCreateSchema.safeParse({ quoteId: "Q-1001", requestedDate: "2026-02-30" }))).toEqual(["quoteId", "requestedDate"]);
    expect(orderCreateSchema.parse({ quoteId: "7d0b2a8e-6f7e-4c1c-9f65-1a7f8c7d1e11", purchaseOrder: "  PO-1 " }).purchaseOrder).toBe("PO-1");
  });
  it("a refund needs a reason and a positive whole number of cents", () => {
    expect(paths(refundCreateSchema.safeParse({ amount_cents: 10.5 }))).toEqual(["amount_cents", "reason"]);
    expect(refundCreateSchema.parse({ reason: "dented in transit" }).amount_cents).toBeUndefined();
  });
});

describe("document numbers", () => {
  it("print with their prefix and read back from what people type", () => {
    expect(documentNumber("quote", 1042)).toBe("Q-1042");
    expect(documentNumber("invoice", 1001)).toBe("INV-1001");
    expect(parseDocumentNumber("q-1042")).toEqual({ n: 1042, kind: "quote" });
    expect(parseDocumentNumber("INV 1001")).toEqual({ n: 1001, kind: "invoice" });
    expect(parseDocumentNumber(" 77 ")).toEqual({ n: 77, kind: null });
    expect(parseDocumentNumber("XY-5")).toBeNull();
    expect(parseDocumentNumber("PO-ALPHA")).toBeNull();
  });
});

describe("the shop rates document", () => {
  it("a version saved before lead time and validity existed parses with their defaults", () => {
    const { leadTimeWorkingDays: _l, quoteValidityDays: _v, ...old } = defaultPriceList;
    expect(priceListSchema.parse(old)).toMatchObject({ leadTimeWorkingDays: 20, quoteValidityDays: 30 });
  });
});

describe("selling lines", () => {
  const cup = (t: number, gap: number) =>
    partsForDesign({ shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 }, cornerRadius_mm: 3, layers: [{ thickness_mm: t, gap_mm: gap, materialId: "ni80", density_kg_m3: 8740 }, { thickness_mm: t, materialId: "ni50", density_kg_m3: 8250 }] });

  it("spread the margin over the lines to the cent, show no rate, and add up to the quoted total [derived]", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 500 }), fc.constantFrom(0.5, 1, 1.5), fc.integer({ min: 0, max: 20 }), fc.integer({ min: 0, max: 60 }), (quantity, t, gap, margin) => {
        const price = priceBuildUp({ parts: cup(t, gap), quantity, priceList: { ...defaultPriceList, marginPercent: margin } });
        const lines = sellingLines(price);
        expect(lines.reduce((s, l) => s + l.total_cents, 0)).toBe(price.subtotal_cents + price.margin_cents);
        expect(lines.every((l) => !("unit_cents" in l))).toBe(true);
        expect(price.subtotal_cents + price.margin_cents - price.discount_cents + price.rounding_cents).toBe(price.total_cents);
        // each line carries its share of the margin: within a cent of line × (1 + margin)
        const byKey = new Map(price.lines.map((l) => [l.key, l.total_cents]));
        for (const l of lines) expect(Math.abs(l.total_cents - byKey.get(l.key)! * (1 + price.margin_cents / price.subtotal_cents))).toBeLessThan(1);
      }),
      { numRuns: 60 },
    );
  });
});

describe("PDF text", () => {
  it("maps the few signs the shipped fonts lack", () => {
    expect(pdfText("⌀50 × 120 mm, μr ≥ 20 000 ≈ ok")).toBe("dia. 50 × 120 mm, µr >= 20 000 ~ ok");
    expect(pdfText("Sølvberg – €12")).toBe("Sølvberg – €12");
    expect(pdfText("漢")).toBe("?");
  });
});
