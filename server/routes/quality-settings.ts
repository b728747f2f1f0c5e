import { Router } from "express";
import { aqlChoices, orderAqlSchema, qualitySettingsSchema, type OrderAqlJson, type QualitySettingsJson } from "../../shared/schemas/sampling";
import type { AppDeps } from "../deps";
import { ConflictError, NotFoundError } from "../errors";
import { parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Order, ShopSettings, recordEvent } from "../models";
import { orderPolicy } from "../policies/order";
import { authorize, requireRole } from "../policies/utils";

const presentQualitySettings = (s: ShopSettings): QualitySettingsJson => ({ defaultAql: s.defaultAql, aqlColumns: aqlChoices, updatedAt: s.updatedAt.toISOString() });

/** Orders whose AQL may still change: lots not yet shipped or stopped. */
const aqlChangeable = (o: Order) => ["awaiting_payment", "paid", "released"].includes(o.status);

/** The shop's default AQL (the planner sets it, quality staff read it) and an order's own AQL. */
export function qualitySettingsRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  router.get("/shop-settings/quality", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    res.json(presentQualitySettings(await ShopSettings.current()));
  });

  router.put("/shop-settings/quality", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const input = parseInput(qualitySettingsSchema, req.body);
    const saved = await sequelize.transaction(async (transaction) => {
      const row = await ShopSettings.findByPk(1, { transaction, lock: transaction.LOCK.UPDATE });
      if (!row) throw NotFoundError("shop settings");
      const before = row.defaultAql;
      if (before !== input.defaultAql) {
        await row.update({ defaultAql: input.defaultAql, updatedById: req.user!.id }, { transaction });
        await recordEvent({ actor: req.user!, action: "shop-settings.default-aql-changed", subject: { type: "shop_settings", id: "1" }, data: { from: before, to: input.defaultAql }, ip: req.ip ?? null }, transaction);
      }
      return row;
    });
    res.json(presentQualitySettings(saved));
  });

  // An order's AQL: set from the shop's default when placed; the planner may agree another with the customer.
  router.put("/orders/:id/aql", requireUser, async (req, res) => {
    const input = parseInput(orderAqlSchema, req.body);
    const order = await sequelize.transaction(async (transaction) => {
      const order = await Order.findByPk(recordId(req.params.id, "order"), { transaction, lock: transaction.LOCK.UPDATE });
      if (!order) throw NotFoundError("order");
      authorize(req.user!, "read", orderPolicy, order);
      requireRole(req.user!, "admin");
      if (!aqlChangeable(order)) throw ConflictError("ORDER_LOCKED", "The AQL of a shipped, cancelled or refunded order no longer changes.");
      if (order.aql !== input.aql) {
        const before = order.aql;
        order.aql = input.aql;
        await order.save({ transaction, fields: ["aql", "updatedAt"] });
        await recordEvent({ actor: req.user!, organizationId: order.organizationId, action: "order.aql-changed", subject: { type: "order", id: order.id }, data: { from: before, to: input.aql }, ip: req.ip ?? null }, transaction);
      }
      return order;
    });
    const body: OrderAqlJson = { orderId: order.id, aql: order.aql };
    res.json(body);
  });

  return router;
}
