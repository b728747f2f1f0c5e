import type { ShopRatesJson, ShopRatesVersionJson } from "../../shared/schemas/shop-rates";
import { constructionSettingsOf, designSearchSettingsOf, priceListSchema } from "../../shared/schemas/pricing";
import type { PriceListVersion } from "../models";

const presentCreator = (v: PriceListVersion) => (v.createdBy ? { id: v.createdBy.id, name: v.createdBy.name } : null);

export function presentShopRatesVersion(v: PriceListVersion): ShopRatesVersionJson {
  return { version: v.version, part: v.part, createdAt: v.createdAt.toISOString(), createdBy: presentCreator(v) };
}

/** The current shop rates as the planner's page reads them: its parts plus who saved them when. */
export function presentShopRates(v: PriceListVersion): ShopRatesJson {
  // parsed, so a version saved before a field existed shows that field's default
  const { stockSheets, formingLimits, construction: _stored, designSearch: _search, ...priceList } = priceListSchema.parse(v.data);
  return {
    ...presentShopRatesVersion(v),
    priceList,
    stockSheets,
    formingLimits,
    construction: constructionSettingsOf(v.data),
    designSearch: designSearchSettingsOf(v.data),
  };
}
