import { Router } from "express";
import { organizationSettingsSchema, shopSettingsSchema, type OrganizationSettingsJson, type ShopSettingsJson } from "../../shared/schemas/shop-settings";
import type { AppDeps } from "../deps";
import { NotFoundError, ValidationError } from "../errors";
import { materialCatalog } from "../services/materialCatalog";
import { parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Organization, ShopSettings, recordEvent } from "../models";
import { authorize, definePolicy, isAdmin, isOwnOrganization, isStaff, requireRole } from "../policies/utils";

const presentShop = (s: ShopSettings): ShopSettingsJson => ({
  name: s.name, address: s.address, email: s.email, phone: s.phone, taxId: s.taxId, mailFrom: s.mailFrom, quoteTerms: s.quoteTerms,
  furnaces: s.furnaces, annealWindows: s.annealWindows, updatedAt: s.updatedAt.toISOString(),
});
const presentOrgSettings = (o: Organization): OrganizationSettingsJson => ({ id: o.id, name: o.name, kind: o.kind, paperSize: o.paperSize });

/** An organisation's own settings: its members change them (and the planner); the shop's staff may read them. */
const organizationSettingsPolicy = definePolicy<Organization, "read" | "update">({
  name: "organization",
  see: (actor, org) => isStaff(actor) || isOwnOrganization(actor, { organizationId: org.id }),
  can: { read: () => true, update: (actor, org) => isAdmin(actor) || (actor.role === "customer" && actor.organizationId === org.id) },
});

/** The shop's details and mail sender (planner), and an organisation's paper size for its documents. */
export function settingsRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  router.get("/shop-settings", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    res.json(presentShop(await ShopSettings.current()));
  });

  router.put("/shop-settings", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const parsed = parseInput(shopSettingsSchema, req.body);
    // the furnaces and anneal windows are optional: omitted, they stay as they are
    const input = Object.fromEntries(Object.entries(parsed).filter(([, v]) => v !== undefined)) as typeof parsed;
    if (input.annealWindows) {
      const catalog = await materialCatalog();
      const unknown = input.annealWindows.findIndex((w) => !catalog.byId.has(w.materialId));
      if (unknown >= 0) throw ValidationError({ [`annealWindows.${unknown}.materialId`]: `unknown alloy "${input.annealWindows[unknown].materialId}"` });
    }
    const saved = await sequelize.transaction(async (transaction) => {
      const row = await ShopSettings.findByPk(1, { transaction, lock: transaction.LOCK.UPDATE });
      if (!row) throw NotFoundError("shop settings");
      const before = presentShop(row);
      await row.update({ ...input, updatedById: req.user!.id }, { transaction });
      const changed = Object.keys(input).filter((k) => JSON.stringify(before[k as keyof typeof input]) !== JSON.stringify(input[k as keyof typeof input]));
      await recordEvent({ actor: req.user!, action: "shop-settings.updated", subject: { type: "shop_settings", id: "1" }, data: { fields: changed }, ip: req.ip ?? null }, transaction);
      return row;
    });
    res.json(presentShop(saved));
  });

  router.get("/organizations/:id/settings", requireUser, async (req, res) => {
    const org = await Organization.findByPk(recordId(req.params.id, "organization"));
    if (!org) throw NotFoundError("organization");
    authorize(req.user!, "read", organizationSettingsPolicy, org);
    res.json(presentOrgSettings(org));
  });

  router.patch("/organizations/:id/settings", requireUser, async (req, res) => {
    const input = parseInput(organizationSettingsSchema, req.body);
    const org = await sequelize.transaction(async (transaction) => {
      const org = await Organization.findByPk(recordId(req.params.id, "organization"), { transaction, lock: transaction.LOCK.UPDATE });
      if (!org) throw NotFoundError("organization");
      authorize(req.user!, "update", organizationSettingsPolicy, org);
      if (org.paperSize !== input.paperSize) {
        org.paperSize = input.paperSize;
        await org.save({ transaction });
        await recordEvent({ actor: req.user!, organizationId: org.id, action: "organization.settings-updated", subject: { type: "organization", id: org.id }, data: { paperSize: input.paperSize }, ip: req.ip ?? null }, transaction);
      }
      return org;
    });
    res.json(presentOrgSettings(org));
  });

  return router;
}
