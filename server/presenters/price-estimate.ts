import { customerPrice } from "../../shared/fabrication";
import type { PriceEstimate, PriceEstimateJson } from "../../shared/schemas/price-estimate";
import type { Actor } from "../policies/utils";

/**
 * A price estimate for its viewer: the shop's staff get the whole build-up (rates, margin,
 * material use); a customer gets the amounts with the margin spread over the lines and no rate.
 * The customer's answer is built from a whitelist, so nothing internal rides along.
 */
export function presentPriceEstimate(estimate: PriceEstimate, priceListVersion: number, viewer: Pick<Actor, "role">): PriceEstimateJson {
  const { parts, nesting, currency } = estimate;
  if (viewer.role === "customer") return { parts, nesting, currency, price: { view: "customer", ...customerPrice(estimate.price) }, priceListVersion };
  return { parts, nesting, currency, price: { view: "shop", ...estimate.price }, priceListVersion };
}
