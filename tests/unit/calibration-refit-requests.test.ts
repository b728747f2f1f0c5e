import { describe, expect, it } from "vitest";
import { combineRefitRequests, type OpenRefitRequest } from "../../server/jobs/calibration-refit";

const ask = (id: string, reason: string, extra: Partial<OpenRefitRequest> = {}): OpenRefitRequest => ({ id, requested_by_id: null, reason, force: false, ...extra });

describe("combineRefitRequests: the asks one refit answers", () => {
  it("names each reason once, in the order asked; answers every ask", () => {
    const one = combineRefitRequests([ask("1", "certificate C-1 issued for lot L-1"), ask("2", "asked for by hand"), ask("3", "certificate C-1 issued for lot L-1")]);
    expect(one.reason).toBe("certificate C-1 issued for lot L-1; asked for by hand");
    expect(one.answers).toEqual(["1", "2", "3"]);
  });

  it("fits even when unchanged if any ask was forced; kept as asked by the first who asked", () => {
    const one = combineRefitRequests([ask("1", "a"), ask("2", "b", { requested_by_id: "u-2", force: true }), ask("3", "c", { requested_by_id: "u-3" })]);
    expect(one.force).toBe(true);
    expect(one.actorId).toBe("u-2");
    expect(combineRefitRequests([ask("1", "a"), ask("2", "b")])).toMatchObject({ force: false, actorId: null });
  });

  it("many asks: as many reasons as fit in the run's 1 000 characters, then how many more", () => {
    const many = Array.from({ length: 40 }, (_, i) => ask(String(i), `certificate C-${1000 + i} issued for lot L-${5000 + i}`));
    const one = combineRefitRequests(many);
    expect(one.reason.length).toBeLessThanOrEqual(1000);
    expect(one.reason).toMatch(/^certificate C-1000 issued for lot L-5000; /);
    const named = one.reason.split("; ").filter((r) => r.startsWith("certificate")).length;
    expect(one.reason).toMatch(new RegExp(`; and ${40 - named} more$`));
    expect(named).toBeGreaterThan(20);
    expect(one.answers).toHaveLength(40);
  });
});
