import { describe, expect, it } from "vitest";
import { isJobCode, jobCode, lotNumber, normalizeCode, parseStepBarcode, stepBarcode } from "../../shared/shop-floor/codes";
import { addWorkingDays, dueDate } from "../../shared/shop-floor/due-dates";
import { checkScan, nextScan, planRouting, routingProblems, stepStatuses, type RoutedPart } from "../../shared/shop-floor/routing";

const part = (p: Partial<RoutedPart> = {}): RoutedPart => ({ role: "cup", method: "drawn", finishedPiece: true, drawStages: 2, processAnneals: 1, takesComponents: false, annealed: true, ...p });
const keys = (p: Partial<RoutedPart>) => planRouting(part(p)).map((s) => s.key);

describe("routings from the forming method", () => {
  it("drawn: material, blank, form with its draws and process anneals, clean, anneal, verify, pack", () => {
    const r = planRouting(part());
    expect(r.map((s) => s.key)).toEqual(["material", "blank", "form", "clean", "anneal", "verify", "pack"]);
    expect(r[2]).toEqual({ key: "form", drawStages: 2, processAnneals: 1 });
  });
  it("rolled and bent add the weld; a drawn can that takes collars is welded too", () => {
    expect(keys({ role: "wall", method: "rolled", drawStages: 0, processAnneals: 0 })).toEqual(["material", "blank", "form", "weld", "clean", "anneal", "verify", "pack"]);
    expect(keys({ role: "body", method: "bent", drawStages: 0 })).toContain("weld");
    expect(keys({ takesComponents: true })).toContain("weld");
  });
  it("end caps and collars stop once ready to be welded on; copper is not hydrogen-annealed", () => {
    expect(keys({ role: "end-cap", method: "rolled", finishedPiece: false, drawStages: 0 })).toEqual(["material", "blank", "form"]);
    expect(keys({ role: "collar", method: "rolled", finishedPiece: false, drawStages: 0 })).toEqual(["material", "blank", "form", "weld"]);
    expect(keys({ annealed: false })).toEqual(["material", "blank", "form", "clean", "verify", "pack"]);
  });
});

describe("routing edits", () => {
  const drawn = { method: "drawn" as const, finishedPiece: true, annealed: true, role: "cup" as const };
  it("a planned routing is sound", () => {
    expect(routingProblems(planRouting(part()), drawn)).toEqual({});
  });
  it("names the step out of order, a step twice, a missing final anneal or clean, and process anneals that cannot fit", () => {
    const r = planRouting(part());
    expect(routingProblems([r[1], r[0], ...r.slice(2)], drawn)).toMatchObject({ "steps.1.key": "Material issue must come before Blank", "steps.0.key": expect.any(String) });
    expect(routingProblems([...r.slice(0, 3), r[2], ...r.slice(3)], drawn)).toMatchObject({ "steps.3.key": "Form is listed twice" });
    expect(routingProblems(r.filter((s) => s.key !== "anneal"), drawn).steps).toMatch(/final hydrogen anneal/);
    expect(routingProblems(r.filter((s) => s.key !== "clean"), drawn).steps).toMatch(/degreased/);
    expect(routingProblems(r.map((s) => (s.key === "form" ? { ...s, drawStages: 2, processAnneals: 2 } : s)), drawn)).toHaveProperty("steps.2.processAnneals");
    expect(routingProblems([{ key: "material" }, { key: "blank" }, { key: "form" }, { key: "pack" }], { ...drawn, finishedPiece: false, role: "end-cap" }).steps).toMatch(/with the piece it is welded to/);
  });
});

describe("scans against the routing", () => {
  const routing = planRouting(part());
  const at = (stepIndex: number, started: boolean) => ({ routing, stepIndex, started });
  it("each step starts once and completes once: what is recorded is a repeat, not an error", () => {
    expect(checkScan(at(0, false), "material", "start")).toEqual({ kind: "new", stepIndex: 0 });
    expect(checkScan(at(0, true), "material", "start")).toEqual({ kind: "repeat", stepIndex: 0 });
    expect(checkScan(at(0, true), "material", "complete")).toEqual({ kind: "new", stepIndex: 0 });
    expect(checkScan(at(1, false), "material", "complete")).toEqual({ kind: "repeat", stepIndex: 0 });
    expect(checkScan(at(1, false), "material", "start")).toEqual({ kind: "repeat", stepIndex: 0 });
  });
  it("refuses what is out of sequence in the operator's words", () => {
    expect(checkScan(at(0, false), "material", "complete", "job J-7")).toMatchObject({ kind: "refused", code: "NOT_STARTED", message: "Material issue has not been started on job J-7: scan start first, then complete when the work is done." });
    expect(checkScan(at(1, true), "form", "start", "job J-7")).toMatchObject({
      kind: "refused", code: "OUT_OF_SEQUENCE", message: "Form cannot start yet: blank is not finished on job J-7. Next on job J-7: complete blank.",
    });
    expect(checkScan(at(0, false), "weld", "start", "job J-7")).toMatchObject({ code: "STEP_NOT_IN_ROUTING", message: expect.stringMatching(/^Job J-7 has no weld step\. Its route is Material issue → Blank → Form → Clean → Hydrogen anneal → Verify → Pack\.$/) });
  });
  it("statuses and the next scan follow the progress", () => {
    expect(stepStatuses(at(2, true)).slice(0, 4)).toEqual(["completed", "completed", "started", "pending"]);
    expect(nextScan(at(2, true))).toEqual({ step: "form", action: "complete" });
    expect(nextScan(at(routing.length, false))).toBeNull();
  });
});

describe("codes printed in barcodes", () => {
  it("job, step and lot codes read back; scanners' lower case and spaces are forgiven", () => {
    expect(jobCode(1042)).toBe("J-1042");
    expect(stepBarcode("J-1042", "anneal")).toBe("J-1042-ANNEAL");
    expect(parseStepBarcode(" j-1042-anneal ")).toEqual({ code: "J-1042", step: "anneal" });
    expect(parseStepBarcode("J-1042-PAINT")).toBeNull();
    expect(isJobCode(normalizeCode(" j-77\n"))).toBe(true);
    expect(lotNumber(1007, new Date("2026-03-02T10:00:00Z"))).toBe("L26-1007");
    // only characters every keyboard-wedge scanner types the same on any layout
    for (const s of [jobCode(99), stepBarcode("J-99", "material"), lotNumber(5, new Date())]) expect(s).toMatch(/^[A-Z0-9-]+$/);
  });
});

describe("due dates", () => {
  it("working days skip weekends; the requested date wins", () => {
    // Friday 2026-03-06 + 1 working day = Monday 2026-03-09; + 5 = Friday 2026-03-13 [derived from the calendar]
    expect(addWorkingDays(new Date("2026-03-06T15:00:00Z"), 1).toISOString().slice(0, 10)).toBe("2026-03-09");
    expect(addWorkingDays(new Date("2026-03-06T15:00:00Z"), 5).toISOString().slice(0, 10)).toBe("2026-03-13");
    expect(dueDate({ requestedDate: "2026-05-01", paidAt: new Date("2026-03-06"), releasedAt: new Date(), leadTime_workingDays: 10 })).toBe("2026-05-01");
    expect(dueDate({ requestedDate: null, paidAt: new Date("2026-03-06T09:00:00Z"), releasedAt: new Date("2026-03-10"), leadTime_workingDays: 10 })).toBe("2026-03-20");
  });
});
