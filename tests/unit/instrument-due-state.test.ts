import { describe, expect, it } from "vitest";
import { dueWords, figuresWords } from "../../src/features/instruments/due-state";
import { instrumentFiltersFrom } from "../../src/api/instruments";
import { paths } from "../../src/config/paths";

// How the register words an instrument's calibration state; [derived] from the rule in
// shared/quality/instruments.ts (the due date is the last usable day) and the 14-day reminder window.
const base = { status: "in-service" as const, overdue: false, daysUntilDue: 100, calibrationDue: "2027-03-01", calibrationSentOn: null, calibrationLaboratory: null };

describe("an instrument's calibration state in words", () => {
  it("out for calibration comes first, whatever the date", () => {
    const w = dueWords({ ...base, status: "in-calibration", overdue: true, daysUntilDue: -3, calibrationSentOn: "2027-01-02", calibrationLaboratory: "Lab A" });
    expect(w.state).toBe("out");
    expect(w.detail).toBe("Not usable until it is back (out since 2027-01-02 at Lab A).");
  });

  it("past its due date it is overdue and refused, with the days counted", () => {
    expect(dueWords({ ...base, overdue: true, daysUntilDue: -12 })).toMatchObject({ state: "overdue", label: "Overdue" });
    expect(dueWords({ ...base, overdue: true, daysUntilDue: -1 }).detail).toMatch(/1 day ago: cannot be used in measurements/);
  });

  it("due within 14 days (the due day itself included) is a reminder; day 15 is in date", () => {
    expect(dueWords({ ...base, daysUntilDue: 0 })).toMatchObject({ state: "due-soon", label: "Due today" });
    expect(dueWords({ ...base, daysUntilDue: 1 }).label).toBe("Due in 1 day");
    expect(dueWords({ ...base, daysUntilDue: 14 })).toMatchObject({ state: "due-soon", label: "Due in 14 days" });
    expect(dueWords({ ...base, daysUntilDue: 15 })).toMatchObject({ state: "in-date", label: "In date" });
  });

  it("the figures the arithmetic uses, by kind", () => {
    const none = { turns: null, area_mm2: null, radius_mm: null, range: null };
    expect(figuresWords({ ...none, kind: "search-coil", turns: 200, area_mm2: 314.2 })).toBe("200 turns, 314.2 mm² per turn");
    expect(figuresWords({ ...none, kind: "helmholtz-coil", turns: 100, radius_mm: 250 })).toBe("100 turns per coil, radius 250 mm");
    expect(figuresWords({ ...none, kind: "fluxgate-probe", range: "±100 µT" })).toBe("±100 µT");
    expect(figuresWords({ ...none, kind: "search-coil" })).toBe("—");
  });
});

describe("the register's address", () => {
  it("keeps kind and usable-only, and ignores what it does not know", () => {
    expect(paths.instruments.href()).toBe("/quality/instruments");
    expect(paths.instruments.href({ kind: "search-coil", usable: true })).toBe("/quality/instruments?kind=search-coil&usable=true");
    expect(instrumentFiltersFrom(new URLSearchParams("kind=search-coil&usable=true"))).toEqual({ kind: "search-coil", usable: true });
    expect(instrumentFiltersFrom(new URLSearchParams("kind=toaster&usable=yes"))).toEqual({});
    expect(paths.instrument.href("a/b")).toBe("/quality/instruments/a%2Fb");
  });
});
