import express, { Router } from "express";
import Stripe from "stripe";
import type { AppDeps } from "../deps";
import { AppError } from "../errors";
import { paymentEventRecorder, paymentEventSchema, paymentEventTriage } from "../services/paymentEventRecorder";

/**
 * Events from the payment service. The signature (Stripe-Signature: t=…,v1=HMAC-SHA256 of
 * "t.rawbody") is checked on the raw bytes, so this router is mounted before the JSON parser; no
 * session, no CSRF token: the signature is the proof (server/app.ts mounts it before the request log). Only this event marks an order paid,
 * never the customer's browser coming back from the checkout page.
 */
export function webhooksRouter({ sequelize, config, mailer, logger }: AppDeps): Router {
  const router = Router();
  router.post("/webhooks/stripe", express.raw({ type: () => true, limit: "256kb" }), async (req, res) => {
    req.log = logger; // mounted before the request log: on-error logs through this
    const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    let verified: unknown;
    try {
      verified = Stripe.webhooks.constructEvent(raw, req.get("stripe-signature") ?? "", config.STRIPE_WEBHOOK_SECRET);
    } catch (err) {
      if (err instanceof Stripe.errors.StripeSignatureVerificationError) {
        throw new AppError(400, "SIGNATURE_INVALID", "The Stripe-Signature header does not match the body.");
      }
      throw new AppError(400, "MALFORMED_EVENT", "The event is not valid JSON.");
    }
    const parsed = paymentEventSchema.safeParse(verified);
    if (!parsed.success) throw new AppError(400, "MALFORMED_EVENT", "The event lacks an id, a type or data.object.");
    const outcome =
      (await paymentEventTriage(parsed.data)) ??
      (await sequelize.transaction((transaction) => paymentEventRecorder({ event: parsed.data, mailer, appUrl: config.appUrl, transaction })));
    if (outcome !== "processed" && outcome !== "duplicate" && outcome !== "ignored") logger.warn({ eventId: parsed.data.id, type: parsed.data.type, outcome }, "payment event needs a look");
    res.json({ received: true, outcome });
  });
  return router;
}
