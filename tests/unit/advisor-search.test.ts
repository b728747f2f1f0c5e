// The design advisor against a brute force written here from the definitions: every design of
// a small space worked out in full with the engines directly (no bounds, no memo), the Pareto
// front from its definition (no design at least as good on price, mass and attenuation and
// better on one), the recommendation as the cheapest front design that keeps the margin.
// [derived] throughout: the front and the bounds follow from their definitions.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  adviceProblemFor, adviseDesigns, attenuationCeiling_db, configurationOf, lowEndCeiling_db, countDesigns, designConfig, enumerateDesigns, formable,
  massOf, partsMemo, predictionInput, priceBounder, unnestedSubtotal, type AdviceProblem, type AdviceShop,
} from "../../shared/advisor";
import { blanksKey, memoNest } from "../../shared/advisor/nest-memo";
import { defaultPriceList, nestBlanks, partsForDesign, priceBuildUp, type DesignConfig, type NestBlank } from "../../shared/fabrication";
import { besselMemo, DEFAULT_BUILD_MODEL, materialLibrary, predictFigures, predictShield } from "../../shared/physics";
import { designAdviceRequestSchema, MAX_SEARCH_DESIGNS, type DesignAdviceRequestInput } from "../../shared/schemas/design-advice";
import { predictionRequestSchema } from "../../shared/schemas/prediction";
import { designConfigurationSchema } from "../../shared/schemas/price-estimate";
import { DEFAULT_DESIGN_SEARCH_SETTINGS, type PriceList } from "../../shared/schemas/pricing";
import { DEFAULT_LID_CLEARANCE_MM } from "../../shared/construction-defaults";

const byId = new Map(materialLibrary.map((m) => [m.id, m]));
const RULE = DEFAULT_DESIGN_SEARCH_SETTINGS.minSaturationMargin;

function shopWith(priceList: PriceList = defaultPriceList): AdviceShop {
  return { materials: (id) => byId.get(id), buildModel: DEFAULT_BUILD_MODEL, priceList, minSaturationMargin: RULE };
}

function problemFor(body: DesignAdviceRequestInput, gapSteps_mm = [5, 10], priceList: PriceList = defaultPriceList): AdviceProblem {
  const request = designAdviceRequestSchema.parse(body);
  const r = adviceProblemFor(request, { materials: materialLibrary, priceList, settings: { ...DEFAULT_DESIGN_SEARCH_SETTINGS, gapSteps_mm, minSaturationMargin: RULE } });
  if ("fields" in r) throw new Error(JSON.stringify(r.fields));
  return r.problem;
}

// --- the brute force, from the definitions ---

interface Worked {
  key: string;
  price: number;
  mass: number;
  att: number;
  low: number;
  keeps: boolean;
  order: number;
}

const keyOf = (method: string, layers: { material: string; thickness_mm: number; gap_mm?: number }[]) =>
  `${method}:${layers.map((l) => `${l.material}/${l.thickness_mm}/${l.gap_mm ?? "-"}`).join(";")}`;

function* tuples<T>(items: readonly T[], n: number): Generator<T[]> {
  if (n === 0) return yield [];
  for (const rest of tuples(items, n - 1)) for (const x of items) yield [x, ...rest];
}

function bruteForce(p: AdviceProblem) {
  const worked: Worked[] = [];
  let order = 0;
  for (const method of p.methods) {
    for (let n = 1; n <= p.maxLayers; n++) {
      for (const gap of n > 1 ? p.gapSteps_mm : [0]) {
        for (const choice of tuples(p.options, n)) {
          const layers = choice.map((o, i) => ({ material: o.material, thickness_mm: o.thickness_mm, ...(i < n - 1 ? { gap_mm: gap } : {}) }));
          const body = {
            shape: p.shape, dimensions_mm: p.dimensions_mm, layers, field: p.field, state: "annealed", method,
            ...(p.shape === "cylinder" ? { ends: "closed" } : {}),
          };
          order++;
          if (!predictionRequestSchema.safeParse(body).success) continue;
          // the outside: inside + 2 Σ (t + gap) + 2 t of the outermost; a box's lid skirt; a rolled can's cap flanges
          const t = choice[n - 1].thickness_mm;
          const grow = 2 * choice.slice(0, -1).reduce((s, o) => s + o.thickness_mm + gap, 0) + 2 * t;
          const skirt = p.shape === "box" ? 2 * (DEFAULT_LID_CLEARANCE_MM + t) : 0;
          const flange = method === "rolled" ? 2 * t : 0;
          const outside: Record<string, number> =
            p.shape === "box"
              ? { width: p.dimensions_mm.width + grow + skirt, depth: p.dimensions_mm.depth + grow + skirt, height: p.dimensions_mm.height + grow }
              : { diameter: p.dimensions_mm.diameter + grow + flange, length: p.dimensions_mm.length + grow };
          if (Object.entries(p.maxOutside_mm ?? {}).some(([k, most]) => most !== undefined && outside[k] > most)) continue;
          const config: DesignConfig = {
            shape: p.shape,
            method,
            dimensions_mm: p.dimensions_mm,
            layers: choice.map((o, i) => ({ thickness_mm: o.thickness_mm, gap_mm: i < n - 1 ? gap : undefined, materialId: o.material, density_kg_m3: o.density_kg_m3, limits: o.limits })),
            ...(p.shape === "box" ? { lid: true } : method === "drawn" ? { cornerRadius_mm: Math.min(3, p.dimensions_mm.diameter / 2, p.dimensions_mm.length), trim_mm: 0 } : { seamOverlap_mm: 0 }),
            holes: [],
          };
          const parts = partsForDesign(config);
          const mass = parts.reduce((s, x) => s + x.mass_kg! * x.quantityPerAssembly, 0);
          if (p.maxMass_kg !== undefined && mass > p.maxMass_kg) continue;
          const r = predictShield(body as Parameters<typeof predictShield>[0], (id) => byId.get(id), DEFAULT_BUILD_MODEL);
          const price = priceBuildUp({ parts, quantity: p.quantity, priceList: defaultPriceList, nestGap_mm: 3 }).unitPrice_cents;
          worked.push({
            key: keyOf(method, layers), price, mass, att: r.attenuation_db, low: r.band.low_db,
            keeps: r.layers.every((l) => l.saturationMargin === null || l.saturationMargin >= RULE), order,
          });
        }
      }
    }
  }
  const meeting = worked.filter((w) => w.low >= p.requiredAttenuation_db);
  const dominates = (a: Worked, b: Worked) =>
    a.price <= b.price && a.mass <= b.mass && a.att >= b.att && (a.price < b.price || a.mass < b.mass || a.att > b.att);
  const front = meeting.filter((x) => !meeting.some((y) => dominates(y, x)));
  const cheapestFirst = (a: Worked, b: Worked) => a.price - b.price || a.mass - b.mass || b.att - a.att || a.order - b.order;
  const recommended = [...front].filter((w) => w.keeps).sort(cheapestFirst)[0] ?? [...meeting].filter((w) => w.keeps).sort(cheapestFirst)[0] ?? null;
  return { worked, meeting, front, recommended, sorted: [...meeting].sort(cheapestFirst) };
}

// --- random small requirements ---

// Spaces of 2 to 330 designs, big enough for the bounds to skip work and small enough to brute-force.
const requirement = fc.record({
  shape: fc.constantFrom("cylinder" as const, "cylinder" as const, "box" as const),
  size: fc.tuple(fc.integer({ min: 20, max: 160 }), fc.integer({ min: 20, max: 200 }), fc.integer({ min: 20, max: 120 })),
  required: fc.integer({ min: 25, max: 95 }),
  frequency_hz: fc.constantFrom(0, 10, 50, 60, 400, 1000),
  amplitude_uT: fc.constantFrom(5, 50, 100, 300, 1000, 3000),
  orientation: fc.constantFrom("transverse" as const, "axial" as const),
  quantity: fc.constantFrom(1, 3, 10, 60, 500),
  materials: fc.constantFrom(["ni80", "ni50"], ["ni80", "steel-lc"], ["ni50", "steel-lc"], ["ni80"]),
  gauges: fc.constantFrom([0.5, 1], [1, 1.5], [0.5, 1.5], [1]),
  gaps: fc.constantFrom([5, 10], [10], [5, 20]),
  maxLayers: fc.constantFrom(1, 2, 2, 3, 3, 3),
  listCheapest: fc.integer({ min: 0, max: 6 }),
  roomy: fc.constantFrom(true, true, true, false),
  massCap: fc.oneof({ weight: 3, arbitrary: fc.constant(undefined) }, { weight: 1, arbitrary: fc.double({ min: 0.05, max: 3, noNaN: true }) }),
});

type Requirement = typeof requirement extends fc.Arbitrary<infer T> ? T : never;

function problemFromArbitrary(r: Requirement) {
  const [a, b, c] = r.size;
  const dimensions_mm = r.shape === "box" ? { width: a, depth: Math.min(a, b), height: c } : { diameter: a, length: b };
  const maxOutside_mm = r.roomy ? undefined : r.shape === "box" ? { width: a + 30 } : { diameter: a + 25 };
  return problemFor(
    {
      requiredAttenuation_db: r.required,
      field: { frequency_hz: r.frequency_hz, amplitude_uT: r.amplitude_uT, orientation: r.orientation },
      shape: r.shape,
      dimensions_mm,
      constraints: { maxLayers: r.maxLayers, materials: [...r.materials], gauges_mm: [...r.gauges], ...(maxOutside_mm ? { maxOutside_mm } : {}), ...(r.massCap ? { maxMass_kg: r.massCap } : {}) },
      quantity: r.quantity,
    } as DesignAdviceRequestInput,
    [...r.gaps],
  );
}

const candidateKey = (c: { configuration: { method: string; layers: { material: string; thickness_mm: number; gap_mm?: number }[] } }) => keyOf(c.configuration.method, c.configuration.layers);

describe("design advisor: the search against a brute force [derived]", () => {
  it("agrees with the brute force on the front, the recommendation and the cheapest listed; pruning drops nothing the brute force puts on the front", () => {
    fc.assert(
      fc.property(requirement, (r) => {
        const problem = problemFromArbitrary(r);
        const brute = bruteForce(problem);
        const answer = adviseDesigns(problem, shopWith(), { listCheapest: r.listCheapest });
        const listed = new Map(answer.candidates.map((c) => [candidateKey({ configuration: configurationOf(problem, c.design) }), c]));

        // every brute-force front design is listed, marked on the front, with the same figures
        for (const f of brute.front) {
          const c = listed.get(f.key);
          expect(c, `front design ${f.key} missing`).toBeDefined();
          expect(c!.front).toBe(true);
          expect(c!.unitPrice_cents).toBe(f.price);
          expect(c!.attenuation_db).toBe(f.att);
          expect(c!.mass_kg).toBeCloseTo(f.mass, 12);
        }
        // and nothing else is marked on the front
        expect(answer.candidates.filter((c) => c.front).length).toBe(brute.front.length);
        // every listed design meets the requirement at its band's low end
        for (const c of answer.candidates) expect(c.band.low_db).toBeGreaterThanOrEqual(problem.requiredAttenuation_db);
        // the cheapest are listed
        for (const w of brute.sorted.slice(0, r.listCheapest)) expect(listed.has(w.key), `cheap design ${w.key}`).toBe(true);
        // the same recommendation, meeting the requirement at its low end and keeping the margin
        if (brute.recommended === null) expect(answer.recommended).toBeNull();
        else {
          const rec = answer.candidates[answer.recommended!];
          expect(candidateKey({ configuration: configurationOf(problem, rec.design) })).toBe(brute.recommended.key);
          expect(rec.band.low_db).toBeGreaterThanOrEqual(problem.requiredAttenuation_db);
          expect(rec.keepsMargin).toBe(true);
          expect(answer.reason).toMatch(/cheapest/);
        }
        // nothing meets: the closest says what it lacks
        if (brute.meeting.length === 0 && brute.worked.length > 0) {
          expect(answer.closest).toBeDefined();
          expect(answer.closest!.band.low_db).toBe(Math.max(...brute.worked.map((w) => w.low)));
          expect(answer.closest!.lacks).toMatch(/dB short/);
        }
        // the whole space was evaluated
        expect(answer.evaluated).toBe(countDesigns(problem));
        const s = answer.search;
        const ruledOut = Object.values(s.ruledOut).reduce((x, y) => x + y, 0);
        expect(ruledOut + s.predicted).toBeGreaterThanOrEqual(answer.evaluated);
      }),
      { numRuns: 30 },
    );
  }, 60_000);

  it("gives the same answer with and without pruning", () => {
    fc.assert(
      fc.property(requirement, (r) => {
        const problem = problemFromArbitrary(r);
        const pruned = adviseDesigns(problem, shopWith(), { listCheapest: r.listCheapest });
        const full = adviseDesigns(problem, shopWith(), { listCheapest: r.listCheapest, prune: false });
        const view = (a: typeof pruned) => ({ candidates: a.candidates.map((c) => [c.design.order, c.unitPrice_cents, c.front]), recommended: a.recommended, reason: a.reason, closest: a.closest?.lacks });
        expect(view(pruned)).toEqual(view(full));
        expect(pruned.search.priced).toBeLessThanOrEqual(full.search.priced);
      }),
      { numRuns: 30 },
    );
  }, 60_000);
});

describe("design advisor: the bounds cannot drop a winner [derived]", { timeout: 60_000 }, () => {
  const designs = (problem: AdviceProblem) => [...enumerateDesigns(problem)].filter((d) => formable(problem, d));

  it("the construction ceiling is never below the as-built figure, nor the lowered ceiling below the band's low end", () => {
    fc.assert(
      fc.property(requirement, (r) => {
        const problem = problemFromArbitrary(r);
        for (const d of designs(problem).slice(0, 40)) {
          const p = predictShield(predictionInput(problem, d), (id) => byId.get(id), DEFAULT_BUILD_MODEL);
          expect(p.attenuation_db).toBeLessThanOrEqual(attenuationCeiling_db(problem, d, DEFAULT_BUILD_MODEL) + 1e-9);
          expect(p.band.low_db).toBeLessThanOrEqual(lowEndCeiling_db(problem, d, DEFAULT_BUILD_MODEL) + 1e-9);
        }
      }),
      { numRuns: 25 },
    );
  });

  it("the lowered ceiling is tight: a requirement just below a strong design's low end still finds it", () => {
    // two 1.5 mm ni80 cans in a weak static field: walls far above the ceiling, so the low end sits just under the lowered ceiling
    const body = (required: number) =>
      ({
        requiredAttenuation_db: required, field: { frequency_hz: 0, amplitude_uT: 5 }, shape: "cylinder", dimensions_mm: { diameter: 40, length: 60 },
        constraints: { maxLayers: 2, materials: ["ni80"], gauges_mm: [1.5], methods: ["drawn"] }, quantity: 3,
      }) as DesignAdviceRequestInput;
    const probe = problemFor(body(20), [10]);
    const two = [...enumerateDesigns(probe)].find((d) => d.layers.length === 2)!;
    const low = predictShield(predictionInput(probe, two), (id) => byId.get(id), DEFAULT_BUILD_MODEL).band.low_db;
    const bound = lowEndCeiling_db(probe, two, DEFAULT_BUILD_MODEL);
    expect(bound - low).toBeLessThan(1);
    expect(bound - low).toBeGreaterThanOrEqual(0);
    const a = adviseDesigns(problemFor(body(low - 0.01), [10]), shopWith());
    expect(a.candidates.map((c) => c.design.order)).toEqual([two.order]);
  });

  it("a design that keeps the margin is never skipped for a cheaper one that breaks it: it may be the recommendation", () => {
    // found by search: every front design here runs a layer past a third of saturation, and the
    // cheapest design that keeps the margin is dominated only by designs that do not
    const problem = problemFor(
      {
        requiredAttenuation_db: 65, field: { frequency_hz: 400, amplitude_uT: 300 }, shape: "cylinder", dimensions_mm: { diameter: 165, length: 45 },
        constraints: { maxLayers: 2, materials: ["ni80", "ni50", "steel-lc"], gauges_mm: [0.5, 1, 1.5] }, quantity: 60,
      } as DesignAdviceRequestInput,
      [5, 10],
    );
    const pruned = adviseDesigns(problem, shopWith(), { listCheapest: 0 });
    const full = adviseDesigns(problem, shopWith(), { listCheapest: 0, prune: false });
    expect(pruned.search.ruledOut.dominated).toBeGreaterThan(0);
    const rec = pruned.candidates[pruned.recommended!];
    expect(rec.design.order).toBe(full.candidates[full.recommended!].design.order);
    expect(rec.front).toBe(false);
    expect(rec.keepsMargin).toBe(true);
    expect(pruned.reason).toMatch(/^No design on the price–mass–attenuation front keeps/);
  });

  it("the price lower bound is never above the exact price, whatever the margin, discount and scrap credit", () => {
    fc.assert(
      fc.property(
        requirement,
        fc.integer({ min: 0, max: 60 }),
        fc.integer({ min: 0, max: 40 }),
        fc.boolean(),
        fc.constantFrom(0.3, 0.7, 1),
        fc.boolean(),
        (r, marginPercent, discountPercent, scrapCredit, fallbackUtilisation, sheets) => {
          // without stock sheets at a utilisation of 1 the bound differs from the price by rounding alone
          const priceList: PriceList = {
            ...defaultPriceList, marginPercent, scrapCredit, fallbackUtilisation, quantityBreaks: [{ minQuantity: 2, discountPercent }],
            ...(sheets ? {} : { stockSheets: [] }),
          };
          const problem = problemFromArbitrary(r);
          const bound = priceBounder(priceList, problem.quantity);
          const partsOf = partsMemo(problem);
          for (const d of designs(problem).slice(0, 30)) {
            const { parts, byLayer } = partsOf(d);
            const exact = priceBuildUp({ parts, quantity: problem.quantity, priceList, nestGap_mm: 3 }).unitPrice_cents;
            const slack = bound.slackFor(d.layers);
            expect(bound.lower(parts, slack)).toBeLessThanOrEqual(exact);
            // any layer's own parts bound the whole design
            for (const own of byLayer) expect(bound.lower(own, slack)).toBeLessThanOrEqual(bound.lower(parts, slack));
          }
        },
      ),
      { numRuns: 40 },
    );
  });

  it("the bound's unnested subtotal is priceBuildUp's own, to the cent, for every list and design", () => {
    fc.assert(
      fc.property(requirement, fc.integer({ min: 0, max: 60 }), fc.boolean(), (r, marginPercent, scrapCredit) => {
        const priceList: PriceList = { ...defaultPriceList, marginPercent, scrapCredit };
        const unnested: PriceList = { ...priceList, stockSheets: [], fallbackUtilisation: 1 };
        const problem = problemFromArbitrary(r);
        const subtotal = unnestedSubtotal(priceList, problem.quantity);
        const partsOf = partsMemo(problem);
        for (const d of designs(problem).slice(0, 30)) {
          const { parts, byLayer } = partsOf(d);
          expect(subtotal(parts)).toBe(priceBuildUp({ parts, quantity: problem.quantity, priceList: unnested, nestGap_mm: 3 }).subtotal_cents);
          for (const own of byLayer) expect(subtotal(own)).toBe(priceBuildUp({ parts: own, quantity: problem.quantity, priceList: unnested, nestGap_mm: 3 }).subtotal_cents);
        }
      }),
      { numRuns: 40 },
    );
  });

  it("the layer-by-layer parts and the nesting memo give exactly the engine's parts and price", () => {
    fc.assert(
      fc.property(requirement, (r) => {
        const problem = problemFromArbitrary(r);
        const partsOf = partsMemo(problem);
        const nest = memoNest();
        for (const d of designs(problem).slice(0, 30)) {
          const direct = partsForDesign(designConfig(problem, d));
          const { parts, byLayer } = partsOf(d);
          expect(parts).toEqual(direct);
          expect(byLayer.flat()).toEqual(direct);
          const a = priceBuildUp({ parts: direct, quantity: problem.quantity, priceList: defaultPriceList, nestGap_mm: 3 });
          const b = priceBuildUp({ parts, quantity: problem.quantity, priceList: defaultPriceList, nestGap_mm: 3, nest });
          expect(b).toEqual(a);
          expect(massOf(direct)).toBe(massOf(parts));
        }
      }),
      { numRuns: 25 },
    );
  });

  it("the nesting memo's key tells different blank lists apart and writes a repeating one once", () => {
    const disc = (d: number): NestBlank => ({ kind: "disc", diameter_mm: d });
    const rect = (l: number, w: number): NestBlank => ({ kind: "rectangle", length_mm: l, width_mm: w });
    expect(blanksKey([disc(10), rect(5, 6), disc(10), rect(5, 6)])).toBe("2*d10,r5x6");
    expect(blanksKey([disc(10), disc(10), disc(10)])).toBe("3*d10");
    expect(blanksKey([disc(10), rect(5, 6), disc(10)])).not.toBe(blanksKey([disc(10), disc(10), rect(5, 6)]));
    expect(blanksKey([rect(5, 6)])).not.toBe(blanksKey([rect(6, 5)]));
    const sheet = { materialId: "ni80", thickness_mm: 1, width_mm: 610, length_mm: 1524 };
    const blanks = [disc(120.5), rect(200, 80), disc(120.5), rect(200, 80)];
    const nest = memoNest();
    const direct = nestBlanks(blanks, sheet, { gap_mm: 3 });
    expect(nest(blanks, sheet, { gap_mm: 3 })).toMatchObject({ sheetsNeeded: direct.sheetsNeeded, utilisation: direct.utilisation });
    expect(nest(blanks, sheet, { gap_mm: 3 })).toBe(nest(blanks, sheet, { gap_mm: 3 }));
  });
});

describe("design advisor: the space and the answer", { timeout: 30_000 }, () => {
  it("predicts without the detail (sentences, warnings, the split of the losses), and the figures are the same as with it", () => {
    const p = problemFor({ requiredAttenuation_db: 60, field: { frequency_hz: 60, amplitude_uT: 3000 }, shape: "cylinder", dimensions_mm: { diameter: 50, length: 120 }, constraints: { maxLayers: 2, materials: ["ni80", "ni50"], gauges_mm: [0.5] }, quantity: 1 });
    for (const d of enumerateDesigns(p)) {
      const input = predictionInput(p, d);
      const full = predictShield(input, (id) => byId.get(id), DEFAULT_BUILD_MODEL);
      const bare = predictShield(input, (id) => byId.get(id), DEFAULT_BUILD_MODEL, { detail: false });
      expect(full.warnings.length).toBeGreaterThan(0); // a strong field: saturation warnings
      expect(bare.warnings).toEqual([]);
      expect(bare.asBuilt.summary).toBe("");
      expect(full.asBuilt.losses.length).toBeGreaterThan(0);
      expect(bare.asBuilt.losses).toEqual([]);
      const figures = (r: typeof full) => ({ ...r, warnings: [], asBuilt: { ...r.asBuilt, summary: "", losses: [] }, layers: r.layers.map((l) => ({ ...l, muReason: "" })) });
      expect(figures(bare)).toEqual(figures(full));
    }
  });

  it("the search's figures, band asked for last and Bessel functions remembered, are predictShield's own for every design of random requirements", () => {
    fc.assert(
      fc.property(requirement, (r) => {
        const problem = problemFromArbitrary(r);
        // one memo of the Bessel functions for the whole space, as a search keeps it
        const bessel = besselMemo();
        for (const d of [...enumerateDesigns(problem)].filter((x) => formable(problem, x)).slice(0, 40)) {
          const input = predictionInput(problem, d);
          const full = predictShield(input, (id) => byId.get(id), DEFAULT_BUILD_MODEL);
          const f = predictFigures(input, (id) => byId.get(id), DEFAULT_BUILD_MODEL, bessel);
          expect(f.attenuation_db).toBe(full.attenuation_db);
          expect(f.ideal_db).toBe(full.ideal.attenuation_db);
          expect(f.layers).toEqual(full.layers.map((l) => ({ thickness_mm: l.thickness_mm, wallFluxDensity_T: l.wallFluxDensity_T, saturationMargin: l.saturationMargin })));
          expect(f.band()).toEqual(full.band);
        }
      }),
      { numRuns: 30 },
    );
  });

  const can = (over: Partial<DesignAdviceRequestInput> = {}): DesignAdviceRequestInput =>
    ({
      requiredAttenuation_db: 60,
      field: { frequency_hz: 60, amplitude_uT: 100 },
      shape: "cylinder",
      dimensions_mm: { diameter: 50, length: 120 },
      constraints: { maxLayers: 2, materials: ["ni80", "ni50"], gauges_mm: [0.5, 1] },
      quantity: 10,
      ...over,
    }) as DesignAdviceRequestInput;

  it("counts the space as it enumerates it: methods × Σ options^n × gaps (n > 1)", () => {
    const p = problemFor(can());
    // 4 options (2 alloys × 2 gauges), 2 gaps, 2 methods: (4 + 16·2)·2 = 72
    expect(countDesigns(p)).toBe(72);
    expect([...enumerateDesigns(p)].length).toBe(72);
    const three = problemFor(can({ constraints: { maxLayers: 3, materials: ["ni80", "ni50"], gauges_mm: [0.5, 1] } }));
    expect(countDesigns(three)).toBe(2 * (4 + 16 * 2 + 64 * 2));
    // the demo shop's default search: 3 magnetic alloys at the advisor's 4 gauges, 4 gaps, 1–3 layers, 2 methods
    const demo = problemFor(can({ constraints: {} }), DEFAULT_DESIGN_SEARCH_SETTINGS.gapSteps_mm);
    expect(demo.options.map((o) => o.material)).toEqual(expect.arrayContaining(["ni80", "ni50", "steel-lc"]));
    expect(demo.options.some((o) => o.material === "copper")).toBe(false);
    expect([...new Set(demo.options.map((o) => o.thickness_mm))]).toEqual([0.5, 1, 1.5, 2]);
    expect(countDesigns(demo)).toBe(2 * (12 + 12 ** 2 * 4 + 12 ** 3 * 4));
    // every stocked gauge when asked for (6, 6 and 5 of them)
    const all = problemFor(can({ constraints: { gauges_mm: [0.35, 0.5, 0.75, 1, 1.5, 2, 3] } }), DEFAULT_DESIGN_SEARCH_SETTINGS.gapSteps_mm);
    expect(countDesigns(all)).toBe(2 * (17 + 17 ** 2 * 4 + 17 ** 3 * 4));
    expect(countDesigns(all)).toBeLessThanOrEqual(MAX_SEARCH_DESIGNS);
  });

  it("names what the shop cannot offer by field", () => {
    const request = designAdviceRequestSchema.parse(can({ constraints: { materials: ["ni80", "unobtainium", "copper"], gauges_mm: [0.5, 0.7] } }));
    const noCopperStock: PriceList = { ...defaultPriceList, stockSheets: defaultPriceList.stockSheets.filter((s) => s.materialId !== "copper") };
    const r = adviceProblemFor(request, { materials: materialLibrary, priceList: noCopperStock, settings: DEFAULT_DESIGN_SEARCH_SETTINGS });
    expect("fields" in r && r.fields).toEqual({
      "constraints.materials.1": 'Unknown material "unobtainium".',
      "constraints.materials.2": "The shop stocks no sheet of copper.",
      "constraints.gauges_mm.1": "The shop stocks no 0.7 mm sheet of ni80.",
    });
    const g = adviceProblemFor(designAdviceRequestSchema.parse(can({ constraints: { materials: ["ni80"], gauges_mm: [0.5, 0.7] } })), {
      materials: materialLibrary,
      priceList: defaultPriceList,
      settings: DEFAULT_DESIGN_SEARCH_SETTINGS,
    });
    expect("fields" in g && g.fields).toEqual({ "constraints.gauges_mm.1": "The shop stocks no 0.7 mm sheet of ni80." });
    // the shop's advisor gauges, none of them stocked in the alloy asked for
    const none = adviceProblemFor(designAdviceRequestSchema.parse(can({ constraints: { materials: ["ni80"] } })), {
      materials: materialLibrary,
      priceList: defaultPriceList,
      settings: { ...DEFAULT_DESIGN_SEARCH_SETTINGS, gauges_mm: [0.6, 0.9] },
    });
    expect("fields" in none && none.fields["constraints.gauges_mm"]).toMatch(/stocks none of the gauges the advisor offers \(0.6, 0.9 mm\) in ni80/);
  });

  it("each candidate's configuration is a quote's: the prediction body and the fabrication body accept it unchanged", () => {
    for (const shape of ["cylinder", "box"] as const) {
      const p = problemFor(can(shape === "box" ? { shape, requiredAttenuation_db: 50, dimensions_mm: { width: 80, depth: 60, height: 40 } } : {}));
      const answer = adviseDesigns(p, shopWith());
      expect(answer.candidates.length).toBeGreaterThan(0);
      for (const c of answer.candidates) {
        const configuration = configurationOf(p, c.design);
        expect(configuration.requiredAttenuation_db).toBe(p.requiredAttenuation_db);
        expect(predictionRequestSchema.safeParse(configuration).success).toBe(true);
        expect(designConfigurationSchema.safeParse(configuration).success).toBe(true);
        // the figures are the engine's for exactly that body
        const parsed = predictionRequestSchema.parse(configuration);
        expect(predictShield(parsed, (id) => byId.get(id), DEFAULT_BUILD_MODEL).attenuation_db).toBe(c.attenuation_db);
      }
    }
  });

  it("recommends the cheapest front design that keeps the margin, with a sentence on why", () => {
    const p = problemFor(can());
    const a = adviseDesigns(p, shopWith());
    const rec = a.candidates[a.recommended!];
    expect(rec.front).toBe(true);
    expect(rec.keepsMargin).toBe(true);
    for (const c of a.candidates) if (c.front && c.keepsMargin) expect(c.unitPrice_cents).toBeGreaterThanOrEqual(rec.unitPrice_cents);
    expect(a.reason).toContain(rec.summary);
    expect(a.reason).toMatch(/third of its saturation/);
    // cheapest first
    const prices = a.candidates.map((c) => c.unitPrice_cents);
    expect(prices).toEqual([...prices].sort((x, y) => x - y));
  });

  it("nothing meets an impossible figure: the closest design, and how many dB it is short", () => {
    const a = adviseDesigns(problemFor(can({ requiredAttenuation_db: 200 })), shopWith());
    expect(a.candidates).toEqual([]);
    expect(a.recommended).toBeNull();
    expect(a.reason).toMatch(/No design the shop makes/);
    expect(a.closest!.shortfall.db).toBeCloseTo(200 - a.closest!.band.low_db, 9);
    expect(a.closest!.lacks).toMatch(/dB short at the low end of its band/);
    // two layers is the most allowed here; the closest has two
    expect(a.closest!.design.layers).toHaveLength(2);
  });

  it("nothing fits the room: the least oversized design, and by how much", () => {
    const a = adviseDesigns(problemFor(can({ constraints: { maxLayers: 2, materials: ["ni80"], gauges_mm: [1], maxOutside_mm: { diameter: 51 } } })), shopWith());
    expect(a.candidates).toEqual([]);
    expect(a.closest!.shortfall.oversize_mm!.diameter).toBeCloseTo(50 + 2 - 51, 9);
    expect(a.closest!.lacks).toMatch(/too big: 1 mm over the largest outside diameter/);
    const heavy = adviseDesigns(problemFor(can({ constraints: { maxLayers: 1, materials: ["ni80"], gauges_mm: [1], maxMass_kg: 0.01 } })), shopWith());
    expect(heavy.closest!.shortfall.overMass_kg).toBeGreaterThan(0);
    expect(heavy.closest!.lacks).toMatch(/too heavy/);
  });

  it("a field that saturates every design that meets it: no recommendation, the closest saturates", () => {
    // 2 mT at 60 Hz across a 150 mm can: a thin nickel-iron wall would carry more than its saturation
    const a = adviseDesigns(
      problemFor(can({ requiredAttenuation_db: 20, field: { frequency_hz: 60, amplitude_uT: 2000 }, dimensions_mm: { diameter: 150, length: 200 }, constraints: { maxLayers: 1, materials: ["ni80"], gauges_mm: [0.5] } })),
      shopWith(),
    );
    expect(a.recommended).toBeNull();
    expect(a.candidates.length).toBeGreaterThan(0);
    expect(a.closest!.shortfall.saturatedLayers).toEqual([0]);
    expect(a.closest!.lacks).toMatch(/saturates: layer 1 \(0.5 mm ni80\) would carry [\d.]+ T at its peak, above its 0.77 T saturation/);
    expect(a.reason).toMatch(/saturation/);
  });
});
