import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import {
  attenuationDb, canonicalize, certificateDigest, factorFromDb, HELMHOLTZ_FACTOR, helmholtzCentreField, judgeMeasurement, MU0,
  searchCoilField, searchCoilVoltage, shieldingFactor, sha256Hex,
} from "../../shared/quality";

/** Biot–Savart for circular loops, summed over short straight segments: the field at a point [derived]. */
function loopsField(loops: Array<{ z: number; radius: number; turns: number }>, current: number, at: [number, number, number], segments = 20_000): [number, number, number] {
  const B: [number, number, number] = [0, 0, 0];
  const k = (4e-7 * Math.PI * current) / (4 * Math.PI); // μ0·I/4π with μ0 = 4π·1e-7
  for (const loop of loops) {
    for (let s = 0; s < segments; s++) {
      const a0 = (2 * Math.PI * s) / segments;
      const a1 = (2 * Math.PI * (s + 1)) / segments;
      const p0 = [loop.radius * Math.cos(a0), loop.radius * Math.sin(a0), loop.z];
      const p1 = [loop.radius * Math.cos(a1), loop.radius * Math.sin(a1), loop.z];
      const dl = [p1[0] - p0[0], p1[1] - p0[1], p1[2] - p0[2]];
      const mid = [(p0[0] + p1[0]) / 2, (p0[1] + p1[1]) / 2, (p0[2] + p1[2]) / 2];
      const r = [at[0] - mid[0], at[1] - mid[1], at[2] - mid[2]];
      const r3 = Math.pow(Math.hypot(r[0], r[1], r[2]), 3);
      // dB = k·n·dl × r / |r|³
      B[0] += (k * loop.turns * (dl[1] * r[2] - dl[2] * r[1])) / r3;
      B[1] += (k * loop.turns * (dl[2] * r[0] - dl[0] * r[2])) / r3;
      B[2] += (k * loop.turns * (dl[0] * r[1] - dl[1] * r[0])) / r3;
    }
  }
  return B;
}

describe("Helmholtz pair centre field, B = (4/5)^{3/2}·μ0·n·I/R [pub: textbook formula; domain.md §6]", () => {
  it("the factor (4/5)^{3/2} = 0.715541753 [derived]", () => {
    expect(HELMHOLTZ_FACTOR).toBeCloseTo(0.7155417528, 9);
  });
  it("a worked case: n 100, I 1 A, R 0.25 m → 359.67 µT [derived by hand: 0.7155418 · 1.2566371e-6 = 8.99170e-7 T·m/A; · 100 / 0.25]", () => {
    expect(helmholtzCentreField({ turnsPerCoil: 100, current_A: 1, radius_m: 0.25 }) * 1e6).toBeCloseTo(359.67, 2);
  });
  it.each([
    [100, 1, 0.25],
    [25, 0.2, 0.1],
    [320, 2.5, 0.5],
  ])("n %i, I %f A, R %f m: the formula agrees with a Biot–Savart sum over both coils to 1e-6 [derived]", (n, I, R) => {
    const numeric = loopsField([{ z: -R / 2, radius: R, turns: n }, { z: R / 2, radius: R, turns: n }], I, [0, 0, 0]);
    const formula = helmholtzCentreField({ turnsPerCoil: n, current_A: I, radius_m: R });
    expect(Math.abs(numeric[0]) + Math.abs(numeric[1])).toBeLessThan(formula * 1e-9); // along the axis only
    // the code's μ0 (CODATA 2018) and the sum's 4π·1e-7 differ by 5.5e-10 relative
    expect(Math.abs(numeric[2] - formula) / formula).toBeLessThan(1e-6);
  });
  it("the field is uniform near the centre: 1 % of R off centre it changes by far less than 1e-6 [derived]", () => {
    const R = 0.3;
    const loops = [{ z: -R / 2, radius: R, turns: 50 }, { z: R / 2, radius: R, turns: 50 }];
    const centre = loopsField(loops, 1, [0, 0, 0])[2];
    const off = loopsField(loops, 1, [0, 0, 0.01 * R])[2];
    expect(Math.abs(off - centre) / centre).toBeLessThan(1e-6);
  });
  it("refuses zero or negative inputs", () => {
    expect(() => helmholtzCentreField({ turnsPerCoil: 0, current_A: 1, radius_m: 0.2 })).toThrow();
    expect(() => helmholtzCentreField({ turnsPerCoil: 10, current_A: -1, radius_m: 0.2 })).toThrow();
  });
  it("μ0 is CODATA 2018's [pub: CODATA 2018, 1.25663706212(19)e-6 N/A²]", () => {
    expect(MU0).toBe(1.25663706212e-6);
    expect(Math.abs(MU0 - 4e-7 * Math.PI) / MU0).toBeLessThan(1e-9);
  });
});

describe("search coil, V_rms = 2π·f·N·A·B_rms [pub: Faraday's law; domain.md §6]", () => {
  /** Faraday's law worked numerically: emf = −N·dΦ/dt over one period of B_peak·sin ωt, then its RMS [derived]. */
  function faradayRms(f: number, N: number, A: number, B_rms: number, steps = 200_000): number {
    const Bpk = B_rms * Math.SQRT2;
    const T = 1 / f;
    const dt = T / steps;
    let sumSq = 0;
    for (let i = 0; i < steps; i++) {
      const t = i * dt;
      const flux = (x: number) => N * A * Bpk * Math.sin(2 * Math.PI * f * x);
      const emf = -(flux(t + dt / 2) - flux(t - dt / 2)) / dt;
      sumSq += emf * emf;
    }
    return Math.sqrt(sumSq / steps);
  }
  it.each([
    [60, 200, 1e-4, 1e-6],
    [50, 1000, 3.14e-4, 2.5e-7],
    [1000, 50, 2e-5, 1e-5],
  ])("f %f Hz, N %i, A %f m², B %f T: formula = numeric Faraday to 1e-6", (f, N, A, B) => {
    const v = searchCoilVoltage({ frequency_hz: f, turns: N, area_m2: A, field_T: B });
    expect(Math.abs(v - faradayRms(f, N, A, B)) / v).toBeLessThan(1e-6);
    expect(searchCoilField({ frequency_hz: f, turns: N, area_m2: A, voltage_V: v })).toBeCloseTo(B, 15);
  });
  it("the voltage doubles when the frequency doubles at the same field [pub: domain.md §6]", () => {
    const at = (f: number) => searchCoilVoltage({ frequency_hz: f, turns: 100, area_m2: 1e-4, field_T: 1e-6 });
    expect(at(120) / at(60)).toBeCloseTo(2, 12);
  });
  it("a DC field induces nothing: frequency 0 is refused", () => {
    expect(() => searchCoilField({ frequency_hz: 0, turns: 100, area_m2: 1e-4, voltage_V: 0.001 })).toThrow();
  });
});

describe("shielding factor and decibels, S = H_out/H_in, A = 20·log10 S [pub: Celozzi, Araneo & Lovat 2008, app. B]", () => {
  it.each([
    [10, 20],
    [100, 40],
    [1000, 60],
    [2, 6.0206],
    [316.2278, 50],
  ])("S %f → %f dB", (S, db) => {
    expect(attenuationDb(S)).toBeCloseTo(db, 3);
    expect(factorFromDb(db)).toBeCloseTo(S, 2);
  });
  it("applied 50 µT, inside 0.5 µT: S 100, 40 dB; passes 40 dB, fails 40.01 dB", () => {
    expect(shieldingFactor(50, 0.5)).toBeCloseTo(100, 12);
    expect(judgeMeasurement({ applied_uT: 50, inside_uT: 0.5, required_db: 40 })).toMatchObject({ attenuation_db: 40, pass: true });
    expect(judgeMeasurement({ applied_uT: 50, inside_uT: 0.5, required_db: 40.01 }).pass).toBe(false);
  });
  it("refuses a reading of zero or below", () => {
    expect(() => shieldingFactor(50, 0)).toThrow();
    expect(() => shieldingFactor(-1, 0.5)).toThrow();
  });
});

describe("certificate digest: SHA-256 of the canonical text [pub: FIPS 180-4, checked against node:crypto]", () => {
  const content = { lot: "L-000123", measurements: [{ serial: "A1", attenuation_db: 52.3, pass: true }], aql: 1, note: null, z: { b: 2, a: 1 } };
  it("sorted keys, no whitespace, every number with 10 significant digits", () => {
    expect(canonicalize(content)).toBe(
      '{"aql":1.000000000e+0,"lot":"L-000123","measurements":[{"attenuation_db":5.230000000e+1,"pass":true,"serial":"A1"}],"note":null,"z":{"a":1.000000000e+0,"b":2.000000000e+0}}',
    );
  });
  it("the digest is node:crypto's SHA-256 of the canonical text", () => {
    const expected = createHash("sha256").update(canonicalize(content), "utf8").digest("hex");
    expect(certificateDigest(content)).toBe(expected);
    expect(certificateDigest(content)).toMatch(/^[0-9a-f]{64}$/);
  });
  it("FIPS 180-4 test vector: SHA-256('abc') [pub]", () => {
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
  it("key order and floating-point noise do not change the digest; a changed value does", () => {
    const reordered = { z: { a: 1, b: 2 }, note: null, measurements: [{ pass: true, attenuation_db: 52.300000000000004, serial: "A1" }], lot: "L-000123", aql: 1.0 };
    expect(certificateDigest(reordered)).toBe(certificateDigest(content));
    expect(certificateDigest({ ...content, aql: 1.5 })).not.toBe(certificateDigest(content));
    expect(canonicalize(40)).toBe(canonicalize(39.99999999999999));
    expect(canonicalize(-0)).toBe(canonicalize(0));
  });
  it("non-ASCII text is hashed as UTF-8, like node's crypto", () => {
    const c = { material: "80 % Ni–Fe–Mo, µr 30 000" };
    expect(certificateDigest(c)).toBe(createHash("sha256").update(canonicalize(c), "utf8").digest("hex"));
  });
  it("refuses what has no canonical form", () => {
    expect(() => canonicalize(Number.NaN)).toThrow();
    expect(() => canonicalize({ when: new Date() } as never)).toThrow();
    expect(() => canonicalize([undefined] as never)).toThrow();
  });
});
