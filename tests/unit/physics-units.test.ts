import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { fieldUnits, fromMicrotesla, fromMillimetres, lengthUnits, toMicrotesla, toMillimetres } from "../../shared/units";

describe("units", () => {
  it("lengths to millimetres", () => {
    expect(toMillimetres(1, "in")).toBeCloseTo(25.4, 12);
    expect(toMillimetres(40, "mil")).toBeCloseTo(1.016, 12);
    expect(toMillimetres(3, "mm")).toBe(3);
    expect(toMillimetres(2, "cm")).toBe(20);
  });
  it("fields to microtesla (A/m and Oe in air, B = μ0·H)", () => {
    expect(toMicrotesla(1, "G")).toBeCloseTo(100, 12);
    expect(toMicrotesla(500, "mG")).toBeCloseTo(50, 12);
    expect(toMicrotesla(1, "mT")).toBeCloseTo(1000, 12);
    expect(toMicrotesla(1, "T")).toBeCloseTo(1e6, 6);
    expect(toMicrotesla(1, "Oe")).toBeCloseTo(100, 12);
    expect(toMicrotesla(1, "A/m")).toBeCloseTo(1.2566370614, 9);
    // 1 Oe = 1000/(4π) A/m
    expect(toMicrotesla(1000 / (4 * Math.PI), "A/m")).toBeCloseTo(toMicrotesla(1, "Oe"), 9);
  });
  it("inverses round-trip for every unit", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.constantFrom(...lengthUnits), fc.constantFrom(...fieldUnits), (v, lu, fu) => {
        return Math.abs(fromMillimetres(toMillimetres(v, lu), lu) - v) <= 1e-12 * v && Math.abs(fromMicrotesla(toMicrotesla(v, fu), fu) - v) <= 1e-12 * v;
      }),
    );
  });
  it("unknown units throw", () => {
    expect(() => toMillimetres(1, "furlong" as never)).toThrow(RangeError);
    expect(() => toMicrotesla(1, "kG" as never)).toThrow(RangeError);
  });
});
