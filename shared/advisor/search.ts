// The design advisor's search: every design of the space (space.ts) is either worked out in
// full (prediction, saturation check, outside size, mass, price at the quantity) or ruled out
// by an exact check or a bound that cannot drop a design the answer shows (bounds.ts).
//
// The answer lists the designs that meet the requirement at the low end of their band: all of
// the Pareto front on price, mass and attenuation, the `listCheapest` cheapest, and the
// recommendation (the cheapest on the front that keeps every layer's saturation margin).
// Two bounds save work:
// - a design whose construction ceiling, lowered by the band's spread, is below the
//   requirement cannot meet it at the low end of its band: no prediction;
// - a meeting design is not priced in full (no nesting) when its price lower bound is above
//   the price of a design already worked out that is no heavier and at least as strong (and
//   keeps the margin, if this one does): it is then strictly dominated, so off the front, and
//   never the recommendation; and when that bound is also above the listCheapest-th price
//   found so far (a price that only falls as the search goes on), so it is not among the
//   cheapest either. The test reads the figure, not the band, so it comes first: a design set
//   aside by it is off the answer whether it meets the requirement or not, and never needs its band.
// Designs are taken cheapest first by their price without nesting, so the ones that do the
// skipping come early (the order changes only how much is skipped, never the answer).

import { FabricationInputError, type FabricatedPart } from "../fabrication";
import { besselMemo } from "../physics/bessel";
import type { BuildModel } from "../physics/build-model";
import { predictFigures, PredictionInputError, type MaterialLookup, type ShieldFigures } from "../physics/predict";
import type { PriceList } from "../schemas/pricing";
import { priceBuildUp } from "../fabrication/pricing";
import type { Shortfall } from "../schemas/design-advice";
import { lowEndCeiling_db, priceBounder, unnestedSubtotal } from "./bounds";
import { lacksSentence, noRecommendationReason, recommendationReason } from "./explain";
import { memoNest } from "./nest-memo";
import { byPrice, frontFlags, RunningFront } from "./pareto";
import {
  countDesigns, enumerateDesigns, formable, massOf, outsideSize, oversize, partsMemo, predictionInput, summaryOf,
  type AdviceMethod, type AdviceProblem, type Design, type DesignParts, type LayerOption,
} from "./space";

/** What the search reads of the shop: the library, the as-built model, the current shop rates and the margin rule. */
export interface AdviceShop {
  materials: MaterialLookup;
  buildModel: BuildModel;
  priceList: PriceList;
  /** every layer's saturation / peak wall flux at least this for a recommendation */
  minSaturationMargin: number;
}

export interface AdviceOptions {
  /** meeting designs listed besides the front, cheapest first */
  listCheapest?: number;
  /** false: work every design out in full (the tests compare both ways) */
  prune?: boolean;
}

/** Web between blanks on the sheet: the price estimate's figure, so the prices agree. */
export const NEST_GAP_MM = 3;
export const DEFAULT_LIST_CHEAPEST = 60;
/** how often the search yields (designs), so a caller can keep its event loop turning */
const YIELD_EVERY = 32;

export interface EvaluatedDesign {
  design: Design;
  attenuation_db: number;
  band: { low_db: number; high_db: number };
  ideal_db: number;
  unitPrice_cents: number;
  currency: string;
  mass_kg: number;
  outside_mm: Record<string, number>;
  layers: { material: string; thickness_mm: number; wallFluxDensity_T: number; saturationMargin: number | null }[];
  saturationMargin: number | null;
  keepsMargin: boolean;
}

export interface AdvisedCandidate extends EvaluatedDesign {
  /** the design in a line (summaryOf) */
  summary: string;
  front: boolean;
}

export interface ClosestDesign extends EvaluatedDesign {
  summary: string;
  lacks: string;
  shortfall: Shortfall;
}

export interface SearchStats {
  designs: number;
  ruledOut: { tooBig: number; tooHeavy: number; cannotReach: number; dominated: number; notMade: number };
  predicted: number;
  priced: number;
  notListed: number;
  elapsed_ms: number;
}

export interface AdviceResult {
  evaluated: number;
  candidates: AdvisedCandidate[];
  recommended: number | null;
  reason: string;
  closest?: ClosestDesign;
  search: SearchStats;
}

/** Progress while the search runs: designs dealt with so far of the total. */
export interface AdviceProgress {
  done: number;
  total: number;
}

/** A design that fits the space and the constraints on size, waiting its turn. */
interface Pending {
  design: Design;
  outside: Record<string, number>;
  /** material cost of the walls, roughly: the order of the designs that cannot reach the requirement */
  cost: number;
  /** the parts (null: the shop cannot make them) and their price without nesting: the order of the search */
  made?: DesignParts | null;
  rank: number;
}

/** The walls' material cost, roughly (area × thickness × density × price): the search's order. */
function roughCost(p: AdviceProblem, d: Design): number {
  const dims = p.dimensions_mm;
  let cost = 0, grow = 0;
  for (const l of d.layers) {
    const t = l.thickness_mm;
    const area =
      p.shape === "box"
        ? 2 * ((dims.width + grow) * (dims.depth + grow) + (dims.width + grow) * (dims.height + grow) + (dims.depth + grow) * (dims.height + grow))
        : Math.PI * (dims.diameter + grow) * (dims.length + grow) + (Math.PI * (dims.diameter + grow) ** 2) / 2;
    cost += area * t * l.density_kg_m3 * 1e-9 * l.pricePerKg_cents;
    grow += 2 * (t + d.gap_mm);
  }
  return cost;
}

/** The cheapest `k` prices seen, to know the k-th. */
class CheapestPrices {
  private prices: number[] = [];
  constructor(private readonly k: number) {}
  add(price: number): void {
    if (this.k <= 0) return;
    const a = this.prices;
    if (a.length === this.k && price >= a[a.length - 1]) return;
    let i = a.length;
    while (i > 0 && a[i - 1] > price) i--;
    a.splice(i, 0, price);
    if (a.length > this.k) a.pop();
  }
  /** the k-th cheapest so far: +∞ until k are seen, −∞ when none are listed for being cheap */
  get threshold(): number {
    if (this.k <= 0) return -Infinity;
    return this.prices.length < this.k ? Infinity : this.prices[this.k - 1];
  }
}

/**
 * The search as steps: yields its progress now and then (a server slices it so its event loop
 * keeps turning; a caller may stop pulling to cancel) and returns the answer.
 */
export function* adviseSteps(problem: AdviceProblem, shop: AdviceShop, options: AdviceOptions = {}): Generator<AdviceProgress, AdviceResult, void> {
  const started = globalThis.performance.now();
  const listCheapest = options.listCheapest ?? DEFAULT_LIST_CHEAPEST;
  const prune = options.prune ?? true;
  const required = problem.requiredAttenuation_db;
  const rule = shop.minSaturationMargin;
  const total = countDesigns(problem);
  const stats: SearchStats = { designs: total, ruledOut: { tooBig: 0, tooHeavy: 0, cannotReach: 0, dominated: 0, notMade: 0 }, predicted: 0, priced: 0, notListed: 0, elapsed_ms: 0 };
  const bounder = priceBounder(shop.priceList, problem.quantity);
  const nest = memoNest();
  // the designs' walls stand at a few hundred radii: each wall's Bessel functions once per search
  const bessel = besselMemo();
  const currency = shop.priceList.currency;
  /** designs dealt with: ruled out, or worked out */
  let done = 0;

  const layerParts = partsMemo(problem);

  const partsOf = (design: Design): DesignParts | null => {
    try {
      return layerParts(design);
    } catch (err) {
      if (err instanceof FabricationInputError) return null;
      throw err;
    }
  };
  // the ceiling depends on the method, the layer count and the outermost alloy only: kept by
  // method and outermost layer option, a slot per layer count
  const ceilings = new Map<AdviceMethod, Map<LayerOption, number[]>>();
  const ceilingOf = (d: Design) => {
    let byOuter = ceilings.get(d.method);
    if (!byOuter) ceilings.set(d.method, (byOuter = new Map()));
    const outer = d.layers[d.layers.length - 1];
    let byCount = byOuter.get(outer);
    if (!byCount) byOuter.set(outer, (byCount = []));
    let c = byCount[d.layers.length];
    if (c === undefined) c = byCount[d.layers.length] = lowEndCeiling_db(problem, d, shop.buildModel);
    return c;
  };

  // 1. The space, with the exact checks that need no engine: formable, and the outside size.
  const pending: Pending[] = [];
  let leastOversize: { design: Design; outside: Record<string, number>; excess: number } | null = null;
  let seen = 0;
  for (const design of enumerateDesigns(problem)) {
    if (++seen % (YIELD_EVERY * 16) === 0) yield { done: seen - pending.length, total };
    if (!formable(problem, design)) {
      stats.ruledOut.notMade++;
      continue;
    }
    const outside = outsideSize(problem, design);
    const over = oversize(problem, outside);
    const keys = Object.keys(over);
    if (keys.length) {
      stats.ruledOut.tooBig++;
      const excess = Math.max(...keys.map((k) => over[k] / problem.maxOutside_mm![k]!));
      if (!leastOversize || excess < leastOversize.excess) leastOversize = { design, outside, excess };
      continue;
    }
    pending.push({ design, outside, cost: roughCost(problem, design), rank: 0 });
  }
  // cheapest first by the price without nesting (every line of the price but the scrap), so the
  // designs that do the skipping come early; the ones that cannot reach the requirement need no parts
  const unnested = unnestedSubtotal(shop.priceList, problem.quantity);
  for (const item of pending) {
    if (ceilingOf(item.design) < required) continue;
    item.made = partsOf(item.design);
    item.rank = item.made ? unnested(item.made.parts) : Infinity;
  }
  pending.sort((a, b) => a.rank - b.rank || a.cost - b.cost || a.design.order - b.design.order);
  done = seen - pending.length;
  yield { done, total };

  // 2. Each design that fits, roughly cheapest first.
  const meeting: EvaluatedDesign[] = [];
  const allFront = new RunningFront();
  const keepFront = new RunningFront();
  const cheapest = new CheapestPrices(listCheapest);
  /** fits, but its ceiling is below the requirement: the nearest miss may be among them */
  const unreachable: { item: Pending; ceiling: number }[] = [];
  let nearestMiss: { evaluated: Omit<EvaluatedDesign, "unitPrice_cents">; parts: FabricatedPart[] } | null = null;
  /** the lightest design over the largest mass (set from the closures below, hence a holder) */
  const overweight: { lightest: { item: Pending; parts: FabricatedPart[]; mass: number } | null } = { lightest: null };
  /** the parts of a design that fits within the largest mass, or why not */
  const fitting = (item: Pending): { parts: FabricatedPart[]; byLayer: FabricatedPart[][]; mass: number } | "not-made" | "too-heavy" => {
    const made = item.made !== undefined ? item.made : partsOf(item.design);
    if (!made) return "not-made";
    const mass = massOf(made.parts);
    if (problem.maxMass_kg !== undefined && mass > problem.maxMass_kg) {
      if (!overweight.lightest || mass < overweight.lightest.mass) overweight.lightest = { item, parts: made.parts, mass };
      return "too-heavy";
    }
    return { parts: made.parts, byLayer: made.byLayer, mass };
  };
  /** The design's figures; its band is worked out by `banded` (a design set aside on its figure alone never needs it). */
  const figures = (item: Pending, mass_kg: number): Omit<EvaluatedDesign, "unitPrice_cents" | "band"> & { figures: ShieldFigures } | null => {
    let r;
    try {
      // the figures only: the sentences, warnings and losses are not read here
      r = predictFigures(predictionInput(problem, item.design), shop.materials, shop.buildModel, bessel);
    } catch (err) {
      if (err instanceof PredictionInputError) return null;
      throw err;
    }
    stats.predicted++;
    let smallest: number | null = null;
    const layers = r.layers.map((l, i) => {
      if (l.saturationMargin !== null && (smallest === null || l.saturationMargin < smallest)) smallest = l.saturationMargin;
      return { material: item.design.layers[i].material, thickness_mm: l.thickness_mm, wallFluxDensity_T: l.wallFluxDensity_T, saturationMargin: l.saturationMargin };
    });
    return {
      design: item.design,
      attenuation_db: r.attenuation_db,
      ideal_db: r.ideal_db,
      currency,
      mass_kg,
      outside_mm: item.outside,
      layers,
      saturationMargin: smallest,
      keepsMargin: smallest === null || smallest >= rule,
      figures: r,
    };
  };
  const banded = (f: NonNullable<ReturnType<typeof figures>>): Omit<EvaluatedDesign, "unitPrice_cents"> => {
    const band = f.figures.band();
    return {
      design: f.design,
      attenuation_db: f.attenuation_db,
      band: { low_db: band.low_db, high_db: band.high_db },
      ideal_db: f.ideal_db,
      currency: f.currency,
      mass_kg: f.mass_kg,
      outside_mm: f.outside_mm,
      layers: f.layers,
      saturationMargin: f.saturationMargin,
      keepsMargin: f.keepsMargin,
    };
  };
  const predict = (item: Pending, parts: FabricatedPart[], mass_kg = massOf(parts)): Omit<EvaluatedDesign, "unitPrice_cents"> | null => {
    const f = figures(item, mass_kg);
    return f && banded(f);
  };
  const price = (parts: FabricatedPart[]): number => {
    stats.priced++;
    return priceBuildUp({ parts, quantity: problem.quantity, priceList: shop.priceList, nestGap_mm: NEST_GAP_MM, nest }).unitPrice_cents;
  };
  /**
   * Strictly dominated by a design already worked out that meets the requirement, and dearer
   * than the cheapest listed: off the front and unlisted whether it meets the requirement or not
   * (and when it does not, a design meets it, so no nearest miss is asked for).
   */
  const dominated = (e: Pick<EvaluatedDesign, "keepsMargin" | "mass_kg" | "attenuation_db" | "design">, fit: { parts: FabricatedPart[] }): boolean => {
    const threshold = cheapest.threshold;
    if (!prune || threshold === Infinity) return false;
    // the whole design's bound (its parts come once: not kept); the cheap test first, then the front
    const bound = bounder.lower(fit.parts, bounder.slackFor(e.design.layers), false);
    return bound > threshold && (e.keepsMargin ? keepFront : allFront).anyAsGoodBelow(e.mass_kg, e.attenuation_db, bound);
  };

  for (const item of pending) {
    if (++done % YIELD_EVERY === 0) yield { done, total };
    const ceiling = ceilingOf(item.design);
    if (ceiling < required) {
      stats.ruledOut.cannotReach++;
      unreachable.push({ item, ceiling });
      continue;
    }
    const fit = fitting(item);
    if (typeof fit === "string") {
      stats.ruledOut[fit === "not-made" ? "notMade" : "tooHeavy"]++;
      continue;
    }
    const { parts } = fit;
    const f = figures(item, fit.mass);
    if (!f) {
      stats.ruledOut.notMade++;
      continue;
    }
    // dominance reads the figure alone, so it comes before the band
    if (dominated(f, fit)) {
      stats.ruledOut.dominated++;
      continue;
    }
    const e = banded(f);
    if (e.band.low_db < required) {
      if (!nearestMiss || e.band.low_db > nearestMiss.evaluated.band.low_db) nearestMiss = { evaluated: e, parts };
      continue;
    }
    const full: EvaluatedDesign = { ...e, unitPrice_cents: price(parts) };
    meeting.push(full);
    allFront.add(full);
    if (full.keepsMargin) keepFront.add(full);
    cheapest.add(full.unitPrice_cents);
  }

  // 3. The answer from the designs worked out.
  meeting.sort((a, b) => byPrice(a, b) || a.design.order - b.design.order);
  const front = frontFlags(meeting);
  const frontSize = front.filter(Boolean).length;
  let pick = meeting.findIndex((m, i) => front[i] && m.keepsMargin);
  const onFront = pick >= 0;
  if (pick < 0) pick = meeting.findIndex((m) => m.keepsMargin);
  const listed = meeting.map((_, i) => front[i] || i < listCheapest || i === pick);
  const candidates: AdvisedCandidate[] = [];
  let recommended: number | null = null;
  meeting.forEach((m, i) => {
    if (!listed[i]) return;
    if (i === pick) recommended = candidates.length;
    candidates.push({ ...m, summary: summaryOf(m.design), front: front[i] });
  });
  stats.notListed = meeting.length - candidates.length;

  let reason: string;
  let closest: ClosestDesign | undefined;
  const shortfallOf = (e: Omit<EvaluatedDesign, "unitPrice_cents">, over: Record<string, number> = {}, overMass?: number): Shortfall => {
    const s: Shortfall = {};
    if (e.band.low_db < required) s.db = required - e.band.low_db;
    const saturated = e.layers.flatMap((l, i) => (l.saturationMargin !== null && l.saturationMargin < rule ? [i] : []));
    if (saturated.length) s.saturatedLayers = saturated;
    if (Object.keys(over).length) s.oversize_mm = over;
    if (overMass !== undefined) s.overMass_kg = overMass;
    return s;
  };
  const describeClosest = (e: EvaluatedDesign, s: Shortfall): ClosestDesign => {
    const summary = summaryOf(e.design);
    return { ...e, summary, shortfall: s, lacks: lacksSentence(s, { ...e, summary }, required, rule) };
  };

  if (pick >= 0) {
    const p = meeting[pick];
    reason = recommendationReason({ pick: { ...p, summary: summaryOf(p.design) }, onFront, frontSize, cheaperBreakingMargin: meeting.filter((m, i) => front[i] && i < pick).length, required_db: required, minMargin: rule });
  } else if (meeting.length) {
    // every design that meets it breaks the margin: the front design that comes nearest keeping it
    let best = -1;
    meeting.forEach((m, i) => {
      if (front[i] && (best < 0 || (m.saturationMargin ?? Infinity) > (meeting[best].saturationMargin ?? Infinity))) best = i;
    });
    closest = describeClosest(meeting[best], shortfallOf(meeting[best]));
    reason = noRecommendationReason({ anyMeets: true, required_db: required, minMargin: rule, anyMade: true });
  } else {
    // Nothing meets it. The fitting design with the highest low end: designs whose lowered
    // ceiling is below the best low end found cannot beat it, so the rest go highest first.
    unreachable.sort((a, b) => b.ceiling - a.ceiling || a.item.cost - b.item.cost);
    for (const { item, ceiling } of unreachable) {
      if (nearestMiss && ceiling <= nearestMiss.evaluated.band.low_db) break;
      yield { done, total };
      const fit = fitting(item);
      if (typeof fit === "string") continue;
      const { parts } = fit;
      const e = predict(item, parts, fit.mass);
      if (e && (!nearestMiss || e.band.low_db > nearestMiss.evaluated.band.low_db)) nearestMiss = { evaluated: e, parts };
    }
    if (nearestMiss) {
      const e = { ...nearestMiss.evaluated, unitPrice_cents: price(nearestMiss.parts) };
      closest = describeClosest(e, shortfallOf(e));
    } else if (overweight.lightest) {
      const { item, parts, mass } = overweight.lightest;
      const e = predict(item, parts);
      if (e) closest = describeClosest({ ...e, unitPrice_cents: price(parts) }, shortfallOf(e, {}, mass - problem.maxMass_kg!));
    } else if (leastOversize) {
      const item: Pending = { design: leastOversize.design, outside: leastOversize.outside, cost: 0, rank: 0 };
      const parts = partsOf(item.design)?.parts;
      const e = parts && predict(item, parts);
      if (parts && e) {
        const mass = massOf(parts);
        const overMass = problem.maxMass_kg !== undefined && mass > problem.maxMass_kg ? mass - problem.maxMass_kg : undefined;
        closest = describeClosest({ ...e, unitPrice_cents: price(parts) }, shortfallOf(e, oversize(problem, item.outside), overMass));
      }
    }
    reason = noRecommendationReason({ anyMeets: false, required_db: required, minMargin: rule, anyMade: closest !== undefined });
  }

  stats.elapsed_ms = Math.round(globalThis.performance.now() - started);
  return { evaluated: total, candidates, recommended, reason, ...(closest ? { closest } : {}), search: stats };
}

/** The whole search at once. */
export function adviseDesigns(problem: AdviceProblem, shop: AdviceShop, options: AdviceOptions = {}): AdviceResult {
  const steps = adviseSteps(problem, shop, options);
  for (;;) {
    const r = steps.next();
    if (r.done) return r.value;
  }
}
