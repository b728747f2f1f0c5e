/**
 * Price build-up of a job from its parts list.
 *
 * Money is integer cents. Rounding: each line's total is rounded once, half away from zero,
 * from its shown quantity × unit price (quantities of kg, metres and furnace-load shares are
 * shown to 0.001), so anyone can redo every line from what the quote shows. Margin and discount
 * are rounded once each. The unit price is the rounded per-piece price and the total is
 * unit × quantity; the difference to the exact sum is reported as `rounding_cents` (under half
 * a cent per piece), so the invoice multiplies out.
 * Setup is charged once per job and so spread over the quantity.
 */
import type { PriceList, StockSheet } from "../schemas/pricing";
import { nestBlanks, type NestBlank, type NestOptions, type NestResult } from "./nesting";
import type { FabricatedPart } from "./parts";

export type { PriceList, StockSheet, FormingLimits, MaterialPrice, QuantityBreak } from "../schemas/pricing";

export interface PriceLine {
  key: string;
  label: string;
  quantity: number;
  unit_cents: number;
  total_cents: number;
}

export interface PriceBuildUp {
  lines: PriceLine[];
  subtotal_cents: number;
  marginPercent: number;
  margin_cents: number;
  discountPercent: number;
  discount_cents: number;
  rounding_cents: number;
  setupPerUnit_cents: number;
  unitPrice_cents: number;
  quantity: number;
  total_cents: number;
  currency: string;
  /** material use per alloy and gauge */
  material: Array<{ materialId: string; thickness_mm: number; net_kg: number; gross_kg: number; utilisation: number; sheet?: StockSheet }>;
}

export interface PriceInput {
  parts: FabricatedPart[];
  /** assemblies ordered */
  quantity: number;
  priceList: PriceList;
  /** parts the sampling plan measures; default min(quantity, 2), the smallest ISO 2859-1 sample */
  sampleSize?: number;
  /** web between blanks on the sheet, default 3 mm */
  nestGap_mm?: number;
  /**
   * Nests one alloy and gauge's blanks on a stock sheet: nestBlanks unless given. A caller that
   * prices thousands of designs (the design advisor) passes a memo of it; the price is the same.
   */
  nest?: (blanks: NestBlank[], sheet: StockSheet, options: NestOptions) => Pick<NestResult, "unplaced" | "sheetsNeeded" | "utilisation">;
}

/** Round half away from zero (Math.round rounds −0.5 toward +∞). */
export const roundCents = (x: number): number => Math.sign(x) * Math.round(Math.abs(x));
/** A line's quantity as shown, to 0.001. */
export const q3 = (x: number): number => Math.round(x * 1000) / 1000;
const line = (key: string, label: string, quantity: number, unit_cents: number): PriceLine => ({ key, label, quantity, unit_cents, total_cents: roundCents(quantity * unit_cents) || 0 });

const nestShape = (p: FabricatedPart): NestBlank =>
  p.blank.kind === "disc"
    ? { kind: "disc", diameter_mm: p.blank.diameter_mm }
    : // a cross nests as its bounding rectangle: conservative, the arms' notches are scrap
      { kind: "rectangle", length_mm: p.blank.length_mm, width_mm: p.blank.width_mm };

/** Nesting a sample of at most this many blanks sets the utilisation for the whole quantity. */
const NEST_SAMPLE_BLANKS = 400;

export function discountFor(quantity: number, priceList: PriceList): number {
  let d = 0;
  let best = 0;
  for (const b of priceList.quantityBreaks) if (quantity >= b.minQuantity && b.minQuantity >= best) { best = b.minQuantity; d = b.discountPercent; }
  return d;
}

export function priceBuildUp(input: PriceInput): PriceBuildUp {
  const { parts, quantity, priceList: pl } = input;
  if (!Number.isInteger(quantity) || quantity < 1) throw new RangeError("quantity must be a positive whole number");
  if (parts.length === 0) throw new RangeError("no parts to price");
  const gap = input.nestGap_mm ?? 3;
  const nest = input.nest ?? nestBlanks;
  const lines: PriceLine[] = [];
  const material: PriceBuildUp["material"] = [];

  // material, grouped by alloy and gauge
  const groups = new Map<string, FabricatedPart[]>();
  for (const p of parts) {
    if (!p.materialId) throw new RangeError(`part of layer ${p.layer} has no material`);
    if (p.mass_kg === undefined) throw new RangeError(`part of layer ${p.layer} has no mass (density missing)`);
    const k = `${p.materialId}@${p.thickness_mm}`;
    (groups.get(k) ?? groups.set(k, []).get(k)!).push(p);
  }
  const scrapLines: PriceLine[] = [];
  for (const group of groups.values()) {
    const { materialId, thickness_mm } = group[0] as { materialId: string; thickness_mm: number };
    const price = pl.materials.find((m) => m.materialId === materialId);
    if (!price) throw new RangeError(`no price for material ${materialId}`);
    const perAssembly = group.reduce((s, p) => s + p.quantityPerAssembly, 0);
    const net = group.reduce((s, p) => s + (p.mass_kg ?? 0) * p.quantityPerAssembly, 0) * quantity;
    const assemblies = Math.max(1, Math.min(quantity, Math.floor(NEST_SAMPLE_BLANKS / perAssembly)));
    let blanks: NestBlank[] | undefined; // built when a stock sheet of the alloy and gauge is there to nest on
    let utilisation = pl.fallbackUtilisation;
    let chosen: StockSheet | undefined;
    for (const sheet of pl.stockSheets) {
      if (sheet.materialId !== materialId || Math.abs(sheet.thickness_mm - thickness_mm) > 1e-6) continue;
      if (!blanks) {
        // each part's shape once, listed as often as it is cut (nesting only reads the list)
        const shapes = group.map(nestShape);
        blanks = [];
        for (let a = 0; a < assemblies; a++) for (let j = 0; j < group.length; j++) for (let n = 0; n < group[j].quantityPerAssembly; n++) blanks.push(shapes[j]);
      }
      const r = nest(blanks, sheet, { gap_mm: gap });
      if (r.unplaced.length > 0 || r.sheetsNeeded === 0) continue;
      if (!chosen || r.utilisation > utilisation) { utilisation = r.utilisation; chosen = sheet; }
    }
    const gross = net / utilisation;
    material.push({ materialId, thickness_mm, net_kg: net, gross_kg: gross, utilisation, sheet: chosen });
    lines.push(line(`material:${materialId}:${thickness_mm}`, `Material ${materialId} ${thickness_mm} mm (incl. nesting scrap), kg`, q3(gross), price.pricePerKg_cents));
    if (pl.scrapCredit && price.scrapCreditPerKg_cents > 0) {
      scrapLines.push(line(`scrap-credit:${materialId}:${thickness_mm}`, `Scrap credit ${materialId} ${thickness_mm} mm, kg`, q3(gross - net), -price.scrapCreditPerKg_cents));
    }
  }
  lines.push(...scrapLines);

  const sum = (f: (p: FabricatedPart) => number) => parts.reduce((s, p) => s + f(p) * p.quantityPerAssembly, 0) * quantity;
  const pieces = sum(() => 1);
  const finished = sum((p) => (p.finishedPiece ? 1 : 0));
  const sample = Math.min(quantity, input.sampleSize ?? Math.min(quantity, 2));

  lines.push(line("blanking", "Blanking (shear, laser or punch), per blank", pieces, pl.blankingPerPart_cents));
  lines.push(line("forming-draw", "Forming: draw stages", sum((p) => p.drawStages), pl.formingPerDrawStage_cents));
  lines.push(line("process-anneal", "Process anneals between draws", sum((p) => p.processAnneals), pl.processAnnealPerAnneal_cents));
  lines.push(line("forming-bend", "Forming: bends", sum((p) => p.bendCount), pl.formingPerBend_cents));
  lines.push(line("welding", "Welding (seams, corners, caps, collars), m", q3(sum((p) => p.weldLength_mm) / 1000), pl.weldingPerMetre_cents));
  lines.push(line("cleaning", "Cleaning before the furnace, per piece", finished, pl.cleaningPerPart_cents));
  lines.push(line("hydrogen-anneal", `Hydrogen anneal, share of furnace loads (${pl.partsPerFurnaceLoad} pieces a load)`, q3(finished / pl.partsPerFurnaceLoad), pl.hydrogenAnnealPerLoad_cents));
  lines.push(line("verification", "Attenuation verification, per sampled part", sample, pl.verificationPerSampledPart_cents));
  lines.push(line("packing", "Padded packing, per piece", finished, pl.packingPerPart_cents));
  lines.push(line("setup", "Setup, per job", 1, pl.setupPerJob_cents));

  const subtotal = lines.reduce((s, l) => s + l.total_cents, 0);
  const margin = roundCents((subtotal * pl.marginPercent) / 100);
  const discountPercent = discountFor(quantity, pl);
  const discount = roundCents(((subtotal + margin) * discountPercent) / 100);
  const exact = subtotal + margin - discount;
  const unit = roundCents(exact / quantity);
  const total = unit * quantity;
  return {
    lines,
    subtotal_cents: subtotal,
    marginPercent: pl.marginPercent,
    margin_cents: margin,
    discountPercent,
    discount_cents: discount,
    rounding_cents: total - exact,
    setupPerUnit_cents: roundCents(pl.setupPerJob_cents / quantity),
    unitPrice_cents: unit,
    quantity,
    total_cents: total,
    currency: pl.currency,
    material,
  };
}

const NI_GAUGES = [0.35, 0.5, 0.75, 1.0, 1.5, 2.0];
const PLAIN_GAUGES = [0.5, 1.0, 1.5, 2.0, 3.0];

/**
 * Demo price list. All prices are invented demo values in EUR cents, not quotations; the
 * planner edits them (validated by priceListSchema).
 */
export const defaultPriceList: PriceList = {
  currency: "EUR",
  materials: [
    { materialId: "ni80", pricePerKg_cents: 9500, scrapCreditPerKg_cents: 900 },
    { materialId: "ni50", pricePerKg_cents: 6500, scrapCreditPerKg_cents: 600 },
    { materialId: "steel-lc", pricePerKg_cents: 180, scrapCreditPerKg_cents: 15 },
    { materialId: "copper", pricePerKg_cents: 1100, scrapCreditPerKg_cents: 550 },
    { materialId: "aluminium", pricePerKg_cents: 650, scrapCreditPerKg_cents: 120 },
  ],
  scrapCredit: true,
  blankingPerPart_cents: 250,
  formingPerDrawStage_cents: 900,
  formingPerBend_cents: 180,
  processAnnealPerAnneal_cents: 1200,
  weldingPerMetre_cents: 4500,
  cleaningPerPart_cents: 300,
  hydrogenAnnealPerLoad_cents: 48000,
  partsPerFurnaceLoad: 40,
  verificationPerSampledPart_cents: 3500,
  packingPerPart_cents: 400,
  setupPerJob_cents: 15000,
  marginPercent: 18,
  quantityBreaks: [
    { minQuantity: 10, discountPercent: 3 },
    { minQuantity: 50, discountPercent: 7 },
    { minQuantity: 200, discountPercent: 12 },
  ],
  fallbackUtilisation: 0.7,
  leadTimeWorkingDays: 20,
  quoteValidityDays: 30,
  stockSheets: [
    ...NI_GAUGES.flatMap((t) => [
      { materialId: "ni80", thickness_mm: t, width_mm: 610, length_mm: 1524 },
      { materialId: "ni50", thickness_mm: t, width_mm: 610, length_mm: 1524 },
    ]),
    ...PLAIN_GAUGES.flatMap((t) => [
      { materialId: "steel-lc", thickness_mm: t, width_mm: 1000, length_mm: 2000 },
      { materialId: "copper", thickness_mm: t, width_mm: 1000, length_mm: 2000 },
      { materialId: "aluminium", thickness_mm: t, width_mm: 1000, length_mm: 2000 },
    ]),
  ],
  // first-draw / redraw limits mid-band [practice]; nickel-iron and copper work-harden, so anneal between draws
  formingLimits: [
    { materialId: "ni80", firstDrawRatio: 1.9, redrawRatio: 1.3, processAnnealBetweenDraws: true },
    { materialId: "ni50", firstDrawRatio: 1.9, redrawRatio: 1.3, processAnnealBetweenDraws: true },
    { materialId: "steel-lc", firstDrawRatio: 2.0, redrawRatio: 1.3, processAnnealBetweenDraws: false },
    { materialId: "copper", firstDrawRatio: 2.0, redrawRatio: 1.3, processAnnealBetweenDraws: true },
    { materialId: "aluminium", firstDrawRatio: 1.9, redrawRatio: 1.25, processAnnealBetweenDraws: false },
  ],
};

export function formingLimitsFor(materialId: string, priceList: PriceList = defaultPriceList) {
  return priceList.formingLimits.find((f) => f.materialId === materialId);
}

/** A line of the price as a customer reads it: what, how much of it, and its amount (the shop's margin included). */
export interface CustomerPriceLine {
  key: string;
  label: string;
  quantity: number;
  total_cents: number;
}

/**
 * The price build-up without the shop's margin and internal rates: each line's amount carries
 * its share of the margin (spread in proportion, whole cents, largest remainders first, so the
 * lines still add up to the subtotal), and no line shows a rate. Discount, rounding, the price
 * per piece and the total are the same figures the shop sees.
 */
export interface CustomerPriceBuildUp {
  lines: CustomerPriceLine[];
  subtotal_cents: number;
  discountPercent: number;
  discount_cents: number;
  rounding_cents: number;
  setupPerUnit_cents: number;
  unitPrice_cents: number;
  quantity: number;
  total_cents: number;
  currency: string;
}

/** Whole cents that add up to `target`, in proportion to `weights` (largest remainder). */
export function spreadCents(weights: readonly number[], target: number): number[] {
  const sum = weights.reduce((s, w) => s + w, 0);
  if (sum === 0) return weights.map(() => 0);
  const exact = weights.map((w) => (w * target) / sum);
  const floors = exact.map(Math.floor);
  let left = target - floors.reduce((s, x) => s + x, 0);
  const order = exact.map((x, i) => ({ i, frac: x - Math.floor(x) })).sort((a, b) => b.frac - a.frac || a.i - b.i);
  for (const { i } of order) {
    if (left <= 0) break;
    floors[i] += 1;
    left -= 1;
  }
  return floors.map((x) => x || 0);
}

export function customerPrice(p: PriceBuildUp): CustomerPriceBuildUp {
  const withMargin = p.subtotal_cents + p.margin_cents;
  const totals = p.subtotal_cents === 0 ? p.lines.map((l) => l.total_cents) : spreadCents(p.lines.map((l) => l.total_cents), withMargin);
  return {
    lines: p.lines.map((l, i) => ({ key: l.key, label: l.label, quantity: l.quantity, total_cents: totals[i] })),
    subtotal_cents: withMargin,
    discountPercent: p.discountPercent,
    discount_cents: p.discount_cents,
    rounding_cents: p.rounding_cents,
    // the setup share a piece carries, margin included
    setupPerUnit_cents: p.subtotal_cents === 0 ? p.setupPerUnit_cents : roundCents((p.setupPerUnit_cents * withMargin) / p.subtotal_cents),
    unitPrice_cents: p.unitPrice_cents,
    quantity: p.quantity,
    total_cents: p.total_cents,
    currency: p.currency,
  };
}
