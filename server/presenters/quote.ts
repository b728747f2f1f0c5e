import { designSummary } from "../../shared/schemas/design";
import { documentNumber } from "../../shared/schemas/documents";
import type { QuoteJson, QuoteSummaryJson } from "../../shared/schemas/quote";
import type { Quote } from "../models";
import { quotePolicy } from "../policies/quote";
import { abilities, type Actor } from "../policies/utils";
import { presentPriceView } from "./price-estimate";

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
    price: presentPriceView(quote.price, actor),
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
