import { constructionSettingsOf } from "../../shared/schemas/pricing";
import type { PriceListVersion } from "../models";

const presentCreator = (v: PriceListVersion) => (v.createdBy ? { id: v.createdBy.id, name: v.createdBy.name } : null);

/** The current shop rates as the planner's page reads them: four parts plus who saved them when. */
export function presentShopRates(v: PriceListVersion) {
  const { stockSheets, formingLimits, construction: _stored, ...priceList } = v.data;
  return { version: v.version, part: v.part, createdAt: v.createdAt, createdBy: presentCreator(v), priceList, stockSheets, formingLimits, construction: constructionSettingsOf(v.data) };
}

export function presentShopRatesVersion(v: PriceListVersion) {
  return { version: v.version, part: v.part, createdAt: v.createdAt, createdBy: presentCreator(v) };
}
