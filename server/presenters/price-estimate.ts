import { customerPrice, type PriceBuildUp } from "../../shared/fabrication";
import type { PriceEstimate, PriceEstimateJson, PriceView } from "../../shared/schemas/price-estimate";
import type { Actor } from "../policies/utils";

/**
 * THE way a price build-up is shown (estimates and quotes alike): the shop's staff get the whole
 * build-up (rates, margin); a customer gets `customerPrice`, the amounts with the margin spread
 * over the lines and no rate, built from a whitelist so nothing internal rides along.
 */
export function presentPriceView(price: PriceBuildUp, viewer: Pick<Actor, "role">): PriceView {
  return viewer.role === "customer" ? { view: "customer", ...customerPrice(price) } : { view: "shop", ...price };
}

/**
 * A price estimate for its viewer: the shop's staff get the whole build-up (rates, margin,
 * material use); a customer gets the amounts with the margin spread over the lines and no rate.
 * The customer's answer is built from a whitelist, so nothing internal rides along.
 */
export function presentPriceEstimate(estimate: PriceEstimate, priceListVersion: number, viewer: Pick<Actor, "role">): PriceEstimateJson {
  const { parts, nesting, currency } = estimate;
  return { parts, nesting, currency, price: presentPriceView(estimate.price, viewer), priceListVersion };
}
