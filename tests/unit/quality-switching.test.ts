import { describe, expect, it } from "vitest";
import { nextPlan, switchingState, type SwitchingEntry } from "../../shared/quality";

// The switching rules of ISO 2859-1:1999 clause 9 [pub] (normal → reduced by the 1999 switching
// score, 9.3.3), worked lot by lot [derived].
const lot = (label: string, nonconforming: number, extra: Partial<Extract<SwitchingEntry, { kind: "lot" }>> = {}): SwitchingEntry => ({ kind: "lot", label, lotSize: 500, nonconforming, ...extra });
// lot of 500 at AQL 1.0: normal H n 50 Ac 1 Re 2; tightened H n 50 Ac 1 Re 2 (II-B: H at 1.0 ↓ to J n 80 1/2);
// reduced H n 20 (II-C: H at 1.0 is 0/2)

describe("switching between normal, tightened and reduced inspection [pub: ISO 2859-1:1999 clause 9]", () => {
  it("starts on normal", () => {
    expect(switchingState(1, [])).toMatchObject({ state: "normal", switchingScore: 0 });
  });

  it("normal → tightened when 2 of 5 or fewer consecutive lots are not accepted", () => {
    const r = switchingState(1, [lot("L1", 2), lot("L2", 0), lot("L3", 0), lot("L4", 0), lot("L5", 3)]);
    expect(r.state).toBe("tightened");
    expect(r.reason).toMatch(/2 of the last 5 lots not accepted/);
  });

  it("but not when the two rejections are 6 lots apart", () => {
    const r = switchingState(1, [lot("L1", 2), lot("L2", 0), lot("L3", 0), lot("L4", 0), lot("L5", 0), lot("L6", 2)]);
    expect(r.state).toBe("normal");
  });

  it("tightened uses Table II-B: lot of 500 at AQL 1.0 → J's 1/2 with 80 parts", () => {
    const r = switchingState(1, [lot("L1", 2), lot("L2", 2)]);
    expect(nextPlan(500, 1, r)).toMatchObject({ inspection: "tightened", planCodeLetter: "J", sampleSize: 80, accept: 1, reject: 2 });
  });

  it("tightened → normal after 5 consecutive lots accepted", () => {
    const history = [lot("L1", 2), lot("L2", 2), lot("T1", 0), lot("T2", 1), lot("T3", 0), lot("T4", 0)];
    expect(switchingState(1, history).state).toBe("tightened");
    const r = switchingState(1, [...history, lot("T5", 0)]);
    expect(r.state).toBe("normal");
    expect(r.reason).toMatch(/5 lots in a row accepted on tightened/);
    expect(r.switchingScore).toBe(0);
  });

  it("a rejection on tightened restarts the count of 5", () => {
    const r = switchingState(1, [lot("L1", 2), lot("L2", 2), lot("T1", 0), lot("T2", 0), lot("T3", 0), lot("T4", 0), lot("T5", 2), lot("T6", 0)]);
    expect(r.state).toBe("tightened");
  });

  it("discontinued when 5 lots in all are not accepted on tightened; corrective action resumes on tightened", () => {
    const onTightened = [lot("L1", 2), lot("L2", 2)];
    const bad = [lot("T1", 2), lot("T2", 0), lot("T3", 2), lot("T4", 2), lot("T5", 0), lot("T6", 2), lot("T7", 2)];
    const r = switchingState(1, [...onTightened, ...bad]);
    expect(r.state).toBe("discontinued");
    expect(r.reason).toMatch(/5 lots not accepted on tightened/);
    expect(nextPlan(500, 1, r)).toBeNull();
    const later = switchingState(1, [...onTightened, ...bad, lot("X1", 0), { kind: "corrective-action", label: "CA-7" }]);
    expect(later.steps.at(-2)?.note).toMatch(/not inspected under the scheme/);
    expect(later.state).toBe("tightened");
  });

  it("switching score: +3 per lot accepted at the AQL one step tighter when Ac ≥ 2, reduced at 30 with approval and steady production", () => {
    // lot of 3000 at AQL 2.5: K n 125 Ac 7; one step tighter (1.5) K is Ac 5: 5 or fewer adds 3
    const big = (label: string, d: number) => ({ kind: "lot" as const, label, lotSize: 3000, nonconforming: d });
    const nine = Array.from({ length: 9 }, (_, i) => big(`L${i + 1}`, 3));
    expect(switchingState(2.5, nine, { reducedApproved: true })).toMatchObject({ state: "normal", switchingScore: 27 });
    const ten = [...nine, big("L10", 5)];
    const r = switchingState(2.5, ten, { reducedApproved: true });
    expect(r.state).toBe("reduced");
    expect(r.reason).toMatch(/switching score 30/);
    // reduced: K n 50 (II-C K at 2.5 is 3/6)
    expect(nextPlan(3000, 2.5, r)).toMatchObject({ inspection: "reduced", sampleSize: 50, accept: 3, reject: 6 });
  });

  it("a lot accepted but not at the tighter AQL resets the score to 0 (Ac ≥ 2)", () => {
    const big = (label: string, d: number) => ({ kind: "lot" as const, label, lotSize: 3000, nonconforming: d });
    const r = switchingState(2.5, [big("L1", 0), big("L2", 0), big("L3", 6)]);
    expect(r).toMatchObject({ state: "normal", switchingScore: 0 });
    expect(r.steps[2].decision).toBe("accepted");
  });

  it("Ac 0 or 1: +2 per accepted lot, 0 on a rejection; 15 accepted lots reach 30", () => {
    const fifteen = Array.from({ length: 15 }, (_, i) => lot(`L${i + 1}`, i % 2));
    expect(switchingState(1, fifteen.slice(0, 14))).toMatchObject({ switchingScore: 28 });
    expect(switchingState(1, fifteen, { reducedApproved: true }).state).toBe("reduced");
    expect(switchingState(1, [...fifteen.slice(0, 10), lot("X", 2)]).switchingScore).toBe(0);
  });

  it("score 30 without the authority's approval, or with production not steady, stays normal and says why", () => {
    const fifteen = Array.from({ length: 15 }, (_, i) => lot(`L${i + 1}`, 0));
    const r = switchingState(1, fifteen);
    expect(r.state).toBe("normal");
    expect(r.reason).toMatch(/reduced inspection is not approved/);
    const unsteady = [...fifteen.slice(0, 14), lot("L15", 0, { productionSteady: false })];
    expect(switchingState(1, unsteady, { reducedApproved: true }).reason).toMatch(/production is not steady/);
  });

  describe("reduced → normal", () => {
    const toReduced = Array.from({ length: 15 }, (_, i) => lot(`L${i + 1}`, 0));
    it("on a lot not accepted", () => {
      const r = switchingState(1, [...toReduced, lot("R1", 2)], { reducedApproved: true });
      expect(r.state).toBe("normal");
      expect(r.reason).toMatch(/not accepted on reduced/);
    });
    it("on a count between Ac and Re (II-C's gap): the lot is accepted, normal comes back", () => {
      // II-C, H at 1.0: n 20, Ac 0, Re 2: one nonconforming part falls in the gap
      const r = switchingState(1, [...toReduced, lot("R1", 1)], { reducedApproved: true });
      expect(r.steps.at(-1)?.decision).toBe("accepted-back-to-normal");
      expect(r.state).toBe("normal");
    });
    it("when production is irregular, or the authority asks", () => {
      expect(switchingState(1, [...toReduced, lot("R1", 0, { productionSteady: false })], { reducedApproved: true }).state).toBe("normal");
      expect(switchingState(1, [...toReduced, { kind: "normal-required", label: "audit" }], { reducedApproved: true }).state).toBe("normal");
    });
    it("stays reduced while lots are accepted", () => {
      expect(switchingState(1, [...toReduced, lot("R1", 0), lot("R2", 0)], { reducedApproved: true }).state).toBe("reduced");
    });
  });

  it("resubmitted lots do not count", () => {
    const r = switchingState(1, [lot("L1", 2), lot("L1 again", 2, { resubmitted: true }), lot("L2", 0)]);
    expect(r.state).toBe("normal");
    expect(r.steps[1].note).toMatch(/resubmitted/);
  });

  it("every step says what happened in words", () => {
    const r = switchingState(1, [lot("L1", 0), lot("L2", 2)]);
    expect(r.steps.map((s) => s.note)).toEqual([
      "L1: 0 nonconforming in 50 (Ac 1, Re 2), accepted; switching score 2.",
      "L2: 2 nonconforming in 50 (Ac 1, Re 2), not accepted; switching score 0.",
    ]);
  });
});
