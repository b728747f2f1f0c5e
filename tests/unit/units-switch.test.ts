import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { amountFromCents, centsFromAmount, readNumber, showAmount, showInUnit, tidyNumber, toCanonical } from "../../shared/units";
import { canonicalOf, moneyScale, quantityScale } from "../../src/components/ui/unit-input";
import { designFromParams, designToParams } from "../../src/features/design-check/design-url";
import { checkDraft, defaultDesign, type DesignDraft } from "../../src/features/design-check/design-model";

// A unit switch changes what is shown, never the quantity: the state keeps canonical values
// (mm, µT, Hz, cents) and each box derives its text from them.

/** What the page does on a unit switch: the box re-shows the kept value; the kept value is untouched. */
function switchUnits(d: DesignDraft, units: DesignDraft["units"]): DesignDraft {
  return { ...d, units };
}

describe("units that convert the value shown, never the quantity", () => {
  it("inches and back leave the design exactly as it was (no 119.99 mm)", () => {
    const d = defaultDesign();
    const before = checkDraft(d).request;
    const inches = switchUnits(d, { ...d.units, length: "in" });
    expect(showInUnit("length", inches.length_mm, "in")).toBe("4.72441");
    const back = switchUnits(inches, { ...d.units, length: "mm" });
    expect(showInUnit("length", back.length_mm, "mm")).toBe("120");
    expect(checkDraft(back).request).toEqual(before);
    // and through the address bar too: the same design whatever the units
    expect(checkDraft(designFromParams(designToParams(inches))).request).toEqual(before);
  });

  it("switching µT to mT keeps the field: 100 µT shows as 0.1 mT, never as a 100 mT design", () => {
    const d = defaultDesign();
    const mT = switchUnits(d, { ...d.units, field: "mT" });
    expect(showInUnit("flux", mT.amplitude_uT, "mT")).toBe("0.1");
    expect(checkDraft(mT).request!.field.amplitude_uT).toBe(100);
    expect(showInUnit("flux", 100, "G")).toBe("1");
    expect(showInUnit("frequency", 1200, "kHz")).toBe("1.2");
  });

  it("any length typed in any unit, shown in another and back, reads back the number typed [derived]", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 10_000, noNaN: true }), fc.constantFrom("mm", "in", "mil" as const), fc.constantFrom("mm", "in", "mil" as const), (typed, from, to) => {
        const kept = canonicalOf(tidyNumber(typed), quantityScale("length", from))!;
        const shownElsewhere = showInUnit("length", kept, to);
        // the kept value is untouched by showing it; showing it in its first unit gives the typed figure
        return shownElsewhere !== "" && showInUnit("length", kept, from) === tidyNumber(typed) && Math.abs(toCanonical("length", +tidyNumber(typed), from) - kept) === 0;
      }),
    );
  });

  it("reads what people type: comma decimals, spaced digit groups, a typographic minus; empty is null, words are NaN", () => {
    expect(readNumber("1,5")).toBe(1.5);
    expect(readNumber(" 8 750 ")).toBe(8750);
    expect(readNumber("\u22123.5")).toBe(-3.5);
    expect(readNumber("2e-3")).toBe(0.002);
    expect(readNumber("")).toBeNull();
    expect(readNumber("12abc")).toBeNaN();
    expect(readNumber("1.2.3")).toBeNaN();
  });

  it("money is typed in currency units and kept in whole cents (19.99 € → 1999, not 1998)", () => {
    expect(centsFromAmount(19.99, "EUR")).toBe(1999);
    expect(centsFromAmount(0.1 + 0.2, "EUR")).toBe(30);
    expect(centsFromAmount(1500, "JPY")).toBe(1500); // no minor unit [pub: ISO 4217]
    expect(amountFromCents(9500, "EUR")).toBe(95);
    expect(showAmount(9500, "EUR")).toBe("95.00");
    expect(canonicalOf("95", moneyScale("EUR"))).toBe(9500);
    expect(canonicalOf("1 234,5", moneyScale("EUR"))).toBe(123450);
  });
});
