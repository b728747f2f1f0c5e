// `node --import tsx fake-services/payments/index.ts`: the payment service stand-in on $PAYMENTS_PORT
// (4110). Events go to $PAYMENTS_WEBHOOK_URL, by default the application's /api/webhooks/stripe at
// $APP_URL (or 127.0.0.1:$PORT), signed with $STRIPE_WEBHOOK_SECRET.
import { startPaymentsStandIn } from "./server";

const appUrl = process.env.APP_URL ?? `http://127.0.0.1:${process.env.PORT ?? 4100}`;
const payments = await startPaymentsStandIn({
  port: Number(process.env.PAYMENTS_PORT ?? 4110),
  webhookUrl: process.env.PAYMENTS_WEBHOOK_URL ?? `${appUrl.replace(/\/$/, "")}/api/webhooks/stripe`,
  webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? "whsec_fluxwright_local",
});
console.log(`payment stand-in: ${payments.url} (events to ${process.env.PAYMENTS_WEBHOOK_URL ?? `${appUrl}/api/webhooks/stripe`})`);
const stop = () => void payments.close().then(() => process.exit(0));
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
