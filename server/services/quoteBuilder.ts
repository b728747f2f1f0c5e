import type { Transaction } from "sequelize";
import type { FabricatedPart, PriceBuildUp } from "../../shared/fabrication";
import { predictShield, PredictionInputError, type PredictionInput, type PredictionResult } from "../../shared/physics";
import type { PriceList } from "../../shared/schemas/pricing";
import { forFabrication, type QuoteBlank, type QuoteBlankPart, type QuoteConfiguration } from "../../shared/schemas/quote";
import { ValidationError } from "../errors";
import { Quote, recordEvent } from "../models";
import type { Actor } from "../policies/utils";
import { materialCatalog, type MaterialCatalog } from "./materialCatalog";
import { designPrice } from "./priceEstimator";
import { currentPriceList } from "./shopRatesUpdater";

const DAY_MS = 86_400_000;

/** The prediction body of a configuration, as the prediction engine takes it (method included). */
export function predictionOf(configuration: QuoteConfiguration, catalog: MaterialCatalog): PredictionResult {
  try {
    // the whole configuration goes in: the engine reads what it knows (shape, layers, field, method…)
    return predictShield(configuration as unknown as PredictionInput, (id) => catalog.byId.get(id));
  } catch (err) {
    if (err instanceof PredictionInputError) throw ValidationError({ [`configuration.${err.field}`]: err.message });
    throw err;
  }
}

function blankOf(parts: FabricatedPart[]): { blank: QuoteBlank; mass_kg: number | null } {
  const listed: QuoteBlankPart[] = parts.map((p) => ({
    layer: p.layer, role: p.role, method: p.method, materialId: p.materialId, thickness_mm: p.thickness_mm,
    quantityPerAssembly: p.quantityPerAssembly, blank: p.blank, area_mm2: p.area_mm2, mass_kg: p.mass_kg,
  }));
  const main = listed.find((p) => p.layer === 0) ?? listed[0];
  const masses = parts.map((p) => (p.mass_kg === undefined ? null : p.mass_kg * p.quantityPerAssembly));
  const mass_kg = masses.every((m) => m !== null) ? masses.reduce((s: number, m) => s + (m as number), 0) : null;
  return { blank: { ...main.blank, layer: main.layer, role: main.role, area_mm2: main.area_mm2, mass_kg: main.mass_kg, parts: listed }, mass_kg };
}

export interface Priced {
  prediction: PredictionResult;
  blank: QuoteBlank;
  mass_kg: number | null;
  price: PriceBuildUp;
}

/** Prediction, blanks and price of a configuration at a quantity: pure, given the catalog and the list. */
export function priceAndPredict(props: { configuration: QuoteConfiguration; quantity: number; priceList: PriceList; catalog: MaterialCatalog }): Priced {
  const prediction = predictionOf(props.configuration, props.catalog);
  const { parts, price } = designPrice({ configuration: forFabrication(props.configuration), quantity: props.quantity, priceList: props.priceList });
  return { prediction, ...blankOf(parts), price };
}

/**
 * Prices a configuration with the current shop rates and freezes it as a quote: the prediction
 * answer, the blanks, the whole build-up with the price-list version it used, quantity, lead time
 * and validity. The number comes from the quote sequence; the event is written in the same transaction.
 */
export async function quoteBuilder(props: {
  actor: Actor;
  organizationId: string;
  configuration: QuoteConfiguration;
  quantity: number;
  designId?: string | null;
  requotedFromId?: string | null;
  ip: string | null;
  transaction: Transaction;
  now?: Date;
}): Promise<Quote> {
  const { transaction } = props;
  const now = props.now ?? new Date();
  const catalog = await materialCatalog();
  const rates = await currentPriceList(transaction);
  const priceList = rates.data;
  const priced = priceAndPredict({ configuration: props.configuration, quantity: props.quantity, priceList, catalog });
  const quote = await Quote.create(
    {
      organizationId: props.organizationId,
      createdById: props.actor.id,
      designId: props.designId ?? null,
      requotedFromId: props.requotedFromId ?? null,
      configuration: props.configuration,
      prediction: priced.prediction,
      blank: priced.blank,
      price: priced.price,
      priceListId: rates.id,
      priceListVersion: rates.version,
      quantity: props.quantity,
      unitPriceCents: priced.price.unitPrice_cents,
      totalCents: priced.price.total_cents,
      currency: priced.price.currency,
      massKg: priced.mass_kg,
      leadTimeWorkingDays: priceList.leadTimeWorkingDays,
      validityDays: priceList.quoteValidityDays,
      expiresAt: new Date(now.getTime() + priceList.quoteValidityDays * DAY_MS),
      createdAt: now,
      updatedAt: now,
    },
    { transaction },
  );
  await recordEvent(
    {
      actor: props.actor,
      organizationId: props.organizationId,
      action: props.requotedFromId ? "quote.requoted" : "quote.created",
      subject: { type: "quote", id: quote.id },
      data: { number: quote.number, total_cents: quote.totalCents, currency: quote.currency, priceListVersion: rates.version, designId: quote.designId, requotedFromId: quote.requotedFromId },
      ip: props.ip,
      at: now,
    },
    transaction,
  );
  return quote;
}
