import type { Transaction } from "sequelize";
import type { FabricatedPart, PriceBuildUp } from "../../shared/fabrication";
import { predictShield, PredictionInputError, type PredictionInput, type PredictionResult } from "../../shared/physics";
import { buildModelFrom, type BuildModel } from "../../shared/physics/build-model";
import { constructionSettingsOf, type PriceList } from "../../shared/schemas/pricing";
import { forFabrication, type QuoteBlank, type QuoteBlankPart, type QuoteConfiguration } from "../../shared/schemas/quote";
import { prepared, type PreparedStatement } from "../db/prepared";
import { ValidationError } from "../errors";
import { Quote } from "../models";
import type { Actor } from "../policies/utils";
import { buildModelCatalog, calibrationFitsSnapshot } from "./buildModelCatalog";
import { materialCatalog, type MaterialCatalog } from "./materialCatalog";
import { designPrice } from "./priceEstimator";
import { currentPriceList } from "./shopRatesUpdater";

const DAY_MS = 86_400_000;

/** The prediction body of a configuration, as the prediction engine takes it (method included). */
export function predictionOf(configuration: QuoteConfiguration, catalog: MaterialCatalog, buildModel: BuildModel): PredictionResult {
  try {
    // the whole configuration goes in: the engine reads what it knows (shape, layers, field, method…)
    return predictShield(configuration as unknown as PredictionInput, (id) => catalog.byId.get(id), buildModel);
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
  // the as-built model of the same shop-rates version the price comes from, so a quote names one set of settings
  // and the shop's calibration fits as last loaded: the prediction's `calibration` names the fit used
  const prediction = predictionOf(props.configuration, props.catalog, buildModelFrom(constructionSettingsOf(props.priceList), { fits: calibrationFitsSnapshot() }));
  const { parts, price } = designPrice({ configuration: forFabrication(props.configuration), quantity: props.quantity, priceList: props.priceList });
  return { prediction, ...blankOf(parts), price };
}

// The quote and its event in one statement (atomic on its own, no transaction round trips: quote
// creation is the customer's most frequent write), and only if the price list it was priced with
// is still the current one; otherwise nothing is written and the caller prices again.
const INSERT_QUOTE: PreparedStatement = { name: "quote-insert", text: `
with head as (select id, version from price_lists order by version desc limit 1),
q as (
  insert into quotes (number, organization_id, created_by_id, design_id, requoted_from_id, configuration, prediction, blank, price,
    price_list_id, price_list_version, quantity, unit_price_cents, total_cents, currency, mass_kg, lead_time_working_days,
    validity_days, expires_at, created_at, updated_at)
  select nextval('quote_number_seq'), $1, $2, $3, $4, $5, $6, $7, $8, head.id, head.version, $9, $10, $11, $12, $13, $14, $15, $16, $17, $17
  from head where head.id = $18
  returning id, number, organization_id, design_id, requoted_from_id, total_cents, currency, price_list_version),
e as (
  insert into events (actor_id, organization_id, action, subject_type, subject_id, data, ip, created_at)
  select $2, q.organization_id, $19, 'quote', q.id::text,
    jsonb_build_object('number', q.number, 'total_cents', q.total_cents, 'currency', q.currency, 'priceListVersion', q.price_list_version,
      'designId', q.design_id, 'requotedFromId', q.requoted_from_id),
    $20, $17
  from q)
select id, number from q` };

/**
 * Prices a configuration with the current shop rates and freezes it as a quote: the prediction
 * answer, the blanks, the whole build-up with the price-list version it used, quantity, lead time
 * and validity. The number comes from the quote sequence, the event is written with the quote.
 */
export async function quoteBuilder(props: {
  actor: Actor;
  organizationId: string;
  configuration: QuoteConfiguration;
  quantity: number;
  designId?: string | null;
  requotedFromId?: string | null;
  ip: string | null;
  /** the caller's, when the quote is part of a larger change; alone it needs none */
  transaction?: Transaction;
  now?: Date;
}): Promise<Quote> {
  const { transaction } = props;
  const now = props.now ?? new Date();
  const catalog = await materialCatalog();
  await buildModelCatalog(); // loads the calibration fits when a refit cleared them
  for (let attempt = 0; attempt < 3; attempt++) {
    const rates = await currentPriceList(transaction, { fresh: attempt > 0 });
    const priceList = rates.data;
    const priced = priceAndPredict({ configuration: props.configuration, quantity: props.quantity, priceList, catalog });
    const json = (x: unknown) => JSON.stringify(x);
    const expiresAt = new Date(now.getTime() + priceList.quoteValidityDays * DAY_MS);
    // a named statement: planned once per connection (see db/prepared.ts)
    const [row] = await prepared<{ id: string; number: number }>(Quote.sequelize!, INSERT_QUOTE, [
      props.organizationId, props.actor.id, props.designId ?? null, props.requotedFromId ?? null,
      json(props.configuration), json(priced.prediction), json(priced.blank), json(priced.price),
      props.quantity, priced.price.unitPrice_cents, priced.price.total_cents, priced.price.currency, priced.mass_kg,
      priceList.leadTimeWorkingDays, priceList.quoteValidityDays, expiresAt, now,
      rates.id, props.requotedFromId ? "quote.requoted" : "quote.created", props.ip,
    ], transaction);
    // the row as written, from what was sent (the answers need not travel back and be parsed again)
    if (row)
      return Quote.build(
        {
          id: row.id, number: row.number, organizationId: props.organizationId, createdById: props.actor.id, designId: props.designId ?? null,
          requotedFromId: props.requotedFromId ?? null, configuration: props.configuration, prediction: priced.prediction, blank: priced.blank,
          price: priced.price, priceListId: rates.id, priceListVersion: rates.version, quantity: props.quantity,
          unitPriceCents: priced.price.unitPrice_cents, totalCents: priced.price.total_cents, currency: priced.price.currency, massKg: priced.mass_kg,
          leadTimeWorkingDays: priceList.leadTimeWorkingDays, validityDays: priceList.quoteValidityDays, expiresAt, expiryReminderSentAt: null,
          createdAt: now, updatedAt: now,
        },
        { isNewRecord: false, raw: true }, // raw: the timestamps are set as they are, not as on a new record
      );
    // the planner saved new rates meanwhile: price again with them
  }
  throw new Error("the price list kept changing while a quote was priced");
}
