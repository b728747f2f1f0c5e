import { describe, expect, it } from "vitest";
import { defaultPriceList, partsForDesign, priceBuildUp } from "../../shared/fabrication";
import { priceListSchema } from "../../shared/schemas/pricing";

const parts = partsForDesign({
  shape: "cylinder",
  method: "rolled",
  dimensions_mm: { diameter: 50, length: 120 },
  layers: [
    { thickness_mm: 1, gap_mm: 10, materialId: "ni80", density_kg_m3: 8740 },
    { thickness_mm: 1.5, materialId: "ni50", density_kg_m3: 8250 },
  ],
  seamOverlap_mm: 6,
  holes: [{ diameter_mm: 8, collarLength_mm: 16 }],
});

describe("price build-up", () => {
  it("default price list passes its own schema", () => {
    expect(priceListSchema.safeParse(defaultPriceList).success).toBe(true);
  });

  for (const quantity of [1, 7, 25, 300]) {
    it(`quantity ${quantity}: integer cents, lines sum to subtotal, subtotal + margin − discount + rounding = total`, () => {
      const p = priceBuildUp({ parts, quantity, priceList: defaultPriceList, sampleSize: Math.min(quantity, 5) });
      for (const l of p.lines) {
        expect(Number.isInteger(l.unit_cents)).toBe(true);
        expect(Number.isInteger(l.total_cents)).toBe(true);
        expect(Math.abs(l.total_cents - l.quantity * l.unit_cents)).toBeLessThanOrEqual(0.5);
      }
      expect(p.lines.reduce((s, l) => s + l.total_cents, 0)).toBe(p.subtotal_cents);
      expect(p.subtotal_cents + p.margin_cents - p.discount_cents + p.rounding_cents).toBe(p.total_cents);
      expect(p.total_cents).toBe(p.unitPrice_cents * quantity);
      expect(Math.abs(p.rounding_cents)).toBeLessThanOrEqual(quantity / 2);
      for (const v of [p.subtotal_cents, p.margin_cents, p.discount_cents, p.unitPrice_cents, p.total_cents]) expect(Number.isInteger(v)).toBe(true);
      expect(p.currency).toBe("EUR");
    });
  }

  it("setup is charged once, so the unit price falls with quantity; breaks apply", () => {
    const one = priceBuildUp({ parts, quantity: 1, priceList: defaultPriceList });
    const many = priceBuildUp({ parts, quantity: 60, priceList: defaultPriceList });
    expect(one.lines.find((l) => l.key === "setup")!.total_cents).toBe(defaultPriceList.setupPerJob_cents);
    expect(many.lines.find((l) => l.key === "setup")!.total_cents).toBe(defaultPriceList.setupPerJob_cents);
    expect(many.unitPrice_cents).toBeLessThan(one.unitPrice_cents);
    expect(many.discountPercent).toBe(7);
  });

  it("material charged on gross mass from nesting; scrap credit negative", () => {
    const p = priceBuildUp({ parts, quantity: 10, priceList: defaultPriceList });
    for (const m of p.material) {
      expect(m.gross_kg).toBeGreaterThan(m.net_kg);
      expect(m.sheet).toBeDefined();
    }
    const scrap = p.lines.filter((l) => l.key.startsWith("scrap-credit"));
    expect(scrap.length).toBe(2);
    for (const l of scrap) expect(l.total_cents).toBeLessThan(0);
    const noCredit = priceBuildUp({ parts, quantity: 10, priceList: { ...defaultPriceList, scrapCredit: false } });
    expect(noCredit.lines.some((l) => l.key.startsWith("scrap-credit"))).toBe(false);
  });

  it("schema rejects non-integer cents and a bad currency", () => {
    const r = priceListSchema.safeParse({ ...defaultPriceList, currency: "eur", setupPerJob_cents: 10.5 });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join("."))).toEqual(expect.arrayContaining(["currency", "setupPerJob_cents"]));
  });
});
