import type { PriceBuildUp } from "../../shared/fabrication";
import { designSummary } from "../../shared/schemas/design";
import { documentNumber } from "../../shared/schemas/documents";
import type { QuoteJson, QuotePrice, QuotePriceLine, QuoteSummaryJson } from "../../shared/schemas/quote";
import type { Quote } from "../models";
import { quotePolicy } from "../policies/quote";
import { abilities, isStaff, type Actor } from "../policies/utils";

/**
 * The build-up as a customer sees it: each line's selling amount (the margin spread over the lines
 * in proportion, by largest remainder so they add up to the cent), never a rate or the margin.
 * Empty lines (no bends on a drawn cup) are left out.
 */
export function sellingLines(price: PriceBuildUp): QuotePriceLine[] {
  const lines = price.lines.filter((l) => l.total_cents !== 0);
  const target = price.subtotal_cents + price.margin_cents;
  const factor = price.subtotal_cents === 0 ? 1 : target / price.subtotal_cents;
  const exact = lines.map((l) => l.total_cents * factor);
  const floors = exact.map(Math.floor);
  let rest = target - floors.reduce((s, x) => s + x, 0);
  const order = exact.map((x, i) => ({ i, frac: x - Math.floor(x) })).sort((a, b) => b.frac - a.frac);
  for (const { i } of order) {
    if (rest <= 0) break;
    floors[i] += 1;
    rest -= 1;
  }
  return lines.map((l, i) => ({ key: l.key, label: l.label, quantity: l.quantity, total_cents: floors[i] }));
}

export function presentPrice(price: PriceBuildUp, actor: Actor, priceListVersion: number): QuotePrice {
  const out: QuotePrice = {
    lines: sellingLines(price),
    linesTotal_cents: price.subtotal_cents + price.margin_cents,
    discountPercent: price.discountPercent,
    discount_cents: price.discount_cents,
    rounding_cents: price.rounding_cents,
    unitPrice_cents: price.unitPrice_cents,
    quantity: price.quantity,
    total_cents: price.total_cents,
    currency: price.currency,
  };
  // the shop's rates and margin are for the shop's eyes only
  if (isStaff(actor)) {
    out.internal = {
      lines: price.lines.map((l) => ({ key: l.key, label: l.label, quantity: l.quantity, unit_cents: l.unit_cents, total_cents: l.total_cents })),
      subtotal_cents: price.subtotal_cents,
      marginPercent: price.marginPercent,
      margin_cents: price.margin_cents,
      priceListVersion,
    };
  }
  return out;
}

export function presentQuote(quote: Quote, actor: Actor, now = new Date()): QuoteJson {
  const orderId = quote.orderId ?? null;
  const status = quote.statusAt(orderId, now);
  const can = abilities(actor, quotePolicy, quote);
  return {
    id: quote.id,
    number: documentNumber("quote", quote.number),
    status,
    organization: { id: quote.organizationId, name: quote.organization?.name ?? "" },
    createdBy: quote.createdBy ? { id: quote.createdBy.id, name: quote.createdBy.name } : null,
    designId: quote.designId,
    requotedFromId: quote.requotedFromId,
    orderId,
    configuration: quote.configuration,
    quantity: quote.quantity,
    unitPrice_cents: quote.unitPriceCents,
    total_cents: quote.totalCents,
    currency: quote.currency,
    prediction: quote.prediction,
    blank: quote.blank,
    mass_kg: quote.massKg,
    price: presentPrice(quote.price, actor, quote.priceListVersion),
    priceListVersion: quote.priceListVersion,
    leadTime_workingDays: quote.leadTimeWorkingDays,
    validity_days: quote.validityDays,
    expiresAt: quote.expiresAt.toISOString(),
    createdAt: quote.createdAt.toISOString(),
    abilities: { order: can.order && status === "open", requote: can.requote, download: can.read },
  };
}

export function presentQuoteSummary(quote: Quote, now = new Date()): QuoteSummaryJson {
  const orderId = quote.orderId ?? null;
  return {
    id: quote.id,
    number: documentNumber("quote", quote.number),
    status: quote.statusAt(orderId, now),
    organization: { id: quote.organizationId, name: quote.organization?.name ?? "" },
    designId: quote.designId,
    orderId,
    summary: designSummary(quote.configuration),
    quantity: quote.quantity,
    unitPrice_cents: quote.unitPriceCents,
    total_cents: quote.totalCents,
    currency: quote.currency,
    attenuation_db: quote.prediction.attenuation_db,
    requiredAttenuation_db: quote.configuration.requiredAttenuation_db,
    expiresAt: quote.expiresAt.toISOString(),
    createdAt: quote.createdAt.toISOString(),
  };
}
