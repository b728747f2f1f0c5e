import { describe, expect, it } from "vitest";
import { customerPrice, defaultPriceList, partsForDesign, priceBuildUp, spreadCents } from "../../shared/fabrication";
import { formatMoney, MINUS } from "../../src/lib/money";

const parts = partsForDesign({
  shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 60 },
  layers: [{ thickness_mm: 1, materialId: "ni80", density_kg_m3: 8740 }], cornerRadius_mm: 3,
});

describe("what a customer sees of a price", () => {
  const shop = priceBuildUp({ parts, quantity: 10, priceList: defaultPriceList });
  const customer = customerPrice(shop);

  it("no margin line and no rate: the lines carry the margin and still add up", () => {
    expect(customer).not.toHaveProperty("margin_cents");
    expect(customer).not.toHaveProperty("marginPercent");
    expect(customer).not.toHaveProperty("material");
    for (const l of customer.lines) expect(l).not.toHaveProperty("unit_cents");
    expect(customer.lines.reduce((s, l) => s + l.total_cents, 0)).toBe(customer.subtotal_cents);
    expect(customer.subtotal_cents).toBe(shop.subtotal_cents + shop.margin_cents);
    // the same price in the end
    expect(customer.subtotal_cents - customer.discount_cents + customer.rounding_cents).toBe(customer.total_cents);
    expect([customer.unitPrice_cents, customer.total_cents]).toEqual([shop.unitPrice_cents, shop.total_cents]);
  });

  it("spreads whole cents by the largest remainder, so the sum is exact [derived]", () => {
    expect(spreadCents([1, 1, 1], 100)).toEqual([34, 33, 33]);
    expect(spreadCents([100, -10, 10], 118)).toEqual([118, -12, 12]);
    expect(spreadCents([0, 0], 0)).toEqual([0, 0]);
    const w = shop.lines.map((l) => l.total_cents);
    expect(spreadCents(w, 123457).reduce((a, b) => a + b, 0)).toBe(123457);
  });

  it("one minus sign: credits and discounts are written with U+2212, never a hyphen", () => {
    expect(formatMoney(-900, "EUR")).toBe(`${MINUS}€9.00`);
    expect(formatMoney(-123456, "EUR")).toBe(`${MINUS}€1,234.56`);
    expect(formatMoney(900, "EUR")).toBe("€9.00");
    expect(formatMoney(-0, "EUR")).toBe("€0.00");
    const credit = shop.lines.find((l) => l.key.startsWith("scrap-credit"))!;
    expect(formatMoney(credit.total_cents, "EUR").startsWith(MINUS)).toBe(true);
  });
});
