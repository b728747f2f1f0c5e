import { priceListSchema } from "../../shared/schemas/pricing";
import type { PriceListVersion } from "../models";

const presentCreator = (v: PriceListVersion) => (v.createdBy ? { id: v.createdBy.id, name: v.createdBy.name } : null);

/** The current shop rates as the planner's page reads them: three parts plus who saved them when. */
export function presentShopRates(v: PriceListVersion) {
  // parsed, so a version saved before a field existed shows that field's default
  const { stockSheets, formingLimits, ...priceList } = priceListSchema.parse(v.data);
  return { version: v.version, part: v.part, createdAt: v.createdAt, createdBy: presentCreator(v), priceList, stockSheets, formingLimits };
}

export function presentShopRatesVersion(v: PriceListVersion) {
  return { version: v.version, part: v.part, createdAt: v.createdAt, createdBy: presentCreator(v) };
}
