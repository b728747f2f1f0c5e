import type { Transaction } from "sequelize";
import { priceListSchema, type PriceList } from "../../shared/schemas/pricing";
import type { ConstructionUpdate, DesignSearchUpdate, FormingLimitsUpdate, PriceRates, ShopRatePart, StockSheetsUpdate } from "../../shared/schemas/shop-rates";
import { AppError, ValidationError } from "../errors";
import { fieldErrors } from "../middleware/validate";
import { PriceListVersion, recordEvent } from "../models";
import type { Actor } from "../policies/utils";

export type ShopRatesChange =
  | { part: "price-list"; input: PriceRates }
  | { part: "stock-sheets"; input: StockSheetsUpdate }
  | { part: "forming-limits"; input: FormingLimitsUpdate }
  | { part: "construction"; input: ConstructionUpdate }
  | { part: "design-search"; input: DesignSearchUpdate };

export interface DiffEntry {
  path: string;
  before: unknown;
  after: unknown;
}

const MAX_DIFF_ENTRIES = 200;

/** Leaf-by-leaf difference of two JSON values, paths dotted like the API's field names. */
export function jsonDiff(before: unknown, after: unknown, path = "", out: DiffEntry[] = []): DiffEntry[] {
  if (out.length >= MAX_DIFF_ENTRIES) return out;
  const isObj = (x: unknown): x is Record<string, unknown> => typeof x === "object" && x !== null;
  if (isObj(before) && isObj(after) && Array.isArray(before) === Array.isArray(after)) {
    const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
    for (const k of keys) jsonDiff(before[k], after[k], path ? `${path}.${k}` : k, out);
    return out;
  }
  if (JSON.stringify(before) !== JSON.stringify(after)) out.push({ path: path || "body", before: before ?? null, after: after ?? null });
  return out;
}

/** The list that is current now, or a 503 when nobody has set one up (the seed does). */
export async function currentShopRates(transaction?: Transaction): Promise<PriceListVersion> {
  const current = await PriceListVersion.current({ transaction });
  if (!current) throw new AppError(503, "SHOP_RATES_MISSING", "No price list has been set up yet; run the demo seed or ask the planner.");
  return current;
}

/** Parsed documents by version id: a version never changes, so its parse can be kept. */
const parsedVersions = new Map<string, PriceList>();
/** The head as last read; a quote's insert checks it is still the head, so a stale one only costs a retry. */
let lastHead: { id: string; version: number; data: PriceList; readAt: number } | undefined;
const HEAD_FRESH_MS = 2000;

/**
 * The current version's id, number and parsed document (defaults filled in for fields an older
 * version lacks). Reads the small id row at most every two seconds (`fresh` forces it); the
 * document is parsed once per version.
 */
export async function currentPriceList(transaction?: Transaction, opts: { fresh?: boolean } = {}): Promise<{ id: string; version: number; data: PriceList }> {
  if (!opts.fresh && !transaction && lastHead && Date.now() - lastHead.readAt < HEAD_FRESH_MS) return lastHead;
  const head = await PriceListVersion.findOne({ attributes: ["id", "version"], order: [["version", "DESC"]], transaction });
  if (!head) throw new AppError(503, "SHOP_RATES_MISSING", "No price list has been set up yet; run the demo seed or ask the planner.");
  let data = parsedVersions.get(head.id);
  if (!data) {
    const row = await PriceListVersion.findByPk(head.id, { attributes: ["data"], transaction });
    data = priceListSchema.parse(row!.data);
    if (parsedVersions.size > 20) parsedVersions.clear();
    parsedVersions.set(head.id, data);
  }
  lastHead = { id: head.id, version: head.version, data, readAt: Date.now() };
  return lastHead;
}

/**
 * Replaces one part of the current price list by inserting the next version, and records the
 * before/after difference as an event in the same transaction. Saves at the same moment take turns
 * (PriceListVersion.lockForNextVersion): each lands as its own version on top of the one before, so
 * a save of the stock sheets never undoes a price-list save made a moment earlier.
 */
export async function shopRatesUpdater(props: { actor: Actor; change: ShopRatesChange; ip: string | null; transaction: Transaction }): Promise<{ version: PriceListVersion; diff: DiffEntry[] }> {
  const { actor, change, transaction } = props;
  await PriceListVersion.lockForNextVersion(transaction);
  const current = await currentShopRates(transaction);
  const before = current.data;
  const next: PriceList =
    change.part === "price-list"
      ? {
          ...change.input,
          stockSheets: before.stockSheets,
          formingLimits: before.formingLimits,
          ...(before.construction ? { construction: before.construction } : {}),
          ...(before.designSearch ? { designSearch: before.designSearch } : {}),
        }
      : change.part === "stock-sheets"
        ? { ...before, stockSheets: change.input.stockSheets }
        : change.part === "forming-limits"
          ? { ...before, formingLimits: change.input.formingLimits }
          : change.part === "design-search"
            ? { ...before, designSearch: change.input.designSearch }
            : { ...before, construction: change.input.construction };
  // the merged document is what quotes read, so it is checked whole
  const parsed = priceListSchema.safeParse(next);
  if (!parsed.success) throw ValidationError(fieldErrors(parsed.error));
  const diff = jsonDiff(before, parsed.data);
  lastHead = undefined; // this process prices with the new version as soon as it commits
  const version = await PriceListVersion.create(
    { version: current.version + 1, part: change.part as ShopRatePart, data: parsed.data, createdById: actor.id },
    { transaction },
  );
  await recordEvent(
    {
      actor,
      action: `shop-rates.${change.part}.updated`,
      subject: { type: "price_list", id: String(version.version) },
      data: { fromVersion: current.version, toVersion: version.version, changes: diff },
      ip: props.ip,
    },
    transaction,
  );
  return { version, diff };
}
