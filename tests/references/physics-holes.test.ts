// Cable holes and their collars (chimneys), checked against the waveguide-below-cut-off law.
// Tags as in domain.md: [derived] derived and checked numerically, [practice] the trade's rule.
// Field entering a tube of radius a decays as exp(−j·z/a); for a high-μ wall at low frequency
// j = 3.832 with the field across the tube and 2.405 along it (the weak case); for a good
// conductor at AC 1.841 across (the weak case) and 3.832 along. [derived]
import { describe, expect, it } from "vitest";
import { predictShield, type PredictionInput } from "../../shared/physics/predict";
import { collarAttenuation_db, collarLengthFor_mm, LEAKAGE_ROOT } from "../../shared/physics/thin";

const DB_PER_NEPER = 20 / Math.LN10; // 8.686

const can: PredictionInput = {
  shape: "cylinder",
  dimensions_mm: { diameter: 50, length: 120 },
  ends: "closed",
  layers: [{ material: "ni80", thickness_mm: 1 }],
  field: { frequency_hz: 60, amplitude_uT: 100, orientation: "transverse" },
  state: "annealed",
};
const wallsOnly = predictShield(can);

describe("collar attenuation: 20·log10(exp(j·L/a)) = 8.686·j·L/a dB", () => {
  it("[derived] a collar two hole diameters long: ≈ 83.6 dB along the collar, ≈ 133 dB across it", () => {
    const d = 10, L = 2 * d; // L/a = 4
    expect(collarAttenuation_db(L, d, "axial")).toBeCloseTo(8.686 * 2.405 * 4, 1); // 83.56
    expect(collarAttenuation_db(L, d, "axial")).toBeCloseTo(83.6, 1);
    expect(collarAttenuation_db(L, d, "transverse")).toBeCloseTo(8.686 * 3.832 * 4, 1); // 133.1
    expect(Math.round(collarAttenuation_db(L, d, "transverse"))).toBe(133);
    // the law depends on L/d only: the same shape at any size gives the same dB
    expect(collarAttenuation_db(2 * L, 2 * d, "axial")).toBeCloseTo(collarAttenuation_db(L, d, "axial"), 10);
    // and is linear in L: no collar, no attenuation
    expect(collarAttenuation_db(0, d, "axial")).toBe(0);
    expect(collarAttenuation_db(3 * d, d, "axial")).toBeCloseTo(1.5 * collarAttenuation_db(2 * d, d, "axial"), 10);
  });

  it("[derived] the roots are the tube's cut-off roots: 2.405 (J0) along, 3.832 (J1) across", () => {
    expect(LEAKAGE_ROOT.axial).toBeCloseTo(2.405, 3);
    expect(LEAKAGE_ROOT.transverse).toBeCloseTo(3.832, 3);
    expect(collarAttenuation_db(1, 2, "axial")).toBeCloseTo(DB_PER_NEPER * 2.405, 3);
  });

  it("[derived] the needed length inverts it: L = A·a/(8.686·j)", () => {
    for (const orientation of ["axial", "transverse"] as const) {
      for (const [A, d] of [[40, 6], [83.6, 10], [120, 25], [200, 3]]) {
        const L = collarLengthFor_mm(A, d, orientation);
        expect(L).toBeCloseTo((A * (d / 2)) / (DB_PER_NEPER * LEAKAGE_ROOT[orientation]), 9);
        expect(collarAttenuation_db(L, d, orientation)).toBeCloseTo(A, 9);
      }
    }
    expect(collarLengthFor_mm(8.686 * 2.405 * 4, 10, "axial")).toBeCloseTo(20, 2);
  });

  it("[practice] a collar 1–2 hole diameters long: about 42–84 dB along it, the range of one to two good layers", () => {
    const one = collarAttenuation_db(10, 10, "axial");
    const two = collarAttenuation_db(20, 10, "axial");
    expect(one).toBeCloseTo(41.8, 1);
    expect(two).toBeCloseTo(83.6, 1);
    // the default one-layer ni80 can (about 63 dB as built) needs one to two and a half diameters
    const r = predictShield({ ...can, holes: [{ diameter_mm: 10, collarLength_mm: 20 }] });
    const ratio = r.holes[0].neededCollarLength_mm / 10;
    expect(ratio).toBeGreaterThan(1);
    expect(ratio).toBeLessThan(2.5);
  });
});

describe("holes in the prediction", () => {
  it("[derived] reports each hole's collar attenuation and the collar length the built walls' figure needs", () => {
    const r = predictShield({ ...can, holes: [{ diameter_mm: 10, collarLength_mm: 5 }, { diameter_mm: 6, collarLength_mm: 30 }] });
    expect(r.holes).toHaveLength(2);
    const [a, b] = r.holes;
    expect(a).toMatchObject({ index: 0, diameter_mm: 10, collarLength_mm: 5 });
    // a high-μ collar at 60 Hz: the weak case is the field along it, j = 2.405
    expect(a.decayRoot).toBeCloseTo(2.405, 2);
    expect(a.collarAttenuation_db).toBeCloseTo(DB_PER_NEPER * a.decayRoot * (5 / 5), 9);
    // the target is the built walls' figure, not the seamless shell's
    expect(r.wallAttenuation_db).toBeCloseTo(wallsOnly.attenuation_db, 9);
    expect(r.wallAttenuation_db).toBeLessThan(r.ideal.attenuation_db);
    expect(a.neededCollarLength_mm).toBeCloseTo(collarLengthFor_mm(r.wallAttenuation_db, 10, a.decayRoot), 9);
    expect(b.neededCollarLength_mm).toBeCloseTo(collarLengthFor_mm(r.wallAttenuation_db, 6, b.decayRoot), 9);
    // the short collar is named, in words, with the length it needs; the long one is not
    const short = r.warnings.filter((w) => w.code === "SHORT_COLLAR");
    expect(short).toHaveLength(1);
    expect(short[0].message).toMatch(/^Hole 1 \(Ø 10 mm\): its 5 mm collar gives about 21 dB/);
    expect(short[0].message).toContain(`at least ${(Math.ceil(a.neededCollarLength_mm * 10) / 10).toFixed(1)} mm`);
    // a plain hole says so
    const plain = predictShield({ ...can, holes: [{ diameter_mm: 10 }] });
    expect(plain.holes[0].collarLength_mm).toBe(0);
    expect(plain.warnings.find((w) => w.code === "SHORT_COLLAR")!.message).toMatch(/has no collar/);
  });

  it("[derived] a collar in a conducting wall at AC takes the conductor's weak constant, 1.841 (field across it)", () => {
    const tube: PredictionInput = { ...can, dimensions_mm: { diameter: 100, length: 300 }, layers: [{ material: "aluminium", thickness_mm: 3 }], field: { ...can.field, frequency_hz: 10_000 } };
    const r = predictShield({ ...tube, holes: [{ diameter_mm: 10, collarLength_mm: 20 }, { diameter_mm: 40, collarLength_mm: 80 }] });
    // between the two limits, nearer the conductor's the wider the collar (K = k·a/μ grows with a)
    for (const h of r.holes) {
      expect(h.decayRoot).toBeGreaterThan(1.841);
      expect(h.decayRoot).toBeLessThan(2.405);
    }
    expect(r.holes[1].decayRoot).toBeLessThan(1.9);
    expect(r.holes[0].collarAttenuation_db).toBeLessThan(collarAttenuation_db(20, 10, "axial")); // weaker than a high-μ collar
  });

  it("[derived] asking for the stated length clears the warning", () => {
    const r = predictShield({ ...can, holes: [{ diameter_mm: 10, collarLength_mm: 5 }] });
    const asked = Number(/at least ([\d.]+) mm/.exec(r.warnings.find((w) => w.code === "SHORT_COLLAR")!.message)![1]);
    const again = predictShield({ ...can, holes: [{ diameter_mm: 10, collarLength_mm: asked }] });
    expect(again.warnings.map((w) => w.code)).not.toContain("SHORT_COLLAR");
  });

  it("[derived] the needed length aims at the built walls' figure, which the construction ceiling bounds, not at the seamless shell's", () => {
    // four ni80 layers at DC: the seamless figure runs far past what a built shield reaches
    const layers = [1, 2, 3, 4].map(() => ({ material: "ni80", thickness_mm: 1, gap_mm: 10 }));
    const r = predictShield({ ...can, layers, field: { ...can.field, frequency_hz: 0 }, holes: [{ diameter_mm: 10, collarLength_mm: 60 }] });
    expect(r.ideal.attenuation_db).toBeGreaterThan(r.wallAttenuation_db + 40);
    expect(r.wallAttenuation_db).toBeLessThanOrEqual(r.asBuilt.ceiling_db);
    expect(r.holes[0].neededCollarLength_mm).toBeCloseTo(collarLengthFor_mm(r.wallAttenuation_db, 10, r.holes[0].decayRoot), 9);
    expect(r.warnings.map((w) => w.code)).not.toContain("SHORT_COLLAR");
  });

  it("[derived] HOLE_LIMITED: 1/S_eff = 1/S_walls + Σ (hole area / wall area)·exp(−2.405·L/a)", () => {
    const walls = predictShield(can);
    expect(walls.holes).toEqual([]);
    expect(walls.wallAttenuation_db).toBe(walls.attenuation_db);

    const d = 10, L = 5;
    const r = predictShield({ ...can, holes: [{ diameter_mm: d, collarLength_mm: L }] });
    expect(r.wallAttenuation_db).toBeCloseTo(walls.attenuation_db, 9);
    const wallArea = Math.PI * 50 * 120 + 2 * (Math.PI * 50 ** 2) / 4; // closed can, inside surface
    const leak = ((Math.PI * d * d) / 4 / wallArea) * Math.exp((-r.holes[0].decayRoot * L) / (d / 2));
    const expected = 1 / (1 / walls.shieldingFactor + leak);
    expect(r.shieldingFactor).toBeCloseTo(expected, 6);
    expect(r.attenuation_db).toBeCloseTo(20 * Math.log10(expected), 6);
    expect(r.warnings.map((w) => w.code)).toContain("HOLE_LIMITED");
    expect(r.warnings.find((w) => w.code === "HOLE_LIMITED")!.message).toContain(`${r.attenuation_db.toFixed(1)} dB instead of the walls' ${r.wallAttenuation_db.toFixed(1)} dB`);
    // the band is of the figure with the holes: it brackets it, and the holes hold its top below the walls'
    expect(r.band.low_db).toBeLessThanOrEqual(r.attenuation_db);
    expect(r.band.high_db).toBeGreaterThanOrEqual(r.attenuation_db);
    expect(r.band.high_db).toBeLessThan(walls.band.high_db);
    expect(r.asBuilt.losses.map((x) => x.cause)).toContain("holes");

    // at the needed length the hole costs well under 1 dB: no HOLE_LIMITED, no SHORT_COLLAR
    const long = predictShield({ ...can, holes: [{ diameter_mm: d, collarLength_mm: r.holes[0].neededCollarLength_mm }] });
    expect(walls.attenuation_db - long.attenuation_db).toBeLessThan(0.1);
    expect(long.warnings.map((w) => w.code)).not.toContain("HOLE_LIMITED");
    expect(long.warnings.map((w) => w.code)).not.toContain("SHORT_COLLAR");

    // more holes leak more, and a longer collar never reads worse
    const two = predictShield({ ...can, holes: [{ diameter_mm: d, collarLength_mm: L }, { diameter_mm: d, collarLength_mm: L }] });
    expect(two.attenuation_db).toBeLessThan(r.attenuation_db);
    let previous = -Infinity;
    for (const len of [0, 2, 5, 10, 15, 20, 30]) {
      const a = predictShield({ ...can, holes: [{ diameter_mm: d, collarLength_mm: len }] }).attenuation_db;
      expect(a).toBeGreaterThanOrEqual(previous);
      expect(a).toBeLessThanOrEqual(walls.attenuation_db + 1e-9);
      previous = a;
    }
  });

  it("rejects a hole the engine cannot use, naming the field", () => {
    expect(() => predictShield({ ...can, holes: [{ diameter_mm: 0 }] })).toThrow(expect.objectContaining({ field: "holes.0.diameter_mm" }));
    expect(() => predictShield({ ...can, holes: [{ diameter_mm: 5 }, { diameter_mm: 5, collarLength_mm: -1 }] })).toThrow(expect.objectContaining({ field: "holes.1.collarLength_mm" }));
  });
});
