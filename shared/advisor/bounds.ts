// Bounds that let the search skip work without ever dropping a design it would show. Each is a
// bound, never an estimate; the property tests in tests/unit/advisor-search.test.ts check
// them against the full computation on random designs.
//
// 1. Attenuation, from above: the as-built figure combines the walls with the construction
//    ceiling as 1/S = 1/S_walls + 1/S_ceiling (+ leaks), so S ≤ S_ceiling; the band's low end
//    is the same sum with the ceiling lowered by the model's spread (and never above the
//    figure). A design whose lowered ceiling is below the requirement cannot meet it at the
//    low end, whatever its walls.
// 2. Price, from below: the price build-up with every blank's own mass as the material bought
//    (utilisation 1, no nesting scrap). Nesting only ever buys more: gross = net / utilisation
//    with utilisation ≤ 1, and while the scrap credit per kg is below the price per kg, each
//    extra kg of scrap costs (price − credit) > 0. Every other line is the same for both. The
//    rounding of kg to 0.001 and of each line, the margin, the discount and the unit price to
//    whole cents is allowed for (see priceLowerBound).

import { ceiling_db, constructionOf, fitFor, fitInUse, type BuildModel } from "../physics/build-model";
import { discountFor, q3, roundCents, type FabricatedPart, type PriceList } from "../fabrication";
import type { AdviceProblem, Design, LayerOption } from "./space";

/** The highest as-built figure the design's construction allows, dB: its ceiling. */
export function attenuationCeiling_db(p: AdviceProblem, d: Design, model: BuildModel): number {
  const construction = constructionOf(p.shape, "closed");
  // a fitted ceiling is looked up by the outermost layer's alloy, as the prediction does
  const outer = d.layers[d.layers.length - 1];
  return ceiling_db(model, construction, d.layers.length, fitFor(model, outer.material, d.method, construction)?.ceiling_db);
}

/**
 * The highest low end of the band the construction allows: the band's low end takes the ceiling
 * lowered by the model's spread, or, for a class whose shop calibration is in use, the figure
 * (at most the ceiling) less the calibrated band's depth below it.
 */
export function lowEndCeiling_db(p: AdviceProblem, d: Design, model: BuildModel): number {
  const outer = d.layers[d.layers.length - 1];
  const fit = fitFor(model, outer.material, d.method, constructionOf(p.shape, "closed"));
  const below = fitInUse(fit) && fit.band_db ? fit.band_db.below : model.spread.ceiling_db;
  return attenuationCeiling_db(p, d, model) - Math.max(0, below);
}

export interface PriceBounder {
  /** What rounding and scrap credits may take off a design with these layers (see lower). */
  slackFor(layers: readonly LayerOption[]): number;
  /**
   * A unit price in cents that the exact price of a design is never below (−Infinity: no bound
   * for this list); `slack` is slackFor(the design's layers). `parts` may be all of the
   * design's parts, or some of them: the unnested subtotal only grows as parts are added (each
   * line's quantity is a sum over the parts, every rate is ≥ 0), so part of a design bounds the
   * whole. A part list seen before (the same array) is not priced again; `remember: false`
   * for a list that will not come again (a whole design's).
   */
  lower(parts: FabricatedPart[], slack: number, remember?: boolean): number;
}

export function priceBounder(priceList: PriceList, quantity: number): PriceBounder {
  // With a scrap credit above the price per kg, more scrap would lower the price: no bound.
  const creditAbovePrice = priceList.scrapCredit && priceList.materials.some((m) => m.scrapCreditPerKg_cents > m.pricePerKg_cents);
  const creditOf = new Map(priceList.materials.map((m) => [m.materialId, priceList.scrapCredit ? m.scrapCreditPerKg_cents : 0]));
  const m = priceList.marginPercent / 100;
  const d = discountFor(quantity, priceList) / 100;
  const unnested = unnestedSubtotal(priceList, quantity);
  const subtotals = new WeakMap<FabricatedPart[], number>();
  const subtotalOf = (parts: FabricatedPart[], remember: boolean) => {
    if (!remember) return unnested(parts);
    let sub = subtotals.get(parts);
    if (sub === undefined) subtotals.set(parts, (sub = unnested(parts)));
    return sub;
  };
  return {
    slackFor(layers) {
      // Per alloy and gauge (a design's groups are its layers' distinct alloy and gauge), the
      // nested material line against the unnested one:
      // round(q(G)·p) − round(q(G − N)·c) − round(q(N)·p) ≥ (q(G) − q(N))·(p − c) − 0.0015·c − 1.5,
      // q rounding kg to 0.001 (±0.0005) and round to whole cents (±0.5); without a credit line
      // it is ≥ 0 (both rounding steps keep order).
      let slack = 0;
      layers.forEach((l, i) => {
        for (let j = 0; j < i; j++) if (layers[j].material === l.material && layers[j].thickness_mm === l.thickness_mm) return;
        const c = creditOf.get(l.material) ?? 0;
        if (c > 0) slack += 0.0015 * c + 1.5;
      });
      return slack;
    },
    lower(parts, slack, remember = true) {
      if (creditAbovePrice) return -Infinity;
      // exact = sub + round(sub·m) − round((sub + round(sub·m))·d) ≥ sub·(1 + m)(1 − d) − 1,
      // and the unit price round(exact / quantity) is a whole number ≥ exact / quantity − 0.5.
      const exact = (subtotalOf(parts, remember) - slack) * (1 + m) * (1 - d) - 1;
      return Math.ceil(exact / quantity - 0.5 - 1e-9);
    },
  };
}

/**
 * The subtotal in cents of priceBuildUp with every blank's own mass as the material bought (no
 * stock sheets, utilisation 1), worked out as priceBuildUp works it out, step for step and in
 * the same order, so the figure is the same to the last bit; without the lines' labels, keys
 * and the nesting, as a search bounds tens of thousands of designs with it.
 * tests/unit/advisor-search.test.ts checks it against priceBuildUp.
 */
export function unnestedSubtotal(priceList: PriceList, quantity: number): (parts: readonly FabricatedPart[]) => number {
  if (!Number.isInteger(quantity) || quantity < 1) throw new RangeError("quantity must be a positive whole number");
  const pl = priceList;
  // the first price of an alloy, as priceBuildUp finds it
  const pricePerKg = new Map<string, number>();
  for (const m of pl.materials) if (!pricePerKg.has(m.materialId)) pricePerKg.set(m.materialId, m.pricePerKg_cents);
  const line = (q: number, unit_cents: number): number => roundCents(q * unit_cents) || 0;
  const sample = Math.min(quantity, Math.min(quantity, 2));
  // the lines that do not depend on the parts
  const fixed = line(sample, pl.verificationPerSampledPart_cents) + line(1, pl.setupPerJob_cents);
  // a design's alloy-and-gauge groups, first seen first (few: a list is enough)
  const groupMaterial: string[] = [], groupThickness: number[] = [], groupNet: number[] = [];
  return (parts) => {
    if (parts.length === 0) throw new RangeError("no parts to price");
    let groups = 0;
    let pieces = 0, draws = 0, anneals = 0, bends = 0, weld = 0, finished = 0;
    for (const p of parts) {
      if (!p.materialId) throw new RangeError(`part of layer ${p.layer} has no material`);
      if (p.mass_kg === undefined) throw new RangeError(`part of layer ${p.layer} has no mass (density missing)`);
      let g = 0;
      while (g < groups && !(groupMaterial[g] === p.materialId && groupThickness[g] === p.thickness_mm)) g++;
      if (g === groups) {
        groupMaterial[g] = p.materialId;
        groupThickness[g] = p.thickness_mm;
        groupNet[g] = 0;
        groups++;
      }
      const n = p.quantityPerAssembly;
      groupNet[g] += p.mass_kg * n;
      pieces += n;
      draws += p.drawStages * n;
      anneals += p.processAnneals * n;
      bends += p.bendCount * n;
      weld += p.weldLength_mm * n;
      if (p.finishedPiece) finished += n;
    }
    let subtotal = fixed;
    for (let g = 0; g < groups; g++) {
      const price = pricePerKg.get(groupMaterial[g]);
      if (price === undefined) throw new RangeError(`no price for material ${groupMaterial[g]}`);
      // gross = net / 1: no scrap, so a scrap credit line is 0
      subtotal += line(q3((groupNet[g] * quantity) / 1), price);
    }
    finished *= quantity;
    subtotal += line(pieces * quantity, pl.blankingPerPart_cents);
    subtotal += line(draws * quantity, pl.formingPerDrawStage_cents);
    subtotal += line(anneals * quantity, pl.processAnnealPerAnneal_cents);
    subtotal += line(bends * quantity, pl.formingPerBend_cents);
    subtotal += line(q3((weld * quantity) / 1000), pl.weldingPerMetre_cents);
    subtotal += line(finished, pl.cleaningPerPart_cents);
    subtotal += line(q3(finished / pl.partsPerFurnaceLoad), pl.hydrogenAnnealPerLoad_cents);
    subtotal += line(finished, pl.packingPerPart_cents);
    return subtotal;
  };
}
