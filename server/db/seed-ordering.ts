import type { Transaction } from "sequelize";
import { quoteConfigurationSchema, type QuoteConfiguration } from "../../shared/schemas/quote";
import type { Mailer } from "../jobs/mailer";
import { CheckoutSession, Design, Order, Payment, recordEvent, type Organization, type User } from "../models";
import { designSaver } from "../services/designSaver";
import { orderPlacer } from "../services/orderPlacer";
import { paymentEventRecorder } from "../services/paymentEventRecorder";
import { quoteBuilder } from "../services/quoteBuilder";

// The demo's saved designs, quotes and orders (invented): for the first customer organisation a
// design of each kind, quotes (one expired, one about to expire) and an order in every state; a
// few for the second one. Money and dates come from the same services the app uses.

const DAY = 86_400_000;
/** the seed queues no mail: these are past events */
const silent: Mailer = { enqueue: async () => {}, send: () => {}, idle: async () => {} };

const field = (frequency_hz: number, amplitude_uT: number) => ({ frequency_hz, amplitude_uT, orientation: "transverse" as const });
const designs = {
  photomultiplier: {
    name: "Photomultiplier can, two layers",
    configuration: { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 50, length: 120 }, ends: "closed", layers: [{ material: "ni80", thickness_mm: 1, gap_mm: 10 }, { material: "ni80", thickness_mm: 1 }], field: field(60, 100), state: "annealed", cornerRadius_mm: 3, trim_mm: 0, requiredAttenuation_db: 40 },
  },
  fluxgate: {
    name: "Fluxgate housing, rolled",
    configuration: { shape: "cylinder", method: "rolled", dimensions_mm: { diameter: 80, length: 200 }, ends: "closed", layers: [{ material: "ni80", thickness_mm: 1.5 }], field: field(50, 200), state: "annealed", seamOverlap_mm: 6, requiredAttenuation_db: 30 },
  },
  sensorBox: {
    name: "Sensor box with lid",
    configuration: { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, layers: [{ material: "ni80", thickness_mm: 1, gap_mm: 6 }, { material: "ni50", thickness_mm: 1 }], field: field(50, 500), state: "annealed", bendRadius_mm: 1.5, kFactor: 0.44, lid: true, requiredAttenuation_db: 35 },
  },
  beamline: {
    name: "Beamline pickup shield",
    configuration: { shape: "cylinder", method: "drawn", dimensions_mm: { diameter: 40, length: 90 }, ends: "closed", layers: [{ material: "ni80", thickness_mm: 0.75 }], field: field(0, 50), state: "annealed", cornerRadius_mm: 2, requiredAttenuation_db: 25 },
  },
} as const;

type DesignKey = keyof typeof designs;

export async function seedOrdering(props: { customers: Organization[]; buyers: User[]; planner: User; appUrl: string; transaction: Transaction; now?: Date }): Promise<string[]> {
  const { transaction } = props;
  const now = props.now ?? new Date();
  const at = (daysAgo: number) => new Date(now.getTime() - daysAgo * DAY);
  const created: string[] = [];

  for (const [i, org] of props.customers.entries()) {
    const buyer = props.buyers[i];
    const keys: DesignKey[] = i === 0 ? ["photomultiplier", "fluxgate", "sensorBox"] : ["beamline"];
    if (await Design.count({ where: { organizationId: org.id, name: designs[keys[0]].name }, transaction })) continue;

    const saved = new Map<DesignKey, { id: string; configuration: QuoteConfiguration }>();
    for (const key of keys) {
      const configuration = quoteConfigurationSchema.parse(designs[key].configuration);
      const d = await designSaver({ actor: buyer, input: { name: designs[key].name, configuration }, ip: null, transaction });
      saved.set(key, { id: d.id, configuration });
    }
    const quote = (key: DesignKey, quantity: number, daysAgo: number) =>
      quoteBuilder({ actor: buyer, organizationId: org.id, configuration: saved.get(key)!.configuration, quantity, designId: saved.get(key)!.id, ip: null, transaction, now: at(daysAgo) });
    const order = async (key: DesignKey, quantity: number, daysAgo: number, details: { purchaseOrder?: string; deliveryAddress?: string } = {}) => {
      const q = await quote(key, quantity, daysAgo + 1);
      return orderPlacer({ actor: buyer, quote: q, input: details, mailer: silent, appUrl: props.appUrl, ip: null, transaction, now: at(daysAgo) });
    };
    const pay = async (o: Order, daysAgo: number) => {
      const id = `cs_demo_${o.id.replace(/-/g, "").slice(0, 16)}`;
      await CheckoutSession.create({ id, orderId: o.id, amountCents: o.totalCents, currency: o.currency, url: "", status: "open", idempotencyKey: `demo-${id}`, createdById: buyer.id }, { transaction });
      await recordEvent({ actor: buyer, organizationId: o.organizationId, action: "order.checkout-started", subject: { type: "order", id: o.id }, data: { sessionId: id }, at: at(daysAgo) }, transaction);
      const event = { id: `evt_demo_${id.slice(8)}`, type: "checkout.session.completed", data: { object: { id, amount_total: o.totalCents, currency: o.currency.toLowerCase(), payment_status: "paid", payment_intent: `pi_demo_${id.slice(8)}` } } };
      await paymentEventRecorder({ event, mailer: silent, appUrl: props.appUrl, transaction, now: at(daysAgo) });
      await o.reload({ transaction });
    };
    const advance = async (o: Order, status: "released" | "shipped", daysAgo: number) => {
      o.status = status;
      await o.save({ transaction });
      await recordEvent({ actor: props.planner, organizationId: o.organizationId, action: `order.${status}`, subject: { type: "order", id: o.id }, data: {}, at: at(daysAgo) }, transaction);
    };
    const address = i === 0 ? "Fernhollow Instruments, goods in\nBuilding 2, Fernhollow Science Park\nFH1 2AB" : "Quillbrook Beam Lab, stores\nRing Road 7\nQB4 8LK";

    if (i === 0) {
      await quote("photomultiplier", 10, 3); // open
      await quote("fluxgate", 4, 40); // expired: re-quote at today's rates
      await quote("sensorBox", 6, 28); // expires in two days
      await order("photomultiplier", 2, 1, { purchaseOrder: "FH-PO-2207", deliveryAddress: address }); // awaiting payment
      const paid = await order("photomultiplier", 5, 6, { purchaseOrder: "FH-PO-2191", deliveryAddress: address });
      await pay(paid, 5);
      const released = await order("fluxgate", 3, 15, { purchaseOrder: "FH-PO-2164", deliveryAddress: address });
      await pay(released, 14);
      await advance(released, "released", 12);
      const shipped = await order("sensorBox", 2, 30, { purchaseOrder: "FH-PO-2102", deliveryAddress: address });
      await pay(shipped, 29);
      await advance(shipped, "released", 27);
      await advance(shipped, "shipped", 3);
      const refunded = await order("photomultiplier", 1, 20, { purchaseOrder: "FH-PO-2133" });
      await pay(refunded, 20);
      await Payment.create({ orderId: refunded.id, kind: "refund", status: "refunded", amountCents: refunded.totalCents, currency: refunded.currency, providerReference: `re_demo_${refunded.id.slice(0, 8)}`, checkoutSessionId: null, reason: "Ordered twice by mistake", createdById: props.planner.id, createdAt: at(19) }, { transaction });
      refunded.status = "refunded";
      await refunded.save({ transaction });
      await recordEvent({ actor: props.planner, organizationId: org.id, action: "payment.refunded", subject: { type: "order", id: refunded.id }, data: { amount_cents: refunded.totalCents, currency: refunded.currency, reason: "Ordered twice by mistake", full: true }, at: at(19) }, transaction);
      const cancelled = await order("fluxgate", 1, 9);
      cancelled.status = "cancelled";
      await cancelled.save({ transaction });
      await recordEvent({ actor: buyer, organizationId: org.id, action: "order.cancelled", subject: { type: "order", id: cancelled.id }, data: {}, at: at(8) }, transaction);
    } else {
      await quote("beamline", 8, 2);
      await order("beamline", 4, 2, { purchaseOrder: "QB-118", deliveryAddress: address });
      const paid = await order("beamline", 12, 10, { purchaseOrder: "QB-104", deliveryAddress: address });
      await pay(paid, 9);
    }
    created.push(`ordering demo for ${org.name}`);
  }
  return created;
}
