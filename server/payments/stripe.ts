import Stripe from "stripe";
import type { Config } from "../config";
import { AppError } from "../errors";

/**
 * The official SDK, pointed at PAYMENTS_URL: the local stand-in (fake-services/payments) unless
 * production names the hosted service. No SDK retries: a failure reaches the customer at once
 * as "try again", and the idempotency keys make the next try safe.
 */
export function createStripe(config: Config): Stripe {
  const url = new URL(config.paymentsUrl);
  const protocol = url.protocol === "https:" ? "https" : "http";
  return new Stripe(config.STRIPE_SECRET_KEY, {
    host: url.hostname,
    port: Number(url.port || (protocol === "https" ? 443 : 80)),
    protocol,
    maxNetworkRetries: 0,
    telemetry: false,
    timeout: 10_000,
  });
}

/** Run a call to the payment service; its failures become the API's error shape (nothing is written). */
export async function paymentService<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    if (err instanceof Stripe.errors.StripeConnectionError || err instanceof Stripe.errors.StripeAPIError || err instanceof Stripe.errors.StripeRateLimitError) {
      throw new AppError(503, "PAYMENTS_UNAVAILABLE", "The payment service is not answering right now. Nothing was charged and your order is kept; try again in a minute.");
    }
    if (err instanceof Stripe.errors.StripeError) {
      throw new AppError(502, "PAYMENTS_REJECTED", `The payment service refused the request: ${err.message}`);
    }
    throw err;
  }
}
