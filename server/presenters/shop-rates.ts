import type { ShopRatesJson, ShopRatesVersionJson } from "../../shared/schemas/shop-rates";
import { constructionSettingsOf, designSearchSettingsOf } from "../../shared/schemas/pricing";
import type { PriceListVersion } from "../models";

const presentCreator = (v: PriceListVersion) => (v.createdBy ? { id: v.createdBy.id, name: v.createdBy.name } : null);

export function presentShopRatesVersion(v: PriceListVersion): ShopRatesVersionJson {
  return { version: v.version, part: v.part, createdAt: v.createdAt.toISOString(), createdBy: presentCreator(v) };
}

/** The current shop rates as the planner's page reads them: its parts plus who saved them when. */
export function presentShopRates(v: PriceListVersion): ShopRatesJson {
  const { stockSheets, formingLimits, construction: _stored, designSearch: _search, ...priceList } = v.data;
  return {
    ...presentShopRatesVersion(v),
    priceList,
    stockSheets,
    formingLimits,
    construction: constructionSettingsOf(v.data),
    designSearch: designSearchSettingsOf(v.data),
  };
}
