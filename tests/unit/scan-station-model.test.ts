// The scan station's pure rules: what a scanned text is, and where a job stands once the scans
// still queued on the device are counted. Values are the shop's own code formats [derived].
import { describe, expect, it } from "vitest";
import type { JobJson } from "../../shared/schemas/jobs";
import type { StepKey, StepStatus } from "../../shared/shop-floor/routing";
import { actionForStep, projectJob, readScannedText, stepCautions } from "../../src/features/scan-station/station-model";
import { routingFromRows } from "../../src/features/floor/routing-editor";

const job = (statuses: StepStatus[], keys: StepKey[] = ["material", "blank", "form", "clean", "anneal", "verify", "pack"]): Pick<JobJson, "code" | "steps"> => ({
  code: "J-1042",
  steps: keys.map((key, i) => ({ key, label: key, status: statuses[i] ?? "pending", barcode: `J-1042-${key.toUpperCase()}`, started: null, completed: null })),
});

describe("reading a scanned text", () => {
  it("tells a job code from a step code, forgiving case and spaces, and refuses anything else", () => {
    expect(readScannedText(" j-1042 ")).toEqual({ kind: "job", code: "J-1042" });
    expect(readScannedText("J-1042-form")).toEqual({ kind: "step", code: "J-1042", step: "form" });
    expect(readScannedText("L26-1007")).toEqual({ kind: "unreadable", text: "L26-1007" });
    expect(readScannedText("J-1042-PAINT").kind).toBe("unreadable");
    expect(readScannedText("").kind).toBe("unreadable");
  });
});

describe("a job moved on by the device's queue", () => {
  it("counts queued scans that follow the sequence, in order", () => {
    const p = projectJob(job(["completed", "pending"]), [
      { code: "J-1042", step: "blank", action: "start" },
      { code: "j-1042", step: "J-1042-BLANK", action: "complete" },
    ]);
    expect(p.pending).toBe(2);
    expect(p.statuses.slice(0, 3)).toEqual(["completed", "completed", "pending"]);
    expect(p.next).toEqual({ step: "form", action: "start" });
  });

  it("ignores a queued scan out of turn or of another job (the server will refuse or place it)", () => {
    const p = projectJob(job(["completed", "pending"]), [
      { code: "J-1042", step: "form", action: "start" },
      { code: "J-9999", step: "blank", action: "start" },
      { code: "J-1042", step: "blank", action: "complete" },
    ]);
    expect(p.pending).toBe(0);
    expect(p.next).toEqual({ step: "blank", action: "start" });
  });

  it("has no next move once every step is done", () => {
    const p = projectJob(job(["completed", "completed", "completed", "completed", "completed", "completed", "started"]), [{ code: "J-1042", step: "pack", action: "complete" }]);
    expect(p.next).toBeNull();
  });

  it("reads a step barcode as the job's next move at that step, else as a start", () => {
    const p = projectJob(job(["completed", "started"]), []);
    expect(actionForStep(p, "blank")).toBe("complete");
    expect(actionForStep(p, "form")).toBe("start");
    expect(actionForStep(p, "material")).toBe("complete"); // done: a repeat of its completion
    expect(actionForStep(null, "form")).toBe("start");
  });
});

describe("cautions where the work can hurt", () => {
  it("press work at blank and form, hydrogen at anneal, handling after anneal", () => {
    expect(stepCautions("form", "H2", "AFTER")[0]).toMatch(/press/i);
    expect(stepCautions("blank", "H2", "AFTER")[0]).toMatch(/guards/i);
    expect(stepCautions("anneal", "H2", "AFTER")).toEqual(["H2"]);
    expect(stepCautions("pack", "H2", "AFTER")).toEqual(["AFTER"]);
    expect(stepCautions("material", "H2", "AFTER")).toEqual([]);
  });
});

describe("the routing editor's rows", () => {
  it("sends the ticked steps in the trade's order, draws only on form, notes trimmed", () => {
    const rows = [
      { key: "material" as const, on: true, drawStages: "", processAnneals: "", note: " " },
      { key: "blank" as const, on: true, drawStages: "", processAnneals: "", note: "" },
      { key: "form" as const, on: true, drawStages: "3", processAnneals: "1", note: " slow ram " },
      { key: "weld" as const, on: false, drawStages: "", processAnneals: "", note: "x" },
    ];
    expect(routingFromRows(rows)).toEqual([{ key: "material" }, { key: "blank" }, { key: "form", drawStages: 3, processAnneals: 1, note: "slow ram" }]);
  });
});
